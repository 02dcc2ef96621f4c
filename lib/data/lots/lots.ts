import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { getDb } from '@/lib/db/index';
import type { SessionUser } from '@/lib/auth/session';
import { lotCode } from '@/lib/domain/lot-code';
import type { LotStage } from '@/lib/domain/lot-stage';
import { remainingGrams } from '@/lib/domain/lot-weights';
import { todayIn } from '@/lib/domain/local-date';
import type { LotListQuery } from '@/lib/schemas/lots';
import type { Page } from '@/lib/schemas/list-query';
import { recordAudit } from '@/lib/data/audit';
import { ConflictError } from '@/lib/domain/errors';
import { bestBeforeDate } from '@/lib/domain/jars';
import { getSettings } from '@/lib/data/settings/settings';
import { assertOpen, KEEPER_LOTS_SQL, lockLot, lotSnapshot } from './access';
import type { HoneyOrigin, Lot } from '@/models/lot';

/** The calendar year now in the business's time zone (the lot code's year). */
export function businessYear(timeZone: string, now = new Date()): number {
  return Number(todayIn(timeZone, now).slice(0, 4));
}

/**
 * The next lot code, taken inside the caller's transaction. The upsert locks the
 * (prefix, year) row until the transaction ends, so concurrent lots queue up, and a
 * rolled-back lot gives its number back: no gaps, no duplicates.
 */
export async function takeLotCode(prefix: string, year: number, t: Transaction): Promise<string> {
  const [row] = await getDb().sequelize.query<{ last_value: number }>(
    `INSERT INTO lot_sequences (prefix, year, last_value) VALUES (:prefix, :year, 1)
     ON CONFLICT (prefix, year) DO UPDATE SET last_value = lot_sequences.last_value + 1
     RETURNING last_value`,
    { type: QueryTypes.SELECT, replacements: { prefix, year }, transaction: t },
  );
  return lotCode(prefix, year, Number(row.last_value));
}

export type NewLot = {
  floralSource: string;
  heather?: boolean;
  extractedOn?: string | null;
  notes?: string;
  /** The honey category of 2001/110/EC Annex II; left out = unchanged on update, the defaults on create. */
  honeyOrigin?: HoneyOrigin;
  annexSource?: string;
  bakers?: boolean;
  pressed?: boolean;
  tropical?: boolean;
  lowEnzyme?: boolean;
};

function categoryColumns(input: NewLot) {
  const out: Partial<Pick<Lot, 'honeyOrigin' | 'annexSource' | 'bakers' | 'pressed' | 'tropical' | 'lowEnzyme'>> = {};
  if (input.honeyOrigin !== undefined) out.honeyOrigin = input.honeyOrigin;
  if (input.annexSource !== undefined) out.annexSource = input.annexSource || null;
  for (const k of ['bakers', 'pressed', 'tropical', 'lowEnzyme'] as const)
    if (input[k] !== undefined) out[k] = input[k];
  return out;
}

/** A new lot in *gathering*, with the next code; audited in the same transaction. */
export async function createLot(
  actor: SessionUser,
  input: NewLot,
  extra: { isBlend?: boolean; stage?: LotStage; t?: Transaction } = {},
): Promise<Lot> {
  const { sequelize, models } = getDb();
  const settings = await getSettings();
  const run = async (t: Transaction) => {
    const code = await takeLotCode(settings.lotCodePrefix, businessYear(settings.timeZone), t);
    const lot = await models.Lot.create(
      {
        code,
        floralSource: input.floralSource.trim(),
        heather: input.heather ?? false,
        ...categoryColumns(input),
        extractedOn: input.extractedOn || null,
        notes: input.notes ?? '',
        createdBy: actor.id,
        isBlend: extra.isBlend ?? false,
        stage: extra.stage ?? 'gathering',
      },
      { transaction: t },
    );
    await recordAudit(
      {
        actorUserId: actor.id,
        action: extra.isBlend ? 'lot.blend' : 'lot.create',
        entityType: 'lot',
        entityId: lot.id,
        after: lotSnapshot(lot),
      },
      t,
    );
    return lot;
  };
  return extra.t ? run(extra.t) : sequelize.transaction(run);
}

export async function updateLotDetails(actor: SessionUser, lotId: number, input: NewLot): Promise<void> {
  const { sequelize } = getDb();
  await sequelize.transaction(async (t) => {
    const lot = await lockLot(lotId, t);
    assertOpen(lot, 'changing its details');
    const before = lotSnapshot(lot);
    const extractedOn = input.extractedOn || null;
    const dates: { extractedOn?: string | null; bestBeforeOn?: string | null } = {};
    if (extractedOn !== (lot.extractedOn ?? null)) {
      // The best-before follows the extraction date until a jar carries it; after that both stay.
      const { JarringRun, StockLevel } = getDb().models;
      const jarred =
        (await JarringRun.count({ where: { lotId: lot.id }, transaction: t })) > 0 ||
        (await StockLevel.count({ where: { lotId: lot.id }, transaction: t })) > 0;
      if (jarred)
        throw new ConflictError(
          `Jars of lot ${lot.code} already carry best-before ${lot.bestBeforeOn ?? '(set)'}, counted from extraction on ${lot.extractedOn ?? '(not recorded)'}; the extraction date can no longer change. Note the correction in the lot's notes.`,
        );
      const settings = await getSettings();
      dates.extractedOn = extractedOn;
      dates.bestBeforeOn = extractedOn ? bestBeforeDate(extractedOn, settings.bestBeforeMonths) : null;
    }
    await lot.update(
      {
        floralSource: input.floralSource.trim(),
        heather: input.heather ?? false,
        ...dates,
        notes: input.notes ?? '',
        ...categoryColumns(input),
      },
      { transaction: t },
    );
    await recordAudit(
      {
        actorUserId: actor.id,
        action: 'lot.update',
        entityType: 'lot',
        entityId: lot.id,
        before,
        after: lotSnapshot(lot),
      },
      t,
    );
  });
}

