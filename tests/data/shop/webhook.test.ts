import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import Stripe from 'stripe';
import { closeDb, getDb } from '@/lib/db/index';
import { POST as checkoutPOST } from '@/app/api/checkout/route';
import { POST as webhookPOST } from '@/app/api/stripe/webhook/route';
import { cancelOrderAction, markPackedAction, refundOrderAction } from '@/app/(back-office)/admin/orders/actions';
import { getOrderForViewer } from '@/lib/data/orders/read';
import { orderToken } from '@/lib/payments/order-token';
import { DEMO, signInAs, setRequestHeaders } from '@/tests/support/session';
import {
  guest,
  hook,
  makeProduct,
  orderOf,
  SHOP_WEBHOOK_SECRET,
  startOrder,
  startShopFake,
  stockOf,
  waitUntil,
  type ShopFake,
  checkoutRequest,
} from '@/tests/support/shop';

let shop: ShopFake;
beforeAll(async () => {
  shop = await startShopFake();
});
afterAll(async () => {
  await shop?.close();
  await closeDb();
});
beforeEach(async () => {
  setRequestHeaders({});
  await signInAs(null);
  await fetch(`${shop.fake.url}/_fake/config`, {
    method: 'POST',
    body: JSON.stringify({ deliverTwice: false, reverseOrder: false, failNext: 0 }),
  });
});

const signer = new Stripe('sk_test_signer');
const count = (table: string) =>
  getDb()
    .sequelize.query(`SELECT count(*)::int AS n FROM ${table}`, { plain: true })
    .then((r) => (r as { n: number }).n);

function deliver(payload: string, signature: string) {
  return webhookPOST(
    new Request('http://127.0.0.1/api/stripe/webhook', {
      method: 'POST',
      headers: { 'stripe-signature': signature },
      body: payload,
    }),
  );
}

async function paidEventFor(sessionId: string) {
  const events = await fetch(`${shop.fake.url}/_fake/events?type=checkout.session.completed&session=${sessionId}`).then(
    (r) => r.json(),
  );
  return (events.data[0] as { event: Stripe.Event }).event;
}

async function pay(sessionId: string, card = '4242424242424242') {
  return hook(shop.fake, `/_fake/sessions/${sessionId}/pay`, { card });
}

