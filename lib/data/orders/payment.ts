import 'server-only';
import type Stripe from 'stripe';
import type { Transaction } from 'sequelize';
import { getDb } from '@/lib/db/index';
import { DomainError } from '@/lib/domain/errors';
import { enqueueMail } from '@/lib/mail/outbox';
import { orderConfirmationMail, paidAfterReleaseMail } from '@/lib/mail/order-mails';
import { appUrl } from '@/lib/config/app-url';
import { orderToken } from '@/lib/payments/order-token';
import type { Order } from '@/models/order';
import { recordAudit } from '@/lib/data/audit';
import { getSettings } from '@/lib/data/settings/settings';
import { getOrderDetail } from './read';
import { orderAllocations, releaseReservedLocked, reserveLines, sellReserved } from './stock';

export type EventOutcome = 'duplicate' | 'ignored' | 'paid' | 'paid-needs-refund' | 'released' | 'refund-recorded';

/**
 * Applies one verified Stripe event. Claiming the event id (INSERT … ON CONFLICT DO NOTHING) and
 * every change it causes share ONE transaction: a replayed or concurrent duplicate changes nothing,
 * and a failure leaves no claim behind, so Stripe's retry is processed afresh.
 * Events may arrive in any order; each handler checks the order's state before acting.
 */
export async function applyStripeEvent(event: Stripe.Event): Promise<{ outcome: EventOutcome; mail: boolean }> {
  const { sequelize } = getDb();
  let mail = false;
  const outcome = await sequelize.transaction(async (t): Promise<EventOutcome> => {
    const [claimed] = await sequelize.query(
      `INSERT INTO stripe_events (id, type, received_at) VALUES (:id, :type, now()) ON CONFLICT (id) DO NOTHING RETURNING id`,
      { replacements: { id: event.id, type: event.type }, transaction: t },
    );
    if ((claimed as unknown[]).length === 0) return 'duplicate';
    switch (event.type) {
      case 'checkout.session.completed':
      case 'checkout.session.async_payment_succeeded': {
        const r = await sessionCompleted(t, event.data.object);
        mail = r !== 'ignored';
        return r;
      }
      case 'checkout.session.expired':
        return sessionExpired(t, event.data.object);
      case 'charge.refunded':
        return chargeRefunded(t, event.data.object);
      default:
        return 'ignored';
    }
  });
  return { outcome, mail };
}

async function orderForSession(t: Transaction, session: Stripe.Checkout.Session): Promise<Order | null> {
  const { Order } = getDb().models;
  const id = Number(session.metadata?.orderId);
  const byId =
    Number.isInteger(id) && id > 0 ? await Order.findByPk(id, { transaction: t, lock: t.LOCK.UPDATE }) : null;
  if (byId && (!byId.stripeSessionId || byId.stripeSessionId === session.id)) return byId;
  return Order.findOne({ where: { stripeSessionId: session.id }, transaction: t, lock: t.LOCK.UPDATE });
}

async function sessionCompleted(t: Transaction, session: Stripe.Checkout.Session): Promise<EventOutcome> {
  if (session.payment_status !== 'paid') return 'ignored';
  const order = await orderForSession(t, session);
  if (!order || order.paidAt) return 'ignored';
  const paymentIntentId =
    typeof session.payment_intent === 'string' ? session.payment_intent : (session.payment_intent?.id ?? null);
  const settings = await getSettings();
  const link = `${appUrl()}/orders/${order.number}?t=${orderToken(order.number)}`;
  const paid = { paidAt: new Date(), paymentIntentId, stripeSessionId: session.id, reservedUntil: null };

  if (order.status === 'expired' || order.status === 'cancelled') {
    // Paid after the reservation was released (out-of-order or late events): take the jars again if we can.
    const lines = await getDb().models.OrderLine.findAll({ where: { orderId: order.id }, transaction: t });
    const reReserved = await getDb().sequelize.transaction({ transaction: t }, async (sp) => {
      try {
        await reserveLines(
          sp,
          lines.map((l) => ({
            lineId: l.id,
            productId: l.productId,
            productName: l.productName,
            quantity: l.quantity,
          })),
        );
        return true;
      } catch (err) {
        if (err instanceof DomainError) return false;
        throw err;
      }
    });
    if (!reReserved) {
      const before = order.status;
      await order.update(paid, { transaction: t });
      await recordAudit(
        {
          actorUserId: null,
          action: 'order.paid_without_stock',
          entityType: 'order',
          entityId: order.id,
          before: { status: before },
          after: { paymentIntentId },
          reason: 'Paid after its reservation was released; not enough jars left',
        },
        t,
      );
      const detail = await getOrderDetail(order.id, t);
      if (detail && settings.contactEmail) {
        await enqueueMail(
          paidAfterReleaseMail(detail, {
            business: settings.businessName,
            link: `${appUrl()}/admin/orders/${order.id}`,
            to: settings.contactEmail,
          }),
          t,
        );
      }
      return 'paid-needs-refund';
    }
  } else if (order.status !== 'awaiting_payment') {
    return 'ignored';
  }

  const before = order.status;
  await sellReserved(t, order.id, order.number);
  await order.update({ ...paid, status: 'paid' }, { transaction: t });
  await recordAudit(
    {
      actorUserId: null,
      action: 'order.paid',
      entityType: 'order',
      entityId: order.id,
      before: { status: before },
      after: {
        status: 'paid',
        paymentIntentId,
        lots: (await orderAllocations(t, order.id, 'sold')).map((a) => `${a.lotCode}×${a.quantity}`),
      },
    },
    t,
  );
  const detail = await getOrderDetail(order.id, t);
  if (detail)
    await enqueueMail(
      orderConfirmationMail(detail, { business: settings.businessName, link, address: settings.address }),
      t,
    );
  return 'paid';
}

async function sessionExpired(t: Transaction, session: Stripe.Checkout.Session): Promise<EventOutcome> {
  const order = await orderForSession(t, session);
  // An expiry that arrives after the payment (or after a cancel) has nothing left to do.
  if (!order || order.status !== 'awaiting_payment') return 'ignored';
  await releaseReservedLocked(t, order, 'expired', null, 'The checkout session expired');
  return 'released';
}

async function chargeRefunded(t: Transaction, charge: Stripe.Charge): Promise<EventOutcome> {
  const { Order } = getDb().models;
  const pi = typeof charge.payment_intent === 'string' ? charge.payment_intent : charge.payment_intent?.id;
  if (!pi) return 'ignored';
  const order = await Order.findOne({ where: { paymentIntentId: pi }, transaction: t, lock: t.LOCK.UPDATE });
  if (!order) return 'ignored';
  // Refunds made at the desk are already counted; one made elsewhere (e.g. Stripe's dashboard) is
  // caught up here. amount_refunded is a running total, so applying it twice changes nothing.
  const refunded = Math.min(order.totalCents, Math.max(order.refundedCents, charge.amount_refunded));
  const status =
    refunded >= order.totalCents && order.paidAt && !['expired', 'cancelled'].includes(order.status)
      ? 'refunded'
      : order.status;
  if (refunded === order.refundedCents && status === order.status) return 'ignored';
  await order.update({ refundedCents: refunded, status }, { transaction: t });
  await recordAudit(
    {
      actorUserId: null,
      action: 'order.refund_seen',
      entityType: 'order',
      entityId: order.id,
      after: { refundedCents: refunded, status },
      reason: 'Stripe reported a refund',
    },
    t,
  );
  return 'refund-recorded';
}
