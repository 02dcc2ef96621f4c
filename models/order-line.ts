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
import type { Product } from './product';
import type { OrderAllocation } from './order-allocation';

export interface OrderLine extends Timestamps {}
export class OrderLine extends Model<InferAttributes<OrderLine>, InferCreationAttributes<OrderLine>> {
  declare id: CreationOptional<number>;
  declare orderId: number;
  declare productId: number;
  /** What the customer saw when ordering; prices are always ours, never the browser's. */
  declare productName: string;
  declare quantity: number;
  declare unitPriceCents: number;
  declare order?: NonAttribute<Order>;
  declare product?: NonAttribute<Product>;
  declare allocations?: NonAttribute<OrderAllocation[]>;
}

export function initOrderLine(sequelize: Sequelize) {
  return OrderLine.init(
    {
      ...serialId(),
      orderId: { type: DataTypes.INTEGER, allowNull: false },
      productId: { type: DataTypes.INTEGER, allowNull: false },
      productName: { type: DataTypes.STRING(120), allowNull: false },
      quantity: { type: DataTypes.INTEGER, allowNull: false },
      unitPriceCents: { type: DataTypes.INTEGER, allowNull: false },
      ...timestamps(),
    },
    { sequelize, modelName: 'OrderLine', tableName: 'order_lines', underscored: true },
  );
}
