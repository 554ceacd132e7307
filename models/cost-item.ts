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
import type { Activity } from './activity';
import type { Organization } from './organization';
import type { Project } from './project';

/**
 * A line of the estimate. Either `dist` (an uncertain amount) or `ratePerDay` with an
 * activity or `span: "project"` (a time-dependent cost) is set; `base` defaults to the distribution's central value.
 */
export class CostItem extends Model<InferAttributes<CostItem>, InferCreationAttributes<CostItem>> {
  declare id: CreationOptional<number>;
  declare organizationId: ForeignKey<Organization['id']>;
  declare projectId: ForeignKey<Project['id']>;
  declare code: string;
  declare description: string;
  declare base: number | null;
  declare dist: DistSpec | null;
  declare ratePerDay: DistSpec | number | null;
  declare activityId: ForeignKey<Activity['id']> | null;
  /** "project": the rate is paid for the whole project's duration (no activity). */
  declare span: 'project' | null;
  declare ownerName: string | null;
  declare notes: string | null;
  declare sortOrder: CreationOptional<number>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

CostItem.init(
  {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    organizationId: { type: DataTypes.INTEGER, allowNull: false },
    projectId: { type: DataTypes.INTEGER, allowNull: false },
    code: { type: DataTypes.STRING(40), allowNull: false },
    description: { type: DataTypes.STRING(255), allowNull: false },
    base: { type: DataTypes.DOUBLE, allowNull: true },
    dist: { type: DataTypes.JSON, allowNull: true },
    ratePerDay: { type: DataTypes.JSON, allowNull: true },
    activityId: { type: DataTypes.INTEGER, allowNull: true },
    span: { type: DataTypes.STRING(16), allowNull: true },
    ownerName: { type: DataTypes.STRING(120), allowNull: true },
    notes: { type: DataTypes.TEXT, allowNull: true },
    sortOrder: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'CostItems' },
);
