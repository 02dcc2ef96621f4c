'use server';
import { revalidatePath } from 'next/cache';
import { guardedAction } from '@/lib/http/server-action';
import { orderIdInput, refundInput, shipInput } from '@/lib/schemas/orders';
import { advanceOrder, cancelUnpaidOrder, refundOrder } from '@/lib/data/orders/desk';
import { getOrderDetail } from '@/lib/data/orders/read';
import { kickMail } from '@/lib/mail/outbox';
import { fail } from '@/lib/schemas/result';
import { currencyMinorDigits } from '@/lib/domain/units';

function done(orderId: number) {
  kickMail();
  revalidatePath(`/admin/orders/${orderId}`);
  revalidatePath('/admin/orders');
  return { ok: true as const };
}

export const markPackedAction = guardedAction('orders.desk', orderIdInput, async (user, { orderId }) => {
  await advanceOrder(user.id, orderId, 'packed');
  return done(orderId);
});

export const markShippedAction = guardedAction('orders.desk', shipInput, async (user, { orderId, tracking }) => {
  await advanceOrder(user.id, orderId, 'shipped', tracking);
  return done(orderId);
});

export const markPickedUpAction = guardedAction('orders.desk', orderIdInput, async (user, { orderId }) => {
  await advanceOrder(user.id, orderId, 'picked_up');
  return done(orderId);
});

export const cancelOrderAction = guardedAction('orders.desk', orderIdInput, async (user, { orderId }) => {
  await cancelUnpaidOrder(user.id, orderId);
  return done(orderId);
});

export const refundOrderAction = guardedAction('orders.refund', refundInput, async (user, data) => {
  const order = await getOrderDetail(data.orderId);
  if (!order) return fail('No such order.');
  // Money typed in the major unit becomes integer minor units once, with Math.round (DEVELOPERS.md, "Money and weights").
  const amountCents = Math.round(data.amount * 10 ** currencyMinorDigits(order.currency));
  await refundOrder(user.id, {
    orderId: data.orderId,
    amountCents,
    jars: data.jars,
    restock: data.restock,
    reason: data.reason,
    requestKey: data.requestKey,
  });
  return done(data.orderId);
});
