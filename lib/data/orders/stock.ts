import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { getDb } from '@/lib/db/index';
import { ConflictError } from '@/lib/domain/errors';
import { SELLABLE_STAGES } from '@/lib/data/shop/catalogue';
import { recordAudit } from '@/lib/data/audit';
import { getSettingsIn } from '@/lib/data/settings/settings';
import { todayIn } from '@/lib/domain/local-date';
import type { Order } from '@/models/order';

/**
 * Stock moves made by orders. Every function here runs inside the caller's transaction and locks
 * stock_levels rows with SELECT … FOR UPDATE in one fixed order — (product_id, best_before_on,
 * lot_id) — so concurrent checkouts, payments, releases and refunds queue up instead of deadlocking.
 * Callers lock the order row first, then stock: the same order everywhere.
 */

type LockedRow = { productId: number; lotId: number; onHand: number; reserved: number; bestBeforeOn: string };
const COLS = `product_id AS "productId", lot_id AS "lotId", on_hand AS "onHand", reserved, best_before_on AS "bestBeforeOn"`;
const ORDER = 'ORDER BY product_id, best_before_on, lot_id';

/** Stock that may be sold: a sellable lot, not past its best-before date (the business's today). */
async function lockSellable(t: Transaction, productIds: number[]): Promise<LockedRow[]> {
  if (productIds.length === 0) return [];
  const today = todayIn((await getSettingsIn(t)).timeZone);
  return getDb().sequelize.query<LockedRow>(
    `SELECT ${COLS} FROM stock_levels
     WHERE product_id IN (:productIds) AND lot_id IN (SELECT id FROM lots WHERE stage IN ${SELLABLE_STAGES})
       AND best_before_on >= :today
     ${ORDER} FOR UPDATE`,
    { type: QueryTypes.SELECT, replacements: { productIds, today }, transaction: t },
  );
}

async function lockPairs(t: Transaction, pairs: { productId: number; lotId: number }[]): Promise<void> {
  if (pairs.length === 0) return;
  const values = pairs.map((p) => `(${Number(p.productId)},${Number(p.lotId)})`).join(',');
  await getDb().sequelize.query(
    `SELECT 1 FROM stock_levels WHERE (product_id, lot_id) IN (${values}) ${ORDER} FOR UPDATE`,
    {
      type: QueryTypes.SELECT,
      transaction: t,
    },
  );
}

async function bump(t: Transaction, productId: number, lotId: number, onHand: number, reserved: number): Promise<void> {
  await getDb().sequelize.query(
    `UPDATE stock_levels SET on_hand = on_hand + :onHand, reserved = reserved + :reserved, updated_at = now()
     WHERE product_id = :productId AND lot_id = :lotId`,
    { replacements: { productId, lotId, onHand, reserved }, transaction: t },
  );
}

export type LineToReserve = { lineId: number; productId: number; productName: string; quantity: number };

const jars = (n: number) => `${n} jar${n === 1 ? '' : 's'}`;

/**
 * Reserves each line's jars from the lots with the oldest best-before date first, recording an
 * allocation per lot. Not enough stock for any line → 409 naming the product and what is left,
 * and the caller's transaction rolls back.
 */
export async function reserveLines(t: Transaction, lines: LineToReserve[]): Promise<void> {
  const { OrderAllocation } = getDb().models;
  const sorted = [...lines].sort((a, b) => a.productId - b.productId);
  const rows = await lockSellable(t, [...new Set(sorted.map((l) => l.productId))]);
  const short: string[] = [];
  const plan: { line: LineToReserve; lotId: number; quantity: number }[] = [];
  for (const line of sorted) {
    const mine = rows.filter((r) => r.productId === line.productId);
    const left = mine.reduce((s, r) => s + r.onHand - r.reserved, 0);
    if (left < line.quantity) {
      short.push(
        left <= 0
          ? `${line.productName} is sold out.`
          : `Only ${jars(left)} of ${line.productName} ${left === 1 ? 'is' : 'are'} left.`,
      );
      continue;
    }
    let need = line.quantity;
    for (const r of mine) {
      const take = Math.min(need, r.onHand - r.reserved);
      if (take <= 0) continue;
      plan.push({ line, lotId: r.lotId, quantity: take });
      need -= take;
      if (need === 0) break;
    }
  }
  if (short.length) throw new ConflictError(short.join(' '));
  for (const p of plan) {
    await bump(t, p.line.productId, p.lotId, 0, p.quantity);
    await OrderAllocation.create(
      { orderLineId: p.line.lineId, lotId: p.lotId, quantity: p.quantity, state: 'reserved' },
      { transaction: t },
    );
  }
}

export type AllocationRow = {
  id: number;
  lineId: number;
  productId: number;
  lotId: number;
  quantity: number;
  state: string;
  lotCode: string;
};

