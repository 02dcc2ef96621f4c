import 'server-only';
import { createHash, randomUUID } from 'node:crypto';
import { getDb } from '@/lib/db/index';
import { ConflictError, InvalidError, NotFoundError } from '@/lib/domain/errors';
import { enqueueMail } from '@/lib/mail/outbox';
import { orderReadyMail, orderRefundMail, orderShippedMail } from '@/lib/mail/order-mails';
import { stripe } from '@/lib/payments/stripe';
import { appUrl } from '@/lib/config/app-url';
import { orderToken } from '@/lib/payments/order-token';
import type { OrderStatus } from '@/lib/domain/order-status';
import { recordAudit } from '@/lib/data/audit';
import { getSettings } from '@/lib/data/settings/settings';
import { getOrderDetail } from './read';
import { orderAllocations, releaseReservedLocked, returnSold } from './stock';

/** The order desk's writes (owner, crew). Each locks the order row and records an audit entry. */

const STEP: Record<
  'packed' | 'shipped' | 'picked_up',
  { from: OrderStatus[]; stamp: 'packedAt' | 'shippedAt' | 'pickedUpAt' }
> = {
  packed: { from: ['paid'], stamp: 'packedAt' },
  shipped: { from: ['paid', 'packed'], stamp: 'shippedAt' },
  picked_up: { from: ['paid', 'packed'], stamp: 'pickedUpAt' },
};

const link = (number: string) => `${appUrl()}/orders/${number}?t=${orderToken(number)}`;

export async function advanceOrder(
  actorUserId: number,
  orderId: number,
  to: 'packed' | 'shipped' | 'picked_up',
  tracking = '',
): Promise<void> {
  const { sequelize, models } = getDb();
  const settings = await getSettings();
  await sequelize.transaction(async (t) => {
    const order = await models.Order.findByPk(orderId, { transaction: t, lock: t.LOCK.UPDATE });
    if (!order) throw new NotFoundError('No such order.');
    const step = STEP[to];
    if (!step.from.includes(order.status))
      throw new ConflictError(
        `Order ${order.number} is ${order.status.replace('_', ' ')}; it cannot be marked ${to.replace('_', ' ')}.`,
      );
    if (to === 'shipped' && order.fulfilment !== 'ship')
      throw new ConflictError('This order is for pickup; mark it picked up instead.');
    if (to === 'picked_up' && order.fulfilment !== 'pickup')
      throw new ConflictError('This order is shipped, not picked up.');
    const before = { status: order.status };
    await order.update(
      { status: to, [step.stamp]: new Date(), ...(to === 'shipped' ? { tracking: tracking || null } : {}) },
      { transaction: t },
    );
    await recordAudit(
      {
        actorUserId,
        action: `order.${to}`,
        entityType: 'order',
        entityId: order.id,
        before,
        after: { status: to, ...(to === 'shipped' ? { tracking } : {}) },
      },
      t,
    );
    const detail = await getOrderDetail(order.id, t);
    if (!detail) return;
    const ctx = { business: settings.businessName, link: link(order.number), address: settings.address };
    if (to === 'packed' && order.fulfilment === 'pickup') await enqueueMail(orderReadyMail(detail, ctx), t);
    if (to === 'shipped') await enqueueMail(orderShippedMail(detail, ctx), t);
  });
}

/** Cancels an unpaid order: its jars go back at once and its payment page is closed. */
export async function cancelUnpaidOrder(actorUserId: number, orderId: number): Promise<void> {
  const { sequelize, models } = getDb();
  const sessionId = await sequelize.transaction(async (t) => {
    const order = await models.Order.findByPk(orderId, { transaction: t, lock: t.LOCK.UPDATE });
    if (!order) throw new NotFoundError('No such order.');
    if (order.status !== 'awaiting_payment')
      throw new ConflictError('Only an order still awaiting payment can be cancelled; refund a paid one.');
    await releaseReservedLocked(t, order, 'cancelled', actorUserId, 'Cancelled at the order desk');
    return order.stripeSessionId;
  });
  // If the buyer pays in the meantime, the webhook sees a cancelled order and takes the jars again or flags a refund.
  if (sessionId)
    await stripe()
      .checkout.sessions.expire(sessionId)
      .catch(() => undefined);
}

export type RefundRequest = {
  orderId: number;
  amountCents: number;
  jars: { lineId: number; quantity: number }[];
  restock: boolean;
  reason: string;
  /** The refund form's own key (one per form shown); a request without one is never a repeat. */
  requestKey?: string;
};

/**
 * The idempotency key of a refund: derived from what is refunded (order, amount, jars) and the form's
 * request key, so the same refund sent twice (double click, retry, two people at once) is one refund
 * at Stripe, and a refund row with this key already in the table refuses the repeat before any money moves.
 */
export function refundKey(r: RefundRequest): string {
  const jars = r.jars
    .filter((j) => j.quantity > 0)
    .map((j) => `${j.lineId}x${j.quantity}`)
    .sort()
    .join(',');
  const what = [r.orderId, r.amountCents, jars, r.restock ? 'restock' : 'writeoff', r.requestKey ?? randomUUID()].join(
    '|',
  );
  return `refund-${r.orderId}-${createHash('sha256').update(what).digest('hex').slice(0, 32)}`;
}

