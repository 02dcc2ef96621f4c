import 'server-only';
import { NOT_ATTRIBUTED, roundLotShares } from '@/lib/domain/yield-allocation';
import type { ColonyBase, LotRow, ShareRow } from './yield-sql';
import type { ReportFilter } from './scope';

/**
 * The season report put together from the rows of the season queries (yield-sql.ts): each lot's
 * weight and revenue shared out to colonies in whole grams and cents, then totals per yard,
 * keeper and line. No database here.
 */

export type LotShare = { lotId: number; lotCode: string; grams: number; pctOfLot: number };
export type ColonyReportRow = {
  colonyId: number;
  code: string;
  status: string;
  yardId: number;
  yardName: string;
  keeperId: number;
  keeperName: string;
  parentCode: string | null;
  splitCodes: string[];
  lineCode: string;
  supersPulled: number;
  honeyGrams: number;
  revenueCents: number;
  waterPct: number | null;
  lotShares: LotShare[];
  rankInYard: number;
};
export type TotalRow = {
  id: number;
  name: string;
  colonies: number;
  producing: number;
  supersPulled: number;
  honeyGrams: number;
  meanHoneyGrams: number;
  revenueCents: number;
  meanRevenueCents: number;
};
export type LineRow = {
  lineCode: string;
  colonies: string[];
  honeyGrams: number;
  meanHoneyGrams: number;
  revenueCents: number;
};
export type SeasonReport = {
  season: number;
  seasons: number[];
  filter: ReportFilter;
  colonies: ColonyReportRow[];
  nothing: ColonyReportRow[];
  yards: TotalRow[];
  keepers: TotalRow[];
  lines: LineRow[];
  lots: (LotRow & { attributedGrams: number; unattributedGrams: number })[];
  totals: {
    honeyGrams: number;
    revenueCents: number;
    lotGrams: number;
    lotRevenueCents: number;
    unattributedGrams: number;
  };
};

const UNATTRIBUTED = NOT_ATTRIBUTED;

function totalsBy(
  rows: ColonyReportRow[],
  id: (r: ColonyReportRow) => number,
  name: (r: ColonyReportRow) => string,
): TotalRow[] {
  const groups = new Map<number, TotalRow>();
  for (const r of rows) {
    const g = groups.get(id(r)) ?? {
      id: id(r),
      name: name(r),
      colonies: 0,
      producing: 0,
      supersPulled: 0,
      honeyGrams: 0,
      meanHoneyGrams: 0,
      revenueCents: 0,
      meanRevenueCents: 0,
    };
    g.colonies += 1;
    g.producing += r.honeyGrams > 0 ? 1 : 0;
    g.supersPulled += r.supersPulled;
    g.honeyGrams += r.honeyGrams;
    g.revenueCents += r.revenueCents;
    groups.set(id(r), g);
  }
  return [...groups.values()]
    .map((g) => ({
      ...g,
      meanHoneyGrams: Math.round(g.honeyGrams / g.colonies),
      meanRevenueCents: Math.round(g.revenueCents / g.colonies),
    }))
    .sort((a, b) => a.name.localeCompare(b.name));
}

export function buildReport(input: {
  season: number;
  seasons: number[];
  scope: ReportFilter;
  shares: ShareRow[];
  lots: LotRow[];
  bases: ColonyBase[];
  lines: Map<number, string>;
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
    const { grams, cents } = roundLotShares(
      lot.ownGrams,
      lot.revenueCents,
      (sharesByLot.get(lot.id) ?? []).map((s) => ({ id: String(s.colonyId), frac: s.frac })),
    );
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
  const betterInYard = (yardId: number, grams: number) =>
    1 + (yardHoney.get(yardId) ?? []).filter((g) => g > grams).length;

  const colonies: ColonyReportRow[] = bases.map((c) => {
    const list = cells.get(c.id) ?? [];
    const honeyGrams = list.reduce((a, x) => a + x.grams, 0);
    const watered = list.filter((x) => x.grams > 0 && lotById.get(x.lotId)?.waterPct != null);
    const waterGrams = watered.reduce((a, x) => a + x.grams, 0);
    return {
      colonyId: c.id,
      code: c.code,
      status: c.status,
      yardId: c.yardId,
      yardName: c.yardName,
      keeperId: c.keeperId,
      keeperName: c.keeperName,
      parentCode: c.parentCode,
      splitCodes: c.splitCodes ?? [],
      lineCode: lines.get(c.id) ?? c.code,
      supersPulled: c.supersPulled,
      honeyGrams,
      revenueCents: list.reduce((a, x) => a + x.cents, 0),
      // Mean water content of its lots, weighted by the grams it gave to each.
      waterPct:
        waterGrams > 0
          ? Math.round(
              (watered.reduce((a, x) => a + x.grams * (lotById.get(x.lotId)!.waterPct as number), 0) / waterGrams) * 10,
            ) / 10
          : null,
      lotShares: list
        .filter((x) => x.grams > 0)
        .map((x) => {
          const lot = lotById.get(x.lotId)!;
          return {
            lotId: x.lotId,
            lotCode: lot.code,
            grams: x.grams,
            pctOfLot: lot.ownGrams > 0 ? Math.round((1000 * x.grams) / lot.ownGrams) / 10 : 0,
          };
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
      return {
        lineCode,
        colonies: list.map((c) => c.code),
        honeyGrams,
        meanHoneyGrams: Math.round(honeyGrams / list.length),
        revenueCents: list.reduce((a, c) => a + c.revenueCents, 0),
      };
    })
    .sort((a, b) => b.meanHoneyGrams - a.meanHoneyGrams);

  const shown = scope.keeperId !== undefined || scope.yardId !== undefined;
  const shownLots = new Set(colonies.flatMap((c) => c.lotShares.map((s) => s.lotId)));
  return {
    season,
    seasons,
    filter: scope,
    colonies,
    nothing: colonies.filter((c) => c.honeyGrams === 0),
    yards: totalsBy(
      colonies,
      (c) => c.yardId,
      (c) => c.yardName,
    ),
    keepers: totalsBy(
      colonies,
      (c) => c.keeperId,
      (c) => c.keeperName,
    ),
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
