import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/db/index';
import { DEFAULT_SUPER_ESTIMATES, type SuperEstimates } from '@/lib/domain/yield-allocation';
import { getSettings } from '@/lib/data/settings/settings';
import { seasonBounds } from '@/lib/domain/season';
import { LOT_SEASON_SQL, SEASON_OF_SQL, estimateParams, revCte, rootsCte, seasonRange, walkCte } from './yield-ctes';

/** The owner's season start month (settings); seasons run from its 1st to the day before it a year on. */
const startMonth = async () => (await getSettings()).seasonStartMonth;

/**
 * The SQL behind the season report. Everything that touches many rows (super pulls, lot
 * parents, order allocations) is aggregated here; JavaScript only rounds the short
 * per-lot share lists (see build-report.ts). The shared pieces and the rules they follow are
 * in yield-ctes.ts.
 */

/** The owner's estimates (settings.superEstimates) over the defaults, depth by depth; anything unusable is ignored. */
export function superEstimatesFrom(setting: Partial<SuperEstimates> | null | undefined): SuperEstimates {
  const out: SuperEstimates = { ...DEFAULT_SUPER_ESTIMATES };
  for (const depth of ['deep', 'medium', 'shallow'] as const) {
    const e = setting?.[depth];
    if (
      e &&
      Number.isFinite(e.gramsPerBox) &&
      e.gramsPerBox > 0 &&
      Number.isInteger(e.framesPerBox) &&
      e.framesPerBox > 0
    )
      out[depth] = e;
  }
  return out;
}

export type ShareRow = { lotId: number; colonyId: number; yardId: number; frac: number };
export type LotRow = {
  id: number;
  code: string;
  floralSource: string;
  stage: string;
  isBlend: boolean;
  netGrams: number;
  ownGrams: number;
  revenueCents: number;
  waterPct: number | null;
  supers: number;
};

/** Exact fraction of each of the season's lots that each colony made (unrounded). */
export async function seasonShares(season: number, est: SuperEstimates): Promise<ShareRow[]> {
  const { sequelize } = getDb();
  return sequelize.query<ShareRow>(
    `WITH RECURSIVE ${rootsCte}, ${walkCte}
     SELECT f.root_id AS "lotId", f.colony_id AS "colonyId", c.yard_id AS "yardId", f.frac
     FROM fracs f JOIN colonies c ON c.id = f.colony_id`,
    { type: QueryTypes.SELECT, replacements: { ...seasonRange(season, await startMonth()), ...estimateParams(est) } },
  );
}

/** The season's lots with own weight, revenue kept and mean water content. */
export async function seasonLots(season: number): Promise<LotRow[]> {
  const { sequelize } = getDb();
  return sequelize.query<LotRow>(
    `WITH ${rootsCte}, ${revCte},
     water AS (
       SELECT lot_id, AVG(water_pct)::float8 AS pct FROM moisture_readings
       WHERE voided_at IS NULL AND lot_id IN (SELECT id FROM roots) GROUP BY lot_id
     ),
     supers AS (SELECT lot_id, COUNT(*)::int AS n FROM super_pulls WHERE lot_id IN (SELECT id FROM roots) GROUP BY lot_id)
     SELECT l.id, l.code, l.floral_source AS "floralSource", l.stage, l.is_blend AS "isBlend", l.net_grams AS "netGrams",
            r.own::int AS "ownGrams", COALESCE(rev.cents, 0)::int AS "revenueCents", water.pct AS "waterPct", COALESCE(supers.n, 0) AS supers
     FROM roots r JOIN lots l ON l.id = r.id
     LEFT JOIN rev ON rev.lot_id = r.id LEFT JOIN water ON water.lot_id = r.id LEFT JOIN supers ON supers.lot_id = r.id
     ORDER BY l.code`,
    { type: QueryTypes.SELECT, replacements: seasonRange(season, await startMonth()) },
  );
}

export type ColonyBase = {
  id: number;
  code: string;
  status: string;
  yardId: number;
  yardName: string;
  keeperId: number;
  keeperName: string;
  parentId: number | null;
  parentCode: string | null;
  splitCodes: string[] | null;
  supersPulled: number;
};

