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

export const FACTOR_ENTRIES = ['change', 'factor'] as const;

/**
 * A risk driver: a condition (ground, market, design maturity…) that, when it acts
 * (probability), multiplies the cost of the line items and the duration of the activities it
 * applies to by one sampled factor. `applies` keeps the codes and WBS branches as typed ("3.*"),
 * resolved to codes only when the model is built, so lines added under a branch join it.
 */
export class RiskDriver extends Model<InferAttributes<RiskDriver>, InferCreationAttributes<RiskDriver>> {
  declare id: CreationOptional<number>;
  declare organizationId: ForeignKey<Organization['id']>;
  declare projectId: ForeignKey<Project['id']>;
  declare code: string;
  declare name: string;
  declare standsFor: string | null;
  declare probability: number;
  declare factor: DistSpec;
  declare entry: (typeof FACTOR_ENTRIES)[number];
  declare applies: string[];
  declare sortOrder: CreationOptional<number>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

RiskDriver.init(
  {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    organizationId: { type: DataTypes.INTEGER, allowNull: false },
    projectId: { type: DataTypes.INTEGER, allowNull: false },
    code: { type: DataTypes.STRING(40), allowNull: false },
    name: { type: DataTypes.STRING(255), allowNull: false },
    standsFor: { type: DataTypes.TEXT, allowNull: true },
    probability: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 1 },
    factor: { type: DataTypes.JSON, allowNull: false },
    entry: { type: DataTypes.ENUM(...FACTOR_ENTRIES), allowNull: false, defaultValue: 'change' },
    applies: { type: DataTypes.JSON, allowNull: false },
    sortOrder: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'RiskDrivers' },
);
