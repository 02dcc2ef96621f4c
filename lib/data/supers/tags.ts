import 'server-only';
import { Op } from 'sequelize';
import { getDb } from '@/lib/db/index';
import type { SuperDepth } from '@/models/super-tag';
import { recordAudit } from '@/lib/data/audit';

/** Codes like "OT-0001": prefix, dash, at least four digits. */
export function tagCodes(prefix: string, from: number, count: number): string[] {
  return Array.from({ length: count }, (_, i) => `${prefix.toUpperCase()}-${String(from + i).padStart(4, '0')}`);
}

/** Creates the tags that do not exist yet; returns all codes of the batch (new and existing). */
export async function createTagBatch(
  actorUserId: number,
  input: { prefix: string; from: number; count: number; depth: SuperDepth; frameCount: number },
): Promise<{ codes: string[]; created: number }> {
  const { sequelize, models } = getDb();
  const codes = tagCodes(input.prefix, input.from, input.count);
  return sequelize.transaction(async (t) => {
    const existing = new Set(
      (await models.SuperTag.findAll({ where: { code: codes }, attributes: ['code'], transaction: t })).map(
        (x) => x.code,
      ),
    );
    const fresh = codes.filter((c) => !existing.has(c));
    await models.SuperTag.bulkCreate(
      fresh.map((code) => ({ code, depth: input.depth, frameCount: input.frameCount })),
      { transaction: t },
    );
    await recordAudit(
      {
        actorUserId,
        action: 'superTags.create',
        entityType: 'superTags',
        entityId: `${codes[0]}..${codes.at(-1)}`,
        after: { created: fresh.length },
      },
      t,
    );
    return { codes, created: fresh.length };
  });
}

export async function listTags(
  prefix?: string,
  limit = 5000,
): Promise<{ code: string; depth: SuperDepth; frameCount: number }[]> {
  const rows = await getDb().models.SuperTag.findAll({
    where: { retiredAt: null, ...(prefix ? { code: { [Op.startsWith]: prefix.toUpperCase() } } : {}) },
    order: [['code', 'ASC']],
    limit,
  });
  return rows.map((r) => ({ code: r.code, depth: r.depth, frameCount: r.frameCount }));
}

/** Printed tags that are free to go on a hive: not retired and not on any hive now (for the Super on pick list). */
export async function listFreeTags(limit = 2000): Promise<string[]> {
  const [rows] = (await getDb().sequelize.query(
    `SELECT t.code FROM super_tags t
      WHERE t.retired_at IS NULL
        AND NOT EXISTS (SELECT 1 FROM super_pulls p
                         WHERE upper(p.tag_code) = t.code AND p.pulled_on IS NULL AND p.voided_at IS NULL)
      ORDER BY t.code LIMIT :limit`,
    { replacements: { limit } },
  )) as [{ code: string }[], unknown];
  return rows.map((r) => r.code);
}

/** The tags on each of these colonies now (for the pull pick list): colony id → codes. */
export async function listTagsOnColonies(colonyIds: number[]): Promise<Record<number, string[]>> {
  if (colonyIds.length === 0) return {};
  const rows = await getDb().models.SuperPull.findAll({
    where: { colonyId: colonyIds, pulledOn: null, voidedAt: null, tagCode: { [Op.ne]: null } },
    attributes: ['colonyId', 'tagCode'],
    order: [['tagCode', 'ASC']],
  });
  const out: Record<number, string[]> = {};
  for (const r of rows) (out[r.colonyId] ??= []).push(r.tagCode as string);
  return out;
}
