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
import type { User } from './user';

export const OUTBOUND_STATUSES = ['pending', 'sent', 'failed'] as const;
export type OutboundStatus = (typeof OUTBOUND_STATUSES)[number];

/** One e-mail to one recipient, written with the action that caused it and sent later. */
export class OutboundMessage extends Model<
  InferAttributes<OutboundMessage>,
  InferCreationAttributes<OutboundMessage>
> {
  declare id: CreationOptional<number>;
  declare kind: string;
  declare userId: ForeignKey<User['id']> | null;
  declare toAddress: string;
  declare subject: string;
  declare html: string;
  declare text: string;
  declare status: CreationOptional<OutboundStatus>;
  declare attempts: CreationOptional<number>;
  declare lastError: CreationOptional<string | null>;
  declare nextAttemptAt: Date;
  declare sentAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

OutboundMessage.init(
  {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    kind: { type: DataTypes.STRING(40), allowNull: false },
    toAddress: { type: DataTypes.STRING(254), allowNull: false },
    subject: { type: DataTypes.STRING(250), allowNull: false },
    html: { type: DataTypes.TEXT, allowNull: false },
    text: { type: DataTypes.TEXT, allowNull: false },
    status: { type: DataTypes.ENUM(...OUTBOUND_STATUSES), allowNull: false, defaultValue: 'pending' },
    attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    lastError: { type: DataTypes.STRING(1000), allowNull: true },
    nextAttemptAt: { type: DataTypes.DATE, allowNull: false },
    sentAt: { type: DataTypes.DATE, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'OutboundMessages' },
);
