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
import type { Project } from './project';
import type { User } from './user';

/** Who changed what, with the record before and after. Written, never updated. */
export class AuditEntry extends Model<InferAttributes<AuditEntry>, InferCreationAttributes<AuditEntry>> {
  declare id: CreationOptional<number>;
  declare organizationId: ForeignKey<Organization['id']>;
  declare projectId: ForeignKey<Project['id']> | null;
  declare userId: ForeignKey<User['id']> | null;
  declare entity: string;
  declare entityId: string | null;
  declare action: 'create' | 'update' | 'delete' | string;
  declare before: unknown;
  declare after: unknown;
  declare createdAt: CreationOptional<Date>;
}

AuditEntry.init(
  {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    entity: { type: DataTypes.STRING(40), allowNull: false },
    entityId: { type: DataTypes.STRING(64), allowNull: true },
    action: { type: DataTypes.STRING(20), allowNull: false },
    before: { type: DataTypes.JSON, allowNull: true },
    after: { type: DataTypes.JSON, allowNull: true },
    createdAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'AuditEntries', updatedAt: false },
);
