import 'server-only';
import { Op, type Transaction } from 'sequelize';
import { getDb } from '@/lib/db/index';
import type { SessionUser } from '@/lib/auth/session';
import type { Page } from '@/lib/schemas/list-query';
import type { LedgerListQuery } from '@/lib/schemas/stock';
import { ConflictError, InvalidError, NotFoundError } from '@/lib/domain/errors';
import { bestBeforeDate } from '@/lib/domain/jars';
import { todayIn } from '@/lib/domain/local-date';
import type { StockEntryKind } from '@/models/stock-entry';
import { recordAudit } from '@/lib/data/audit';
import { getSettings, getSettingsIn } from '@/lib/data/settings/settings';
import { readableLotIds } from '@/lib/data/lots/access';

export type StockEntryInput = {
  productId: number;
  lotId: number;
  /** Jars: + into stock, − out of it. */
  delta: number;
  kind: StockEntryKind;
  reason?: string;
  jarringRunId?: number | null;
  orderId?: number | null;
  createdBy: number | null;
  /** Change of reserved jars in the same update (orders: reserve +n at payment, −n when shipped with delta −n). */
  reservedDelta?: number;
};

export type StockLevelRow = {
  productId: number;
  lotId: number;
  onHand: number;
  reserved: number;
  bestBeforeOn: string;
};

/** Best-before of a lot's jars: the lot's own date, else extraction (or today) + the owner's months. */
async function lotBestBefore(lotId: number, t: Transaction): Promise<string> {
  const lot = await getDb().models.Lot.findByPk(lotId, { transaction: t });
  if (!lot) throw new NotFoundError('No such lot.');
  if (lot.bestBeforeOn) return lot.bestBeforeOn;
  const { bestBeforeMonths, timeZone } = await getSettingsIn(t);
  return bestBeforeDate(lot.extractedOn ?? todayIn(timeZone), bestBeforeMonths);
}

/**
 * The one way stock changes: appends a ledger entry and updates the product/lot level, both in
 * the caller's transaction, with the level row locked. Refuses (409) anything that would take
 * on-hand below 0 or below the reserved jars; the table's CHECK is only the last guard.
 */
export async function addStockEntry(input: StockEntryInput, transaction: Transaction): Promise<StockLevelRow> {
  const { StockLevel, StockEntry } = getDb().models;
  if (!Number.isInteger(input.delta)) throw new InvalidError('Stock changes are whole jars.');
  const reservedDelta = input.reservedDelta ?? 0;
  const where = { productId: input.productId, lotId: input.lotId };
  let level = await StockLevel.findOne({ where, transaction, lock: transaction.LOCK.UPDATE });
  if (!level) {
    if (input.delta < 0 || reservedDelta !== 0)
      throw new ConflictError('There are no jars of this product from this lot in stock.');
    const bestBeforeOn = await lotBestBefore(input.lotId, transaction);
    // Two first entries at once: the loser's insert waits on the key, then finds the row.
    await StockLevel.bulkCreate([{ ...where, onHand: 0, reserved: 0, bestBeforeOn }], {
      transaction,
      ignoreDuplicates: true,
    });
    level = await StockLevel.findOne({ where, transaction, lock: transaction.LOCK.UPDATE });
    if (!level) throw new Error('stock level row vanished');
  }
  const onHand = level.onHand + input.delta;
  const reserved = level.reserved + reservedDelta;
  if (onHand < 0) {
    throw new ConflictError(
      `Only ${level.onHand} jar${level.onHand === 1 ? '' : 's'} on hand; stock cannot go below 0.`,
    );
  }
  if (reserved < 0) throw new ConflictError('Fewer jars are reserved than that.');
  if (reserved > onHand) {
    throw new ConflictError(
      `${level.reserved} of the ${level.onHand} jars on hand are reserved for orders; on-hand cannot go below the reserved jars.`,
    );
  }
  await level.update({ onHand, reserved }, { transaction });
  await StockEntry.create(
    {
      productId: input.productId,
      lotId: input.lotId,
      delta: input.delta,
      kind: input.kind,
      reason: input.reason ?? '',
      jarringRunId: input.jarringRunId ?? null,
      orderId: input.orderId ?? null,
      createdBy: input.createdBy,
    },
    { transaction },
  );
  return { productId: level.productId, lotId: level.lotId, onHand, reserved, bestBeforeOn: level.bestBeforeOn };
}

/** Breakage (−), counted adjustment (±) or return (+), with the reason, audited. */
export async function adjustStock(
  actorUserId: number,
  input: {
    productId: number;
    lotId: number;
    kind: 'breakage' | 'adjustment' | 'return';
    delta: number;
    reason: string;
  },
): Promise<StockLevelRow> {
  const { sequelize } = getDb();
  return sequelize.transaction(async (t) => {
    const level = await addStockEntry({ ...input, createdBy: actorUserId }, t);
    await recordAudit(
      {
        actorUserId,
        action: `stock.${input.kind}`,
        entityType: 'stock',
        entityId: `${input.productId}:${input.lotId}`,
        after: { delta: input.delta, onHand: level.onHand },
        reason: input.reason,
      },
      t,
    );
    return level;
  });
}

export type StockLotRow = StockLevelRow & {
  productName: string;
  lotCode: string;
  floralSource: string;
  available: number;
};
export type StockProductTotal = {
  productId: number;
  productName: string;
  onHand: number;
  reserved: number;
  available: number;
  lots: number;
  earliestBestBefore: string | null;
};

