import 'server-only';
import type { Transaction } from 'sequelize';
import { getDb } from '@/lib/db/index';
import type { SessionUser } from '@/lib/auth/session';
import type { Colony } from '@/models/colony';

/**
 * Who sees which yards. Owner and honey-house crew: all (crew only reads; the permission
 * table stops its writes). Keeper: the yards listed for them in yard_keepers. Customer: none.
 */
export type YardScope = { all: true } | { all: false; yardIds: number[] };

export async function yardScope(user: SessionUser, transaction?: Transaction): Promise<YardScope> {
  if (user.role === 'owner' || user.role === 'crew') return { all: true };
  if (user.role !== 'keeper') return { all: false, yardIds: [] };
  const rows = await getDb().models.YardKeeper.findAll({
    where: { userId: user.id },
    attributes: ['yardId'],
    transaction,
  });
  return { all: false, yardIds: rows.map((r) => r.yardId) };
}

export function inScope(scope: YardScope, yardId: number): boolean {
  return scope.all || scope.yardIds.includes(yardId);
}

/** A colony the user may see, or null (another keeper's colony looks like no colony at all → 404). */
export async function colonyInScope(
  user: SessionUser,
  colonyId: number,
  transaction?: Transaction,
): Promise<Colony | null> {
  if (!Number.isInteger(colonyId) || colonyId <= 0) return null;
  const colony = await getDb().models.Colony.findByPk(colonyId, {
    transaction,
    lock: transaction ? transaction.LOCK.UPDATE : undefined,
  });
  if (!colony) return null;
  return inScope(await yardScope(user, transaction), colony.yardId) ? colony : null;
}

/** For writes: crew and customers never write colony records, whatever the caller checked before. */
export function canWriteColonies(user: SessionUser): boolean {
  return user.role === 'owner' || user.role === 'keeper';
}
