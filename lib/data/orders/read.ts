import 'server-only';
import type { Transaction } from 'sequelize';
import { getDb } from '@/lib/db/index';
import type { SessionUser } from '@/lib/auth/session';
import { can } from '@/lib/auth/roles';
import { checkOrderToken } from '@/lib/payments/order-token';
import type { Order, ShippingAddress } from '@/models/order';
import type { OrderStatus } from '@/lib/domain/order-status';
import { orderAllocations } from './stock';

export type OrderLineDetail = {
  id: number;
  productId: number;
  productName: string;
  quantity: number;
  unitPriceCents: number;
  lots: { lotId: number; code: string; quantity: number; state: string }[];
};

export type OrderDetail = {
  id: number;
  number: string;
  status: OrderStatus;
  fulfilment: 'pickup' | 'ship';
  customerId: number | null;
  email: string;
  name: string;
  phone: string;
  shippingAddress: ShippingAddress | null;
  subtotalCents: number;
  shippingCents: number;
  totalCents: number;
  refundedCents: number;
  currency: string;
  paymentIntentId: string | null;
  reservedUntil: Date | null;
  paidAt: Date | null;
  packedAt: Date | null;
  shippedAt: Date | null;
  pickedUpAt: Date | null;
  tracking: string | null;
  createdAt: Date;
  lines: OrderLineDetail[];
  refunds: { id: number; amountCents: number; restock: boolean; reason: string; createdAt: Date }[];
  /** Paid after its reservation was released and no stock was left: staff must refund it. */
  needsRefund: boolean;
};

export async function getOrderDetail(orderId: number, t?: Transaction): Promise<OrderDetail | null> {
  const { Order, OrderLine, Refund } = getDb().models;
  const o = await Order.findByPk(orderId, {
    include: [
      { model: OrderLine, as: 'lines' },
      { model: Refund, as: 'refunds' },
    ],
    order: [
      [{ model: OrderLine, as: 'lines' }, 'id', 'ASC'],
      [{ model: Refund, as: 'refunds' }, 'id', 'ASC'],
    ],
    transaction: t,
  });
  if (!o) return null;
  const allocations = await orderAllocations(t, o.id);
  const shown = allocations.filter((a) => a.state !== 'released');
  return {
    id: o.id,
    number: o.number,
    status: o.status,
    fulfilment: o.fulfilment,
    customerId: o.customerId ?? null,
    email: o.email,
    name: o.name,
    phone: o.phone,
    shippingAddress: o.shippingAddress ?? null,
    subtotalCents: o.subtotalCents,
    shippingCents: o.shippingCents,
    totalCents: o.totalCents,
    refundedCents: o.refundedCents,
    currency: o.currency,
    paymentIntentId: o.paymentIntentId ?? null,
    reservedUntil: o.reservedUntil ?? null,
    paidAt: o.paidAt ?? null,
    packedAt: o.packedAt ?? null,
    shippedAt: o.shippedAt ?? null,
    pickedUpAt: o.pickedUpAt ?? null,
    tracking: o.tracking ?? null,
    createdAt: o.createdAt,
    lines: (o.lines ?? []).map((l) => ({
      id: l.id,
      productId: l.productId,
      productName: l.productName,
      quantity: l.quantity,
      unitPriceCents: l.unitPriceCents,
      lots: shown
        .filter((a) => a.lineId === l.id)
        .map((a) => ({ lotId: a.lotId, code: a.lotCode, quantity: a.quantity, state: a.state })),
    })),
    refunds: (o.refunds ?? []).map((r) => ({
      id: r.id,
      amountCents: r.amountCents,
      restock: r.restock,
      reason: r.reason,
      createdAt: r.createdAt,
    })),
    needsRefund: needsRefund(o),
  };
}

export function needsRefund(o: Pick<Order, 'status' | 'paidAt' | 'refundedCents' | 'totalCents'>): boolean {
  return (o.status === 'expired' || o.status === 'cancelled') && Boolean(o.paidAt) && o.refundedCents < o.totalCents;
}

/**
 * An order as the viewer may see it: staff see all, a customer only their own, anyone holding the
 * signed link its order. Anything else is null (→ 404, so a number cannot be probed).
 */
export async function getOrderForViewer(
  number: string,
  user: SessionUser | null,
  token: string | null,
): Promise<OrderDetail | null> {
  const { Order } = getDb().models;
  const row = await Order.findOne({ where: { number }, attributes: ['id', 'customerId'] });
  if (!row) return null;
  const staff = user && can(user.role, 'orders.desk');
  const own = user?.role === 'customer' && row.customerId === user.id;
  if (!staff && !own && !checkOrderToken(number, token)) return null;
  return getOrderDetail(row.id);
}
