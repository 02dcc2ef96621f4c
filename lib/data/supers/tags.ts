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
