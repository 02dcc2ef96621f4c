import { z } from 'zod';
import { ORDER_STATUSES } from '@/lib/domain/order-status';
import { idempotencyKey, safeString } from './fields';
import { listQuery } from './list-query';

export const orderIdInput = z.object({ orderId: z.number().int().positive() });

export const shipInput = z.object({
  orderId: z.number().int().positive(),
  tracking: safeString().trim().max(200, 'At most 200 characters').default(''),
});
export type ShipInput = z.input<typeof shipInput>;

/** Money in the currency's major unit as typed (e.g. 12.50); converted to cents once. */
const refundAmount = z.number({ error: 'Enter the amount to refund' }).positive('More than zero').max(1_000_000);

export const refundInput = z.object({
  orderId: z.number().int().positive(),
  amount: refundAmount,
  /** Jars coming back per order line; 0 for a money-only refund. */
  jars: z
    .array(z.object({ lineId: z.number().int().positive(), quantity: z.number().int().min(0).max(1000) }))
    .default([]),
  /** true: the jars go back on the shelf; false: they are written off (broken, opened). */
  restock: z.boolean(),
  reason: safeString().trim().max(500).default(''),
  /** One per refund form shown: the same refund sent twice is refused (lib/data/orders/desk.ts, refundKey). */
  requestKey: idempotencyKey.optional(),
});
export type RefundInput = z.input<typeof refundInput>;

/** The order desk's refund form: the amount as typed in its text field ("12,50" reads as 12.50), then the same checks. */
export const refundFormInput = refundInput.extend({
  amount: z.preprocess(
    (v) => (typeof v === 'string' ? (v.trim() === '' ? undefined : Number(v.trim().replace(',', '.'))) : v),
    refundAmount,
  ),
});

/** The order desk's filters: the orders still to pack and send (paid or packed), all, or one status. */
export const ORDER_DESK_FILTERS = ['open', 'all', ...ORDER_STATUSES] as const;
export type OrderDeskFilter = (typeof ORDER_DESK_FILTERS)[number];

export const orderListQuery = listQuery(
  ['createdAt', 'totalCents'],
  {
    status: z.enum(ORDER_DESK_FILTERS).default('open'),
    q: safeString().trim().max(80).optional(),
  },
  'createdAt',
  { defaultDir: 'desc' },
);
export type OrderListQuery = z.output<typeof orderListQuery>;

/** A customer's own orders, newest first. */
export const customerOrderListQuery = listQuery(['createdAt'], {}, 'createdAt', { defaultDir: 'desc' });
export type CustomerOrderListQuery = z.output<typeof customerOrderListQuery>;