describe('the Stripe webhook', () => {
  it('marks the order paid, sells the reserved jars and queues the confirmation with lot codes', async () => {
    const p = await makeProduct('paid', [2, 5]);
    const order = await startOrder([{ productId: p.productId, quantity: 3 }]);
    expect((await pay(order.stripeSessionId!)).status).toBe(200);
    const paid = await waitUntil(
      () => orderOf(order.number),
      (o) => o?.status === 'paid',
    );
    expect(paid?.paymentIntentId).toMatch(/^pi_/);
    expect(await stockOf(p.productId)).toEqual([
      { lotId: p.lotIds[0], onHand: 0, reserved: 0 },
      { lotId: p.lotIds[1], onHand: 4, reserved: 0 },
    ]);
    const mail = await getDb().models.OutboxMessage.findOne({ where: { dedupeKey: `order-confirmed-${order.id}` } });
    expect(mail?.toAddress).toBe(order.email);
    const lots = await getDb().models.Lot.findAll({ where: { id: p.lotIds } });
    for (const lot of lots) expect(mail?.textBody).toContain(lot.code);
    expect(mail?.htmlBody).toContain('Honey is not for infants');
  });

  it('a replayed event changes nothing', async () => {
    const p = await makeProduct('replay', [5]);
    const order = await startOrder([{ productId: p.productId, quantity: 2 }]);
    await pay(order.stripeSessionId!);
    await waitUntil(
      () => orderOf(order.number),
      (o) => o?.status === 'paid',
    );
    const event = await paidEventFor(order.stripeSessionId!);
    const [stock, entries, mails] = [
      await stockOf(p.productId),
      await count('stock_entries'),
      await count('outbox_messages'),
    ];
    const payload = JSON.stringify(event);
    const res = await deliver(
      payload,
      signer.webhooks.generateTestHeaderString({ payload, secret: SHOP_WEBHOOK_SECRET }),
    );
    expect(res.status).toBe(200);
    expect((await res.json()).outcome).toBe('duplicate');
    expect(await stockOf(p.productId)).toEqual(stock);
    expect(await count('stock_entries')).toBe(entries);
    expect(await count('outbox_messages')).toBe(mails);
  });

  it('a bad signature is a 400 and changes nothing', async () => {
    const p = await makeProduct('badsig', [5]);
    const order = await startOrder([{ productId: p.productId, quantity: 2 }]);
    // A forged "paid" event for a real, unpaid order: tampered body, wrong secret, no header, too old.
    const forged = JSON.stringify({
      id: 'evt_forged_1',
      object: 'event',
      type: 'checkout.session.completed',
      data: {
        object: {
          id: order.stripeSessionId,
          object: 'checkout.session',
          payment_status: 'paid',
          metadata: { orderId: String(order.id) },
          payment_intent: 'pi_forged',
        },
      },
    });
    const events = await count('stripe_events');
    const wrongSecret = signer.webhooks.generateTestHeaderString({ payload: forged, secret: 'whsec_not_ours' });
    const good = signer.webhooks.generateTestHeaderString({
      payload: '{"id":"evt_other"}',
      secret: SHOP_WEBHOOK_SECRET,
    });
    const old = signer.webhooks.generateTestHeaderString({
      payload: forged,
      secret: SHOP_WEBHOOK_SECRET,
      timestamp: Math.floor(Date.now() / 1000) - 301,
    });
    for (const sig of [wrongSecret, good, old, '']) expect((await deliver(forged, sig)).status).toBe(400);
    expect(await count('stripe_events')).toBe(events);
    expect((await orderOf(order.number))?.status).toBe('awaiting_payment');
    expect((await stockOf(p.productId))[0]).toMatchObject({ onHand: 5, reserved: 2 });
  });

  it('events delivered twice are applied once', async () => {
    await fetch(`${shop.fake.url}/_fake/config`, { method: 'POST', body: JSON.stringify({ deliverTwice: true }) });
    const p = await makeProduct('twice', [5]);
    const order = await startOrder([{ productId: p.productId, quantity: 2 }]);
    await pay(order.stripeSessionId!);
    await waitUntil(
      async () => shop.webhookStatuses.length,
      () => false,
      600,
    );
    expect((await orderOf(order.number))?.status).toBe('paid');
    expect((await stockOf(p.productId))[0]).toEqual({ lotId: p.lotIds[0], onHand: 3, reserved: 0 });
    expect(await getDb().models.StockEntry.count({ where: { orderId: order.id } })).toBe(1);
  });

  it('an expiry that arrives after the payment is ignored', async () => {
    const p = await makeProduct('late-expiry', [5]);
    const order = await startOrder([{ productId: p.productId, quantity: 2 }]);
    await pay(order.stripeSessionId!);
    await waitUntil(
      () => orderOf(order.number),
      (o) => o?.status === 'paid',
    );
    const expired = {
      ...(await paidEventFor(order.stripeSessionId!)),
      id: 'evt_late_expiry_' + order.id,
      type: 'checkout.session.expired',
    };
    const payload = JSON.stringify(expired);
    const res = await deliver(
      payload,
      signer.webhooks.generateTestHeaderString({ payload, secret: SHOP_WEBHOOK_SECRET }),
    );
    expect((await res.json()).outcome).toBe('ignored');
    expect((await orderOf(order.number))?.status).toBe('paid');
    expect((await stockOf(p.productId))[0]).toEqual({ lotId: p.lotIds[0], onHand: 3, reserved: 0 });
  });

  it('a payment after the order was cancelled takes the jars again when there are enough', async () => {
    await signInAs(DEMO.crew);
    const p = await makeProduct('late-pay', [5]);
    const order = await startOrder([{ productId: p.productId, quantity: 2 }]);
    const sessionId = order.stripeSessionId!;
    // Stripe's session stays payable in this story: cancel only our side, then the buyer pays.
    await getDb().models.Order.update({ stripeSessionId: null }, { where: { id: order.id } });
    expect(await cancelOrderAction({ orderId: order.id })).toEqual({ ok: true });
    await getDb().models.Order.update({ stripeSessionId: sessionId }, { where: { id: order.id } });
    expect((await stockOf(p.productId))[0].reserved).toBe(0);
    await pay(sessionId);
    const paid = await waitUntil(
      () => orderOf(order.number),
      (o) => o?.status === 'paid',
    );
    expect(paid?.status).toBe('paid');
    expect((await stockOf(p.productId))[0]).toEqual({ lotId: p.lotIds[0], onHand: 3, reserved: 0 });
  });

  it('a payment after release with no jars left is flagged for a refund, not oversold', async () => {
    const p = await makeProduct('late-none', [2]);
    const order = await startOrder([{ productId: p.productId, quantity: 2 }]);
    const sessionId = order.stripeSessionId!;
    await getDb().models.Order.update({ stripeSessionId: null }, { where: { id: order.id } });
    await signInAs(DEMO.crew);
    await cancelOrderAction({ orderId: order.id });
    await getDb().models.Order.update({ stripeSessionId: sessionId }, { where: { id: order.id } });
    await signInAs(null);
    const other = await startOrder([{ productId: p.productId, quantity: 2 }]);
    await pay(sessionId);
    const flagged = await waitUntil(
      () => orderOf(order.number),
      (o) => Boolean(o?.paidAt),
    );
    expect(flagged?.status).toBe('cancelled');
    expect(flagged?.paymentIntentId).toMatch(/^pi_/);
    expect((await stockOf(p.productId))[0]).toEqual({ lotId: p.lotIds[0], onHand: 2, reserved: 2 });
    expect(await getDb().models.OutboxMessage.count({ where: { dedupeKey: `order-needs-refund-${order.id}` } })).toBe(
      1,
    );
    expect((await orderOf(other.number))?.status).toBe('awaiting_payment');
  });
});

