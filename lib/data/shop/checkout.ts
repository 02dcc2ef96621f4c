import 'server-only';
import { Op, QueryTypes } from 'sequelize';
import { getDb } from '@/lib/db/index';
import { ConflictError, DomainError, TooManyError } from '@/lib/domain/errors';
import { parcelWeightGrams, shippingCents } from '@/lib/domain/shipping';
import type { CheckoutData } from '@/lib/schemas/checkout';
import type { SessionUser } from '@/lib/auth/session';
import { stripe } from '@/lib/payments/stripe';
import { appUrl } from '@/lib/config/app-url';
import { orderToken } from '@/lib/payments/order-token';
import { getSettings } from '@/lib/data/settings/settings';
import { reserveLines } from '@/lib/data/orders/stock';
import { releaseReservedLocked } from '@/lib/data/orders/stock';

/** How long a checkout holds its jars; the Checkout Session expires at the same moment. */
const RESERVE_MINUTES = 30;
// Stripe refuses expires_at under 30 min after the session's own creation time, which is a moment
// after ours: a little slack keeps the request valid (docs.stripe.com/api/checkout/sessions/create, expires_at).
const SLACK_SECONDS = 30;

/**
 * Checkout limits (docs/architecture.md, "Checkout limits"): a checkout holds real jars, so one
 * address or e-mail may start only so many, and hold only so many unpaid at once.
 */
export const CHECKOUT_LIMITS = {
  windowMinutes: 10,
  /** Checkouts started per client address in the window (a household or office shares one address). */
  startsPerAddress: 10,
  /** Checkouts started per e-mail in the window. */
  startsPerEmail: 5,
  /** Unpaid orders holding jars at once, per client address. */
  openPerAddress: 3,
  /** Unpaid orders holding jars at once, per e-mail. */
  openPerEmail: 2,
} as const;

export type StartedCheckout = { orderId: number; number: string; url: string };

/**
 * Refuses (429) a checkout past CHECKOUT_LIMITS. Counted from the orders table, so the limits hold
 * across app processes and restarts. 'local' (no address known: tests, scripts) counts like any other.
 */
async function assertWithinCheckoutLimits(email: string, ip: string): Promise<void> {
  const [row] = await getDb().sequelize.query<{
    startsIp: number;
    startsEmail: number;
    openIp: number;
    openEmail: number;
  }>(
    `SELECT
       count(*) FILTER (WHERE client_ip = :ip AND created_at > now() - make_interval(mins => :mins))::int AS "startsIp",
       count(*) FILTER (WHERE lower(email) = :email AND created_at > now() - make_interval(mins => :mins))::int AS "startsEmail",
       count(*) FILTER (WHERE client_ip = :ip AND status = 'awaiting_payment')::int AS "openIp",
       count(*) FILTER (WHERE lower(email) = :email AND status = 'awaiting_payment')::int AS "openEmail"
     FROM orders
     WHERE (client_ip = :ip OR lower(email) = :email)
       AND (status = 'awaiting_payment' OR created_at > now() - make_interval(mins => :mins))`,
    {
      type: QueryTypes.SELECT,
      replacements: { ip, email: email.toLowerCase(), mins: CHECKOUT_LIMITS.windowMinutes },
    },
  );
  if (row.openIp >= CHECKOUT_LIMITS.openPerAddress || row.openEmail >= CHECKOUT_LIMITS.openPerEmail)
    throw new TooManyError(
      'You already have unpaid orders holding jars. Finish paying for one, or cancel it from its payment page, then try again.',
    );
  if (row.startsIp >= CHECKOUT_LIMITS.startsPerAddress || row.startsEmail >= CHECKOUT_LIMITS.startsPerEmail)
    throw new TooManyError(
      `Too many checkouts in a short time. Please wait ${CHECKOUT_LIMITS.windowMinutes} minutes and try again.`,
    );
}

/**
 * Builds the order from OUR prices, reserves the jars (one transaction, row locks), then asks
 * Stripe for a Checkout Session and returns its URL. If Stripe fails the reservation is released.
 */
