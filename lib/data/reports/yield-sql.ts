import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/db/index';
import { DEFAULT_SUPER_ESTIMATES, type SuperEstimates } from '@/lib/domain/yield-allocation';

/**
 * The SQL behind the season report. Everything that touches many rows (super pulls, lot
 * parents, order allocations) is aggregated here; JavaScript only rounds the short
 * per-lot share lists (see yield-report.ts).
 *
 * How a lot's weight reaches the colonies (the same rules as lib/domain/yield-allocation.ts):
 * - A super's honey is full − empty when both are weighed (> 0, full > empty), else the
 *   estimate per frame of its depth × capped frames (or frame count), capped at its frame count.
 * - A lot's sources are its supers (by honey) and, for a blend, its parent lots (by the grams
 *   taken). A walk down lot_parents multiplies the fractions, so each root lot ends with the
 *   exact fraction of it that each colony made.
 * - A lot's own weight is net_grams minus what it gave to blends, so no gram is counted twice:
 *   the given grams are counted in the blend, which passes them back through this lot.
 * - A voided pull (recorded by mistake) is never in a lot (super_pulls_void_state_ck), so the lot
 *   walks below need no test for it; the per-colony pull counts and seasons leave it out.
 */

/** The owner's estimates (settings.superEstimates) over the defaults, depth by depth; anything unusable is ignored. */
export function superEstimatesFrom(setting: Partial<SuperEstimates> | null | undefined): SuperEstimates {
  const out: SuperEstimates = { ...DEFAULT_SUPER_ESTIMATES };
  for (const depth of ['deep', 'medium', 'shallow'] as const) {
    const e = setting?.[depth];
    if (e && Number.isFinite(e.gramsPerBox) && e.gramsPerBox > 0 && Number.isInteger(e.framesPerBox) && e.framesPerBox > 0) out[depth] = e;
  }
  return out;
}

function estimateParams(est: SuperEstimates) {
  return {
    perFrameDeep: est.deep.gramsPerBox / est.deep.framesPerBox,
    perFrameMedium: est.medium.gramsPerBox / est.medium.framesPerBox,
    perFrameShallow: est.shallow.gramsPerBox / est.shallow.framesPerBox,
  };
}

/** A super's honey in grams, as superHoneyGrams computes it. */
export const HONEY_SQL = (sp: string) => `(CASE
  WHEN ${sp}.full_grams > 0 AND ${sp}.empty_grams > 0 AND ${sp}.full_grams > ${sp}.empty_grams THEN (${sp}.full_grams - ${sp}.empty_grams)::numeric
  ELSE ROUND((CASE ${sp}.depth WHEN 'deep' THEN :perFrameDeep WHEN 'medium' THEN :perFrameMedium ELSE :perFrameShallow END)::numeric
    * LEAST(GREATEST(COALESCE(${sp}.capped_frames, ${sp}.frame_count), 0), ${sp}.frame_count))
END)`;

/** A lot's season: the year it was extracted (or, still gathering, the year it was opened). */
export const LOT_SEASON_SQL = (l: string) => `EXTRACT(YEAR FROM COALESCE(${l}.extracted_on, (${l}.created_at AT TIME ZONE 'UTC')::date))::int`;

/** Revenue kept from an allocation: jars × unit price, less the order's refunds pro rata. */
const REVENUE_SQL = `oa.quantity * ol.unit_price_cents
  * COALESCE(1 - o.refunded_cents::numeric / NULLIF(o.total_cents, 0), 1)`;
const SOLD_WHERE = `oa.state = 'sold' AND o.status NOT IN ('awaiting_payment', 'cancelled', 'expired')`;
const revCte = `rev AS (
  SELECT oa.lot_id, ROUND(SUM(${REVENUE_SQL}))::bigint AS cents
  FROM order_allocations oa JOIN order_lines ol ON ol.id = oa.order_line_id JOIN orders o ON o.id = ol.order_id
  WHERE oa.lot_id IN (SELECT id FROM roots) AND ${SOLD_WHERE}
  GROUP BY oa.lot_id
)`;

export type ShareRow = { lotId: number; colonyId: number; yardId: number; frac: number };
export type LotRow = {
  id: number; code: string; floralSource: string; stage: string; isBlend: boolean;
  netGrams: number; ownGrams: number; revenueCents: number; waterPct: number | null; supers: number;
};

/** The same test as LOT_SEASON_SQL = :season, written as date ranges so the planner can estimate it (and use lots_extracted_on). */
const LOT_IN_SEASON = (l: string) => `((${l}.extracted_on >= :seasonFrom AND ${l}.extracted_on < :seasonTo)
  OR (${l}.extracted_on IS NULL AND (${l}.created_at AT TIME ZONE 'UTC')::date >= :seasonFrom AND (${l}.created_at AT TIME ZONE 'UTC')::date < :seasonTo))`;
const seasonRange = (season: number) => ({ season, seasonFrom: `${season}-01-01`, seasonTo: `${season + 1}-01-01` });

const rootsCte = `given AS (SELECT parent_lot_id AS lot_id, SUM(grams) AS g FROM lot_parents GROUP BY parent_lot_id),
roots AS (
  SELECT l.id, GREATEST(l.net_grams - COALESCE(gv.g, 0), 0)::bigint AS own
  FROM lots l LEFT JOIN given gv ON gv.lot_id = l.id
  WHERE ${LOT_IN_SEASON('l')}
)`;

