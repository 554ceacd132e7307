import 'server-only';
import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
} from 'sequelize';
import { sequelize } from '@/lib/db/sequelize';

export class Organization extends Model<
  InferAttributes<Organization>,
  InferCreationAttributes<Organization>
> {
  declare id: CreationOptional<number>;
  declare name: string;
  /** Whether the person who started a run may also approve it as the baseline. */
  declare allowSelfApproval: CreationOptional<boolean>;
  /** The joint confidence of cost and finish at which the outcome draws its frontier, in percent. */
  declare jointConfidence: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

Organization.init(
  {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    allowSelfApproval: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    jointConfidence: { type: DataTypes.TINYINT.UNSIGNED, allowNull: false, defaultValue: 70 },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'Organizations' },
);
