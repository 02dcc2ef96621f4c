import { currencyMinorDigits, formatMoney, formatWeight, type UnitSystem } from '@/lib/domain/units';
import type { SeasonReport } from '@/lib/data/reports/build-report';

/**
 * The season report's tables, defined once for the page, the CSV export and the PDF:
 * `cells` are what people read (the owner's units and currency), `csv` the plain values
 * (grams and money in the currency's main unit, so a spreadsheet can add them up).
 */
export type ReportTable = {
  key: TableKey;
  title: string;
  columns: string[];
  csvColumns: string[];
  numeric: boolean[];
  rows: { id: string; cells: string[]; csv: unknown[] }[];
};
export const TABLE_KEYS = ['colonies', 'yards', 'keepers', 'lines', 'nothing', 'lots', 'shares'] as const;
export type TableKey = (typeof TABLE_KEYS)[number];

export type Units = { weightSystem: UnitSystem; currency: string };

function money(cents: number, currency: string): { text: string; value: number } {
  return { text: formatMoney(cents, currency), value: cents / 10 ** currencyMinorDigits(currency) };
}

export function seasonTables(report: SeasonReport, u: Units): Record<TableKey, ReportTable> {
  const w = (g: number) => formatWeight(g, u.weightSystem);
  const m = (c: number) => money(c, u.currency);
  const cur = u.currency.toUpperCase();
  const totals = (key: 'yards' | 'keepers', title: string, label: string): ReportTable => ({
    key,
    title,
    columns: [label, 'Colonies', 'Made honey', 'Supers pulled', 'Honey', 'Mean per colony', 'Revenue', 'Mean revenue'],
    csvColumns: [
      label,
      'Colonies',
      'Made honey',
      'Supers pulled',
      'Honey (g)',
      'Mean per colony (g)',
      `Revenue (${cur})`,
      `Mean revenue (${cur})`,
    ],
    numeric: [false, true, true, true, true, true, true, true],
    rows: report[key].map((t) => ({
      id: String(t.id),
      cells: [
        t.name,
        String(t.colonies),
        String(t.producing),
        String(t.supersPulled),
        w(t.honeyGrams),
        w(t.meanHoneyGrams),
        m(t.revenueCents).text,
        m(t.meanRevenueCents).text,
      ],
      csv: [
        t.name,
        t.colonies,
        t.producing,
        t.supersPulled,
        t.honeyGrams,
        t.meanHoneyGrams,
        m(t.revenueCents).value,
        m(t.meanRevenueCents).value,
      ],
    })),
  });
  const line = (c: SeasonReport['colonies'][number]) =>
    [c.parentCode ? `split of ${c.parentCode}` : '', c.splitCodes.length ? `splits: ${c.splitCodes.join(', ')}` : '']
      .filter(Boolean)
      .join('; ');

  return {
    colonies: {
      key: 'colonies',
      title: 'Colonies',
      columns: [
        'Colony',
        'Yard',
        'Keeper',
        'Line',
        'Supers pulled',
        'Honey',
        'Share of lots',
        'Water',
        'Revenue',
        'Rank in yard',
      ],
      csvColumns: [
        'Colony',
        'Yard',
        'Keeper',
        'Line',
        'Supers pulled',
        'Honey (g)',
        'Share of lots',
        'Water (%)',
        `Revenue (${cur})`,
        'Rank in yard',
      ],
      numeric: [false, false, false, false, true, true, false, true, true, true],
      rows: report.colonies.map((c) => ({
        id: String(c.colonyId),
        cells: [
          c.code,
          c.yardName,
          c.keeperName,
          line(c) || '—',
          String(c.supersPulled),
          w(c.honeyGrams),
          c.lotShares.map((s) => `${s.lotCode} ${s.pctOfLot}%`).join(', ') || '—',
          c.waterPct === null ? '—' : `${c.waterPct.toFixed(1)}%`,
          m(c.revenueCents).text,
          String(c.rankInYard),
        ],
        csv: [
          c.code,
          c.yardName,
          c.keeperName,
          line(c),
          c.supersPulled,
          c.honeyGrams,
          c.lotShares.map((s) => `${s.lotCode} ${s.pctOfLot}%`).join('; '),
          c.waterPct ?? '',
          m(c.revenueCents).value,
          c.rankInYard,
        ],
      })),
    },
    yards: totals('yards', 'Yards', 'Yard'),
    keepers: totals('keepers', 'Keepers', 'Keeper'),
    lines: {
      key: 'lines',
      title: 'Lines (a colony with its parent and splits)',
      columns: ['Line', 'Colonies', 'Honey', 'Mean per colony', 'Revenue'],
      csvColumns: ['Line', 'Colonies', 'Honey (g)', 'Mean per colony (g)', `Revenue (${cur})`],
      numeric: [false, false, true, true, true],
      rows: report.lines.map((l) => ({
        id: l.lineCode,
        cells: [l.lineCode, l.colonies.join(', '), w(l.honeyGrams), w(l.meanHoneyGrams), m(l.revenueCents).text],
        csv: [l.lineCode, l.colonies.join('; '), l.honeyGrams, l.meanHoneyGrams, m(l.revenueCents).value],
      })),
    },
    nothing: {
      key: 'nothing',
      title: 'Colonies that made no honey this season',
      columns: ['Colony', 'Yard', 'Keeper', 'Status', 'Supers pulled'],
      csvColumns: ['Colony', 'Yard', 'Keeper', 'Status', 'Supers pulled'],
      numeric: [false, false, false, false, true],
      rows: report.nothing.map((c) => ({
        id: String(c.colonyId),
        cells: [c.code, c.yardName, c.keeperName, c.status.replace('_', ' '), String(c.supersPulled)],
        csv: [c.code, c.yardName, c.keeperName, c.status, c.supersPulled],
      })),
    },
    lots: {
      key: 'lots',
      title: 'Lots of the season',
      columns: ['Lot', 'Floral source', 'Stage', 'Own weight', 'Traced to colonies', 'Supers', 'Water', 'Revenue'],
      csvColumns: [
        'Lot',
        'Floral source',
        'Stage',
        'Own weight (g)',
        'Traced to colonies (g)',
        'Supers',
        'Water (%)',
        `Revenue (${cur})`,
      ],
      numeric: [false, false, false, true, true, true, true, true],
      rows: report.lots.map((l) => ({
        id: String(l.id),
        cells: [
          l.code + (l.isBlend ? ' (blend)' : ''),
          l.floralSource || '—',
          l.stage.replace('_', ' '),
          w(l.ownGrams),
          w(l.attributedGrams),
          String(l.supers),
          l.waterPct === null ? '—' : `${l.waterPct.toFixed(1)}%`,
          m(l.revenueCents).text,
        ],
        csv: [
          l.code,
          l.floralSource,
          l.stage,
          l.ownGrams,
          l.attributedGrams,
          l.supers,
          l.waterPct === null ? '' : Math.round(l.waterPct * 10) / 10,
          m(l.revenueCents).value,
        ],
      })),
    },
    shares: {
      key: 'shares',
      title: 'Share of each lot per colony',
      columns: ['Colony', 'Lot', 'Honey', 'Share of lot'],
      csvColumns: ['Colony', 'Lot', 'Honey (g)', 'Share of lot (%)'],
      numeric: [false, false, true, true],
      rows: report.colonies.flatMap((c) =>
        c.lotShares.map((s) => ({
          id: `${c.colonyId}-${s.lotId}`,
          cells: [c.code, s.lotCode, w(s.grams), `${s.pctOfLot}%`],
          csv: [c.code, s.lotCode, s.grams, s.pctOfLot],
        })),
      ),
    },
  };
}
