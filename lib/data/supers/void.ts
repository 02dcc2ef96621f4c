import 'server-only';
import { getDb } from '@/lib/db/index';
import type { SessionUser } from '@/lib/auth/session';
import { ConflictError, InvalidError, NotFoundError } from '@/lib/domain/errors';
import { canWriteColonies, colonyInScope } from '@/lib/data/yards/scope';
import { recordAudit } from '@/lib/data/audit';
import { recomputeColonyFlags } from './flags';
import type { PullVoid } from './pulls';

export type VoidResult = { id: number; colonyId: number; void: PullVoid; reflagged: number };
/** Which record the keeper saw and meant to void: a recorded pull, or a super still on the hive. */
export type VoidTarget = 'pull' | 'on';

/**
 * Voids a super record entered by mistake: the row stays (struck through in the lists, with who,
 * when and why) but counts for nothing from then on.
 *
 * - A recorded pull (`target` 'pull'): not in the honey house's pick list, not in yields,
 *   last-pulled dates or counts, and not in its colony's conflict checks (the colony's other pulls
 *   are checked again in the same transaction).
 * - A super still on the hive (`target` 'on'): no longer on the hive anywhere, so the colony's next
 *   pull does not close it and its tag is free to go on again. If it was pulled meanwhile, that is a
 *   409: the keeper saw a super on, and voiding would now void a pull they have not seen.
 *
 * A super already in a lot cannot be voided here: the honey house takes it out of the lot first.
 * Another keeper's record is "not found".
 */
export async function voidSuperPull(
  user: SessionUser,
  superPullId: number,
  reason: string,
  target: VoidTarget = 'pull',
): Promise<VoidResult> {
  const { sequelize, models } = getDb();
  const why = reason.trim();
  const noun = target === 'on' ? 'super-on record' : 'pull';
  if (why.length < 3) throw new InvalidError(`Say why this ${noun} is being voided (at least 3 characters).`);
  const notFound = () => new NotFoundError(target === 'on' ? 'No such super-on record.' : 'No such super pull.');
  if (!Number.isInteger(superPullId) || superPullId <= 0) throw notFound();
  return sequelize.transaction(async (t) => {
    const found = await models.SuperPull.findByPk(superPullId, { attributes: ['id', 'colonyId'], transaction: t });
    if (!found) throw notFound();
    // The colony first, then its supers in id order: recording a pull also locks the colony first,
    // and filling a lot locks supers in id order, so none of them can deadlock with a void.
    const colony = canWriteColonies(user) ? await colonyInScope(user, found.colonyId, t) : null;
    if (!colony) throw notFound();
    const supers = await models.SuperPull.findAll({
      where: { colonyId: colony.id },
      order: [['id', 'ASC']],
      lock: t.LOCK.UPDATE,
      transaction: t,
    });
    const sp = supers.find((s) => s.id === superPullId);
    if (!sp) throw notFound();
    const label = sp.tagCode ? `Super ${sp.tagCode}` : 'This super';
    if (sp.voidedAt) throw new ConflictError(`This ${noun} is already voided.`);
    if (target === 'pull' && !sp.pulledOn)
      throw new ConflictError(
        `${label} is still on the hive: only a recorded pull can be voided. To void it as put on by mistake, use “Void this super-on record…”.`,
      );
    if (target === 'on' && sp.pulledOn)
      throw new ConflictError(
        `${label} was pulled on ${sp.pulledOn}, so it is no longer on the hive. Reload the page; if that pull is the mistake, void the pull.`,
      );
    if (sp.lotId !== null) {
      const lot = await models.Lot.findByPk(sp.lotId, { attributes: ['code'], transaction: t });
      throw new ConflictError(
        `${label} is already in lot ${lot?.code ?? `#${sp.lotId}`}, so its pull cannot be voided. Ask the honey house to take it out of the lot first (they can while the lot is still gathering).`,
      );
    }
    const voidedAt = new Date();
    await sp.update({ voidedAt, voidedByUserId: user.id, voidReason: why }, { transaction: t });
    // Only pulled supers take part in the conflict checks: a super still on changes no other row's flags.
    const reflagged = target === 'pull' ? await recomputeColonyFlags(colony.id, t) : 0;
    const actor = await models.User.findByPk(user.id, { attributes: ['name'], transaction: t });
    await recordAudit(
      {
        actorUserId: user.id,
        action: target === 'on' ? 'super.on.void' : 'super.void',
        entityType: 'super_pull',
        entityId: sp.id,
        before: { voidedAt: null },
        after:
          target === 'on'
            ? {
                colonyId: colony.id,
                colonyCode: colony.code,
                tagCode: sp.tagCode,
                putOnOn: sp.putOnOn,
                voidedAt: voidedAt.toISOString(),
              }
            : {
                colonyId: colony.id,
                colonyCode: colony.code,
                tagCode: sp.tagCode,
                pulledOn: sp.pulledOn,
                voidedAt: voidedAt.toISOString(),
                reflaggedNeighbours: reflagged,
              },
        reason: why,
      },
      t,
    );
    return {
      id: sp.id,
      colonyId: colony.id,
      void: { at: voidedAt.toISOString(), byName: actor?.name ?? null, reason: why },
      reflagged,
    };
  });
}
