import 'server-only';
import { Op, UniqueConstraintError, type Transaction, type WhereOptions } from 'sequelize';
import { getDb } from '@/lib/db/index';
import type { SessionUser } from '@/lib/auth/session';
import type { PullListQuery } from '@/lib/schemas/supers';
import type { SuperPull } from '@/models/super-pull';
import type { SuperDepth } from '@/models/super-tag';
import { toGrams } from '@/lib/domain/units';
import { ConflictError, DomainError, InvalidError, NotFoundError } from '@/lib/domain/errors';
import { canWriteColonies, colonyInScope, yardScope } from '@/lib/data/yards/scope';
import { writableColony } from '@/lib/data/colonies/colonies';
import { flagsForPull, recomputeColonyFlags } from './flags';
import { recordAudit } from '@/lib/data/audit';
import type { Paged } from '@/lib/data/yards/yards';

type Viewer = Pick<SessionUser, 'id' | 'role'>;
export type PullRow = {
  id: number; colonyId: number; colonyCode: string; yardId: number; yardName: string; tagCode: string | null;
  depth: SuperDepth; frameCount: number; putOnOn: string | null; pulledOn: string | null; fullGrams: number | null;
  cappedFrames: number | null; flagged: boolean; flagReasons: string[]; inLot: boolean; pulledByName: string | null;
  /** Set when the pull was voided as a mistake: it stays listed, struck through, and counts for nothing. */
  voided: PullVoid | null;
};
export type PullVoid = { at: string; byName: string | null; reason: string };

export function pullVoid(p: Pick<SuperPull, 'voidedAt' | 'voidReason' | 'voidedBy'>): PullVoid | null {
  if (!p.voidedAt) return null;
  return { at: new Date(p.voidedAt).toISOString(), byName: p.voidedBy?.name ?? null, reason: p.voidReason ?? '' };
}

function toRow(p: SuperPull & { pulledByUser?: { name: string } | null }): PullRow {
  return {
    id: p.id, colonyId: p.colonyId, colonyCode: p.colony?.code ?? '', yardId: p.colony?.yardId ?? 0, yardName: p.colony?.yard?.name ?? '',
    tagCode: p.tagCode ?? null, depth: p.depth, frameCount: p.frameCount, putOnOn: p.putOnOn ?? null, pulledOn: p.pulledOn ?? null,
    fullGrams: p.fullGrams ?? null, cappedFrames: p.cappedFrames ?? null, flagged: p.flagged, flagReasons: p.flagReasons ?? [],
    inLot: p.lotId != null, pulledByName: null, voided: pullVoid(p),
  };
}

const voidedByInclude = { association: 'voidedBy', attributes: ['id', 'name'] };

const SORTS = { pulledOn: ['pulledOn'], colony: ['colony', 'code'], fullGrams: ['fullGrams'] } as const;

/** Pulled supers (not those still on a hive), newest first by default, in the user's yards; voided ones too unless filtered. */
export async function listSuperPulls(user: Viewer, query: PullListQuery): Promise<Paged<PullRow>> {
  const { models } = getDb();
  const scope = await yardScope(user);
  const and: WhereOptions[] = [{ pulledOn: { [Op.ne]: null } }];
  const colonyWhere: WhereOptions[] = [];
  if (!scope.all) colonyWhere.push({ yardId: scope.yardIds });
  if (query.yardId) colonyWhere.push({ yardId: query.yardId });
  if (query.colonyId) and.push({ colonyId: query.colonyId });
  if (query.flagged) and.push({ flagged: query.flagged === 'yes' });
  if (query.voided) and.push({ voidedAt: query.voided === 'yes' ? { [Op.ne]: null } : null });
  if (query.from) and.push({ pulledOn: { [Op.gte]: query.from } });
  if (query.to) and.push({ pulledOn: { [Op.lte]: query.to } });
  const sort = SORTS[query.sort];
  const { rows, count } = await models.SuperPull.findAndCountAll({
    where: { [Op.and]: and },
    include: [
      { association: 'colony', attributes: ['id', 'code', 'yardId'], where: { [Op.and]: colonyWhere }, required: true, include: [{ association: 'yard', attributes: ['id', 'name'] }] },
      voidedByInclude,
    ],
    order: [
      sort.length === 2 ? [{ model: models.Colony, as: 'colony' }, 'code', query.dir] : [sort[0], query.dir === 'desc' ? 'DESC NULLS LAST' : 'ASC NULLS LAST'],
      ['id', 'DESC'],
    ],
    limit: query.pageSize,
    offset: (query.page - 1) * query.pageSize,
  });
  return { rows: rows.map(toRow), total: count, page: query.page, pageSize: query.pageSize };
}