describe('the order desk', () => {
  it('a refund returns jars to stock, records the refund and tells the customer', async () => {
    const p = await makeProduct('refund', [4], 1000);
    const order = await startOrder([{ productId: p.productId, quantity: 3 }]);
    await pay(order.stripeSessionId!);
    await waitUntil(
      () => orderOf(order.number),
      (o) => o?.status === 'paid',
    );
    const line = await getDb().models.OrderLine.findOne({ where: { orderId: order.id } });
    await signInAs(DEMO.customer);
    expect(
      await refundOrderAction({
        orderId: order.id,
        amount: 20,
        jars: [{ lineId: line!.id, quantity: 2 }],
        restock: true,
      }),
    ).toMatchObject({ ok: false });
    await signInAs(DEMO.crew);
    const result = await refundOrderAction({
      orderId: order.id,
      amount: 20,
      jars: [{ lineId: line!.id, quantity: 2 }],
      restock: true,
      reason: 'Two jars arrived cracked',
    });
    expect(result).toEqual({ ok: true });
    expect(await stockOf(p.productId)).toEqual([{ lotId: p.lotIds[0], onHand: 1 + 2, reserved: 0 }]);
    const after = await orderOf(order.number);
    expect(after?.refundedCents).toBe(2000);
    expect(after?.status).toBe('paid');
    const refund = await getDb().models.Refund.findOne({ where: { orderId: order.id } });
    expect(refund).toMatchObject({ amountCents: 2000, restock: true });
    expect(refund?.stripeRefundId).toMatch(/^re_/);
    expect(await getDb().models.StockEntry.sum('delta', { where: { orderId: order.id, kind: 'return' } })).toBe(2);
    expect(await getDb().models.OutboxMessage.count({ where: { dedupeKey: `order-refund-${refund!.id}` } })).toBe(1);
    // The charge.refunded webhook races back and must not count the money twice.
    await waitUntil(
      () =>
        fetch(`${shop.fake.url}/_fake/events?type=charge.refunded`)
          .then((r) => r.json())
          .then((j) => j.data.length),
      (n) => n > 0,
    );
    await new Promise((r) => setTimeout(r, 200));
    expect((await orderOf(order.number))?.refundedCents).toBe(2000);
    // The rest, written off: stock stays; the order is now fully refunded.
    expect(
      await refundOrderAction({
        orderId: order.id,
        amount: 10,
        jars: [{ lineId: line!.id, quantity: 1 }],
        restock: false,
      }),
    ).toEqual({ ok: true });
    expect(await stockOf(p.productId)).toEqual([{ lotId: p.lotIds[0], onHand: 3, reserved: 0 }]);
    expect((await orderOf(order.number))?.status).toBe('refunded');
    expect(await refundOrderAction({ orderId: order.id, amount: 1, jars: [], restock: false })).toMatchObject({
      ok: false,
      message: expect.stringMatching(/left to refund/),
    });
  });

  it('mark packed needs a paid order, and a pickup order gets a ready mail', async () => {
    const p = await makeProduct('pack', [3]);
    const order = await startOrder([{ productId: p.productId, quantity: 1 }]);
    await signInAs(DEMO.crew);
    expect(await markPackedAction({ orderId: order.id })).toMatchObject({
      ok: false,
      message: expect.stringMatching(/awaiting payment/),
    });
    await pay(order.stripeSessionId!);
    await waitUntil(
      () => orderOf(order.number),
      (o) => o?.status === 'paid',
    );
    expect(await markPackedAction({ orderId: order.id })).toEqual({ ok: true });
    expect(await getDb().models.OutboxMessage.count({ where: { dedupeKey: `order-ready-${order.id}` } })).toBe(1);
  });
});

