import 'server-only';
import { Op, type WhereOptions } from 'sequelize';
import { getDb } from '@/lib/db/index';
import type { SessionUser } from '@/lib/auth/session';
import type { YardListQuery } from '@/lib/schemas/yards';
import type { Page } from '@/lib/schemas/list-query';
import type { Yard } from '@/models/yard';
import { ConflictError, InvalidError, NotFoundError } from '@/lib/domain/errors';
import { recordAudit } from '@/lib/data/audit';
import { inScope, yardScope } from './scope';

export type YardRow = {
  id: number;
  name: string;
  place: string;
  latitude: number | null;
  longitude: number | null;
  forageNotes: string;
  keepers: { id: number; name: string }[];
  activeColonies: number;
};

// The main table's alias is the model's class name, which a production build minifies: ask the class.
const colonyCount = () =>
  `(SELECT count(*)::int FROM colonies c WHERE c.yard_id = "${getDb().models.Yard.name}"."id" AND c.status = 'active')`;

function toRow(y: Yard): YardRow {
  return {
    id: y.id,
    name: y.name,
    place: y.place,
    latitude: y.latitude,
    longitude: y.longitude,
    forageNotes: y.forageNotes,
    keepers: (y.keepers ?? []).map((k) => ({ id: k.id, name: k.name })).sort((a, b) => a.name.localeCompare(b.name)),
    activeColonies: Number(y.get('activeColonies') ?? 0),
  };
}

export async function listYards(user: SessionUser, query: YardListQuery): Promise<Page<YardRow>> {
  const { sequelize, models } = getDb();
  const scope = await yardScope(user);
  const where: WhereOptions = { archivedAt: null };
  const and: WhereOptions[] = [where];
  if (!scope.all) and.push({ id: scope.yardIds });
  if (query.q) and.push({ name: { [Op.iLike]: `%${query.q.replace(/[%_\\]/g, '\\$&')}%` } });
  const order =
    query.sort === 'colonies'
      ? sequelize.literal(`${colonyCount()} ${query.dir.toUpperCase()}, "${models.Yard.name}"."name" ASC`)
      : [['name', query.dir]];
  const { rows, count } = await models.Yard.findAndCountAll({
    where: { [Op.and]: and },
    attributes: { include: [[sequelize.literal(colonyCount()), 'activeColonies']] },
    order: Array.isArray(order) ? (order as [string, string][]) : [order],
    limit: query.pageSize,
    offset: (query.page - 1) * query.pageSize,
    distinct: true,
  });
  const ids = rows.map((r) => r.id);
  const withKeepers = ids.length
    ? await models.Yard.findAll({
        where: { id: ids },
        include: [{ association: 'keepers', attributes: ['id', 'name'], through: { attributes: [] } }],
      })
    : [];
  const keepersById = new Map(withKeepers.map((y) => [y.id, y.keepers ?? []]));
  return {
    rows: rows.map((r) => toRow(Object.assign(r, { keepers: keepersById.get(r.id) ?? [] }))),
    total: count,
    page: query.page,
    pageSize: query.pageSize,
  };
}

/** One yard, or null when it does not exist or is not the keeper's. */
export async function getYard(user: SessionUser, yardId: number): Promise<YardRow | null> {
  const { sequelize, models } = getDb();
  if (!Number.isInteger(yardId) || yardId <= 0) return null;
  if (!inScope(await yardScope(user), yardId)) return null;
  const yard = await models.Yard.findByPk(yardId, {
    attributes: { include: [[sequelize.literal(colonyCount()), 'activeColonies']] },
    include: [{ association: 'keepers', attributes: ['id', 'name'], through: { attributes: [] } }],
  });
  return yard ? toRow(yard) : null;
}

/** Staff who can be given yards: keepers and owners, not disabled. */
export async function listAssignableKeepers(): Promise<{ id: number; name: string; role: string }[]> {
  const users = await getDb().models.User.findAll({
    where: { role: ['keeper', 'owner'], disabledAt: null },
    order: [['name', 'ASC']],
  });
  return users.map((u) => ({ id: u.id, name: u.name, role: u.role }));
}

type YardData = {
  name: string;
  place: string;
  latitude: number | null;
  longitude: number | null;
  forageNotes: string;
  keeperIds: number[];
};

async function checkKeepers(keeperIds: number[]): Promise<void> {
  if (keeperIds.length === 0) return;
  const found = await getDb().models.User.count({
    where: { id: keeperIds, role: ['keeper', 'owner'], disabledAt: null },
  });
  if (found !== new Set(keeperIds).size)
    throw new InvalidError('Only active keepers (or the owner) can be assigned to a yard.');
}

/** Owner only (the caller checks yards.manage). */
export async function saveYard(actorUserId: number, yardId: number | null, data: YardData): Promise<number> {
  const { sequelize, models } = getDb();
  await checkKeepers(data.keeperIds);
  const taken = await models.Yard.findOne({
    where: { name: { [Op.iLike]: data.name }, ...(yardId ? { id: { [Op.ne]: yardId } } : {}) },
  });
  if (taken) throw new ConflictError(`There is already a yard called ${taken.name}.`);
  return sequelize.transaction(async (t) => {
    const { keeperIds, ...fields } = data;
    let yard: Yard | null;
    let before: Record<string, unknown> | null = null;
    if (yardId) {
      yard = await models.Yard.findByPk(yardId, { transaction: t, lock: t.LOCK.UPDATE });
      if (!yard) throw new NotFoundError('No such yard.');
      const keepers = await models.YardKeeper.findAll({ where: { yardId }, transaction: t });
      before = { ...yard.get({ plain: true }), keeperIds: keepers.map((k) => k.userId).sort() };
      await yard.update(fields, { transaction: t });
    } else {
      yard = await models.Yard.create(fields, { transaction: t });
    }
    await models.YardKeeper.destroy({ where: { yardId: yard.id }, transaction: t });
    if (keeperIds.length)
      await models.YardKeeper.bulkCreate(
        [...new Set(keeperIds)].map((userId) => ({ yardId: yard.id, userId })),
        { transaction: t },
      );
    await recordAudit(
      {
        actorUserId,
        action: yardId ? 'yard.update' : 'yard.create',
        entityType: 'yard',
        entityId: yard.id,
        before,
        after: { ...fields, keeperIds: [...keeperIds].sort() },
      },
      t,
    );
    return yard.id;
  });
}

/** Yards the user may put colonies in (for move and create forms). */
export async function listYardChoices(user: SessionUser): Promise<{ id: number; name: string }[]> {
  const scope = await yardScope(user);
  const yards = await getDb().models.Yard.findAll({
    where: { archivedAt: null, ...(scope.all ? {} : { id: scope.yardIds }) },
    order: [['name', 'ASC']],
  });
  return yards.map((y) => ({ id: y.id, name: y.name }));
}
