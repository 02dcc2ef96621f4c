import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import { serialId, timestamps, type Timestamps } from './columns';
import type { Order } from './order';

export interface Refund extends Timestamps {}
export class Refund extends Model<InferAttributes<Refund>, InferCreationAttributes<Refund>> {
  declare id: CreationOptional<number>;
  declare orderId: number;
  declare stripeRefundId: CreationOptional<string | null>;
  declare amountCents: number;
  /** Derived from the refund request; unique, so the same refund cannot be made twice. */
  declare requestKey: CreationOptional<string | null>;
  declare restock: boolean;
  declare reason: CreationOptional<string>;
  declare createdBy: number | null;
  declare order?: NonAttribute<Order>;
}

export function initRefund(sequelize: Sequelize) {
  return Refund.init(
    {
      ...serialId(),
      orderId: { type: DataTypes.INTEGER, allowNull: false },
      stripeRefundId: { type: DataTypes.STRING(120), allowNull: true, unique: true },
      amountCents: { type: DataTypes.INTEGER, allowNull: false },
      requestKey: { type: DataTypes.STRING(120), allowNull: true, unique: true },
      restock: { type: DataTypes.BOOLEAN, allowNull: false },
      reason: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      createdBy: { type: DataTypes.INTEGER, allowNull: true },
      ...timestamps(),
    },
    { sequelize, modelName: 'Refund', tableName: 'refunds', underscored: true },
  );
}
