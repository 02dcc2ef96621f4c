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
import type { OrderLine } from './order-line';
import type { Lot } from './lot';

export const ALLOCATION_STATES = ['reserved', 'sold', 'released', 'returned', 'written_off'] as const;
export type AllocationState = (typeof ALLOCATION_STATES)[number];

/** Which lot's jars fill a line: made when stock is reserved (oldest best-before first), final once paid. */
export interface OrderAllocation extends Timestamps {}
export class OrderAllocation extends Model<InferAttributes<OrderAllocation>, InferCreationAttributes<OrderAllocation>> {
  declare id: CreationOptional<number>;
  declare orderLineId: number;
  declare lotId: number;
  declare quantity: number;
  declare state: CreationOptional<AllocationState>;
  declare line?: NonAttribute<OrderLine>;
  declare lot?: NonAttribute<Lot>;
}

export function initOrderAllocation(sequelize: Sequelize) {
  return OrderAllocation.init(
    {
      ...serialId(),
      orderLineId: { type: DataTypes.INTEGER, allowNull: false },
      lotId: { type: DataTypes.INTEGER, allowNull: false },
      quantity: { type: DataTypes.INTEGER, allowNull: false },
      state: {
        type: DataTypes.STRING(12),
        allowNull: false,
        defaultValue: 'reserved',
        validate: { isIn: [ALLOCATION_STATES] },
      },
      ...timestamps(),
    },
    { sequelize, modelName: 'OrderAllocation', tableName: 'order_allocations', underscored: true },
  );
}
