import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb } from '@/lib/db/index';
import { seasonLots } from '@/lib/data/reports/yield-sql';
import { buildFixture, insert, type Fixture } from '@/tests/support/report-fixtures';

/**
 * Colony revenue is the money kept for honey (docs/trade-rules.md, "Revenue kept"): the jars still
 * sold, less money refunded without jars coming back, where a refund never counts against honey
 * while it fits in the order's shipping charge. A returned jar already left "sold", so its refund
 * must not be taken off a second time.
 */
const SEASON = 2033;
let fx: Fixture;
let n = 0;

beforeAll(async () => {
  fx = await buildFixture(SEASON, 'RR');
});
afterAll(closeDb);

async function order(p: {
  jars: { qty: number; state: 'sold' | 'returned' | 'written_off' }[];
  shipping: number;
  refunded: number;
  lot: number;
}) {
  const qty = p.jars.reduce((s, j) => s + j.qty, 0);
  const orderId = await insert('orders', {
    number: `RR-X${++n}`,
    customer_id: fx.cust1,
    email: 'rr-one@example.test',
    name: 'Customer rr-one',
    phone: `555-02${n}`,
    status: 'shipped',
    fulfilment: 'ship',
    shipping_address: JSON.stringify({ line1: `${n} Mill Lane`, city: 'Marrow Valley' }),
    subtotal_cents: qty * 1099,
    shipping_cents: p.shipping,
    total_cents: qty * 1099 + p.shipping,
    refunded_cents: p.refunded,
    currency: 'usd',
  });
  const line = await insert('order_lines', {
    order_id: orderId,
    product_id: fx.product,
    product_name: 'RR jar',
    quantity: qty,
    unit_price_cents: 1099,
  });
  for (const j of p.jars)
    await insert('order_allocations', { order_line_id: line, lot_id: p.lot, quantity: j.qty, state: j.state });
}

const revenueOf = async (lotId: number) => (await seasonLots(SEASON)).find((l) => l.id === lotId)!.revenueCents;

describe('revenue kept for honey', () => {
  it('a refund that returns jars is not deducted again from the jars still sold', async () => {
    const before = await revenueOf(fx.lotC);
    // 2 jars at 10.99 and 5.00 shipping; one jar refunded (10.99) and returned to stock.
    await order({
      lot: fx.lotC,
      shipping: 500,
      refunded: 1099,
      jars: [
        { qty: 1, state: 'sold' },
        { qty: 1, state: 'returned' },
      ],
    });
    expect((await revenueOf(fx.lotC)) - before).toBe(1099);
  });

  it('a refund of the shipping charge only does not lower honey revenue', async () => {
    const before = await revenueOf(fx.lotC);
    await order({ lot: fx.lotC, shipping: 500, refunded: 500, jars: [{ qty: 1, state: 'sold' }] });
    expect((await revenueOf(fx.lotC)) - before).toBe(1099);
  });

  it('money refunded without returning jars, beyond the shipping charge, comes off honey', async () => {
    const before = await revenueOf(fx.lotC);
    // 2 jars kept by the customer, 7.00 back: 5.00 of it fits in the shipping charge, 2.00 is honey.
    await order({ lot: fx.lotC, shipping: 500, refunded: 700, jars: [{ qty: 2, state: 'sold' }] });
    expect((await revenueOf(fx.lotC)) - before).toBe(2 * 1099 - 200);
  });

  it('a written-off jar refunded in full, plus a goodwill refund, never goes below zero', async () => {
    const before = await revenueOf(fx.lotC);
    // Everything refunded (a broken jar written off, the kept jar refunded as goodwill, shipping too).
    await order({
      lot: fx.lotC,
      shipping: 500,
      refunded: 2 * 1099 + 500,
      jars: [
        { qty: 1, state: 'sold' },
        { qty: 1, state: 'written_off' },
      ],
    });
    expect((await revenueOf(fx.lotC)) - before).toBe(0);
  });
});
