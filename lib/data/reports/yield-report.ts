import 'server-only';
import { QueryTypes } from 'sequelize';
import type { SessionUser } from '@/lib/auth/session';
import { getDb } from '@/lib/db/index';
import { NOT_ATTRIBUTED, roundLotShares } from '@/lib/domain/yield-allocation';
import { getSettings } from '@/lib/data/settings/settings';
import {
  listSeasons, seasonColonies, seasonHistory, seasonLots, seasonShares, superEstimatesFrom,
  type ColonyBase, type HistoryRow, type LotRow, type ShareRow,
} from './yield-sql';

export type ReportFilter = { season?: number; yardId?: number; keeperId?: number };
export type LotShare = { lotId: number; lotCode: string; grams: number; pctOfLot: number };
export type ColonyReportRow = {
  colonyId: number; code: string; status: string; yardId: number; yardName: string; keeperId: number; keeperName: string;
  parentCode: string | null; splitCodes: string[]; lineCode: string; supersPulled: number;
  honeyGrams: number; revenueCents: number; waterPct: number | null; lotShares: LotShare[]; rankInYard: number;
};
export type TotalRow = {
  id: number; name: string; colonies: number; producing: number; supersPulled: number;
  honeyGrams: number; meanHoneyGrams: number; revenueCents: number; meanRevenueCents: number;
};
export type LineRow = { lineCode: string; colonies: string[]; honeyGrams: number; meanHoneyGrams: number; revenueCents: number };
export type SeasonReport = {
  season: number; seasons: number[]; filter: ReportFilter;
  colonies: ColonyReportRow[]; nothing: ColonyReportRow[]; yards: TotalRow[]; keepers: TotalRow[]; lines: LineRow[];
  lots: (LotRow & { attributedGrams: number; unattributedGrams: number })[];
  totals: { honeyGrams: number; revenueCents: number; lotGrams: number; lotRevenueCents: number; unattributedGrams: number };
};

const UNATTRIBUTED = NOT_ATTRIBUTED;

/** The report scope a user may see: a keeper only their own colonies; null when they ask for another's. */
export function reportScope(user: SessionUser, filter: ReportFilter): ReportFilter | null {
  if (user.role === 'owner') return filter;
  if (user.role !== 'keeper') return null;
  if (filter.keeperId !== undefined && filter.keeperId !== user.id) return null;
  return { ...filter, keeperId: user.id };
}

function totalsBy(rows: ColonyReportRow[], id: (r: ColonyReportRow) => number, name: (r: ColonyReportRow) => string): TotalRow[] {
  const groups = new Map<number, TotalRow>();
  for (const r of rows) {
    const g = groups.get(id(r)) ?? { id: id(r), name: name(r), colonies: 0, producing: 0, supersPulled: 0, honeyGrams: 0, meanHoneyGrams: 0, revenueCents: 0, meanRevenueCents: 0 };
    g.colonies += 1;
    g.producing += r.honeyGrams > 0 ? 1 : 0;
    g.supersPulled += r.supersPulled;
    g.honeyGrams += r.honeyGrams;
    g.revenueCents += r.revenueCents;
    groups.set(id(r), g);
  }
  return [...groups.values()]
    .map((g) => ({ ...g, meanHoneyGrams: Math.round(g.honeyGrams / g.colonies), meanRevenueCents: Math.round(g.revenueCents / g.colonies) }))
    .sort((a, b) => a.name.localeCompare(b.name));
}

/** Every colony's line: the top of its parent chain (a colony with no parent is its own line). */
async function lineRoots(): Promise<Map<number, string>> {
  const { sequelize } = getDb();
  const rows = await sequelize.query<{ id: number; line: string }>(
    `WITH RECURSIVE up AS (
       SELECT id, id AS top, parent_colony_id, 0 AS depth FROM colonies
       UNION ALL SELECT up.id, p.id, p.parent_colony_id, up.depth + 1 FROM up JOIN colonies p ON p.id = up.parent_colony_id WHERE up.depth < 30
     )
     SELECT DISTINCT ON (up.id) up.id, c.code AS line FROM up JOIN colonies c ON c.id = up.top ORDER BY up.id, up.depth DESC`,
    { type: QueryTypes.SELECT },
  );
  return new Map(rows.map((r) => [r.id, r.line]));
}

/**
 * The season report for `user` (owner: all; keeper: own colonies only). Returns null when the
 * user may not see the asked-for scope (another keeper's report) — callers answer 404.
 */
