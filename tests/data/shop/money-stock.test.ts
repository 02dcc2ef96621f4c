import { afterAll, beforeAll, beforeEach, describe, expect, it, vi } from 'vitest';
import Stripe from 'stripe';
import { QueryTypes } from 'sequelize';
import { closeDb, getDb } from '@/lib/db/index';
import { POST as checkoutPOST } from '@/app/api/checkout/route';
import { POST as webhookPOST } from '@/app/api/stripe/webhook/route';
import { signInAs, setRequestHeaders } from '@/tests/support/session';
import { failOnce } from '@/tests/support/fail-once';
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

// Money and stock: multi-line checkouts under contention, and a webhook whose
// handling fails once and is redelivered. Each story ends with exactly one effect.

let shop: ShopFake;
// The fake's own webhook retry waits a minute, so a test can look at the database between a failed
// delivery and the redelivery it makes itself (the same event, freshly signed, as Stripe does).
beforeAll(async () => {
  shop = await startShopFake({ retryBaseMs: 60_000 });
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

type Item = { productId: number; quantity: number };
type EventRecord = { event: Stripe.Event; attempts: { status: number | null }[] };

const signer = new Stripe('sk_test_signer');
const select = <T extends object>(sql: string, replacements: Record<string, unknown> = {}) =>
  getDb().sequelize.query<T>(sql, { type: QueryTypes.SELECT, replacements });
const post = (items: Item[]) => checkoutPOST(checkoutRequest(guest(items)));

function deliver(event: Stripe.Event) {
  const payload = JSON.stringify(event, null, 2);
  const signature = signer.webhooks.generateTestHeaderString({ payload, secret: SHOP_WEBHOOK_SECRET });
  return webhookPOST(
    new Request('http://127.0.0.1/api/stripe/webhook', {
      method: 'POST',
      headers: { 'stripe-signature': signature },
      body: payload,
    }),
  );
}

const eventRecord = (type: string, sessionId: string) =>
  waitUntil(
    () =>
      fetch(`${shop.fake.url}/_fake/events?type=${type}&session=${sessionId}`)
        .then((r) => r.json())
        .then((j) => j.data[0] as EventRecord | undefined),
    (r) => (r?.attempts.length ?? 0) > 0,
  ).then((r) => r!);

/** What an order has left in the tables a paid or expired event touches. */
async function traces(orderId: number, eventId: string) {
  const { StockEntry, OutboxMessage, AuditEntry, StripeEvent } = getDb().models;
  const [allocations, order] = await Promise.all([
    select<{ state: string }>(
      `SELECT a.state FROM order_allocations a JOIN order_lines ol ON ol.id = a.order_line_id WHERE ol.order_id = :orderId ORDER BY a.id`,
      { orderId },
    ),
    getDb().models.Order.findByPk(orderId),
  ]);
  return {
    status: order?.status,
    paidAt: order?.paidAt ?? null,
    allocations: allocations.map((a) => a.state),
    ledgerEntries: await StockEntry.count({ where: { orderId } }),
    ledgerDelta: (await StockEntry.sum('delta', { where: { orderId } })) ?? 0,
    confirmationMails: await OutboxMessage.count({ where: { dedupeKey: `order-confirmed-${orderId}` } }),
    audit: (
      await AuditEntry.findAll({ where: { entityType: 'order', entityId: String(orderId) }, order: [['id', 'ASC']] })
    ).map((e) => e.action),
    eventRecorded: await StripeEvent.count({ where: { id: eventId } }),
  };
}

describe('multi-line checkouts under contention', () => {
  it('48 simultaneous checkouts of 2–3 lines in opposite orders reserve all their lines or none; paying and expiring them at once moves each jar once', async () => {
    const a = await makeProduct('multi-a', [3, 2]);
    const b = await makeProduct('multi-b', [4]);
    const c = await makeProduct('multi-c', [3]);
    const lotsOf = new Map([
      [a.productId, [3, 2]],
      [b.productId, [4]],
      [c.productId, [3]],
    ]);
    const ids = [...lotsOf.keys()];
    const total = (productId: number) => lotsOf.get(productId)!.reduce((s, n) => s + n, 0);
    // The same pairs in opposite orders (A+B / B+A, A+B+C / C+B+A, …): locks taken in cart order would deadlock.
    const carts: [typeof a, number][][] = [
      [
        [a, 1],
        [b, 1],
      ],
      [
        [b, 1],
        [a, 1],
      ],
      [
        [a, 1],
        [b, 1],
        [c, 1],
      ],
      [
        [c, 1],
        [b, 1],
        [a, 1],
      ],
      [
        [b, 2],
        [c, 1],
      ],
      [
        [c, 1],
        [a, 2],
      ],
      [
        [a, 1],
        [c, 1],
        [b, 1],
      ],
      [
        [c, 2],
        [b, 1],
      ],
    ];
    const requests = Array.from({ length: 48 }, (_, i) =>
      carts[i % carts.length].map(([p, quantity]) => ({ productId: p.productId, quantity })),
    );

    const answers = await Promise.all(requests.map((items) => post(items)));
    const bodies = await Promise.all(answers.map((r) => r.json() as Promise<{ number?: string; error?: string }>));

    // Nothing but "reserved" or "not enough jars": no 5xx, no deadlock (40P01) or serialization error leaking.
    expect(
      answers
        .map((r, i) => ({ status: r.status, body: bodies[i] }))
        .filter((x) => x.status !== 200 && x.status !== 409),
    ).toEqual([]);
    const refused = bodies.filter((_, i) => answers[i].status === 409).map((b) => b.error ?? '');
    for (const message of refused) {
      expect(message).toMatch(/^(Test honey \S+ is sold out\.|Only \d+ jars? of Test honey \S+ (is|are) left\.)( |$)/);
      expect(message).not.toMatch(/deadlock|40P01|40001|serializ/i);
    }
    const okIndexes = answers.map((r, i) => (r.status === 200 ? i : -1)).filter((i) => i >= 0);
    // The stock is small enough that both outcomes happen.
    expect(okIndexes.length).toBeGreaterThan(0);
    expect(refused.length).toBeGreaterThan(0);

    // All or none, read from the tables: the orders holding these products are exactly the answered
    // ones, each with every line fully reserved; a refused checkout left no order, line or allocation.
    const lines = await select<{
      number: string;
      productId: number;
      quantity: number;
      reserved: number;
      other: number;
      status: string;
    }>(
      `SELECT o.number, o.status, ol.product_id AS "productId", ol.quantity,
              COALESCE(SUM(a.quantity) FILTER (WHERE a.state = 'reserved'), 0)::int AS reserved,
              COUNT(a.id) FILTER (WHERE a.state <> 'reserved')::int AS other
       FROM order_lines ol JOIN orders o ON o.id = ol.order_id LEFT JOIN order_allocations a ON a.order_line_id = ol.id
       WHERE ol.product_id IN (:ids) GROUP BY o.number, o.status, ol.id ORDER BY o.number, ol.product_id`,
      { ids },
    );
    const expected = okIndexes
      .flatMap((i) =>
        [...requests[i]]
          .sort((x, y) => x.productId - y.productId)
          .map((l) => ({
            number: bodies[i].number!,
            status: 'awaiting_payment',
            productId: l.productId,
            quantity: l.quantity,
            reserved: l.quantity,
            other: 0,
          })),
      )
      .sort((x, y) => (x.number === y.number ? x.productId - y.productId : x.number < y.number ? -1 : 1));
    expect(lines).toEqual(expected);

    // Per product: stock_levels agree with the allocations, never more reserved than there was.
    const reservedBy = (productId: number) =>
      lines.filter((l) => l.productId === productId).reduce((s, l) => s + l.reserved, 0);
    const levels = await select<{ productId: number; onHand: number; reserved: number }>(
      `SELECT product_id AS "productId", SUM(on_hand)::int AS "onHand", SUM(reserved)::int AS reserved FROM stock_levels WHERE product_id IN (:ids) GROUP BY product_id ORDER BY product_id`,
      { ids },
    );
    expect(levels).toEqual(ids.map((id) => ({ productId: id, onHand: total(id), reserved: reservedBy(id) })));
    for (const id of ids) expect(reservedBy(id)).toBeLessThanOrEqual(total(id));

    // Everyone pays or lets the session expire at the same moment, across the same products.
    const orders = await Promise.all(okIndexes.map((i) => orderOf(bodies[i].number!)));
    const settle = orders.map((o, n) => ({ order: o!, pays: n % 2 === 0 }));
    const deliveredBefore = shop.webhookStatuses.length;
    const hooks = await Promise.all(
      settle.map(({ order, pays }) =>
        hook(
          shop.fake,
          `/_fake/sessions/${order.stripeSessionId}/${pays ? 'pay' : 'expire'}`,
          pays ? { card: '4242424242424242' } : {},
        ),
      ),
    );
    expect(hooks.map((h) => h.status)).toEqual(settle.map(() => 200));
    const numbers = settle.map((s) => s.order.number);
    const settled = await waitUntil(
      () => getDb().models.Order.count({ where: { number: numbers, status: ['paid', 'expired'] } }),
      (n) => n === numbers.length,
      20_000,
    );
    expect(shop.webhookStatuses.slice(deliveredBefore).filter((s) => s !== 200)).toEqual([]);
    expect(settled).toBe(numbers.length);
    for (const { order, pays } of settle) expect((await orderOf(order.number))?.status).toBe(pays ? 'paid' : 'expired');

    // Sold jars left stock once each, released ones came back, and the ledger explains every row.
    const soldOf = (productId: number) =>
      settle
        .filter((s) => s.pays)
        .flatMap((s) => lines.filter((l) => l.number === s.order.number && l.productId === productId))
        .reduce((n, l) => n + l.quantity, 0);
    for (const id of ids) {
      const rows = await stockOf(id);
      expect(rows.reduce((s, r) => s + r.onHand, 0)).toBe(total(id) - soldOf(id));
      expect(rows.map((r) => r.reserved)).toEqual(rows.map(() => 0));
      // What orders took from the ledger is what was sold (compared as a sum: 0 and -0 are the same jars).
      const ordered = (await getDb().models.StockEntry.sum('delta', { where: { productId: id, kind: 'order' } })) ?? 0;
      expect(ordered + soldOf(id)).toBe(0);
      for (const [n, r] of rows.entries()) {
        const moved = (await getDb().models.StockEntry.sum('delta', { where: { productId: id, lotId: r.lotId } })) ?? 0;
        expect(r.onHand).toBe(lotsOf.get(id)![n] + moved);
      }
    }
    const states = await select<{ state: string; n: number }>(
      `SELECT a.state, count(*)::int AS n FROM order_allocations a JOIN order_lines ol ON ol.id = a.order_line_id WHERE ol.product_id IN (:ids) GROUP BY a.state ORDER BY a.state`,
      { ids },
    );
    expect(states.map((s) => s.state).filter((s) => s !== 'sold' && s !== 'released')).toEqual([]);

    // Under all of it, the CHECK refuses a reservation beyond what is on the shelf.
    await expect(
      getDb().sequelize.query(`UPDATE stock_levels SET reserved = on_hand + 1 WHERE product_id = :productId`, {
        replacements: { productId: a.productId },
      }),
    ).rejects.toThrow(/stock_levels_ck/);
  });
});

describe('a webhook whose handling fails once is retried', () => {
  it('paid: the first delivery answers 500 and leaves nothing; the redelivery sells, mails and records the event once', async () => {
    const a = await makeProduct('fail-paid-a', [2, 3]);
    const b = await makeProduct('fail-paid-b', [4]);
    const order = await startOrder([
      { productId: b.productId, quantity: 1 },
      { productId: a.productId, quantity: 3 },
    ]);
    const reserved = [await stockOf(a.productId), await stockOf(b.productId)];
    expect(reserved).toEqual([
      [
        { lotId: a.lotIds[0], onHand: 2, reserved: 2 },
        { lotId: a.lotIds[1], onHand: 3, reserved: 1 },
      ],
      [{ lotId: b.lotIds[0], onHand: 4, reserved: 1 }],
    ]);
    // The fault strikes at the last write of the handler (the confirmation mail), after the claim,
    // the sale, the ledger entries, the status change and the audit entry.
    const cleanUp = await failOnce(
      `ct_fail_paid_${order.id}`,
      'outbox_messages',
      `NEW.dedupe_key = 'order-confirmed-${Number(order.id)}'`,
    );
    const errors = vi.spyOn(console, 'error').mockImplementation(() => undefined);
    try {
      expect(
        (await hook(shop.fake, `/_fake/sessions/${order.stripeSessionId}/pay`, { card: '4242424242424242' })).status,
      ).toBe(200);
      const record = await eventRecord('checkout.session.completed', order.stripeSessionId!);
      expect(record.attempts.map((x) => x.status)).toEqual([500]);
      expect(
        errors.mock.calls.some(
          ([m, e]) => String(m).includes(record.event.id) && String(e).includes('injected failure'),
        ),
      ).toBe(true);

      expect(await traces(order.id, record.event.id)).toEqual({
        status: 'awaiting_payment',
        paidAt: null,
        allocations: ['reserved', 'reserved', 'reserved'],
        ledgerEntries: 0,
        ledgerDelta: 0,
        confirmationMails: 0,
        audit: [],
        eventRecorded: 0,
      });
      expect([await stockOf(a.productId), await stockOf(b.productId)]).toEqual(reserved);

      const retry = await deliver(record.event);
      expect(retry.status).toBe(200);
      expect((await retry.json()).outcome).toBe('paid');
      const once = {
        status: 'paid',
        paidAt: expect.any(Date),
        allocations: ['sold', 'sold', 'sold'],
        ledgerEntries: 3,
        ledgerDelta: -4,
        confirmationMails: 1,
        audit: ['order.paid'],
        eventRecorded: 1,
      };
      expect(await traces(order.id, record.event.id)).toEqual(once);
      expect(await stockOf(a.productId)).toEqual([
        { lotId: a.lotIds[0], onHand: 0, reserved: 0 },
        { lotId: a.lotIds[1], onHand: 2, reserved: 0 },
      ]);
      expect(await stockOf(b.productId)).toEqual([{ lotId: b.lotIds[0], onHand: 3, reserved: 0 }]);

      // Stripe may still send it again: nothing more happens.
      const again = await deliver(record.event);
      expect((await again.json()).outcome).toBe('duplicate');
      expect(await traces(order.id, record.event.id)).toEqual(once);
    } finally {
      errors.mockRestore();
      await cleanUp();
    }
  });

  it('expired: the first delivery answers 500 and keeps the jars reserved; the redelivery releases them once', async () => {
    const p = await makeProduct('fail-expired', [3]);
    const order = await startOrder([{ productId: p.productId, quantity: 2 }]);
    // The fault strikes at the audit entry, after the jars were released and the order closed.
    const cleanUp = await failOnce(
      `ct_fail_expired_${order.id}`,
      'audit_entries',
      `NEW.entity_type = 'order' AND NEW.entity_id = '${Number(order.id)}' AND NEW.action = 'order.expired'`,
    );
    const errors = vi.spyOn(console, 'error').mockImplementation(() => undefined);
    try {
      expect((await hook(shop.fake, `/_fake/sessions/${order.stripeSessionId}/expire`)).status).toBe(200);
      const record = await eventRecord('checkout.session.expired', order.stripeSessionId!);
      expect(record.attempts.map((x) => x.status)).toEqual([500]);
      expect(
        errors.mock.calls.some(
          ([m, e]) => String(m).includes(record.event.id) && String(e).includes('injected failure'),
        ),
      ).toBe(true);

      expect(await traces(order.id, record.event.id)).toMatchObject({
        status: 'awaiting_payment',
        allocations: ['reserved'],
        audit: [],
        eventRecorded: 0,
      });
      expect(await stockOf(p.productId)).toEqual([{ lotId: p.lotIds[0], onHand: 3, reserved: 2 }]);

      const retry = await deliver(record.event);
      expect(retry.status).toBe(200);
      expect((await retry.json()).outcome).toBe('released');
      const once = {
        status: 'expired',
        paidAt: null,
        allocations: ['released'],
        ledgerEntries: 0,
        ledgerDelta: 0,
        confirmationMails: 0,
        audit: ['order.expired'],
        eventRecorded: 1,
      };
      expect(await traces(order.id, record.event.id)).toEqual(once);
      expect(await stockOf(p.productId)).toEqual([{ lotId: p.lotIds[0], onHand: 3, reserved: 0 }]);

      expect((await (await deliver(record.event)).json()).outcome).toBe('duplicate');
      expect(await traces(order.id, record.event.id)).toEqual(once);
      expect(await stockOf(p.productId)).toEqual([{ lotId: p.lotIds[0], onHand: 3, reserved: 0 }]);
    } finally {
      errors.mockRestore();
      await cleanUp();
    }
  });
});
