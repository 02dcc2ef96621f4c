import 'server-only';
import { Op, type WhereOptions } from 'sequelize';
import { getDb } from '@/lib/db/index';
import type { SessionUser } from '@/lib/auth/session';
import type { PullListQuery } from '@/lib/schemas/supers';
import type { Page } from '@/lib/schemas/list-query';
import type { SuperPull } from '@/models/super-pull';
import type { SuperDepth } from '@/models/super-tag';
import { yardScope } from '@/lib/data/yards/scope';

export type PullRow = {
  id: number;
  colonyId: number;
  colonyCode: string;
  yardId: number;
  yardName: string;
  tagCode: string | null;
  depth: SuperDepth;
  frameCount: number;
  putOnOn: string | null;
  pulledOn: string | null;
  fullGrams: number | null;
  cappedFrames: number | null;
  flagged: boolean;
  flagReasons: string[];
  inLot: boolean;
  pulledByName: string | null;
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
    id: p.id,
    colonyId: p.colonyId,
    colonyCode: p.colony?.code ?? '',
    yardId: p.colony?.yardId ?? 0,
    yardName: p.colony?.yard?.name ?? '',
    tagCode: p.tagCode ?? null,
    depth: p.depth,
    frameCount: p.frameCount,
    putOnOn: p.putOnOn ?? null,
    pulledOn: p.pulledOn ?? null,
    fullGrams: p.fullGrams ?? null,
    cappedFrames: p.cappedFrames ?? null,
    flagged: p.flagged,
    flagReasons: p.flagReasons ?? [],
    inLot: p.lotId != null,
    pulledByName: null,
    voided: pullVoid(p),
  };
}

const voidedByInclude = { association: 'voidedBy', attributes: ['id', 'name'] };

const SORTS = { pulledOn: ['pulledOn'], colony: ['colony', 'code'], fullGrams: ['fullGrams'] } as const;

/** Pulled supers (not those still on a hive), newest first by default, in the user's yards; voided ones too unless filtered. */
export async function listSuperPulls(user: SessionUser, query: PullListQuery): Promise<Page<PullRow>> {
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
      {
        association: 'colony',
        attributes: ['id', 'code', 'yardId'],
        where: { [Op.and]: colonyWhere },
        required: true,
        include: [{ association: 'yard', attributes: ['id', 'name'] }],
      },
      voidedByInclude,
    ],
    order: [
      sort.length === 2
        ? [{ model: models.Colony, as: 'colony' }, 'code', query.dir]
        : [sort[0], query.dir === 'desc' ? 'DESC NULLS LAST' : 'ASC NULLS LAST'],
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
    include: [
      {
        association: 'colony',
        attributes: ['id', 'code', 'yardId'],
        include: [{ association: 'yard', attributes: ['id', 'name'] }],
      },
      voidedByInclude,
    ],
    order: [
      ['pulledOn', 'DESC NULLS FIRST'],
      ['putOnOn', 'DESC NULLS LAST'],
      ['id', 'DESC'],
    ],
  });
  return rows.map(toRow);
}
