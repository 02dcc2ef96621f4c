import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { closeDb, getDb } from '@/lib/db/index';
import { POST as checkoutPOST } from '@/app/api/checkout/route';
import { GET as cancelledGET } from '@/app/(storefront)/checkout/cancelled/route';
import { releaseOverdueReservations } from '@/lib/data/shop/checkout';
import { signInAs, setRequestHeaders } from '@/tests/support/session';
import {
  guest,
  hook,
  makeProduct,
  orderOf,
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
});

const post = (body: unknown) => checkoutPOST(checkoutRequest(body));

describe('checkout', () => {
  it('reserves oldest best-before first at our price, whatever the browser says', async () => {
    const p = await makeProduct('oldest', [3, 10], 1450);
    const res = await post({ ...guest([{ productId: p.productId, quantity: 5 }]), priceCents: 1 });
    expect(res.status).toBe(200);
    const { url, number } = (await res.json()) as { url: string; number: string };
    expect(url).toMatch(/\/pay\/cs_test_/);
    const order = await orderOf(number);
    expect(order?.totalCents).toBe(5 * 1450);
    expect(order?.status).toBe('awaiting_payment');
    // 3 from the older lot, 2 from the newer one.
    expect(await stockOf(p.productId)).toEqual([
      { lotId: p.lotIds[0], onHand: 3, reserved: 3 },
      { lotId: p.lotIds[1], onHand: 10, reserved: 2 },
    ]);
    const session = await fetch(`${shop.fake.url}/v1/checkout/sessions/${order?.stripeSessionId}`, {
      headers: { authorization: 'Bearer sk_test_shop' },
    }).then((r) => r.json());
    expect(session.amount_total).toBe(5 * 1450);
    expect(session.metadata.orderId).toBe(String(order?.id));
  });

  it('answers 409 naming the product and how many are left, and reserves nothing', async () => {
    const p = await makeProduct('short', [2]);
    const res = await post(guest([{ productId: p.productId, quantity: 3 }]));
    expect(res.status).toBe(409);
    expect((await res.json()).error).toBe(`Only 2 jars of ${p.name} are left.`);
    expect(await stockOf(p.productId)).toEqual([{ lotId: p.lotIds[0], onHand: 2, reserved: 0 }]);
  });

  it('prices shipping by the parcel weight band (honey plus jar)', async () => {
    // 2 × (340 + 180) g = 1040 g → the 3000 g band of the demo settings, 895 cents.
    const p = await makeProduct('ship', [5], 1000);
    const res = await post({
      ...guest([{ productId: p.productId, quantity: 2 }]),
      fulfilment: 'ship',
      address: { line1: '1 Reed St', city: 'Marrow', postalCode: 'MV1 2AB', country: 'US' },
    });
    expect(res.status).toBe(200);
    const order = await orderOf(((await res.json()) as { number: string }).number);
    expect(order?.shippingCents).toBe(895);
    expect(order?.totalCents).toBe(2000 + 895);
  });

  it('an expired session releases its reservation', async () => {
    const p = await makeProduct('expire', [4]);
    const { number } = (await (await post(guest([{ productId: p.productId, quantity: 4 }]))).json()) as {
      number: string;
    };
    expect((await stockOf(p.productId))[0].reserved).toBe(4);
    const order = await orderOf(number);
    expect((await hook(shop.fake, `/_fake/sessions/${order?.stripeSessionId}/expire`)).status).toBe(200);
    const after = await waitUntil(
      () => orderOf(number),
      (o) => o?.status === 'expired',
    );
    expect(after?.status).toBe('expired');
    expect((await stockOf(p.productId))[0]).toMatchObject({ onHand: 4, reserved: 0 });
    const allocations = await getDb().models.OrderAllocation.findAll({
      include: [{ association: 'line', where: { orderId: after?.id } }],
    });
    expect(allocations.map((a) => a.state)).toEqual(['released']);
  });

  it('the sweep releases reservations past their time', async () => {
    const p = await makeProduct('sweep', [3]);
    const { number } = (await (await post(guest([{ productId: p.productId, quantity: 3 }]))).json()) as {
      number: string;
    };
    await releaseOverdueReservations(new Date(Date.now() + 31 * 60_000));
    expect((await orderOf(number))?.status).toBe('expired');
    expect((await stockOf(p.productId))[0].reserved).toBe(0);
  });

  it('50 simultaneous checkouts for 10 remaining jars sell exactly 10', async () => {
    const p = await makeProduct('rush', [4, 6]);
    const answers = await Promise.all(
      Array.from({ length: 50 }, () => post(guest([{ productId: p.productId, quantity: 1 }]))),
    );
    const statuses = answers.map((a) => a.status);
    expect(statuses.filter((s) => s === 200)).toHaveLength(10);
    expect(statuses.filter((s) => s === 409)).toHaveLength(40);
    const refused = await Promise.all(
      answers.filter((a) => a.status === 409).map((a) => a.json() as Promise<{ error: string }>),
    );
    expect(new Set(refused.map((r) => r.error))).toEqual(new Set([`${p.name} is sold out.`]));
    const started = await Promise.all(
      answers.filter((a) => a.status === 200).map((a) => a.json() as Promise<{ number: string }>),
    );
    // Everyone pays at once; all 10 complete and stock lands at zero, never below.
    for (const s of started) {
      const o = await orderOf(s.number);
      expect(
        (await hook(shop.fake, `/_fake/sessions/${o?.stripeSessionId}/pay`, { card: '4242424242424242' })).status,
      ).toBe(200);
    }
    const numbers = started.map((s) => s.number);
    const paid = await waitUntil(
      () => getDb().models.Order.count({ where: { number: numbers, status: 'paid' } }),
      (n) => n === 10,
    );
    expect(paid).toBe(10);
    expect(await stockOf(p.productId)).toEqual([
      { lotId: p.lotIds[0], onHand: 0, reserved: 0 },
      { lotId: p.lotIds[1], onHand: 0, reserved: 0 },
    ]);
    const ledger = await getDb().models.StockEntry.sum('delta', { where: { productId: p.productId, kind: 'order' } });
    expect(ledger).toBe(-10);
  });

  it('a signed-in customer’s order is theirs, under their account e-mail', async () => {
    const me = await signInAs('customer@hollowmere.test');
    const p = await makeProduct('mine', [2]);
    const res = await post(guest([{ productId: p.productId, quantity: 1 }], 'someone-else@example.test'));
    const order = await orderOf(((await res.json()) as { number: string }).number);
    expect(order?.customerId).toBe(me?.id);
    expect(order?.email).toBe('customer@hollowmere.test');
  });

  it('a Stripe hiccup is retried with the same idempotency key; one session, one reservation', async () => {
    await fetch(`${shop.fake.url}/_fake/config`, { method: 'POST', body: JSON.stringify({ failNext: 1 }) });
    const p = await makeProduct('retry', [3]);
    const res = await post(guest([{ productId: p.productId, quantity: 2 }]));
    expect(res.status).toBe(200);
    const order = await orderOf(((await res.json()) as { number: string }).number);
    expect(order?.stripeSessionId).toMatch(/^cs_test_/);
    expect((await stockOf(p.productId))[0].reserved).toBe(2);
  });

  it('when Stripe stays down the reservation is released and the order cancelled', async () => {
    await fetch(`${shop.fake.url}/_fake/config`, { method: 'POST', body: JSON.stringify({ failNext: 10 }) });
    const p = await makeProduct('outage', [3]);
    const res = await post(guest([{ productId: p.productId, quantity: 2 }]));
    await fetch(`${shop.fake.url}/_fake/config`, { method: 'POST', body: JSON.stringify({ failNext: 0 }) });
    expect(res.status).toBe(503);
    expect((await res.json()).error).toMatch(/Nothing was charged/);
    expect((await stockOf(p.productId))[0].reserved).toBe(0);
    const line = await getDb().models.OrderLine.findOne({
      where: { productId: p.productId },
      include: [{ association: 'order' }],
    });
    expect(line?.order?.status).toBe('cancelled');
  });

  it('refuses a cross-site checkout', async () => {
    setRequestHeaders({ origin: 'https://evil.example', host: '127.0.0.1' });
    const p = await makeProduct('csrf', [2]);
    const res = await post(guest([{ productId: p.productId, quantity: 1 }]));
    expect(res.status).toBe(403);
    expect((await stockOf(p.productId))[0].reserved).toBe(0);
  });
});

