import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/db/index';

/**
 * An invented season (far in the future, so the demo data never shares it) with two keepers,
 * a split, weighed and unweighed supers, a blend and paid orders, written straight with SQL.
 */
export async function insert(table: string, row: Record<string, unknown>): Promise<number> {
  const { sequelize } = getDb();
  const cols = Object.keys(row);
  const [r] = await sequelize.query<{ id: number }>(
    `INSERT INTO ${table} (${cols.join(', ')}, created_at, updated_at) VALUES (${cols.map((c) => `:${c}`).join(', ')}, NOW(), NOW()) RETURNING id`,
    { type: QueryTypes.SELECT, replacements: row },
  );
  return r.id;
}

async function userId(email: string): Promise<number> {
  const [r] = await getDb().sequelize.query<{ id: number }>(`SELECT id FROM users WHERE email = :email`, {
    type: QueryTypes.SELECT,
    replacements: { email },
  });
  return r.id;
}

export type Fixture = Awaited<ReturnType<typeof buildFixture>>;

export async function buildFixture(season: number, tag: string) {
  const keeper = await userId('keeper@hollowmere.test');
  const keeper2 = await userId('keeper2@hollowmere.test');
  const owner = await userId('owner@hollowmere.test');
  const yardA = await insert('yards', { name: `${tag} Upper Field` });
  const yardB = await insert('yards', { name: `${tag} Brook Side` });
  const colony = async (code: string, yard: number, keeperId: number, parent: number | null = null) =>
    insert('colonies', {
      code: `${tag}-${code}`,
      yard_id: yard,
      keeper_id: keeperId,
      origin: parent ? 'split' : 'nucleus',
      parent_colony_id: parent,
      started_on: `${season}-03-01`,
    });
  const c1 = await colony('A1', yardA, keeper);
  const c2 = await colony('A2', yardA, keeper, c1); // a split of A1
  const c3 = await colony('B1', yardB, keeper2);
  const c4 = await colony('B2', yardB, keeper2); // makes nothing

  const lot = async (code: string, net: number, isBlend = false) =>
    insert('lots', {
      code: `${tag}${code}`,
      extracted_on: `${season}-08-01`,
      stage: 'released',
      net_grams: net,
      is_blend: isBlend,
    });
  const lotA = await lot('-001', 52_001);
  const lotB = await lot('-002', 30_017);
  const lotC = await lot('-003', 20_000, true); // blend of A and B
  const lotD = await lot('-004', 9_000); // one unweighed super

  const pull = (
    colonyId: number,
    lotId: number,
    full: number | null,
    empty: number | null,
    depth = 'medium',
    capped: number | null = null,
  ) =>
    insert('super_pulls', {
      colony_id: colonyId,
      lot_id: lotId,
      depth,
      frame_count: 10,
      full_grams: full,
      empty_grams: empty,
      capped_frames: capped,
      put_on_on: `${season}-05-01`,
      pulled_on: `${season}-07-20`,
    });
  const s1 = await pull(c1, lotA, 26_000, 7_000); // 19 000 g measured
  const s2 = await pull(c1, lotA, 24_500, 7_000); // 17 500 g
  const s3 = await pull(c2, lotA, null, null, 'medium', 6); // estimated
  const s4 = await pull(c3, lotB, 25_000, 6_800); // 18 200 g
  const s5 = await pull(c2, lotB, 23_000, 0, 'shallow', 7.5); // empty 0 → estimated
  const s6 = await pull(c3, lotD, null, null, 'deep', null); // estimated from frame count
  await insert('lot_parents', { child_lot_id: lotC, parent_lot_id: lotA, grams: 12_000 });
  await insert('lot_parents', { child_lot_id: lotC, parent_lot_id: lotB, grams: 8_000 });
  await insert('moisture_readings', {
    lot_id: lotA,
    method: 'scale',
    scale_water_pct: 17.2,
    water_pct: 17.2,
    taken_on: `${season}-08-02`,
  });
  await insert('moisture_readings', {
    lot_id: lotB,
    method: 'scale',
    scale_water_pct: 18.4,
    water_pct: 18.4,
    taken_on: `${season}-08-02`,
  });

  const product = await insert('products', {
    slug: `${tag.toLowerCase()}-jar`,
    name: `${tag} jar`,
    net_grams: 340,
    declared_amount: 340,
    container_kind: 'glass jar',
    container_grams: 200,
    price_cents: 1099,
  });
  const customer = async (email: string) =>
    insert('users', { email, name: `Customer ${email.split('@')[0]}`, role: 'customer', session_version: 1 });
  const cust1 = await customer(`${tag.toLowerCase()}-one@example.test`);
  const cust2 = await customer(`${tag.toLowerCase()}-two@example.test`);
  const cust3 = await customer(`${tag.toLowerCase()}-three@example.test`);
  let n = 0;
  const order = async (
    cust: number,
    email: string,
    status: string,
    allocations: { lot: number; qty: number; state?: string }[],
    refunded = 0,
  ) => {
    const qty = allocations.reduce((a, x) => a + x.qty, 0);
    const orderId = await insert('orders', {
      number: `${tag}-${++n}`,
      customer_id: cust,
      email,
      name: `Customer ${email.split('@')[0]}`,
      phone: `555-01${n}`,
      status,
      fulfilment: 'ship',
      shipping_address: JSON.stringify({ line1: `${n} Mill Lane`, city: 'Marrow Valley' }),
      subtotal_cents: qty * 1099,
      total_cents: qty * 1099,
      refunded_cents: refunded,
      currency: 'usd',
    });
    const line = await insert('order_lines', {
      order_id: orderId,
      product_id: product,
      product_name: `${tag} jar`,
      quantity: qty,
      unit_price_cents: 1099,
    });
    for (const a of allocations)
      await insert('order_allocations', {
        order_line_id: line,
        lot_id: a.lot,
        quantity: a.qty,
        state: a.state ?? 'sold',
      });
    return orderId;
  };
  const o1 = await order(cust1, `${tag.toLowerCase()}-one@example.test`, 'paid', [
    { lot: lotA, qty: 3 },
    { lot: lotC, qty: 1 },
  ]);
  const o2 = await order(cust2, `${tag.toLowerCase()}-two@example.test`, 'shipped', [{ lot: lotB, qty: 2 }], 1099);
  const o3 = await order(cust3, `${tag.toLowerCase()}-three@example.test`, 'awaiting_payment', [
    { lot: lotA, qty: 5, state: 'reserved' },
  ]);
  return {
    keeper,
    keeper2,
    owner,
    yardA,
    yardB,
    c1,
    c2,
    c3,
    c4,
    lotA,
    lotB,
    lotC,
    lotD,
    s1,
    s2,
    s3,
    s4,
    s5,
    s6,
    cust1,
    cust2,
    cust3,
    o1,
    o2,
    o3,
    product,
  };
}
