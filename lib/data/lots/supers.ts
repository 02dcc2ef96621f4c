import 'server-only';
import { Op, type Transaction } from 'sequelize';
import { getDb } from '@/lib/db/index';
import type { SessionUser } from '@/lib/auth/session';
import { ConflictError, InvalidError, NotFoundError } from '@/lib/domain/errors';
import { recordAudit } from '@/lib/data/audit';
import { assertOpen, lockLot } from './access';
import type { Lot } from '@/models/lot';
import type { SuperPull } from '@/models/super-pull';

export type AddedSuper = { superPullId: number; tagCode: string | null; colonyCode: string; overridden: boolean };

function superLabel(sp: SuperPull): string {
  return sp.tagCode ? `Super ${sp.tagCode}` : `Super #${sp.id}`;
}

async function lotCodeOf(lotId: number, t: Transaction): Promise<string> {
  const lot = await getDb().models.Lot.findByPk(lotId, { attributes: ['code'], transaction: t });
  return lot?.code ?? `#${lotId}`;
}

/**
 * Puts one pulled super (row already locked) into the lot. A flagged super (feeding or
 * treatment conflict) is refused unless the owner writes an override reason, which is
 * stored on the super and in the audit log.
 */
async function attach(
  actor: SessionUser,
  lot: Lot,
  sp: SuperPull,
  overrideReason: string | undefined,
  t: Transaction,
): Promise<AddedSuper> {
  if (sp.lotId !== null)
    throw new ConflictError(`${superLabel(sp)} is already in lot ${await lotCodeOf(sp.lotId, t)}.`);
  if (sp.voidedAt)
    throw new ConflictError(
      `${superLabel(sp)} was voided by its keeper (recorded by mistake), so it cannot go into a lot.`,
    );
  if (!sp.pulledOn) throw new ConflictError(`${superLabel(sp)} has not been pulled yet.`);
  let overridden = false;
  if (sp.flagged && !sp.overrideReason) {
    const why = (sp.flagReasons ?? []).join('; ') || 'a feeding or treatment conflict';
    if (actor.role !== 'owner')
      throw new ConflictError(
        `${superLabel(sp)} is flagged (${why}). Only the owner can put it into a lot, with a written reason.`,
      );
    if (!overrideReason || overrideReason.trim().length < 5)
      throw new ConflictError(
        `${superLabel(sp)} is flagged (${why}). Write an override reason (at least 5 characters) to put it into the lot.`,
      );
    await sp.update({ overrideReason: overrideReason.trim(), overrideBy: actor.id }, { transaction: t });
    await recordAudit(
      {
        actorUserId: actor.id,
        action: 'super.override',
        entityType: 'super_pull',
        entityId: sp.id,
        after: { flagReasons: sp.flagReasons, lotId: lot.id },
        reason: overrideReason.trim(),
      },
      t,
    );
    await recordAudit(
      {
        actorUserId: actor.id,
        action: 'lot.super.override',
        entityType: 'lot',
        entityId: lot.id,
        after: { superPullId: sp.id, tagCode: sp.tagCode },
        reason: overrideReason.trim(),
      },
      t,
    );
    overridden = true;
  }
  await sp.update({ lotId: lot.id }, { transaction: t });
  await recordAudit(
    {
      actorUserId: actor.id,
      action: 'lot.super.add',
      entityType: 'lot',
      entityId: lot.id,
      before: null,
      after: { superPullId: sp.id, tagCode: sp.tagCode, colonyId: sp.colonyId },
    },
    t,
  );
  const colony = await getDb().models.Colony.findByPk(sp.colonyId, { attributes: ['code'], transaction: t });
  return { superPullId: sp.id, tagCode: sp.tagCode, colonyCode: colony?.code ?? '', overridden };
}

async function openLotForSupers(lotId: number, t: Transaction): Promise<Lot> {
  const lot = await lockLot(lotId, t);
  if (lot.isBlend) throw new ConflictError('A blend is made from lots, not supers.');
  if (lot.stage !== 'gathering' && lot.stage !== 'extracted') {
    throw new ConflictError(
      `Lot ${lot.code} is ${lot.stage.replace('_', ' ')}: supers go in only while it is gathering or extracted.`,
    );
  }
  return lot;
}

/** A scanned or typed tag: the latest pulled super with that tag that is in no lot yet. */
export async function addSuperByTag(
  actor: SessionUser,
  lotId: number,
  tagCode: string,
  overrideReason?: string,
): Promise<AddedSuper> {
  const { sequelize, models } = getDb();
  const code = tagCode.trim();
  return sequelize.transaction(async (t) => {
    const lot = await openLotForSupers(lotId, t);
    const tagWhere = sequelize.where(sequelize.fn('upper', sequelize.col('tag_code')), code.toUpperCase());
    const sp = await models.SuperPull.findOne({
      where: { [Op.and]: [tagWhere, { pulledOn: { [Op.ne]: null } }, { lotId: null }, { voidedAt: null }] },
      order: [
        ['pulledOn', 'DESC'],
        ['id', 'DESC'],
      ],
      lock: t.LOCK.UPDATE,
      transaction: t,
    });
    if (!sp) {
      const any = await models.SuperPull.findOne({ where: tagWhere, order: [['id', 'DESC']], transaction: t });
      if (!any) throw new NotFoundError(`No super with tag ${code}.`);
      if (any.voidedAt)
        throw new ConflictError(
          `The last ${any.pulledOn ? 'pull' : 'super-on record'} of super ${code} was voided by its keeper (recorded by mistake): nothing to put in.`,
        );
      if (!any.pulledOn) throw new ConflictError(`Super ${code} is still on a hive: record its pull first.`);
      if (any.lotId === lot.id) throw new ConflictError(`Super ${code} is already in this lot.`);
      throw new ConflictError(`Super ${code} is already in lot ${await lotCodeOf(any.lotId!, t)}.`);
    }
    return attach(actor, lot, sp, overrideReason, t);
  });
}

