import 'server-only';
import { seasonLabel } from '@/lib/domain/season';
import type { SessionUser } from '@/lib/auth/session';
import { getSeasonReport } from '@/lib/data/reports/yield-report';
import { getSettings } from '@/lib/data/settings/settings';
import { formatMoney, formatWeight } from '@/lib/domain/units';
import { renderTableReport } from '@/lib/pdf/table-report';
import { seasonTables } from './season-tables';

/**
 * One keeper's season report as a PDF (A4, Lora): their totals, colonies, yards, lines,
 * lot shares and the colonies that made nothing. Null when `viewer` may not see it
 * (a keeper asking for another keeper's).
 */
export async function keeperReportPdf(viewer: SessionUser, keeperId: number, season: number, keeperName: string) {
  const [report, settings] = await Promise.all([getSeasonReport(viewer, { season, keeperId }), getSettings()]);
  if (!report) return null;
  const units = { weightSystem: settings.weightSystem, currency: settings.currency };
  const t = seasonTables(report, units);
  const strip = (table: (typeof t)['colonies'], drop: string[]) => {
    const keep = table.columns.map((c, i) => (drop.includes(c) ? -1 : i)).filter((i) => i >= 0);
    return {
      heading: table.title,
      columns: keep.map((i) => table.columns[i]),
      rows: table.rows.map((r) => keep.map((i) => r.cells[i])),
    };
  };
  const bytes = await renderTableReport({
    title: `Season ${seasonLabel(season, settings.seasonStartMonth)} yield report: ${keeperName}`,
    subtitle:
      `${settings.businessName}. ${report.colonies.length} colonies, ${formatWeight(report.totals.honeyGrams, units.weightSystem)} of honey, ` +
      `${formatMoney(report.totals.revenueCents, units.currency)} of jar sales shared back by weight.`,
    sections: [
      {
        ...strip(t.colonies, ['Keeper']),
        note: "Honey is each lot's net weight shared back to the supers by measured honey (full minus empty), or by an estimate from box depth and capped frames where a super was not weighed. Rank is among all colonies in the yard.",
      },
      strip(t.yards, []),
      strip(t.lines, []),
      strip(t.shares, []),
      strip(t.nothing, ['Keeper']),
    ],
    footer: `${settings.businessName} · season ${seasonLabel(season, settings.seasonStartMonth)} · ${keeperName}`,
  });
  return { bytes, filename: `season-${season}-${keeperName}`, report };
}
