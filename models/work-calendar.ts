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

/** An organisation's working week and holidays; an organisation without a row works Monday to Friday. */
export class WorkCalendar extends Model<
  InferAttributes<WorkCalendar>,
  InferCreationAttributes<WorkCalendar>
> {
  declare id: CreationOptional<number>;
  declare organizationId: ForeignKey<Organization['id']>;
  /** ISO weekdays as digits, 1 = Monday … 7 = Sunday. */
  declare weekdays: string;
  /** JSON list of { date, name }, sorted by date. */
  declare holidays: string;
  /** Raised by every change; a change must name the version it was made from. */
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

WorkCalendar.init(
  {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    weekdays: { type: DataTypes.STRING(7), allowNull: false },
    holidays: { type: DataTypes.TEXT('medium'), allowNull: false },
    version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'WorkCalendars' },
);