/** Supers ticked in the list of pulled supers not yet in a lot. All or nothing. */
export async function addSupersById(actor: SessionUser, lotId: number, superPullIds: number[]): Promise<AddedSuper[]> {
  const { sequelize, models } = getDb();
  return sequelize.transaction(async (t) => {
    const lot = await openLotForSupers(lotId, t);
    const rows = await models.SuperPull.findAll({
      where: { id: [...new Set(superPullIds)] },
      order: [['id', 'ASC']],
      lock: t.LOCK.UPDATE,
      transaction: t,
    });
    if (rows.length !== new Set(superPullIds).size) throw new NotFoundError('One of the supers no longer exists.');
    const added: AddedSuper[] = [];
    for (const sp of rows) added.push(await attach(actor, lot, sp, undefined, t));
    return added;
  });
}

/** Takes a super back out of a lot that is still gathering. */
export async function removeSuper(
  actor: SessionUser,
  lotId: number,
  superPullId: number,
  reason: string,
): Promise<void> {
  const { sequelize, models } = getDb();
  await sequelize.transaction(async (t) => {
    const lot = await lockLot(lotId, t);
    if (lot.stage !== 'gathering') throw new ConflictError('Supers can only be taken out while the lot is gathering.');
    const sp = await models.SuperPull.findOne({
      where: { id: superPullId, lotId },
      lock: t.LOCK.UPDATE,
      transaction: t,
    });
    if (!sp) throw new NotFoundError('That super is not in this lot.');
    await sp.update({ lotId: null }, { transaction: t });
    await recordAudit(
      {
        actorUserId: actor.id,
        action: 'lot.super.remove',
        entityType: 'lot',
        entityId: lot.id,
        before: { superPullId: sp.id, tagCode: sp.tagCode },
        after: null,
        reason,
      },
      t,
    );
  });
}

/** The super's empty weight after extraction: its measured honey is full − empty. */
export async function setSuperEmptyWeight(
  actor: SessionUser,
  lotId: number,
  superPullId: number,
  emptyGrams: number,
): Promise<void> {
  const { sequelize, models } = getDb();
  await sequelize.transaction(async (t) => {
    const lot = await lockLot(lotId, t);
    assertOpen(lot, 'changing a super’s empty weight');
    const sp = await models.SuperPull.findOne({
      where: { id: superPullId, lotId },
      lock: t.LOCK.UPDATE,
      transaction: t,
    });
    if (!sp) throw new NotFoundError('That super is not in this lot.');
    if (sp.fullGrams !== null && emptyGrams >= sp.fullGrams)
      throw new InvalidError('The empty weight must be less than the full weight.');
    const before = { emptyGrams: sp.emptyGrams };
    await sp.update({ emptyGrams }, { transaction: t });
    await recordAudit(
      {
        actorUserId: actor.id,
        action: 'lot.super.empty',
        entityType: 'lot',
        entityId: lot.id,
        before: { superPullId: sp.id, ...before },
        after: { superPullId: sp.id, emptyGrams },
      },
      t,
    );
  });
}

export type PullableSuper = {
  id: number;
  tagCode: string | null;
  colonyCode: string;
  yardName: string;
  pulledOn: string;
  depth: string;
  fullGrams: number | null;
  flagged: boolean;
  flagReasons: string[];
};

/** Pulled supers in no lot yet and not voided, newest first; filtered by yard and tag/colony text. */
export async function listPullableSupers(
  filter: { yardId?: number; q?: string; limit?: number } = {},
): Promise<PullableSuper[]> {
  const { models } = getDb();
  const q = filter.q?.trim();
  const like = q ? `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%` : null;
  const rows = await models.SuperPull.findAll({
    where: {
      lotId: null,
      pulledOn: { [Op.ne]: null },
      voidedAt: null,
      ...(like ? { [Op.or]: [{ tagCode: { [Op.iLike]: like } }, { '$colony.code$': { [Op.iLike]: like } }] } : {}),
      ...(filter.yardId ? { '$colony.yard_id$': filter.yardId } : {}),
    },
    include: [
      {
        model: models.Colony,
        as: 'colony',
        attributes: ['code', 'yardId'],
        include: [{ model: models.Yard, as: 'yard', attributes: ['name'] }],
      },
    ],
    order: [
      ['pulledOn', 'DESC'],
      ['id', 'DESC'],
    ],
    limit: filter.limit ?? 100,
  });
  return rows.map((r) => ({
    id: r.id,
    tagCode: r.tagCode,
    colonyCode: r.colony?.code ?? '',
    yardName: r.colony?.yard?.name ?? '',
    pulledOn: r.pulledOn!,
    depth: r.depth,
    fullGrams: r.fullGrams,
    flagged: r.flagged && !r.overrideReason,
    flagReasons: r.flagReasons ?? [],
  }));
}

export async function listYardsBrief(): Promise<{ id: number; name: string }[]> {
  const rows = await getDb().models.Yard.findAll({
    attributes: ['id', 'name'],
    where: { archivedAt: null },
    order: [['name', 'ASC']],
  });
  return rows.map((y) => ({ id: y.id, name: y.name }));
}