export async function setCappingsWax(actor: SessionUser, lotId: number, grams: number): Promise<void> {
  const { sequelize } = getDb();
  await sequelize.transaction(async (t) => {
    const lot = await lockLot(lotId, t);
    assertOpen(lot, 'changing the cappings wax');
    const before = { cappingsWaxGrams: lot.cappingsWaxGrams };
    await lot.update({ cappingsWaxGrams: grams }, { transaction: t });
    await recordAudit(
      {
        actorUserId: actor.id,
        action: 'lot.wax',
        entityType: 'lot',
        entityId: lot.id,
        before,
        after: { cappingsWaxGrams: grams },
      },
      t,
    );
  });
}

/** Floral sources used on earlier lots, most used first (for the input's suggestions). */
export async function floralSourceSuggestions(limit = 30): Promise<string[]> {
  const rows = await getDb().sequelize.query<{ floral_source: string }>(
    `SELECT floral_source FROM lots WHERE floral_source <> '' GROUP BY floral_source ORDER BY count(*) DESC, max(id) DESC LIMIT :limit`,
    { type: QueryTypes.SELECT, replacements: { limit } },
  );
  return rows.map((r) => r.floral_source);
}

export type LotListRow = {
  id: number;
  code: string;
  floralSource: string;
  stage: LotStage;
  isBlend: boolean;
  extractedOn: string | null;
  netGrams: number;
  remainingGrams: number;
  superCount: number;
  createdAt: string;
};
/** A page of lots, with every year that has lots (for the year filter). */
export type LotList = Page<LotListRow> & { years: number[] };

/** One page of lots, filtered; a keeper sees only lots holding their colonies' supers. */
export async function listLots(user: SessionUser, q: LotListQuery): Promise<LotList> {
  const where: string[] = [];
  const replacements: Record<string, unknown> = { limit: q.pageSize, offset: (q.page - 1) * q.pageSize };
  if (user.role === 'keeper') {
    where.push(`l.id IN (${KEEPER_LOTS_SQL})`);
    replacements.keeperId = user.id;
  } else if (user.role !== 'owner' && user.role !== 'crew') {
    return { rows: [], total: 0, page: q.page, pageSize: q.pageSize, years: [] };
  }
  if (q.stage) {
    where.push('l.stage = :stage');
    replacements.stage = q.stage;
  }
  if (q.year) {
    where.push('EXTRACT(YEAR FROM COALESCE(l.extracted_on, l.created_at::date)) = :year');
    replacements.year = q.year;
  }
  if (q.floral) {
    where.push(`l.floral_source ILIKE :floral ESCAPE '\\'`);
    replacements.floral = `%${q.floral.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
  }
  const whereSql = where.length ? `WHERE ${where.join(' AND ')}` : '';
  // Sort columns come from the schema's allow-list, never from the request text itself.
  const sortSql = { createdAt: 'l.created_at', code: 'l.code', extractedOn: 'l.extracted_on', netGrams: 'l.net_grams' }[
    q.sort
  ];
  const dir = q.dir === 'asc' ? 'ASC' : 'DESC';
  const { sequelize } = getDb();
  const rows = await sequelize.query<Record<string, unknown>>(
    `SELECT l.id, l.code, l.floral_source, l.stage, l.is_blend, l.extracted_on, l.net_grams, l.used_grams, l.created_at,
            (SELECT count(*) FROM super_pulls sp WHERE sp.lot_id = l.id)::int AS super_count, count(*) OVER ()::int AS total
     FROM lots l ${whereSql} ORDER BY ${sortSql} ${dir} NULLS LAST, l.id ${dir} LIMIT :limit OFFSET :offset`,
    { type: QueryTypes.SELECT, replacements },
  );
  const years = await sequelize.query<{ y: number }>(
    `SELECT DISTINCT EXTRACT(YEAR FROM COALESCE(extracted_on, created_at::date))::int AS y FROM lots ORDER BY y DESC`,
    { type: QueryTypes.SELECT },
  );
  let total = rows.length ? Number(rows[0].total) : 0;
  if (!rows.length && q.page > 1) {
    const [c] = await sequelize.query<{ n: number }>(`SELECT count(*)::int AS n FROM lots l ${whereSql}`, {
      type: QueryTypes.SELECT,
      replacements,
    });
    total = c.n;
  }
  return {
    total,
    page: q.page,
    pageSize: q.pageSize,
    years: years.map((r) => r.y),
    rows: rows.map((r) => ({
      id: Number(r.id),
      code: String(r.code),
      floralSource: String(r.floral_source),
      stage: r.stage as LotStage,
      isBlend: Boolean(r.is_blend),
      extractedOn: (r.extracted_on as string | null) ?? null,
      netGrams: Number(r.net_grams),
      remainingGrams: remainingGrams({ netGrams: Number(r.net_grams), usedGrams: Number(r.used_grams) }),
      superCount: Number(r.super_count),
      createdAt: new Date(r.created_at as string).toISOString(),
    })),
  };
}