export async function getSeasonReport(user: SessionUser, filter: ReportFilter): Promise<SeasonReport | null> {
  const scope = reportScope(user, filter);
  if (!scope) return null;
  const [settings, seasons] = await Promise.all([getSettings(), listSeasons()]);
  const season = scope.season ?? seasons[0] ?? new Date().getUTCFullYear();
  const est = superEstimatesFrom(settings.superEstimates);
  // Independent queries run side by side; the colony list waits only for the shares.
  const sharesP = seasonShares(season, est);
  const basesP = sharesP.then((sh) => seasonColonies(season, [...new Set(sh.map((s) => s.colonyId))], scope));
  const [shares, lots, bases, lines] = await Promise.all([sharesP, seasonLots(season), basesP, lineRoots()]);
  return buildReport({ season, seasons, scope, shares, lots, bases, lines });
}

function buildReport(input: {
  season: number; seasons: number[]; scope: ReportFilter; shares: ShareRow[]; lots: LotRow[]; bases: ColonyBase[]; lines: Map<number, string>;
}): SeasonReport {
  const { season, seasons, scope, shares, lots, bases, lines } = input;
  const sharesByLot = new Map<number, ShareRow[]>();
  for (const s of shares) {
    const list = sharesByLot.get(s.lotId) ?? [];
    list.push(s);
    sharesByLot.set(s.lotId, list);
  }

  // Whole grams and cents per (colony, lot), rounded per lot so each lot adds up exactly.
  type Cell = { lotId: number; grams: number; cents: number };
  const cells = new Map<number, Cell[]>();
  const lotRows = lots.map((lot) => {
    const { grams, cents } = roundLotShares(lot.ownGrams, lot.revenueCents, (sharesByLot.get(lot.id) ?? []).map((s) => ({ id: String(s.colonyId), frac: s.frac })));
    for (const [id, g] of Object.entries(grams)) {
      if (id === UNATTRIBUTED) continue;
      const colonyId = Number(id);
      const list = cells.get(colonyId) ?? [];
      list.push({ lotId: lot.id, grams: g, cents: cents[id] ?? 0 });
      cells.set(colonyId, list);
    }
    const unattributedGrams = grams[UNATTRIBUTED] ?? 0;
    return { ...lot, attributedGrams: lot.ownGrams - unattributedGrams, unattributedGrams };
  });
  const lotById = new Map(lotRows.map((l) => [l.id, l]));

  // Rank in yard among every colony of the yard that made honey (not only the ones shown).
  const yardOf = new Map<number, number>();
  for (const s of shares) yardOf.set(s.colonyId, s.yardId);
  const yardHoney = new Map<number, number[]>();
  for (const [colonyId, list] of cells) {
    const yardId = yardOf.get(colonyId)!;
    yardHoney.set(yardId, [...(yardHoney.get(yardId) ?? []), list.reduce((a, c) => a + c.grams, 0)]); // ≤ colonies per yard
  }
  const betterInYard = (yardId: number, grams: number) => 1 + (yardHoney.get(yardId) ?? []).filter((g) => g > grams).length;

  const colonies: ColonyReportRow[] = bases.map((c) => {
    const list = cells.get(c.id) ?? [];
    const honeyGrams = list.reduce((a, x) => a + x.grams, 0);
    const watered = list.filter((x) => x.grams > 0 && lotById.get(x.lotId)?.waterPct != null);
    const waterGrams = watered.reduce((a, x) => a + x.grams, 0);
    return {
      colonyId: c.id, code: c.code, status: c.status, yardId: c.yardId, yardName: c.yardName, keeperId: c.keeperId, keeperName: c.keeperName,
      parentCode: c.parentCode, splitCodes: c.splitCodes ?? [], lineCode: lines.get(c.id) ?? c.code, supersPulled: c.supersPulled,
      honeyGrams,
      revenueCents: list.reduce((a, x) => a + x.cents, 0),
      // Mean water content of its lots, weighted by the grams it gave to each.
      waterPct: waterGrams > 0 ? Math.round((watered.reduce((a, x) => a + x.grams * (lotById.get(x.lotId)!.waterPct as number), 0) / waterGrams) * 10) / 10 : null,
      lotShares: list
        .filter((x) => x.grams > 0)
        .map((x) => {
          const lot = lotById.get(x.lotId)!;
          return { lotId: x.lotId, lotCode: lot.code, grams: x.grams, pctOfLot: lot.ownGrams > 0 ? Math.round((1000 * x.grams) / lot.ownGrams) / 10 : 0 };
        })
        .sort((a, b) => b.grams - a.grams),
      rankInYard: betterInYard(c.yardId, honeyGrams),
    };
  });

  const lineGroups = new Map<string, ColonyReportRow[]>();
  for (const c of colonies) lineGroups.set(c.lineCode, [...(lineGroups.get(c.lineCode) ?? []), c]);
  const lineRows: LineRow[] = [...lineGroups]
    .filter(([, list]) => list.length > 1 || list[0].splitCodes.length > 0 || list[0].parentCode !== null)
    .map(([lineCode, list]) => {
      const honeyGrams = list.reduce((a, c) => a + c.honeyGrams, 0);
      return { lineCode, colonies: list.map((c) => c.code), honeyGrams, meanHoneyGrams: Math.round(honeyGrams / list.length), revenueCents: list.reduce((a, c) => a + c.revenueCents, 0) };
    })
    .sort((a, b) => b.meanHoneyGrams - a.meanHoneyGrams);

  const shown = scope.keeperId !== undefined || scope.yardId !== undefined;
  const shownLots = new Set(colonies.flatMap((c) => c.lotShares.map((s) => s.lotId)));
  return {
    season, seasons, filter: scope,
    colonies,
    nothing: colonies.filter((c) => c.honeyGrams === 0),
    yards: totalsBy(colonies, (c) => c.yardId, (c) => c.yardName),
    keepers: totalsBy(colonies, (c) => c.keeperId, (c) => c.keeperName),
    lines: lineRows,
    // A keeper's or one yard's report lists only the lots its colonies gave to.
    lots: shown ? lotRows.filter((l) => shownLots.has(l.id)) : lotRows,
    totals: {
      honeyGrams: colonies.reduce((a, c) => a + c.honeyGrams, 0),
      revenueCents: colonies.reduce((a, c) => a + c.revenueCents, 0),
      lotGrams: lotRows.reduce((a, l) => a + l.ownGrams, 0),
      lotRevenueCents: lotRows.reduce((a, l) => a + l.revenueCents, 0),
      unattributedGrams: lotRows.reduce((a, l) => a + l.unattributedGrams, 0),
    },
  };
}

