import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { closeDb, getDb } from '@/lib/db/index';
import { POST as checkoutPOST } from '@/app/api/checkout/route';
import { refundOrderAction } from '@/app/(back-office)/admin/orders/actions';
import { CHECKOUT_LIMITS } from '@/lib/data/shop/checkout';
import { DEMO, signInAs, setRequestHeaders } from '@/tests/support/session';
import {
  checkoutRequest,
  guest,
  hook,
  makeProduct,
  nextIp,
  orderOf,
  startOrder,
  startShopFake,
  stockOf,
  waitUntil,
  type ShopFake,
} from '@/tests/support/shop';

// Attacks an outside tester made on the shop: stock hoarding by anonymous checkouts, the per-product
// cap dodged with two lines, and two refunds of the same jars at once.

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
});

const checkout = async (body: unknown, ip?: string) => {
  const res = await checkoutPOST(checkoutRequest(body, ip));
  return { status: res.status, json: (await res.json()) as { error?: string; number?: string } };
};

describe('anonymous stock hoarding', () => {
  it('one address cannot hold every box: past the open-unpaid cap a checkout is refused (429) and reserves nothing', async () => {
    const p = await makeProduct('comb', [9]);
    const ip = nextIp();
    for (let i = 0; i < CHECKOUT_LIMITS.openPerAddress; i++)
      expect((await checkout(guest([{ productId: p.productId, quantity: 1 }]), ip)).status).toBe(200);
    const refused = await checkout(guest([{ productId: p.productId, quantity: 1 }]), ip);
    expect(refused.status).toBe(429);
    expect(refused.json.error).toMatch(/unpaid orders/);
    const held = (await stockOf(p.productId))[0].reserved;
    expect(held).toBe(CHECKOUT_LIMITS.openPerAddress);
    // A real buyer elsewhere still gets a jar.
    expect((await checkout(guest([{ productId: p.productId, quantity: 1 }]))).status).toBe(200);
  });

  it('one e-mail cannot hold more than the open-unpaid cap from many addresses', async () => {
    const p = await makeProduct('comb-mail', [9]);
    const email = `hoarder-${process.pid}@example.test`;
    for (let i = 0; i < CHECKOUT_LIMITS.openPerEmail; i++)
      expect((await checkout(guest([{ productId: p.productId, quantity: 1 }], email))).status).toBe(200);
    expect((await checkout(guest([{ productId: p.productId, quantity: 1 }], email))).status).toBe(429);
  });

  it('checkouts are rate-limited per address even when each is cancelled at once', async () => {
    const p = await makeProduct('burst', [200]);
    const ip = nextIp();
    let last = 0;
    for (let i = 0; i <= CHECKOUT_LIMITS.startsPerAddress; i++) {
      const r = await checkout(guest([{ productId: p.productId, quantity: 1 }]), ip);
      last = r.status;
      if (r.status !== 200) break;
      // Leave the payment page at once, so the open-unpaid cap is not what stops it.
      await getDb().models.Order.update(
        { status: 'cancelled', reservedUntil: null },
        { where: { number: r.json.number } },
      );
    }
    expect(last).toBe(429);
  });
});

describe('the per-product cap', () => {
  it('two lines of 48 jars of one product are 96 jars: refused (400), nothing reserved', async () => {
    const p = await makeProduct('cap', [200]);
    const r = await checkout(
      guest([
        { productId: p.productId, quantity: 48 },
        { productId: p.productId, quantity: 48 },
      ]),
    );
    expect(r.status).toBe(400);
    expect(JSON.stringify(r.json)).toMatch(/At most 48 jars per product/);
    expect((await stockOf(p.productId))[0].reserved).toBe(0);
  });

  it('two lines of one product within the cap become one order line', async () => {
    const p = await makeProduct('merge', [20]);
    const r = await checkout(
      guest([
        { productId: p.productId, quantity: 2 },
        { productId: p.productId, quantity: 3 },
      ]),
    );
    expect(r.status).toBe(200);
    const order = await orderOf(r.json.number!);
    const lines = await getDb().models.OrderLine.findAll({ where: { orderId: order!.id } });
    expect(lines.map((l) => l.quantity)).toEqual([5]);
  });
});

describe('two simultaneous refunds of one order', () => {
  it('crew and owner refunding the same jars at once: money moves once, the refund is audited and mailed, the other is refused', async () => {
    // One jar at 10.00; both people refund that jar with half the money at the same moment. Money alone
    // would allow both (5.00 + 5.00), the jar only one.
    const p = await makeProduct('double-refund', [4], 1000);
    const order = await startOrder([{ productId: p.productId, quantity: 1 }]);
    expect(
      (await hook(shop.fake, `/_fake/sessions/${order.stripeSessionId}/pay`, { card: '4242424242424242' })).status,
    ).toBe(200);
    await waitUntil(
      () => orderOf(order.number),
      (o) => o?.status === 'paid',
    );
    const line = await getDb().models.OrderLine.findOne({ where: { orderId: order.id } });
    await signInAs(DEMO.crew);
    const refund = (requestKey: string) =>
      refundOrderAction({
        orderId: order.id,
        amount: 5,
        jars: [{ lineId: line!.id, quantity: 1 }],
        restock: true,
        reason: 'The jar arrived cracked',
        requestKey,
      });
    const results = await Promise.all([refund('crew-form-0001'), refund('owner-form-0002')]);

    // Stripe moved money once.
    const events = await fetch(`${shop.fake.url}/_fake/events?type=refund.created`).then((r) => r.json());
    const mine = (events.data as { event: { data: { object: { metadata: Record<string, string> } } } }[]).filter(
      (e) => e.event.data.object.metadata.orderId === String(order.id),
    );
    expect(mine).toHaveLength(1);
    expect(results.filter((r) => r.ok)).toHaveLength(1);
    expect(results.find((r) => !r.ok)).toMatchObject({ message: expect.stringMatching(/can be returned/) });
    const after = await orderOf(order.number);
    expect(after?.refundedCents).toBe(500);
    const refunds = await getDb().models.Refund.findAll({ where: { orderId: order.id } });
    expect(refunds).toHaveLength(1);
    expect(refunds[0].stripeRefundId).toMatch(/^re_/);
    expect(
      await getDb().models.AuditEntry.count({
        where: { entityType: 'order', entityId: String(order.id), action: 'order.refund' },
      }),
    ).toBe(1);
    expect(await getDb().models.OutboxMessage.count({ where: { dedupeKey: `order-refund-${refunds[0].id}` } })).toBe(1);
    expect(await stockOf(p.productId)).toEqual([{ lotId: p.lotIds[0], onHand: 3 + 1, reserved: 0 }]);
  });

  it('the same refund sent twice (double click, retry) is refused before any money moves', async () => {
    const p = await makeProduct('repeat-refund', [4], 1000);
    const order = await startOrder([{ productId: p.productId, quantity: 3 }]);
    await hook(shop.fake, `/_fake/sessions/${order.stripeSessionId}/pay`, { card: '4242424242424242' });
    await waitUntil(
      () => orderOf(order.number),
      (o) => o?.status === 'paid',
    );
    await signInAs(DEMO.owner);
    const send = () =>
      refundOrderAction({ orderId: order.id, amount: 5, jars: [], restock: false, requestKey: 'same-form-0003' });
    expect(await send()).toEqual({ ok: true });
    expect(await send()).toMatchObject({ ok: false, message: expect.stringMatching(/already made/) });
    expect((await orderOf(order.number))?.refundedCents).toBe(500);
  });
});
