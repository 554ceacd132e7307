import 'server-only';
import {
  DataTypes,
  Model,
  type CreationOptional,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
} from 'sequelize';
import { sequelize } from '@/lib/db/sequelize';
import type { DistSpec } from '@/lib/sim';
import type { Organization } from './organization';
import type { Project } from './project';

export type PredecessorLink = { code: string; type?: 'FS' | 'SS' | 'FF' | 'SF'; lag: number };

/**
 * A schedule activity: duration range in working days, predecessors with their link type (none
 * stored: finish-to-start) and lag, and the probability that it happens (null: always).
 */
export class Activity extends Model<InferAttributes<Activity>, InferCreationAttributes<Activity>> {
  declare id: CreationOptional<number>;
  declare organizationId: ForeignKey<Organization['id']>;
  declare projectId: ForeignKey<Project['id']>;
  declare code: string;
  declare name: string;
  declare duration: DistSpec;
  declare predecessors: PredecessorLink[];
  declare existence: number | null;
  declare sortOrder: CreationOptional<number>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

Activity.init(
  {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    organizationId: { type: DataTypes.INTEGER, allowNull: false },
    projectId: { type: DataTypes.INTEGER, allowNull: false },
    code: { type: DataTypes.STRING(40), allowNull: false },
    name: { type: DataTypes.STRING(255), allowNull: false },
    duration: { type: DataTypes.JSON, allowNull: false },
    predecessors: { type: DataTypes.JSON, allowNull: false, defaultValue: [] },
    existence: { type: DataTypes.DOUBLE, allowNull: true },
    sortOrder: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'Activities' },
);