/** All supers of one colony (on and pulled), for its page. The caller has checked the colony is in scope. */
export async function listColonySupers(colonyId: number): Promise<PullRow[]> {
  const rows = await getDb().models.SuperPull.findAll({
    where: { colonyId },
    include: [{ association: 'colony', attributes: ['id', 'code', 'yardId'], include: [{ association: 'yard', attributes: ['id', 'name'] }] }, voidedByInclude],
    order: [['pulledOn', 'DESC NULLS FIRST'], ['putOnOn', 'DESC NULLS LAST'], ['id', 'DESC']],
  });
  return rows.map(toRow);
}

/** A phone's entry key names one record: the row a put-on or a pull created, or the pull that closed it. */
const byEntryKey = (key: string) => ({ [Op.or]: [{ idempotencyKey: key }, { pullKey: key }] });

async function idempotent<T>(find: () => Promise<T | null>, run: () => Promise<T>): Promise<{ value: T; created: boolean }> {
  const existing = await find();
  if (existing) return { value: existing, created: false };
  try {
    return { value: await run(), created: true };
  } catch (err) {
    if (!(err instanceof UniqueConstraintError)) throw err;
    // Two copies of the same entry raced: the unique index on idempotency_key let only one through.
    const again = await find();
    if (again) return { value: again, created: false };
    throw new ConflictError('That tag is already on a hive; pull it there first, or check the tag code.');
  }
}

export async function putSuperOn(user: Viewer, input: { colonyId: number; depth: SuperDepth; frameCount: number; tagCode: string | null; putOnOn: string; idempotencyKey: string }): Promise<number> {
  const { sequelize, models } = getDb();
  const { value } = await idempotent(
    () => models.SuperPull.findOne({ where: byEntryKey(input.idempotencyKey) }),
    () => sequelize.transaction(async (t) => {
      const colony = await writableColony(user, input.colonyId, t);
      return models.SuperPull.create({ ...input, colonyId: colony.id, putOnBy: user.id }, { transaction: t });
    }));
  return value.id;
}

export type PullInput = {
  colonyId: number; pulledOn: string; depth: SuperDepth; frameCount: number; weight: number | null; weightUnit: 'kg' | 'lb';
  cappedFrames: number | null; tagCode: string | null; idempotencyKey: string;
};
export type PullResult = { id: number; colonyId: number; created: boolean; flagged: boolean; flagReasons: string[] };

/**
 * Records one super pulled. If the colony has a super still on (the same tag, or else the
 * oldest one put on; a put-on voided as a mistake is not on), that super is closed; otherwise a pulled super is recorded with no
 * put-on date. The conflict flag is computed from the colony's feedings and treatments in
 * the same transaction. A repeated idempotency key returns the first result, never a second row.
 */
export async function recordPull(user: Viewer, input: PullInput, outer?: Transaction): Promise<PullResult> {
  const { sequelize, models } = getDb();
  const fullGrams = input.weight === null ? null : toGrams(input.weight, input.weightUnit);
  const find = () => models.SuperPull.findOne({ where: byEntryKey(input.idempotencyKey), transaction: outer });
  const work = async (t: Transaction) => {
    const colony = await writableColony(user, input.colonyId, t);
    const open = await models.SuperPull.findAll({
      where: { colonyId: colony.id, pulledOn: null, voidedAt: null, ...(input.tagCode ? { tagCode: input.tagCode } : {}) },
      order: [['putOnOn', 'ASC NULLS LAST'], ['id', 'ASC']], limit: 1, transaction: t, lock: t.LOCK.UPDATE,
    });
    const onHive = open[0] && (!open[0].putOnOn || open[0].putOnOn <= input.pulledOn) ? open[0] : null;
    const flags = await flagsForPull(colony.id, { id: onHive?.id, pulledOn: input.pulledOn, putOnOn: onHive?.putOnOn ?? null }, t);
    const fields = {
      depth: input.depth, frameCount: input.frameCount, pulledOn: input.pulledOn, fullGrams, cappedFrames: input.cappedFrames,
      tagCode: input.tagCode ?? onHive?.tagCode ?? null, pulledBy: user.id, pullKey: input.idempotencyKey, ...flags,
    };
    // Closing a super that went on keeps the put-on's key, so a late retry of that put-on still finds it.
    if (onHive) return onHive.update(fields, { transaction: t });
    return models.SuperPull.create({ ...fields, idempotencyKey: input.idempotencyKey, colonyId: colony.id }, { transaction: t });
  };
  const { value, created } = await idempotent(find, () => (outer ? work(outer) : sequelize.transaction(work)));
  if (!created && value.colonyId !== input.colonyId) throw new ConflictError('This entry key was already used for another colony.');
  return { id: value.id, colonyId: value.colonyId, created, flagged: value.flagged, flagReasons: value.flagReasons };
}

