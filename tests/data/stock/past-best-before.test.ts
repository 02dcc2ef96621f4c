import { afterAll, describe, expect, it } from 'vitest';
import { closeDb, getDb } from '@/lib/db/index';
import { reserveLines } from '@/lib/data/orders/stock';
import { getCatalogueItem } from '@/lib/data/shop/catalogue';
import { makeProduct } from '@/tests/support/shop';

/**
 * Stock past its best-before date is not sold or allocated (Regulation (EU) No 1169/2011, Annex X
 * sets the wording; selling after it is the business's choice, and Combtrace does not).
 */
afterAll(closeDb);

async function line(productId: number, name: string, quantity: number) {
  const { models } = getDb();
  const order = await models.Order.create({
    number: `PB-${productId}-${quantity}`,
    email: 'pb@example.test',
    fulfilment: 'pickup',
    subtotalCents: 1200 * quantity,
    totalCents: 1200 * quantity,
    currency: 'usd',
  });
  const l = await models.OrderLine.create({
    orderId: order.id,
    productId,
    productName: name,
    quantity,
    unitPriceCents: 1200,
  });
  return l.id;
}

describe('stock past its best-before is not sold', () => {
  it('allocation skips jars past their best-before and the shop does not count them', async () => {
    const { sequelize, models } = getDb();
    const p = await makeProduct('pastbb', [4, 3]);
    // The older lot's jars went past their best-before yesterday-ish (any date before today).
    await models.StockLevel.update(
      { bestBeforeOn: '2020-06-30' },
      { where: { productId: p.productId, lotId: p.lotIds[0] } },
    );
    expect((await getCatalogueItem((await models.Product.findByPk(p.productId))!.slug))!.available).toBe(3);
    const lineId = await line(p.productId, p.name, 2);
    await sequelize.transaction((t) =>
      reserveLines(t, [{ lineId, productId: p.productId, productName: p.name, quantity: 2 }]),
    );
    const allocations = await models.OrderAllocation.findAll({ where: { orderLineId: lineId } });
    expect(allocations.map((a) => [a.lotId, a.quantity])).toEqual([[p.lotIds[1], 2]]);
    const tooMany = await line(p.productId, p.name, 4);
    await expect(
      sequelize.transaction((t) =>
        reserveLines(t, [{ lineId: tooMany, productId: p.productId, productName: p.name, quantity: 4 }]),
      ),
    ).rejects.toThrow(/Only 1 jar/);
  });
});

describe('the owner sees stock past its best-before', () => {
  it('lists jars on hand past their best-before, not fresh ones or empty rows', async () => {
    const { models } = getDb();
    const { stockPastBestBefore } = await import('@/lib/data/stock/stock');
    const p = await makeProduct('pastlist', [2, 5]);
    await models.StockLevel.update(
      { bestBeforeOn: '2020-01-31' },
      { where: { productId: p.productId, lotId: p.lotIds[0] } },
    );
    const mine = (await stockPastBestBefore()).filter((r) => r.productName === p.name);
    expect(mine).toEqual([expect.objectContaining({ onHand: 2, bestBeforeOn: '2020-01-31' })]);
  });
});
