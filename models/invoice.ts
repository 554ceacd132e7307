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

/** An invoice of the payment service, mirrored; amounts in the currency's minor unit (cents). */
export class Invoice extends Model<InferAttributes<Invoice>, InferCreationAttributes<Invoice>> {
  declare id: CreationOptional<number>;
  declare organizationId: ForeignKey<Organization['id']>;
  declare stripeInvoiceId: string;
  declare number: string | null;
  declare status: string;
  declare billingReason: string | null;
  declare total: number;
  declare amountPaid: number;
  declare currency: string;
  declare periodStart: Date | null;
  declare periodEnd: Date | null;
  declare issuedAt: Date;
  declare paidAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

Invoice.init(
  {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    stripeInvoiceId: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    number: { type: DataTypes.STRING(64), allowNull: true },
    status: { type: DataTypes.STRING(24), allowNull: false },
    billingReason: { type: DataTypes.STRING(40), allowNull: true },
    total: { type: DataTypes.INTEGER, allowNull: false },
    amountPaid: { type: DataTypes.INTEGER, allowNull: false },
    currency: { type: DataTypes.STRING(3), allowNull: false },
    periodStart: { type: DataTypes.DATE, allowNull: true },
    periodEnd: { type: DataTypes.DATE, allowNull: true },
    issuedAt: { type: DataTypes.DATE, allowNull: false },
    paidAt: { type: DataTypes.DATE, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'Invoices' },
);
