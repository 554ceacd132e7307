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

export const SUBSCRIPTION_STATUSES = [
  'trialing',
  'active',
  'past_due',
  'unpaid',
  'incomplete',
  'incomplete_expired',
  'canceled',
] as const;
export type SubscriptionStatus = (typeof SUBSCRIPTION_STATUSES)[number];

/** The organisation's seat subscription, mirrored from the payment service's webhooks. */
export class Subscription extends Model<
  InferAttributes<Subscription>,
  InferCreationAttributes<Subscription>
> {
  declare id: CreationOptional<number>;
  declare organizationId: ForeignKey<Organization['id']>;
  declare status: SubscriptionStatus;
  declare seats: number;
  declare unitAmount: CreationOptional<number | null>;
  declare currency: CreationOptional<string | null>;
  declare stripeCustomerId: CreationOptional<string | null>;
  declare stripeSubscriptionId: CreationOptional<string | null>;
  declare trialEndsAt: CreationOptional<Date | null>;
  declare currentPeriodEnd: CreationOptional<Date | null>;
  declare cancelAtPeriodEnd: CreationOptional<boolean>;
  declare endedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

Subscription.init(
  {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    status: { type: DataTypes.ENUM(...SUBSCRIPTION_STATUSES), allowNull: false },
    seats: { type: DataTypes.INTEGER, allowNull: false },
    unitAmount: { type: DataTypes.INTEGER, allowNull: true },
    currency: { type: DataTypes.STRING(3), allowNull: true },
    stripeCustomerId: { type: DataTypes.STRING(64), allowNull: true, unique: true },
    stripeSubscriptionId: { type: DataTypes.STRING(64), allowNull: true, unique: true },
    trialEndsAt: { type: DataTypes.DATE, allowNull: true },
    currentPeriodEnd: { type: DataTypes.DATE, allowNull: true },
    cancelAtPeriodEnd: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    endedAt: { type: DataTypes.DATE, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'Subscriptions' },
);