/** Stock per product and lot, of the lots this user may read (a keeper: their own colonies' lots). */
export async function listStockLevels(user: SessionUser, filter: { productId?: number } = {}): Promise<StockLotRow[]> {
  const { StockLevel, Product, Lot } = getDb().models;
  const readable = await readableLotIds(user);
  const where: Record<string | symbol, unknown> = {};
  if (filter.productId) where.productId = filter.productId;
  if (readable) where.lotId = { [Op.in]: readable };
  const rows = await StockLevel.findAll({
    where,
    include: [
      { model: Product, as: 'product', attributes: ['name', 'sortOrder'] },
      { model: Lot, as: 'lot', attributes: ['code', 'floralSource'] },
    ],
    order: [
      [{ model: Product, as: 'product' }, 'sortOrder', 'ASC'],
      [{ model: Product, as: 'product' }, 'name', 'ASC'],
      ['bestBeforeOn', 'ASC'],
    ],
  });
  return rows.map((r) => ({
    productId: r.productId,
    lotId: r.lotId,
    onHand: r.onHand,
    reserved: r.reserved,
    bestBeforeOn: r.bestBeforeOn,
    available: r.onHand - r.reserved,
    productName: r.product?.name ?? '',
    lotCode: r.lot?.code ?? '',
    floralSource: r.lot?.floralSource ?? '',
  }));
}

/** Totals per product (every product, also those with no stock), over the lots this user may read. */
export async function stockTotals(user: SessionUser): Promise<StockProductTotal[]> {
  const { Product } = getDb().models;
  const [products, levels] = await Promise.all([
    Product.findAll({
      order: [
        ['sortOrder', 'ASC'],
        ['name', 'ASC'],
      ],
    }),
    listStockLevels(user),
  ]);
  return products.map((p) => {
    const mine = levels.filter((l) => l.productId === p.id);
    const withJars = mine.filter((l) => l.onHand > 0);
    return {
      productId: p.id,
      productName: p.name,
      onHand: mine.reduce((s, l) => s + l.onHand, 0),
      reserved: mine.reduce((s, l) => s + l.reserved, 0),
      available: mine.reduce((s, l) => s + l.available, 0),
      lots: withJars.length,
      earliestBestBefore: withJars.map((l) => l.bestBeforeOn).sort()[0] ?? null,
    };
  });
}

export type LedgerRow = {
  id: number;
  createdAt: string;
  productName: string;
  lotCode: string;
  delta: number;
  kind: StockEntryKind;
  reason: string;
  jarringRunId: number | null;
  orderId: number | null;
  byName: string | null;
};

/** One page of the stock ledger, entries of the lots this user may read. Entries are numbered in the order they were written. */
export async function listLedger(user: SessionUser, query: LedgerListQuery): Promise<Page<LedgerRow>> {
  const { StockEntry, Product, Lot, User } = getDb().models;
  const { page, pageSize } = query;
  const readable = await readableLotIds(user);
  const where: Record<string | symbol, unknown> = {};
  if (query.productId) where.productId = query.productId;
  const lotIds = query.lotId ? [query.lotId].filter((id) => !readable || readable.includes(id)) : readable;
  if (lotIds) where.lotId = { [Op.in]: lotIds };
  const [total, entries] = await Promise.all([
    StockEntry.count({ where }),
    StockEntry.findAll({
      where,
      order: [['id', query.dir === 'asc' ? 'ASC' : 'DESC']],
      limit: pageSize,
      offset: (page - 1) * pageSize,
      include: [
        { model: Product, as: 'product', attributes: ['name'] },
        { model: Lot, as: 'lot', attributes: ['code'] },
      ],
    }),
  ]);
  const userIds = [...new Set(entries.map((e) => e.createdBy).filter((id): id is number => id !== null))];
  const users = userIds.length
    ? await User.findAll({ where: { id: { [Op.in]: userIds } }, attributes: ['id', 'name'] })
    : [];
  const names = new Map(users.map((u) => [u.id, u.name]));
  return {
    total,
    page,
    pageSize,
    rows: entries.map((e) => ({
      id: Number(e.id),
      createdAt: new Date(e.createdAt).toISOString(),
      productName: e.product?.name ?? '',
      lotCode: e.lot?.code ?? '',
      delta: e.delta,
      kind: e.kind,
      reason: e.reason,
      jarringRunId: e.jarringRunId ?? null,
      orderId: e.orderId ?? null,
      byName: e.createdBy ? (names.get(e.createdBy) ?? null) : null,
    })),
  };
}

export type PastBestBeforeRow = { productName: string; lotCode: string; onHand: number; bestBeforeOn: string };

/** Jars on hand past their best-before date (the business's today): not sold, to be dealt with. */
export async function stockPastBestBefore(): Promise<PastBestBeforeRow[]> {
  const today = todayIn((await getSettings()).timeZone);
  const rows = await getDb().models.StockLevel.findAll({
    where: { onHand: { [Op.gt]: 0 }, bestBeforeOn: { [Op.lt]: today } },
    include: [
      { association: 'product', attributes: ['name'] },
      { association: 'lot', attributes: ['code'] },
    ],
    order: [
      ['bestBeforeOn', 'ASC'],
      ['lotId', 'ASC'],
    ],
  });
  return rows.map((r) => ({
    productName: r.product?.name ?? '',
    lotCode: r.lot?.code ?? '',
    onHand: r.onHand,
    bestBeforeOn: r.bestBeforeOn,
  }));
}
