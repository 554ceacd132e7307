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

export const RISK_STATUSES = ['open', 'mitigating', 'closed', 'occurred'] as const;
export const RISK_RESPONSES = ['avoid', 'reduce', 'transfer', 'accept'] as const;
export const RISK_SIZES = ['linked', 'independent'] as const;

/**
 * A discrete risk event: if it occurs (probability), it costs and/or delays its activities
 * (`activityCodes`; rows written before hold one `activityId` link instead). A negative cost or
 * delay is an opportunity.
 */
export class RiskEvent extends Model<InferAttributes<RiskEvent>, InferCreationAttributes<RiskEvent>> {
  declare id: CreationOptional<number>;
  declare organizationId: ForeignKey<Organization['id']>;
  declare projectId: ForeignKey<Project['id']>;
  declare code: string;
  declare title: string;
  declare cause: string | null;
  declare event: string | null;
  declare effect: string | null;
  declare ownerName: string | null;
  declare status: (typeof RISK_STATUSES)[number];
  declare response: (typeof RISK_RESPONSES)[number];
  declare probability: number;
  declare costImpact: DistSpec | null;
  declare delayImpact: DistSpec | null;
  declare activityId: ForeignKey<Activity['id']> | null;
  declare activityCodes: string[] | null;
  declare itemCodes: string[] | null;
  declare sizes: CreationOptional<(typeof RISK_SIZES)[number]>;
  declare postProbability: number | null;
  declare postCostImpact: DistSpec | null;
  declare postDelayImpact: DistSpec | null;
  declare mitigationCost: DistSpec | number | null;
  declare sortOrder: CreationOptional<number>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

RiskEvent.init(
  {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    organizationId: { type: DataTypes.INTEGER, allowNull: false },
    projectId: { type: DataTypes.INTEGER, allowNull: false },
    code: { type: DataTypes.STRING(40), allowNull: false },
    title: { type: DataTypes.STRING(255), allowNull: false },
    cause: { type: DataTypes.TEXT, allowNull: true },
    event: { type: DataTypes.TEXT, allowNull: true },
    effect: { type: DataTypes.TEXT, allowNull: true },
    ownerName: { type: DataTypes.STRING(120), allowNull: true },
    status: { type: DataTypes.ENUM(...RISK_STATUSES), allowNull: false, defaultValue: 'open' },
    response: { type: DataTypes.ENUM(...RISK_RESPONSES), allowNull: false, defaultValue: 'reduce' },
    probability: { type: DataTypes.DOUBLE, allowNull: false },
    costImpact: { type: DataTypes.JSON, allowNull: true },
    delayImpact: { type: DataTypes.JSON, allowNull: true },
    activityId: { type: DataTypes.INTEGER, allowNull: true },
    activityCodes: { type: DataTypes.JSON, allowNull: true },
    itemCodes: { type: DataTypes.JSON, allowNull: true },
    sizes: { type: DataTypes.ENUM(...RISK_SIZES), allowNull: false, defaultValue: 'linked' },
    postProbability: { type: DataTypes.DOUBLE, allowNull: true },
    postCostImpact: { type: DataTypes.JSON, allowNull: true },
    postDelayImpact: { type: DataTypes.JSON, allowNull: true },
    mitigationCost: { type: DataTypes.JSON, allowNull: true },
    sortOrder: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'RiskEvents' },
);
