/** The states an order passes through, from checkout to hand-over or refund. */
export const ORDER_STATUSES = [
  'awaiting_payment',
  'paid',
  'packed',
  'shipped',
  'picked_up',
  'cancelled',
  'expired',
  'refunded',
] as const;
export type OrderStatus = (typeof ORDER_STATUSES)[number];
