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
import type { Organization } from './organization';

export class Project extends Model<InferAttributes<Project>, InferCreationAttributes<Project>> {
  declare id: CreationOptional<number>;
  declare organizationId: ForeignKey<Organization['id']>;
  declare name: string;
  declare code: string;
  declare currency: string;
  declare estimateClass: number;
  declare stage: string;
  declare baseDate: string;
  declare description: CreationOptional<string | null>;
  declare assumptions: CreationOptional<string | null>;
  declare exclusions: CreationOptional<string | null>;
  /** The cost and finish targets each new run starts with (the user may change them for one run). */
  declare costTarget: CreationOptional<number | null>;
  declare finishTarget: CreationOptional<string | null>;
  declare archivedAt: CreationOptional<Date | null>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

Project.init(
  {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    name: { type: DataTypes.STRING(160), allowNull: false },
    code: { type: DataTypes.STRING(32), allowNull: false },
    currency: { type: DataTypes.STRING(3), allowNull: false, defaultValue: 'EUR' },
    estimateClass: { type: DataTypes.TINYINT, allowNull: false, defaultValue: 4 },
    stage: { type: DataTypes.STRING(40), allowNull: false, defaultValue: 'Concept' },
    baseDate: { type: DataTypes.DATEONLY, allowNull: false },
    description: { type: DataTypes.TEXT, allowNull: true },
    assumptions: { type: DataTypes.TEXT, allowNull: true },
    exclusions: { type: DataTypes.TEXT, allowNull: true },
    costTarget: { type: DataTypes.DOUBLE, allowNull: true },
    finishTarget: { type: DataTypes.DATEONLY, allowNull: true },
    archivedAt: { type: DataTypes.DATE, allowNull: true },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'Projects', version: true },
);