/** How long the refund waits for Stripe while it holds the order (the row lock): the refund desk, not the shop, waits. */
const STRIPE_REFUND_TIMEOUT_MS = 20_000;

/**
 * Refunds fully or partly through Stripe, in ONE transaction that holds the order row locked from
 * the checks until the refund is recorded: a second refund of the same order (another person, a
 * double click) waits, then sees the money and jars already refunded and is refused before Stripe
 * is called. Stripe is asked with a key derived from the request (refundKey), so a repeat of the same
 * request is refused here or answered by Stripe with the first refund, never a second one. Whatever
 * Stripe did is recorded in the same transaction: the refund row, jars back to stock or written off,
 * the audit entry (with Stripe's refund id and status) and the customer's mail. If Stripe refuses,
 * the transaction rolls back and nothing changed.
 */
export async function refundOrder(actorUserId: number, r: RefundRequest): Promise<{ refundId: number }> {
  const { sequelize, models } = getDb();
  if (!Number.isInteger(r.amountCents) || r.amountCents <= 0) throw new InvalidError('Enter an amount to refund.');
  const key = refundKey(r);
  const settings = await getSettings();
  return sequelize.transaction(async (t) => {
    const order = await models.Order.findByPk(r.orderId, { transaction: t, lock: t.LOCK.UPDATE });
    if (!order) throw new NotFoundError('No such order.');
    if (await models.Refund.findOne({ where: { requestKey: key }, transaction: t }))
      throw new ConflictError(`This refund of order ${order.number} was already made; nothing more was refunded.`);
    if (!order.paidAt) throw new ConflictError('This order was never paid; cancel it instead.');
    if (!order.paymentIntentId)
      throw new ConflictError(
        'This order was not paid by card through the shop, so it cannot be refunded here; refund it by hand.',
      );
    const left = order.totalCents - order.refundedCents;
    if (r.amountCents > left)
      throw new ConflictError(`At most ${left} cents are left to refund on order ${order.number}.`);
    // Check the jars before any money moves: a refund that Stripe made must not fail afterwards.
    const sold = await orderAllocations(t, order.id, 'sold');
    for (const j of r.jars) {
      const have = sold.filter((a) => a.lineId === j.lineId).reduce((s, a) => s + a.quantity, 0);
      if (j.quantity > have)
        throw new ConflictError(`Only ${have} jar${have === 1 ? '' : 's'} of that line can be returned.`);
    }
    const refund = await models.Refund.create(
      {
        orderId: order.id,
        amountCents: r.amountCents,
        restock: r.restock,
        reason: r.reason,
        createdBy: actorUserId,
        requestKey: key,
      },
      { transaction: t },
    );

    let stripeRefund: { id: string; status: string | null };
    try {
      const made = await stripe().refunds.create(
        {
          payment_intent: order.paymentIntentId,
          amount: r.amountCents,
          reason: 'requested_by_customer',
          metadata: { orderId: String(order.id), refundId: String(refund.id) },
        },
        { idempotencyKey: key, timeout: STRIPE_REFUND_TIMEOUT_MS },
      );
      stripeRefund = { id: made.id, status: made.status ?? null };
    } catch (err) {
      console.error(`[refund] order ${order.number}: Stripe refused or did not answer`, err);
      const message =
        err instanceof Error && 'type' in err
          ? `The card payment service refused the refund: ${err.message}`
          : 'The card payment service could not be reached; nothing was refunded. Try again: the same refund is never made twice.';
      throw new ConflictError(message);
    }

    await refund.update({ stripeRefundId: stripeRefund.id }, { transaction: t });
    const refundedCents = order.refundedCents + r.amountCents;
    const before = { status: order.status, refundedCents: order.refundedCents };
    const full = refundedCents >= order.totalCents;
    await order.update(
      {
        refundedCents,
        ...(full && !['expired', 'cancelled'].includes(order.status) ? { status: 'refunded' as const } : {}),
      },
      { transaction: t },
    );
    for (const j of r.jars.filter((x) => x.quantity > 0)) {
      await returnSold(t, {
        orderId: order.id,
        orderNumber: order.number,
        lineId: j.lineId,
        quantity: j.quantity,
        restock: r.restock,
        actorUserId,
      });
    }
    await recordAudit(
      {
        actorUserId,
        action: 'order.refund',
        entityType: 'order',
        entityId: order.id,
        before,
        after: {
          status: order.status,
          refundedCents,
          amountCents: r.amountCents,
          jars: r.jars,
          restock: r.restock,
          stripeRefundId: stripeRefund.id,
          stripeStatus: stripeRefund.status,
        },
        reason: r.reason || null,
      },
      t,
    );
    const detail = await getOrderDetail(order.id, t);
    if (detail)
      await enqueueMail(
        orderRefundMail(detail, {
          business: settings.businessName,
          link: link(order.number),
          amountCents: r.amountCents,
          refundId: refund.id,
        }),
        t,
      );
    return { refundId: refund.id };
  });
}