export async function startCheckout(
  input: CheckoutData,
  user: SessionUser | null,
  clientIp = 'local',
): Promise<StartedCheckout> {
  const { sequelize, models } = getDb();
  const email = user?.role === 'customer' ? user.email : input.email;
  await releaseOverdueReservations();
  await assertWithinCheckoutLimits(email, clientIp);
  const settings = await getSettings();
  const wanted = new Map<number, number>();
  for (const i of input.items) wanted.set(i.productId, (wanted.get(i.productId) ?? 0) + i.quantity);
  const products = await models.Product.findAll({ where: { id: [...wanted.keys()], active: true } });
  if (products.length !== wanted.size)
    throw new ConflictError('Something in your cart is no longer sold. Please check your cart.');
  const lines = products
    .map((p) => ({ product: p, quantity: wanted.get(p.id) as number }))
    .sort((a, b) => a.product.id - b.product.id);
  const subtotal = lines.reduce((s, l) => s + l.quantity * l.product.priceCents, 0);
  let shipping = 0;
  if (input.fulfilment === 'ship') {
    const weight = parcelWeightGrams(
      lines.map((l) => ({
        quantity: l.quantity,
        netGrams: l.product.netGrams,
        containerGrams: l.product.containerGrams,
      })),
    );
    const price = shippingCents(weight, settings.shippingBands ?? []);
    if (price === null)
      throw new ConflictError('This parcel is heavier than we ship. Please choose pickup or fewer jars.');
    shipping = price;
  }
  const expiresAt = Math.floor(Date.now() / 1000) + RESERVE_MINUTES * 60 + SLACK_SECONDS;

  const order = await sequelize.transaction(async (t) => {
    const [{ n }] = await sequelize.query<{ n: number }>(`SELECT nextval('order_number_seq')::int AS n`, {
      type: QueryTypes.SELECT,
      transaction: t,
    });
    const created = await models.Order.create(
      {
        number: `C-${n}`,
        customerId: user?.role === 'customer' ? user.id : null,
        email,
        clientIp: clientIp.slice(0, 64),
        name: input.name,
        phone: input.phone,
        fulfilment: input.fulfilment,
        shippingAddress: input.fulfilment === 'ship' && input.address ? { name: input.name, ...input.address } : null,
        subtotalCents: subtotal,
        shippingCents: shipping,
        totalCents: subtotal + shipping,
        currency: settings.currency,
        reservedUntil: new Date(expiresAt * 1000),
      },
      { transaction: t },
    );
    const toReserve = [];
    for (const l of lines) {
      const line = await models.OrderLine.create(
        {
          orderId: created.id,
          productId: l.product.id,
          productName: l.product.name,
          quantity: l.quantity,
          unitPriceCents: l.product.priceCents,
        },
        { transaction: t },
      );
      toReserve.push({ lineId: line.id, productId: l.product.id, productName: l.product.name, quantity: l.quantity });
    }
    await reserveLines(t, toReserve);
    return created;
  });

  const token = orderToken(order.number);
  try {
    const session = await stripe().checkout.sessions.create(
      {
        mode: 'payment',
        customer_email: order.email,
        client_reference_id: order.number,
        metadata: { orderId: String(order.id), orderNumber: order.number },
        payment_intent_data: { metadata: { orderId: String(order.id) } },
        line_items: [
          ...lines.map((l) => ({
            quantity: l.quantity,
            price_data: {
              currency: settings.currency,
              unit_amount: l.product.priceCents,
              product_data: { name: l.product.name },
            },
          })),
          ...(shipping > 0
            ? [
                {
                  quantity: 1,
                  price_data: {
                    currency: settings.currency,
                    unit_amount: shipping,
                    product_data: { name: 'Shipping' },
                  },
                },
              ]
            : []),
        ],
        success_url: `${appUrl()}/orders/${order.number}?t=${token}&session_id={CHECKOUT_SESSION_ID}`,
        cancel_url: `${appUrl()}/checkout/cancelled?order=${order.number}&t=${token}`,
        expires_at: expiresAt,
      },
      { idempotencyKey: `checkout-order-${order.id}-v1` },
    );
    await order.update({ stripeSessionId: session.id });
    if (!session.url) throw new Error('Stripe returned a session without a URL.');
    return { orderId: order.id, number: order.number, url: session.url };
  } catch (err) {
    await releaseOrder(order.id, 'cancelled', null, 'Could not start the card payment');
    console.error(`[checkout] order ${order.number}: Stripe session not created`, err);
    throw new DomainError(
      'unavailable',
      'The card payment service is not answering. Nothing was charged and your jars are back on the shelf; please try again in a minute.',
    );
  }
}

/**
 * Releases an unpaid order's reservation and closes it (expired session, sweep, cancel).
 * Does nothing unless the order is still awaiting payment; returns whether it changed.
 */
async function releaseOrder(
  orderId: number,
  status: 'expired' | 'cancelled',
  actorUserId: number | null,
  reason: string,
): Promise<boolean> {
  const { sequelize, models } = getDb();
  return sequelize.transaction(async (t) => {
    const order = await models.Order.findByPk(orderId, { transaction: t, lock: t.LOCK.UPDATE });
    if (!order || order.status !== 'awaiting_payment') return false;
    await releaseReservedLocked(t, order, status, actorUserId, reason);
    return true;
  });
}

/**
 * The buyer left Stripe's payment page (its cancel_url, checked by the caller): the jars go back at
 * once instead of after 30 minutes, and the Checkout Session is closed. Only an unpaid order changes.
 */
export async function cancelCheckout(orderNumber: string): Promise<void> {
  const order = await getDb().models.Order.findOne({ where: { number: orderNumber } });
  if (!order || order.status !== 'awaiting_payment') return;
  if (order.stripeSessionId)
    await stripe()
      .checkout.sessions.expire(order.stripeSessionId)
      .catch(() => undefined);
  await releaseOrder(order.id, 'cancelled', null, 'The customer left the payment page');
}

/** The sweep: unpaid orders past their reservation give their jars back. */
export async function releaseOverdueReservations(now = new Date()): Promise<number> {
  const { Order } = getDb().models;
  const overdue = await Order.findAll({
    where: { status: 'awaiting_payment', reservedUntil: { [Op.lt]: now } },
    attributes: ['id'],
    limit: 100,
  });
  let n = 0;
  for (const o of overdue) if (await releaseOrder(o.id, 'expired', null, 'Reservation time ran out')) n++;
  return n;
}
