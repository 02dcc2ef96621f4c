import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { getDb } from '@/lib/db/index';
import type { SessionUser } from '@/lib/auth/session';
import { ConflictError, NotFoundError } from '@/lib/domain/errors';
import type { Lot } from '@/models/lot';

/**
 * Lots a keeper may read: those holding a super of one of their colonies (their own colony
 * or one in a yard they keep), and every blend made from such a lot, recursively.
 */
export const KEEPER_LOTS_SQL = `
  WITH RECURSIVE visible(id) AS (
    SELECT sp.lot_id FROM super_pulls sp JOIN colonies c ON c.id = sp.colony_id
    WHERE sp.lot_id IS NOT NULL AND (c.keeper_id = :keeperId
      OR EXISTS (SELECT 1 FROM yard_keepers yk WHERE yk.yard_id = c.yard_id AND yk.user_id = :keeperId))
    UNION
    SELECT lp.child_lot_id FROM lot_parents lp JOIN visible v ON lp.parent_lot_id = v.id
  ) SELECT id FROM visible`;

/** Whether this user may read the lot: owner and crew any lot, a keeper only their own, nobody else. */
export async function canReadLot(user: SessionUser, lotId: number): Promise<boolean> {
  if (user.role === 'owner' || user.role === 'crew') return true;
  if (user.role !== 'keeper') return false;
  const rows = await getDb().sequelize.query<{ id: number }>(
    `SELECT 1 AS id FROM (${KEEPER_LOTS_SQL}) k WHERE k.id = :lotId LIMIT 1`,
    {
      type: QueryTypes.SELECT,
      replacements: { keeperId: user.id, lotId },
    },
  );
  return rows.length > 0;
}

/**
 * The one scope rule for everything made from a lot (the lot, its jarring runs, stock rows, ledger
 * entries): owner and crew see every lot; a keeper only the lots from their own colonies
 * (KEEPER_LOTS_SQL); anybody else none. Null = no limit; otherwise the lot ids this user may read.
 */
export async function readableLotIds(user: SessionUser): Promise<number[] | null> {
  if (user.role === 'owner' || user.role === 'crew') return null;
  if (user.role !== 'keeper') return [];
  const rows = await getDb().sequelize.query<{ id: number }>(KEEPER_LOTS_SQL, {
    type: QueryTypes.SELECT,
    replacements: { keeperId: user.id },
  });
  return rows.map((r) => r.id);
}

/** The lot, locked for this transaction; a missing lot is a 404. */
export async function lockLot(lotId: number, t: Transaction): Promise<Lot> {
  const lot = await getDb().models.Lot.findByPk(lotId, { transaction: t, lock: t.LOCK.UPDATE });
  if (!lot) throw new NotFoundError('No lot with that id.');
  return lot;
}

const OPEN_STAGES = ['gathering', 'extracted', 'held'];

/** Refuses a change to the lot's records once it is released (corrections void a record instead). */
export function assertOpen(lot: Lot, what: string): void {
  if (!OPEN_STAGES.includes(lot.stage)) {
    throw new ConflictError(
      `Lot ${lot.code} is ${lot.stage.replace('_', ' ')}: ${what} is no longer possible. Correct a record by voiding it with a reason.`,
    );
  }
}

export function lotSnapshot(lot: Lot): Record<string, unknown> {
  return {
    code: lot.code,
    stage: lot.stage,
    floralSource: lot.floralSource,
    heather: lot.heather,
    honeyOrigin: lot.honeyOrigin,
    annexSource: lot.annexSource,
    bakers: lot.bakers,
    pressed: lot.pressed,
    tropical: lot.tropical,
    lowEnzyme: lot.lowEnzyme,
    extractedOn: lot.extractedOn,
    bestBeforeOn: lot.bestBeforeOn,
    netGrams: lot.netGrams,
    usedGrams: lot.usedGrams,
    cappingsWaxGrams: lot.cappingsWaxGrams,
    holdReasons: lot.holdReasons,
    notes: lot.notes,
  };
}