describe('leaving the payment page', () => {
  it('the cancelled checkout releases the jars and redirects to APP_URL, not the host the request came in on', async () => {
    const p = await makeProduct('leave', [3]);
    const { number } = (await (await post(guest([{ productId: p.productId, quantity: 2 }]))).json()) as {
      number: string;
    };
    const order = await orderOf(number);
    const session = await fetch(`${shop.fake.url}/v1/checkout/sessions/${order?.stripeSessionId}`, {
      headers: { authorization: 'Bearer sk_test_shop' },
    }).then((r) => r.json());
    const cancelUrl = new URL(session.cancel_url as string);
    expect(cancelUrl.origin).toBe('http://127.0.0.1:3999');
    // The proxy in front of the app hands the request on to an internal address.
    const internal = new URL(`${cancelUrl.pathname}${cancelUrl.search}`, 'http://10.0.0.7:3000');
    const forged = new URL(internal);
    forged.searchParams.set('t', 'x'.repeat(22));
    const refused = await cancelledGET(new Request(forged));
    expect(refused.status).toBe(303);
    expect(refused.headers.get('location')).toBe('http://127.0.0.1:3999/cart?cancelled=1');
    expect((await orderOf(number))?.status).toBe('awaiting_payment');

    const res = await cancelledGET(new Request(internal));
    expect(res.status).toBe(303);
    expect(res.headers.get('location')).toBe('http://127.0.0.1:3999/cart?cancelled=1');
    // Closing the session makes the fake send checkout.session.expired at once; whichever lands first closes the order.
    expect(['cancelled', 'expired']).toContain((await orderOf(number))?.status);
    expect((await stockOf(p.productId))[0]).toMatchObject({ onHand: 3, reserved: 0 });
  });
});