/** Season-over-season honey per yard, within the user's scope. */
export async function getSeasonHistory(user: SessionUser, filter: ReportFilter): Promise<HistoryRow[] | null> {
  const scope = reportScope(user, filter);
  if (!scope) return null;
  const settings = await getSettings();
  return seasonHistory(superEstimatesFrom(settings.superEstimates), scope);
}

/** Keepers with at least one colony that gave honey or had a super pulled in the season. */
export async function keepersWithColonies(season: number): Promise<{ id: number; name: string; email: string }[]> {
  const { sequelize } = getDb();
  return sequelize.query<{ id: number; name: string; email: string }>(
    `SELECT DISTINCT u.id, u.name, u.email FROM users u JOIN colonies c ON c.keeper_id = u.id
     WHERE u.role = 'keeper' AND u.disabled_at IS NULL AND (
       EXISTS (SELECT 1 FROM super_pulls sp WHERE sp.colony_id = c.id AND sp.pulled_on >= :from AND sp.pulled_on < :to AND sp.voided_at IS NULL)
       OR EXISTS (SELECT 1 FROM super_pulls sp JOIN lots l ON l.id = sp.lot_id WHERE sp.colony_id = c.id
                  AND EXTRACT(YEAR FROM COALESCE(l.extracted_on, (l.created_at AT TIME ZONE 'UTC')::date)) = :season))
     ORDER BY u.name`,
    { type: QueryTypes.SELECT, replacements: { season, from: `${season}-01-01`, to: `${season + 1}-01-01` } },
  );
}

/** Choices for the report's filters, within the user's scope. */
export async function reportFilterChoices(user: SessionUser): Promise<{ yards: { id: number; name: string }[]; keepers: { id: number; name: string }[] }> {
  const { sequelize } = getDb();
  const own = user.role === 'owner' ? null : user.id;
  const [yards, keepers] = await Promise.all([
    sequelize.query<{ id: number; name: string }>(
      `SELECT y.id, y.name FROM yards y WHERE :own::int IS NULL OR EXISTS (SELECT 1 FROM colonies c WHERE c.yard_id = y.id AND c.keeper_id = :own) ORDER BY y.name`,
      { type: QueryTypes.SELECT, replacements: { own } },
    ),
    own === null
      ? sequelize.query<{ id: number; name: string }>(`SELECT id, name FROM users WHERE role = 'keeper' ORDER BY name`, { type: QueryTypes.SELECT })
      : Promise.resolve([]),
  ]);
  return { yards, keepers };
}
