import { afterAll, describe, expect, it } from 'vitest';
import { closeDb, getDb } from '@/lib/db/index';
import { createBlend } from '@/lib/data/lots/blends';
import { addStockEntry } from '@/lib/data/stock/stock';
import { reserveLines } from '@/lib/data/orders/stock';
import { bestBeforeDate } from '@/lib/domain/jars';
import { getSettings } from '@/lib/data/settings/settings';
import type { SessionUser } from '@/lib/auth/session';

/**
 * A blend is never better than its oldest honey: best-before = the earliest of its parents'
 * best-before dates and blend date + the owner's months (docs/trade-rules.md, "Best-before dates").
 * Orders take the earliest best-before first, so the blend goes out before a fresher lot.
 */
afterAll(closeDb);

let seq = 0;
const tag = () => `BB${process.pid % 10000}-${++seq}`;

async function owner(): Promise<SessionUser> {
  const u = (await getDb().models.User.findOne({ where: { email: 'owner@hollowmere.test' } }))!;
  return { id: u.id, name: u.name, email: u.email, role: 'owner' };
}

async function releasedLot(extractedOn: string, bestBeforeOn: string | null = null) {
  return getDb().models.Lot.create({
    code: tag(),
    floralSource: 'Clover',
    stage: 'released',
    extractedOn,
    bestBeforeOn,
    netGrams: 50_000,
    createdBy: null,
  });
}

describe('blend best-before is never later than its oldest honey', () => {
  it('a blend of a lot extracted 1 Jun 2025 is best before 1 Jun 2027 (24 months), not blend date + 24 months', async () => {
    const { bestBeforeMonths } = await getSettings();
    const old = await releasedLot('2025-06-01'); // never jarred: its best-before is extraction + months
    const fresh = await releasedLot('2026-09-01');
    const blend = await createBlend(await owner(), {
      floralSource: 'Autumn blend',
      parts: [
        { lotId: old.id, grams: 10_000 },
        { lotId: fresh.id, grams: 10_000 },
      ],
    });
    const lot = (await getDb().models.Lot.findByPk(blend.id))!;
    expect(lot.bestBeforeOn).toBe(bestBeforeDate('2025-06-01', bestBeforeMonths));
    expect(lot.bestBeforeOn! < bestBeforeDate(lot.extractedOn!, bestBeforeMonths)).toBe(true);
  });

  it("takes a parent's recorded best-before (set when it was first jarred) over its extraction date", async () => {
    const old = await releasedLot('2026-06-01', '2027-03-31');
    const blend = await createBlend(await owner(), {
      floralSource: 'Spring blend',
      parts: [{ lotId: old.id, grams: 5_000 }],
    });
    expect((await getDb().models.Lot.findByPk(blend.id))!.bestBeforeOn).toBe('2027-03-31');
  });

  it('allocation picks the blend before a fresher lot', async () => {
    const { sequelize, models } = getDb();
    const me = await owner();
    const old = await releasedLot('2025-06-01');
    const blend = await createBlend(me, { floralSource: 'Old blend', parts: [{ lotId: old.id, grams: 10_000 }] });
    await models.Lot.update({ stage: 'released' }, { where: { id: blend.id } });
    const fresher = await releasedLot('2026-11-01'); // best before 2028-11-01 at 24 months
    const u = tag().toLowerCase();
    const product = await models.Product.create({
      slug: `bb-${u}`,
      name: `Blend test ${u}`,
      netGrams: 340,
      declaredAmount: 340,
      containerKind: 'glass jar',
      containerGrams: 180,
      priceCents: 1200,
    });
    await sequelize.transaction(async (t) => {
      for (const lotId of [fresher.id, blend.id])
        await addStockEntry({ productId: product.id, lotId, delta: 5, kind: 'jarring', createdBy: me.id }, t);
    });
    const order = await models.Order.create({
      number: `BB-${u}`,
      email: `${u}@example.test`,
      fulfilment: 'pickup',
      subtotalCents: 1200,
      totalCents: 1200,
      currency: 'usd',
    });
    const line = await models.OrderLine.create({
      orderId: order.id,
      productId: product.id,
      productName: product.name,
      quantity: 1,
      unitPriceCents: 1200,
    });
    await sequelize.transaction((t) =>
      reserveLines(t, [{ lineId: line.id, productId: product.id, productName: product.name, quantity: 1 }]),
    );
    const allocations = await models.OrderAllocation.findAll({ where: { orderLineId: line.id } });
    expect(allocations.map((a) => a.lotId)).toEqual([blend.id]);
  });
});