export async function orderAllocations(
  t: Transaction | undefined,
  orderId: number,
  state?: string,
): Promise<AllocationRow[]> {
  return getDb().sequelize.query<AllocationRow>(
    `SELECT a.id, a.order_line_id AS "lineId", ol.product_id AS "productId", a.lot_id AS "lotId", a.quantity, a.state, l.code AS "lotCode"
     FROM order_allocations a JOIN order_lines ol ON ol.id = a.order_line_id JOIN lots l ON l.id = a.lot_id
     WHERE ol.order_id = :orderId ${state ? 'AND a.state = :state' : ''}
     ORDER BY ol.product_id, a.id`,
    { type: QueryTypes.SELECT, replacements: { orderId, state: state ?? null }, transaction: t },
  );
}

/** Reserved → sold: the jars leave on-hand stock, with a ledger entry per lot. */
export async function sellReserved(t: Transaction, orderId: number, orderNumber: string): Promise<number> {
  const { OrderAllocation, StockEntry } = getDb().models;
  const allocations = await orderAllocations(t, orderId, 'reserved');
  await lockPairs(t, allocations);
  for (const a of allocations) {
    await bump(t, a.productId, a.lotId, -a.quantity, -a.quantity);
    await StockEntry.create(
      {
        productId: a.productId,
        lotId: a.lotId,
        delta: -a.quantity,
        kind: 'order',
        reason: `Order ${orderNumber}`,
        orderId,
        createdBy: null,
      },
      { transaction: t },
    );
    await OrderAllocation.update({ state: 'sold' }, { where: { id: a.id }, transaction: t });
  }
  return allocations.length;
}

/** Reserved → released: the jars are free for other customers again. */
async function releaseReserved(t: Transaction, orderId: number): Promise<number> {
  const { OrderAllocation } = getDb().models;
  const allocations = await orderAllocations(t, orderId, 'reserved');
  await lockPairs(t, allocations);
  for (const a of allocations) {
    await bump(t, a.productId, a.lotId, 0, -a.quantity);
    await OrderAllocation.update({ state: 'released' }, { where: { id: a.id }, transaction: t });
  }
  return allocations.reduce((s, a) => s + a.quantity, 0);
}

/** Releases a locked, unpaid order's reservation and closes it, inside the caller's transaction. */
export async function releaseReservedLocked(
  t: Transaction,
  order: Order,
  status: 'expired' | 'cancelled',
  actorUserId: number | null,
  reason: string,
): Promise<number> {
  const jars = await releaseReserved(t, order.id);
  await order.update({ status, reservedUntil: null }, { transaction: t });
  await recordAudit(
    {
      actorUserId,
      action: `order.${status}`,
      entityType: 'order',
      entityId: order.id,
      before: { status: 'awaiting_payment' },
      after: { status, jarsReleased: jars },
      reason,
    },
    t,
  );
  return jars;
}

/**
 * Sold jars of one line come back: restocked (on hand += n, ledger kind 'return') or written off
 * (no stock change: they left on-hand stock when sold). Newest sold allocations are taken first.
 */
export async function returnSold(
  t: Transaction,
  p: { orderId: number; orderNumber: string; lineId: number; quantity: number; restock: boolean; actorUserId: number },
): Promise<void> {
  const { OrderAllocation, StockEntry } = getDb().models;
  const sold = (await orderAllocations(t, p.orderId, 'sold')).filter((a) => a.lineId === p.lineId).reverse();
  const have = sold.reduce((s, a) => s + a.quantity, 0);
  if (have < p.quantity) throw new ConflictError(`Only ${jars(have)} of that line can still be returned.`);
  await lockPairs(t, sold);
  let need = p.quantity;
  for (const a of sold) {
    if (need === 0) break;
    const take = Math.min(need, a.quantity);
    need -= take;
    if (take === a.quantity)
      await OrderAllocation.update(
        { state: p.restock ? 'returned' : 'written_off' },
        { where: { id: a.id }, transaction: t },
      );
    else {
      await OrderAllocation.update({ quantity: a.quantity - take }, { where: { id: a.id }, transaction: t });
      await OrderAllocation.create(
        { orderLineId: a.lineId, lotId: a.lotId, quantity: take, state: p.restock ? 'returned' : 'written_off' },
        { transaction: t },
      );
    }
    if (p.restock) {
      await bump(t, a.productId, a.lotId, take, 0);
      await StockEntry.create(
        {
          productId: a.productId,
          lotId: a.lotId,
          delta: take,
          kind: 'return',
          reason: `Refund of order ${p.orderNumber}`,
          orderId: p.orderId,
          createdBy: p.actorUserId,
        },
        { transaction: t },
      );
    }
  }
}
