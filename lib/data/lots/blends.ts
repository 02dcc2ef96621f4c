import 'server-only';
import { Op } from 'sequelize';
import { getDb } from '@/lib/db/index';
import type { SessionUser } from '@/lib/auth/session';
import { ConflictError, InvalidError, NotFoundError } from '@/lib/domain/errors';
import { nextStage } from '@/lib/domain/lot-stage';
import { remainingGrams } from '@/lib/domain/lot-weights';
import { blendBestBefore, lotBestBefore } from '@/lib/domain/jars';
import { getSettingsIn } from '@/lib/data/settings/settings';
import { todayIn } from '@/lib/domain/local-date';
import { recordAudit } from '@/lib/data/audit';
import { createLot } from './lots';
import { lotSnapshot } from './access';

export type BlendPart = { lotId: number; grams: number };

/**
 * A blend: a new lot made from parts of released lots, by weight. Each parent is locked
 * (in id order, so two blends never deadlock) and its remaining honey (net − used) checked;
 * the grams taken are added to its used_grams in the same transaction. A parent emptied by
 * the blend is packed out. The blend starts *extracted* with net = Σ parts, and its best-before is
 * set at once: never later than its oldest honey (blendBestBefore).
 */
export async function createBlend(
  actor: SessionUser,
  input: { floralSource: string; notes?: string; parts: BlendPart[] },
): Promise<{ id: number; code: string }> {
  const { sequelize, models } = getDb();
  const ids = input.parts.map((p) => p.lotId);
  if (new Set(ids).size !== ids.length) throw new InvalidError('Each parent lot may appear once.');
  return sequelize.transaction(async (t) => {
    const parents = await models.Lot.findAll({
      where: { id: { [Op.in]: ids } },
      order: [['id', 'ASC']],
      lock: t.LOCK.UPDATE,
      transaction: t,
    });
    if (parents.length !== ids.length) throw new NotFoundError('One of the parent lots does not exist.');
    const byId = new Map(parents.map((p) => [p.id, p]));
    for (const part of input.parts) {
      const parent = byId.get(part.lotId)!;
      if (parent.stage !== 'released')
        throw new ConflictError(
          `Lot ${parent.code} is ${parent.stage.replace('_', ' ')}: only released lots can go into a blend.`,
        );
      const left = remainingGrams(parent);
      if (part.grams > left)
        throw new ConflictError(`Lot ${parent.code} has only ${left} g left; ${part.grams} g cannot be taken from it.`);
    }
    const netGrams = input.parts.reduce((sum, p) => sum + p.grams, 0);
    const { bestBeforeMonths, timeZone } = await getSettingsIn(t);
    const blendedOn = todayIn(timeZone);
    const bestBeforeOn = blendBestBefore(
      blendedOn,
      bestBeforeMonths,
      parents.map((p) => lotBestBefore(p, bestBeforeMonths, blendedOn)),
    );
    const blend = await createLot(
      actor,
      {
        floralSource: input.floralSource,
        notes: input.notes ?? '',
        extractedOn: blendedOn,
      },
      { isBlend: true, stage: 'extracted', t },
    );
    await blend.update({ netGrams, bestBeforeOn }, { transaction: t });
    for (const part of input.parts) {
      const parent = byId.get(part.lotId)!;
      const before = lotSnapshot(parent);
      await models.LotParent.create(
        { childLotId: blend.id, parentLotId: parent.id, grams: part.grams },
        { transaction: t },
      );
      const usedGrams = parent.usedGrams + part.grams;
      const packed = nextStage(parent.stage, 'packed_out', {
        role: actor.role,
        hasWeights: true,
        moistureOk: null,
        labOk: null,
        unresolvedFlaggedSupers: 0,
        remainingGrams: parent.netGrams - usedGrams,
      });
      await parent.update({ usedGrams, ...(packed.ok ? { stage: packed.stage } : {}) }, { transaction: t });
      await recordAudit(
        {
          actorUserId: actor.id,
          action: 'lot.blend.take',
          entityType: 'lot',
          entityId: parent.id,
          before,
          after: { ...lotSnapshot(parent), blendLotId: blend.id, blendCode: blend.code, grams: part.grams },
        },
        t,
      );
    }
    await recordAudit(
      {
        actorUserId: actor.id,
        action: 'lot.blend.parts',
        entityType: 'lot',
        entityId: blend.id,
        after: { netGrams, bestBeforeOn, parts: input.parts.map((p) => ({ ...p, code: byId.get(p.lotId)!.code })) },
      },
      t,
    );
    return { id: blend.id, code: blend.code };
  });
}

/** Released lots with honey left, for the blend form. */
export async function listBlendableLots(): Promise<
  { id: number; code: string; floralSource: string; remainingGrams: number }[]
> {
  const rows = await getDb().models.Lot.findAll({ where: { stage: 'released' }, order: [['code', 'ASC']] });
  return rows
    .map((l) => ({ id: l.id, code: l.code, floralSource: l.floralSource, remainingGrams: remainingGrams(l) }))
    .filter((l) => l.remainingGrams > 0);
}
