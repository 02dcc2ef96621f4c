import 'server-only';
import { Op, type WhereOptions } from 'sequelize';
import { getDb } from '@/lib/db/index';
import type { SessionUser } from '@/lib/auth/session';
import type { ColonyListQuery } from '@/lib/schemas/colonies';
import type { Page } from '@/lib/schemas/list-query';
import type { Colony, ColonyOrigin, ColonyStatus } from '@/models/colony';
import { queenMarkColour, type QueenMarkColour } from '@/lib/domain/queen-colour';
import { colonyInScope, yardScope } from '@/lib/data/yards/scope';

export type ColonyRow = {
  id: number;
  code: string;
  yardId: number;
  yardName: string;
  keeperId: number;
  keeperName: string;
  origin: ColonyOrigin;
  status: ColonyStatus;
  queenYear: number | null;
  queenColour: QueenMarkColour | null;
  startedOn: string | null;
  lastPulledOn: string | null;
  flaggedSupers: number;
};
export type ColonyDetail = ColonyRow & {
  notes: string;
  parent: { id: number; code: string } | null;
  splits: { id: number; code: string; status: ColonyStatus }[];
  combinedInto: { id: number; code: string } | null;
};

// The main table's alias is the model's class name, which a production build minifies: ask the class.
const alias = () => getDb().models.Colony.name;
// A voided pull (recorded by mistake) counts for nothing here.
const lastPull = () =>
  `(SELECT max(p.pulled_on) FROM super_pulls p WHERE p.colony_id = "${alias()}"."id" AND p.voided_at IS NULL)`;
const flaggedCount = () =>
  `(SELECT count(*)::int FROM super_pulls p WHERE p.colony_id = "${alias()}"."id" AND p.flagged AND p.voided_at IS NULL)`;
const SORTS = { code: 'code', yard: '$yard.name$', status: 'status', queenYear: 'queenYear' } as const;

function toRow(c: Colony): ColonyRow {
  return {
    id: c.id,
    code: c.code,
    yardId: c.yardId,
    yardName: c.yard?.name ?? '',
    keeperId: c.keeperId,
    keeperName: c.keeper?.name ?? '',
    origin: c.origin,
    status: c.status,
    queenYear: c.queenYear ?? null,
    queenColour: c.queenYear ? queenMarkColour(c.queenYear) : null,
    startedOn: c.startedOn ?? null,
    lastPulledOn: (c.get('lastPulledOn') as string | null) ?? null,
    flaggedSupers: Number(c.get('flaggedSupers') ?? 0),
  };
}

const baseInclude = [
  { association: 'yard', attributes: ['id', 'name'] },
  { association: 'keeper', attributes: ['id', 'name'] },
];

export async function listColonies(user: SessionUser, query: ColonyListQuery): Promise<Page<ColonyRow>> {
  const { sequelize, models } = getDb();
  const scope = await yardScope(user);
  const and: WhereOptions[] = [];
  if (!scope.all) and.push({ yardId: scope.yardIds });
  if (query.yardId) and.push({ yardId: query.yardId });
  if (query.status) and.push({ status: query.status });
  if (query.q) and.push({ code: { [Op.iLike]: `%${query.q.replace(/[%_\\]/g, '\\$&')}%` } });
  const sortKey = SORTS[query.sort];
  const { rows, count } = await models.Colony.findAndCountAll({
    where: { [Op.and]: and },
    attributes: {
      include: [
        [sequelize.literal(lastPull()), 'lastPulledOn'],
        [sequelize.literal(flaggedCount()), 'flaggedSupers'],
      ],
    },
    include: baseInclude,
    order:
      sortKey === '$yard.name$'
        ? [
            [{ model: models.Yard, as: 'yard' }, 'name', query.dir],
            ['code', 'ASC'],
          ]
        : [
            [sortKey, query.dir],
            ['code', 'ASC'],
          ],
    limit: query.pageSize,
    offset: (query.page - 1) * query.pageSize,
  });
  return { rows: rows.map(toRow), total: count, page: query.page, pageSize: query.pageSize };
}

/** A colony with its line, or null when missing or outside the user's yards. */
export async function getColony(user: SessionUser, colonyId: number): Promise<ColonyDetail | null> {
  const { sequelize, models } = getDb();
  const scoped = await colonyInScope(user, colonyId);
  if (!scoped) return null;
  const c = await models.Colony.findByPk(colonyId, {
    attributes: {
      include: [
        [sequelize.literal(lastPull()), 'lastPulledOn'],
        [sequelize.literal(flaggedCount()), 'flaggedSupers'],
      ],
    },
    include: [
      ...baseInclude,
      { association: 'parent', attributes: ['id', 'code'] },
      { association: 'splits', attributes: ['id', 'code', 'status'] },
      { association: 'combinedInto', attributes: ['id', 'code'] },
    ],
  });
  if (!c) return null;
  return {
    ...toRow(c),
    notes: c.notes,
    parent: c.parent ? { id: c.parent.id, code: c.parent.code } : null,
    splits: (c.splits ?? [])
      .map((s) => ({ id: s.id, code: s.code, status: s.status }))
      .sort((a, b) => a.code.localeCompare(b.code)),
    combinedInto: c.combinedInto ? { id: c.combinedInto.id, code: c.combinedInto.code } : null,
  };
}