// Each super's honey computed once (MATERIALIZED): the weights of every lot's sources, and the walk
// from each root lot down through blend parents, multiplying the fractions.
const walkCte = `sp_h AS MATERIALIZED (
  SELECT sp.id, sp.lot_id, sp.colony_id, ${HONEY_SQL('sp')}::float8 AS honey FROM super_pulls sp WHERE sp.lot_id IS NOT NULL
),
lot_w AS (
  SELECT lot_id, SUM(w)::float8 AS w FROM (
    SELECT lot_id, honey AS w FROM sp_h
    UNION ALL SELECT child_lot_id, grams FROM lot_parents
  ) s GROUP BY lot_id
),
walk AS (
  SELECT r.id AS root_id, r.id AS lot_id, 1::float8 AS frac, 0 AS depth FROM roots r
  UNION ALL
  SELECT w.root_id, lp.parent_lot_id, w.frac * lp.grams / lw.w, w.depth + 1
  FROM walk w JOIN lot_w lw ON lw.lot_id = w.lot_id AND lw.w > 0 JOIN lot_parents lp ON lp.child_lot_id = w.lot_id
  WHERE w.depth < 16
),
fracs AS (
  SELECT w.root_id, sp.colony_id, SUM(w.frac * sp.honey / lw.w) AS frac
  FROM walk w JOIN lot_w lw ON lw.lot_id = w.lot_id AND lw.w > 0 JOIN sp_h sp ON sp.lot_id = w.lot_id
  GROUP BY 1, 2
)`;

/** Exact fraction of each of the season's lots that each colony made (unrounded). */
export async function seasonShares(season: number, est: SuperEstimates): Promise<ShareRow[]> {
  const { sequelize } = getDb();
  return sequelize.query<ShareRow>(
    `WITH RECURSIVE ${rootsCte}, ${walkCte}
     SELECT f.root_id AS "lotId", f.colony_id AS "colonyId", c.yard_id AS "yardId", f.frac
     FROM fracs f JOIN colonies c ON c.id = f.colony_id`,
    { type: QueryTypes.SELECT, replacements: { ...seasonRange(season), ...estimateParams(est) } },
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
    { type: QueryTypes.SELECT, replacements: seasonRange(season) },
  );
}

export type ColonyBase = {
  id: number; code: string; status: string; yardId: number; yardName: string; keeperId: number; keeperName: string;
  parentId: number | null; parentCode: string | null; splitCodes: string[] | null; supersPulled: number;
};

/** The colonies that belong in a season: any super pulled, honey in the season's lots, or alive then. */
export async function seasonColonies(season: number, withHoney: number[], scope: { yardId?: number; keeperId?: number }): Promise<ColonyBase[]> {
  const { sequelize } = getDb();
  const from = `${season}-01-01`;
  const to = `${season + 1}-01-01`;
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
      replacements: { from, to, withHoney: `{${withHoney.join(',')}}`, yardId: scope.yardId ?? null, keeperId: scope.keeperId ?? null },
    },
  );
}

export type HistoryRow = { season: number; yardId: number; yardName: string; honeyGrams: number };

/** Season over season: honey per yard for every season, unrounded shares summed in SQL. */
export async function seasonHistory(est: SuperEstimates, scope: { yardId?: number; keeperId?: number }): Promise<HistoryRow[]> {
  const { sequelize } = getDb();
  return sequelize.query<HistoryRow>(
    `WITH RECURSIVE given AS (SELECT parent_lot_id AS lot_id, SUM(grams) AS g FROM lot_parents GROUP BY parent_lot_id),
     roots AS (
       SELECT l.id, GREATEST(l.net_grams - COALESCE(gv.g, 0), 0)::bigint AS own, ${LOT_SEASON_SQL('l')} AS season
       FROM lots l LEFT JOIN given gv ON gv.lot_id = l.id
     ), ${walkCte}
     SELECT r.season, c.yard_id AS "yardId", y.name AS "yardName", ROUND(SUM(r.own * f.frac))::bigint AS "honeyGrams"
     FROM fracs f JOIN roots r ON r.id = f.root_id JOIN colonies c ON c.id = f.colony_id JOIN yards y ON y.id = c.yard_id
     WHERE (:yardId::int IS NULL OR c.yard_id = :yardId) AND (:keeperId::int IS NULL OR c.keeper_id = :keeperId)
     GROUP BY 1, 2, 3 ORDER BY 1, 3`,
    { type: QueryTypes.SELECT, replacements: { ...estimateParams(est), yardId: scope.yardId ?? null, keeperId: scope.keeperId ?? null } },
  );
}

/** Seasons that have lots or super pulls, newest first. */
export async function listSeasons(): Promise<number[]> {
  const { sequelize } = getDb();
  const rows = await sequelize.query<{ season: number }>(
    `SELECT DISTINCT s AS season FROM (
       SELECT ${LOT_SEASON_SQL('l')} AS s FROM lots l
       UNION SELECT EXTRACT(YEAR FROM pulled_on)::int FROM super_pulls WHERE pulled_on IS NOT NULL AND voided_at IS NULL
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
    { type: QueryTypes.SELECT, replacements: { ...seasonRange(season), ...estimateParams(est) } },
  );
}
