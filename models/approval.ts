import 'server-only';
import {
  DataTypes,
  Model,
  type CreationOptional,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
} from 'sequelize';
import { sequelize } from '@/lib/db/sequelize';
import type { Organization } from './organization';
import type { Project } from './project';
import type { SimulationRun } from './simulation-run';
import type { User } from './user';

export const DECISIONS = ['approved', 'returned'] as const;
export type Decision = (typeof DECISIONS)[number];

/**
 * A sponsor's decision on one run: approved as the project's baseline, or returned. Written
 * once, never updated (no updatedAt); one decision per run (unique key on runId).
 */
export class Approval extends Model<InferAttributes<Approval>, InferCreationAttributes<Approval>> {
  declare id: CreationOptional<number>;
  declare organizationId: ForeignKey<Organization['id']>;
  declare projectId: ForeignKey<Project['id']>;
  declare runId: ForeignKey<SimulationRun['id']>;
  declare sponsorId: ForeignKey<User['id']> | null;
  declare sponsorName: string;
  declare decision: Decision;
  declare comment: string;
  declare stage: string;
  declare estimateClass: number;
  /** The sponsor also started the run (only where the organisation allows it). */
  declare selfApproved: CreationOptional<boolean>;
  declare createdAt: CreationOptional<Date>;
  declare run?: NonAttribute<SimulationRun>;
}

Approval.init(
  {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    // Declared here because no association from Organization defines it.
    organizationId: { type: DataTypes.INTEGER, allowNull: false },
    sponsorName: { type: DataTypes.STRING(160), allowNull: false },
    decision: { type: DataTypes.ENUM(...DECISIONS), allowNull: false },
    comment: { type: DataTypes.TEXT, allowNull: false },
    stage: { type: DataTypes.STRING(40), allowNull: false },
    estimateClass: { type: DataTypes.TINYINT, allowNull: false },
    selfApproved: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    createdAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'Approvals', updatedAt: false },
);