/** Several colonies in one pass: each entry stands alone (one failing entry does not undo the others). */
export async function recordPulls(user: Viewer, entries: PullInput[]): Promise<({ ok: true; key: string } & PullResult | { ok: false; key: string; colonyId: number; message: string })[]> {
  const out = [];
  for (const entry of entries) {
    try {
      out.push({ ok: true as const, key: entry.idempotencyKey, ...(await recordPull(user, entry)) });
    } catch (err) {
      if (!(err instanceof DomainError)) throw err;
      out.push({ ok: false as const, key: entry.idempotencyKey, colonyId: entry.colonyId, message: err.message });
    }
  }
  return out;
}

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
export async function voidSuperPull(user: Viewer, superPullId: number, reason: string, target: VoidTarget = 'pull'): Promise<VoidResult> {
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
    const supers = await models.SuperPull.findAll({ where: { colonyId: colony.id }, order: [['id', 'ASC']], lock: t.LOCK.UPDATE, transaction: t });
    const sp = supers.find((s) => s.id === superPullId);
    if (!sp) throw notFound();
    const label = sp.tagCode ? `Super ${sp.tagCode}` : 'This super';
    if (sp.voidedAt) throw new ConflictError(`This ${noun} is already voided.`);
    if (target === 'pull' && !sp.pulledOn) throw new ConflictError(`${label} is still on the hive: only a recorded pull can be voided. To void it as put on by mistake, use “Void this super-on record…”.`);
    if (target === 'on' && sp.pulledOn) throw new ConflictError(`${label} was pulled on ${sp.pulledOn}, so it is no longer on the hive. Reload the page; if that pull is the mistake, void the pull.`);
    if (sp.lotId !== null) {
      const lot = await models.Lot.findByPk(sp.lotId, { attributes: ['code'], transaction: t });
      throw new ConflictError(`${label} is already in lot ${lot?.code ?? `#${sp.lotId}`}, so its pull cannot be voided. Ask the honey house to take it out of the lot first (they can while the lot is still gathering).`);
    }
    const voidedAt = new Date();
    await sp.update({ voidedAt, voidedByUserId: user.id, voidReason: why }, { transaction: t });
    // Only pulled supers take part in the conflict checks: a super still on changes no other row's flags.
    const reflagged = target === 'pull' ? await recomputeColonyFlags(colony.id, t) : 0;
    const actor = await models.User.findByPk(user.id, { attributes: ['name'], transaction: t });
    await recordAudit({
      actorUserId: user.id, action: target === 'on' ? 'super.on.void' : 'super.void', entityType: 'super_pull', entityId: sp.id,
      before: { voidedAt: null },
      after: target === 'on'
        ? { colonyId: colony.id, colonyCode: colony.code, tagCode: sp.tagCode, putOnOn: sp.putOnOn, voidedAt: voidedAt.toISOString() }
        : { colonyId: colony.id, colonyCode: colony.code, tagCode: sp.tagCode, pulledOn: sp.pulledOn, voidedAt: voidedAt.toISOString(), reflaggedNeighbours: reflagged },
      reason: why,
    }, t);
    return { id: sp.id, colonyId: colony.id, void: { at: voidedAt.toISOString(), byName: actor?.name ?? null, reason: why }, reflagged };
  });
}
