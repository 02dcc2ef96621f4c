import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/db/index';
import { parseGs1ElementString } from '@/lib/domain/gs1';

/**
 * Trace: from a lot code, a jar barcode (GS1 element string → lot), a super tag or an order
 * number to the lots behind it, and from each lot one step back (supers, colonies, yards,
 * keepers, feedings and treatments while the supers were on, parent lots) and one step
 * forward (child lots, jarring runs, stock, orders and customers). A handful of indexed
 * queries per lot; nothing scans the whole database.
 */

export type TraceMatch =
  | { kind: 'lot'; label: string }
  | { kind: 'jar'; label: string; gtin?: string; bestBefore?: string }
  | {
      kind: 'super';
      label: string;
      pulls: { id: number; colonyCode: string; pulledOn: string | null; lotCode: string | null; voided: boolean }[];
    }
  | {
      kind: 'order';
      label: string;
      order: { number: string; status: string; name: string; email: string; createdAt: string };
    };

export type LotTrace = {
  lot: {
    id: number;
    code: string;
    stage: string;
    floralSource: string;
    isBlend: boolean;
    netGrams: number;
    usedGrams: number;
    extractedOn: string | null;
    bestBeforeOn: string | null;
    waterPct: number | null;
  };
  supers: {
    id: number;
    tagCode: string | null;
    depth: string;
    putOnOn: string | null;
    pulledOn: string | null;
    fullGrams: number | null;
    emptyGrams: number | null;
    flagged: boolean;
    colonyCode: string;
    yardName: string;
    keeperName: string;
  }[];
  colonies: { code: string; yardName: string; keeperName: string; supers: number }[];
  events: { kind: 'feeding' | 'treatment'; colonyCode: string; what: string; fromOn: string; toOn: string | null }[];
  parents: { code: string; grams: number }[];
  children: { code: string; grams: number }[];
  jarringRuns: { id: number; productName: string; jarCount: number; runOn: string; fillPass: boolean }[];
  stock: { productName: string; onHand: number; reserved: number; bestBeforeOn: string }[];
  recall: RecallRow[];
};

export type RecallRow = {
  orderNumber: string;
  status: string;
  customerName: string;
  email: string;
  phone: string;
  address: string;
  lotCode: string;
  productName: string;
  jars: number;
  paidAt: string | null;
};

export type TraceResult = { query: string; match: TraceMatch | null; lots: LotTrace[]; ms: number };

const sel = { type: QueryTypes.SELECT } as const;

function addressText(a: unknown): string {
  if (!a || typeof a !== 'object') return '';
  return Object.values(a as Record<string, unknown>)
    .filter((v) => typeof v === 'string' && v.trim() !== '')
    .join(', ');
}

/**
 * Everyone who received jars of this lot, or of a blend made from it (down the lot_parents
 * tree): sold allocations only, with the order's contact details and jars per product.
 */
export async function getRecallList(lotId: number): Promise<RecallRow[]> {
  const { sequelize } = getDb();
  const rows = await sequelize.query<Omit<RecallRow, 'address'> & { address: unknown }>(
    `WITH RECURSIVE down AS (
       SELECT :lotId::int AS lot_id, 0 AS depth
       UNION SELECT lp.child_lot_id, d.depth + 1 FROM down d JOIN lot_parents lp ON lp.parent_lot_id = d.lot_id WHERE d.depth < 16
     )
     SELECT o.number AS "orderNumber", o.status, o.name AS "customerName", o.email, o.phone, o.shipping_address AS address,
            l.code AS "lotCode", ol.product_name AS "productName", SUM(oa.quantity)::int AS jars,
            to_char(o.paid_at AT TIME ZONE 'UTC', 'YYYY-MM-DD') AS "paidAt"
     FROM (SELECT DISTINCT lot_id FROM down) d
     JOIN order_allocations oa ON oa.lot_id = d.lot_id AND oa.state = 'sold'
     JOIN order_lines ol ON ol.id = oa.order_line_id JOIN orders o ON o.id = ol.order_id JOIN lots l ON l.id = oa.lot_id
     GROUP BY o.id, l.code, ol.product_name
     ORDER BY o.number, l.code, ol.product_name`,
    { ...sel, replacements: { lotId } },
  );
  return rows.map((r) => ({ ...r, address: addressText(r.address) }));
}

