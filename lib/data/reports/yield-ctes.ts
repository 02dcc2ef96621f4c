import 'server-only';
import type { SuperEstimates } from '@/lib/domain/yield-allocation';
import { assertStartMonth, seasonBounds } from '@/lib/domain/season';

/**
 * The SQL pieces shared by the season queries (yield-sql.ts): a super's honey, a lot's season,
 * revenue kept, and the walk from each lot down to the colonies that made it.
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

/** The per-frame estimates as the :perFrame… replacements HONEY_SQL reads. */
export function estimateParams(est: SuperEstimates) {
  return {
    perFrameDeep: est.deep.gramsPerBox / est.deep.framesPerBox,
    perFrameMedium: est.medium.gramsPerBox / est.medium.framesPerBox,
    perFrameShallow: est.shallow.gramsPerBox / est.shallow.framesPerBox,
  };
}

/** A super's honey in grams, as superHoneyGrams computes it. */
const HONEY_SQL = (sp: string) => `(CASE
  WHEN ${sp}.full_grams > 0 AND ${sp}.empty_grams > 0 AND ${sp}.full_grams > ${sp}.empty_grams THEN (${sp}.full_grams - ${sp}.empty_grams)::numeric
  ELSE ROUND((CASE ${sp}.depth WHEN 'deep' THEN :perFrameDeep WHEN 'medium' THEN :perFrameMedium ELSE :perFrameShallow END)::numeric
    * LEAST(GREATEST(COALESCE(${sp}.capped_frames, ${sp}.frame_count), 0), ${sp}.frame_count))
END)`;

/** The season of a date column: the year of (date − (start month − 1) months), as seasonOf computes it. */
export const SEASON_OF_SQL = (date: string, startMonth: number) => {
  assertStartMonth(startMonth);
  return `EXTRACT(YEAR FROM (${date} - make_interval(months => ${startMonth - 1})))::int`;
};

/** A lot's season: the season it was extracted in (or, still gathering, the one it was opened in). */
export const LOT_SEASON_SQL = (l: string, startMonth: number) =>
  SEASON_OF_SQL(`COALESCE(${l}.extracted_on, (${l}.created_at AT TIME ZONE 'UTC')::date)`, startMonth);

/**
 * Revenue kept for honey (docs/trade-rules.md, "Revenue kept for honey"), per order:
 * - sold = Σ jars × unit price over allocations still `sold` (a returned or written-off jar has
 *   already left `sold`, so the money refunded for it is not taken off again);
 * - back = Σ jars × unit price over allocations `returned` or `written_off`;
 * - honey refund = the money refunded beyond the jars that came back, less what fits in the
 *   shipping charge (a refund never counts against honey while it can be shipping), at most sold.
 * Each still-sold allocation keeps its price × (sold − honey refund) / sold.
 */
const SOLD_WHERE = `oa.state = 'sold' AND o.status NOT IN ('awaiting_payment', 'cancelled', 'expired')`;
export const revCte = `order_honey AS (
  SELECT ol.order_id,
         SUM(CASE WHEN oa.state = 'sold' THEN oa.quantity * ol.unit_price_cents ELSE 0 END)::numeric AS sold,
         SUM(CASE WHEN oa.state IN ('returned', 'written_off') THEN oa.quantity * ol.unit_price_cents ELSE 0 END)::numeric AS back
  FROM order_allocations oa JOIN order_lines ol ON ol.id = oa.order_line_id
  WHERE ol.order_id IN (
    SELECT ol2.order_id FROM order_allocations oa2 JOIN order_lines ol2 ON ol2.id = oa2.order_line_id
    WHERE oa2.lot_id IN (SELECT id FROM roots)
  )
  GROUP BY ol.order_id
),
order_keep AS (
  SELECT o.id AS order_id,
         CASE WHEN oh.sold > 0
           THEN (oh.sold - LEAST(oh.sold, GREATEST(o.refunded_cents - oh.back - o.shipping_cents, 0))) / oh.sold
           ELSE 0 END AS keep
  FROM orders o JOIN order_honey oh ON oh.order_id = o.id
),
rev AS (
  SELECT oa.lot_id, ROUND(SUM(oa.quantity * ol.unit_price_cents * k.keep))::bigint AS cents
  FROM order_allocations oa JOIN order_lines ol ON ol.id = oa.order_line_id JOIN orders o ON o.id = ol.order_id
  JOIN order_keep k ON k.order_id = o.id
  WHERE oa.lot_id IN (SELECT id FROM roots) AND ${SOLD_WHERE}
  GROUP BY oa.lot_id
)`;

/** The same test as LOT_SEASON_SQL = :season, written as date ranges so the planner can estimate it (and use lots_extracted_on). */
const LOT_IN_SEASON = (l: string) => `((${l}.extracted_on >= :seasonFrom AND ${l}.extracted_on < :seasonTo)
  OR (${l}.extracted_on IS NULL AND (${l}.created_at AT TIME ZONE 'UTC')::date >= :seasonFrom AND (${l}.created_at AT TIME ZONE 'UTC')::date < :seasonTo))`;
export const seasonRange = (season: number, startMonth: number) => {
  const { from, to } = seasonBounds(season, startMonth);
  return { season, seasonFrom: from, seasonTo: to };
};

export const rootsCte = `given AS (SELECT parent_lot_id AS lot_id, SUM(grams) AS g FROM lot_parents GROUP BY parent_lot_id),
roots AS (
  SELECT l.id, GREATEST(l.net_grams - COALESCE(gv.g, 0), 0)::bigint AS own
  FROM lots l LEFT JOIN given gv ON gv.lot_id = l.id
  WHERE ${LOT_IN_SEASON('l')}
)`;

// Each super's honey computed once (MATERIALIZED): the weights of every lot's sources, and the walk
// from each root lot down through blend parents, multiplying the fractions.
export const walkCte = `sp_h AS MATERIALIZED (
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