/** The colonies that belong in a season: any super pulled, honey in the season's lots, or alive then. */
export async function seasonColonies(
  season: number,
  withHoney: number[],
  scope: { yardId?: number; keeperId?: number },
): Promise<ColonyBase[]> {
  const { sequelize } = getDb();
  const { from, to } = seasonBounds(season, await startMonth());
  return sequelize.query<ColonyBase>(
    `SELECT c.id, c.code, c.status, c.yard_id AS "yardId", y.name AS "yardName", c.keeper_id AS "keeperId", u.name AS "keeperName",
            c.parent_colony_id AS "parentId", p.code AS "parentCode",
            (SELECT array_agg(k.code ORDER BY k.code) FROM colonies k WHERE k.parent_colony_id = c.id) AS "splitCodes",
            COALESCE(sc.n, 0)::int AS "supersPulled"
     FROM colonies c JOIN yards y ON y.id = c.yard_id JOIN users u ON u.id = c.keeper_id
     LEFT JOIN colonies p ON p.id = c.parent_colony_id
     LEFT JOIN (SELECT colony_id, COUNT(*) AS n FROM super_pulls WHERE pulled_on >= :from AND pulled_on < :to AND voided_at IS NULL GROUP BY colony_id) sc
       ON sc.colony_id = c.id
     WHERE (sc.n > 0 OR c.id = ANY(:withHoney::int[])
            OR (c.status = 'active' AND (c.started_on IS NULL OR c.started_on < :to)))
       AND (:yardId::int IS NULL OR c.yard_id = :yardId) AND (:keeperId::int IS NULL OR c.keeper_id = :keeperId)
     ORDER BY y.name, c.code`,
    {
      type: QueryTypes.SELECT,
      replacements: {
        from,
        to,
        withHoney: `{${withHoney.join(',')}}`,
        yardId: scope.yardId ?? null,
        keeperId: scope.keeperId ?? null,
      },
    },
  );
}

export type HistoryRow = { season: number; yardId: number; yardName: string; honeyGrams: number };

/** Season over season: honey per yard for every season, unrounded shares summed in SQL. */
export async function seasonHistory(
  est: SuperEstimates,
  scope: { yardId?: number; keeperId?: number },
): Promise<HistoryRow[]> {
  const { sequelize } = getDb();
  const m = await startMonth();
  return sequelize.query<HistoryRow>(
    `WITH RECURSIVE given AS (SELECT parent_lot_id AS lot_id, SUM(grams) AS g FROM lot_parents GROUP BY parent_lot_id),
     roots AS (
       SELECT l.id, GREATEST(l.net_grams - COALESCE(gv.g, 0), 0)::bigint AS own, ${LOT_SEASON_SQL('l', m)} AS season
       FROM lots l LEFT JOIN given gv ON gv.lot_id = l.id
     ), ${walkCte}
     SELECT r.season, c.yard_id AS "yardId", y.name AS "yardName", ROUND(SUM(r.own * f.frac))::bigint AS "honeyGrams"
     FROM fracs f JOIN roots r ON r.id = f.root_id JOIN colonies c ON c.id = f.colony_id JOIN yards y ON y.id = c.yard_id
     WHERE (:yardId::int IS NULL OR c.yard_id = :yardId) AND (:keeperId::int IS NULL OR c.keeper_id = :keeperId)
     GROUP BY 1, 2, 3 ORDER BY 1, 3`,
    {
      type: QueryTypes.SELECT,
      replacements: { ...estimateParams(est), yardId: scope.yardId ?? null, keeperId: scope.keeperId ?? null },
    },
  );
}

/** Seasons that have lots or super pulls, newest first. */
export async function listSeasons(): Promise<number[]> {
  const { sequelize } = getDb();
  const m = await startMonth();
  const rows = await sequelize.query<{ season: number }>(
    `SELECT DISTINCT s AS season FROM (
       SELECT ${LOT_SEASON_SQL('l', m)} AS s FROM lots l
       UNION SELECT ${SEASON_OF_SQL('pulled_on', m)} FROM super_pulls WHERE pulled_on IS NOT NULL AND voided_at IS NULL
     ) x ORDER BY 1 DESC`,
    { type: QueryTypes.SELECT },
  );
  return rows.map((r) => r.season);
}

export type ColonyTotalRow = { colonyId: number; honeyGrams: number; revenueCents: number };

/**
 * The plain SQL aggregate the season report depends on: per colony, the season's lots' own
 * weight and revenue times the colony's exact fraction, summed and rounded once per colony.
 * The report's rounding per lot keeps each colony within 1 g (1 cent) per lot of this.
 */
export async function seasonColonyTotals(season: number, est: SuperEstimates): Promise<ColonyTotalRow[]> {
  const { sequelize } = getDb();
  return sequelize.query<ColonyTotalRow>(
    `WITH RECURSIVE ${rootsCte}, ${walkCte}, ${revCte}
     SELECT f.colony_id AS "colonyId", ROUND(SUM(r.own * f.frac))::bigint AS "honeyGrams", ROUND(SUM(COALESCE(rev.cents, 0) * f.frac))::bigint AS "revenueCents"
     FROM fracs f JOIN roots r ON r.id = f.root_id LEFT JOIN rev ON rev.lot_id = f.root_id
     GROUP BY f.colony_id`,
    { type: QueryTypes.SELECT, replacements: { ...seasonRange(season, await startMonth()), ...estimateParams(est) } },
  );
}