async function traceLot(lotId: number): Promise<LotTrace | null> {
  const { sequelize } = getDb();
  const r = { ...sel, replacements: { lotId } };
  const [lots, supers, events, parents, children, jarringRuns, stock, recall] = await Promise.all([
    sequelize.query<LotTrace['lot']>(
      `SELECT l.id, l.code, l.stage, l.floral_source AS "floralSource", l.is_blend AS "isBlend", l.net_grams AS "netGrams",
              l.used_grams AS "usedGrams", l.extracted_on AS "extractedOn", l.best_before_on AS "bestBeforeOn",
              (SELECT ROUND(AVG(water_pct), 1)::float8 FROM moisture_readings m WHERE m.lot_id = l.id AND m.voided_at IS NULL) AS "waterPct"
       FROM lots l WHERE l.id = :lotId`,
      r,
    ),
    sequelize.query<LotTrace['supers'][number]>(
      `SELECT sp.id, sp.tag_code AS "tagCode", sp.depth, sp.put_on_on AS "putOnOn", sp.pulled_on AS "pulledOn",
              sp.full_grams AS "fullGrams", sp.empty_grams AS "emptyGrams", sp.flagged,
              c.code AS "colonyCode", y.name AS "yardName", u.name AS "keeperName"
       FROM super_pulls sp JOIN colonies c ON c.id = sp.colony_id JOIN yards y ON y.id = c.yard_id JOIN users u ON u.id = c.keeper_id
       WHERE sp.lot_id = :lotId ORDER BY c.code, sp.pulled_on, sp.id`,
      r,
    ),
    // While the super was on: from put-on (or pull) to pull (or today); an open feeding or
    // treatment runs on, a treatment's window adds its label's waiting days (as conflicts.ts).
    sequelize.query<LotTrace['events'][number]>(
      `WITH sw AS (
         SELECT colony_id, MIN(COALESCE(put_on_on, pulled_on, CURRENT_DATE)) AS on_from, MAX(COALESCE(pulled_on, CURRENT_DATE)) AS on_to
         FROM super_pulls WHERE lot_id = :lotId GROUP BY colony_id
       )
       SELECT 'feeding' AS kind, c.code AS "colonyCode", replace(f.kind, '_', ' ') || CASE WHEN f.amount <> '' THEN ', ' || f.amount ELSE '' END AS what,
              f.started_on AS "fromOn", f.ended_on AS "toOn"
       FROM sw JOIN feedings f ON f.colony_id = sw.colony_id JOIN colonies c ON c.id = f.colony_id
       WHERE f.started_on <= sw.on_to AND COALESCE(f.ended_on, sw.on_to) >= sw.on_from
       UNION ALL
       SELECT 'treatment', c.code, tk.name || CASE WHEN t.product_name <> '' THEN ' (' || t.product_name || ')' ELSE '' END
              || CASE WHEN t.supers_allowed THEN ', supers allowed by label' ELSE ', no supers by label' END,
              t.applied_on, t.removed_on
       FROM sw JOIN treatments t ON t.colony_id = sw.colony_id JOIN treatment_kinds tk ON tk.id = t.treatment_kind_id JOIN colonies c ON c.id = t.colony_id
       WHERE t.applied_on <= sw.on_to AND COALESCE(t.removed_on, sw.on_to) + t.waiting_days >= sw.on_from
       ORDER BY 2, 4`,
      r,
    ),
    sequelize.query<{ code: string; grams: number }>(
      `SELECT l.code, lp.grams FROM lot_parents lp JOIN lots l ON l.id = lp.parent_lot_id WHERE lp.child_lot_id = :lotId ORDER BY l.code`,
      r,
    ),
    sequelize.query<{ code: string; grams: number }>(
      `SELECT l.code, lp.grams FROM lot_parents lp JOIN lots l ON l.id = lp.child_lot_id WHERE lp.parent_lot_id = :lotId ORDER BY l.code`,
      r,
    ),
    sequelize.query<LotTrace['jarringRuns'][number]>(
      `SELECT j.id, p.name AS "productName", j.jar_count AS "jarCount", j.run_on AS "runOn", j.fill_pass AS "fillPass"
       FROM jarring_runs j JOIN products p ON p.id = j.product_id WHERE j.lot_id = :lotId ORDER BY j.run_on, j.id`,
      r,
    ),
    sequelize.query<LotTrace['stock'][number]>(
      `SELECT p.name AS "productName", s.on_hand AS "onHand", s.reserved, s.best_before_on AS "bestBeforeOn"
       FROM stock_levels s JOIN products p ON p.id = s.product_id WHERE s.lot_id = :lotId ORDER BY p.name`,
      r,
    ),
    getRecallList(lotId),
  ]);
  if (lots.length === 0) return null;
  const colonies = new Map<string, LotTrace['colonies'][number]>();
  for (const s of supers) {
    const c = colonies.get(s.colonyCode) ?? {
      code: s.colonyCode,
      yardName: s.yardName,
      keeperName: s.keeperName,
      supers: 0,
    };
    c.supers += 1;
    colonies.set(s.colonyCode, c);
  }
  return {
    lot: lots[0],
    supers,
    colonies: [...colonies.values()],
    events,
    parents,
    children,
    jarringRuns,
    stock,
    recall,
  };
}

