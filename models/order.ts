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
import type { User } from './user';
import type { OrderLine } from './order-line';
import type { Refund } from './refund';
import { ORDER_STATUSES, type OrderStatus } from '@/lib/domain/order-status';

export const FULFILMENTS = ['pickup', 'ship'] as const;
export type Fulfilment = (typeof FULFILMENTS)[number];
/** Postal address of a 'ship' order, as the customer entered it. */
export type ShippingAddress = {
  name: string;
  line1: string;
  line2: string;
  city: string;
  region: string;
  postalCode: string;
  country: string;
};

export interface Order extends Timestamps {}
export class Order extends Model<InferAttributes<Order>, InferCreationAttributes<Order>> {
  declare id: CreationOptional<number>;
  /** Shown to customers and staff, e.g. "C-10042". */
  declare number: string;
  declare customerId: CreationOptional<number | null>;
  declare email: string;
  declare name: CreationOptional<string>;
  declare phone: CreationOptional<string>;
  declare status: CreationOptional<OrderStatus>;
  declare fulfilment: Fulfilment;
  declare shippingAddress: CreationOptional<ShippingAddress | null>;
  declare subtotalCents: number;
  declare shippingCents: CreationOptional<number>;
  declare totalCents: number;
  declare refundedCents: CreationOptional<number>;
  declare currency: string;
  declare stripeSessionId: CreationOptional<string | null>;
  declare paymentIntentId: CreationOptional<string | null>;
  declare reservedUntil: CreationOptional<Date | null>;
  /** The client address the checkout came from (lib/http/client-ip.ts), for the checkout limits. */
  declare clientIp: CreationOptional<string | null>;
  declare paidAt: CreationOptional<Date | null>;
  declare packedAt: CreationOptional<Date | null>;
  declare shippedAt: CreationOptional<Date | null>;
  declare pickedUpAt: CreationOptional<Date | null>;
  declare tracking: CreationOptional<string | null>;
  declare customer?: NonAttribute<User | null>;
  declare lines?: NonAttribute<OrderLine[]>;
  declare refunds?: NonAttribute<Refund[]>;
}

export function initOrder(sequelize: Sequelize) {
  return Order.init(
    {
      ...serialId(),
      number: { type: DataTypes.STRING(20), allowNull: false, unique: true },
      customerId: { type: DataTypes.INTEGER, allowNull: true },
      email: { type: DataTypes.STRING(254), allowNull: false },
      name: { type: DataTypes.STRING(120), allowNull: false, defaultValue: '' },
      phone: { type: DataTypes.STRING(40), allowNull: false, defaultValue: '' },
      status: {
        type: DataTypes.STRING(20),
        allowNull: false,
        defaultValue: 'awaiting_payment',
        validate: { isIn: [ORDER_STATUSES] },
      },
      fulfilment: { type: DataTypes.STRING(8), allowNull: false, validate: { isIn: [FULFILMENTS] } },
      shippingAddress: { type: DataTypes.JSONB, allowNull: true },
      subtotalCents: { type: DataTypes.INTEGER, allowNull: false },
      shippingCents: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      totalCents: { type: DataTypes.INTEGER, allowNull: false },
      refundedCents: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      currency: { type: DataTypes.STRING(3), allowNull: false },
      stripeSessionId: { type: DataTypes.STRING(120), allowNull: true, unique: true },
      paymentIntentId: { type: DataTypes.STRING(120), allowNull: true },
      reservedUntil: { type: DataTypes.DATE, allowNull: true },
      clientIp: { type: DataTypes.STRING(64), allowNull: true },
      paidAt: { type: DataTypes.DATE, allowNull: true },
      packedAt: { type: DataTypes.DATE, allowNull: true },
      shippedAt: { type: DataTypes.DATE, allowNull: true },
      pickedUpAt: { type: DataTypes.DATE, allowNull: true },
      tracking: { type: DataTypes.STRING(200), allowNull: true },
      ...timestamps(),
    },
    { sequelize, modelName: 'Order', tableName: 'orders', underscored: true },
  );
}