describe('who sees an order', () => {
  it('its customer, staff and the signed link; another customer or a forged link gets nothing', async () => {
    const p = await makeProduct('view', [3]);
    const mine = await signInAs(DEMO.customer);
    const res = await checkoutPOST(checkoutRequest(guest([{ productId: p.productId, quantity: 1 }])));
    const { number } = (await res.json()) as { number: string };
    const asOwner = await getOrderForViewer(
      number,
      { id: mine!.id, name: 'c', email: DEMO.customer, role: 'customer' },
      null,
    );
    expect(asOwner?.number).toBe(number);
    const other = await getDb().models.User.findOne({ where: { role: 'customer', email: 'corin@hollowmere.test' } });
    expect(
      await getOrderForViewer(number, { id: other!.id, name: 'x', email: other!.email, role: 'customer' }, null),
    ).toBeNull();
    expect(await getOrderForViewer(number, null, 'AAAAAAAAAAAAAAAAAAAAAA')).toBeNull();
    expect((await getOrderForViewer(number, null, orderToken(number)))?.number).toBe(number);
    expect((await getOrderForViewer(number, { id: 1, name: 'o', email: DEMO.crew, role: 'crew' }, null))?.number).toBe(
      number,
    );
    // The page itself: another customer gets a 404, the owner gets the page.
    const { default: OrderPage } = await import('@/app/(storefront)/orders/[number]/page');
    const open = () => OrderPage({ params: Promise.resolve({ number }), searchParams: Promise.resolve({}) });
    await signInAs('corin@hollowmere.test');
    await expect(open()).rejects.toThrow('NEXT_NOT_FOUND');
    await signInAs(DEMO.customer);
    await expect(open()).resolves.toBeTruthy();
  });
});

describe('packing slip', () => {
  it('is a PDF for staff, refused to customers and strangers', async () => {
    const { GET } = await import('@/app/(back-office)/admin/orders/[id]/packing-slip/route');
    const p = await makeProduct('slip', [3]);
    const order = await startOrder([{ productId: p.productId, quantity: 2 }]);
    await pay(order.stripeSessionId!);
    await waitUntil(
      () => orderOf(order.number),
      (o) => o?.status === 'paid',
    );
    const call = () => GET(new Request('http://127.0.0.1/x'), { params: Promise.resolve({ id: String(order.id) }) });
    await signInAs(null);
    expect((await call()).status).toBe(401);
    await signInAs(DEMO.customer);
    expect((await call()).status).toBe(403);
    await signInAs(DEMO.crew);
    const res = await call();
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('application/pdf');
    const bytes = new Uint8Array(await res.arrayBuffer());
    expect(new TextDecoder().decode(bytes.slice(0, 5))).toBe('%PDF-');
  });
});