/** Which lots an input names, and what it was (lot, jar barcode, super tag or order). */
async function resolveTraceInput(raw: string): Promise<{ match: TraceMatch | null; lotIds: number[] }> {
  const { sequelize } = getDb();
  const input = raw.trim();
  if (!input) return { match: null, lotIds: [] };
  const lotByCode = async (code: string) =>
    (
      await sequelize.query<{ id: number; code: string }>(`SELECT id, code FROM lots WHERE code IN (:code, :upper)`, {
        ...sel,
        replacements: { code, upper: code.toUpperCase() },
      })
    )[0];

  // A scanned or typed jar barcode: (01)…(15)…(10)LOT, or the raw scan with GS separators.
  const looksGs1 = input.startsWith('(') || input.startsWith(']') || input.includes('\x1d') || /^01\d{14}/.test(input);
  if (looksGs1) {
    const fields = parseGs1ElementString(input);
    const lot = fields.lot ? await lotByCode(fields.lot) : undefined;
    if (lot)
      return {
        match: { kind: 'jar', label: `Jar of lot ${lot.code}`, gtin: fields.gtin, bestBefore: fields.bestBefore },
        lotIds: [lot.id],
      };
  }
  const lot = await lotByCode(input);
  if (lot) return { match: { kind: 'lot', label: `Lot ${lot.code}` }, lotIds: [lot.id] };

  const pulls = await sequelize.query<{
    id: number;
    colonyCode: string;
    pulledOn: string | null;
    lotCode: string | null;
    lotId: number | null;
    voided: boolean;
  }>(
    `SELECT sp.id, c.code AS "colonyCode", sp.pulled_on AS "pulledOn", l.code AS "lotCode", sp.lot_id AS "lotId", sp.voided_at IS NOT NULL AS voided
     FROM super_pulls sp JOIN colonies c ON c.id = sp.colony_id LEFT JOIN lots l ON l.id = sp.lot_id
     WHERE sp.tag_code IN (:tag, :upper) ORDER BY sp.pulled_on DESC NULLS FIRST, sp.id DESC LIMIT 20`,
    { ...sel, replacements: { tag: input, upper: input.toUpperCase() } },
  );
  if (pulls.length > 0) {
    const lotIds = [...new Set(pulls.map((p) => p.lotId).filter((id): id is number => id !== null))].slice(0, 5);
    return {
      match: { kind: 'super', label: `Super tag ${input.toUpperCase()}`, pulls: pulls.map(({ lotId: _l, ...p }) => p) },
      lotIds,
    };
  }

  const orders = await sequelize.query<{
    id: number;
    number: string;
    status: string;
    name: string;
    email: string;
    createdAt: string;
  }>(
    `SELECT id, number, status, name, email, to_char(created_at AT TIME ZONE 'UTC', 'YYYY-MM-DD') AS "createdAt" FROM orders WHERE number IN (:n, :upper)`,
    { ...sel, replacements: { n: input, upper: input.toUpperCase() } },
  );
  if (orders.length > 0) {
    const o = orders[0];
    const lots = await sequelize.query<{ lotId: number }>(
      `SELECT DISTINCT oa.lot_id AS "lotId" FROM order_allocations oa JOIN order_lines ol ON ol.id = oa.order_line_id
       WHERE ol.order_id = :id AND oa.state IN ('sold', 'reserved') ORDER BY 1`,
      { ...sel, replacements: { id: o.id } },
    );
    return {
      match: {
        kind: 'order',
        label: `Order ${o.number}`,
        order: { number: o.number, status: o.status, name: o.name, email: o.email, createdAt: o.createdAt },
      },
      lotIds: lots.map((l) => l.lotId),
    };
  }
  return { match: null, lotIds: [] };
}

/** The whole trace for an input, with how long it took on the server. */
export async function traceInput(raw: string): Promise<TraceResult> {
  const started = performance.now();
  const { match, lotIds } = await resolveTraceInput(raw.slice(0, 200));
  const lots = (await Promise.all(lotIds.slice(0, 10).map(traceLot))).filter((l): l is LotTrace => l !== null);
  return { query: raw, match, lots, ms: Math.round((performance.now() - started) * 10) / 10 };
}

export async function getLotCode(lotId: number): Promise<string | null> {
  const [row] = await getDb().sequelize.query<{ code: string }>(`SELECT code FROM lots WHERE id = :lotId`, {
    ...sel,
    replacements: { lotId },
  });
  return row?.code ?? null;
}
