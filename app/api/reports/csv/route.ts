import { authorize } from '@/lib/auth/session';
import { getSeasonReport } from '@/lib/data/reports/yield-report';
import { getSettings } from '@/lib/data/settings/settings';
import { toCsv } from '@/lib/domain/csv';
import { handleRouteError, HttpError } from '@/lib/http/json';
import { seasonTables } from '@/lib/reports/season-tables';
import { parseReportQuery, reportTableKey } from '@/lib/schemas/reports';

export const dynamic = 'force-dynamic';

/** One table of the season report as CSV (?table=colonies|yards|…&season=&yard=&keeper=), within the user's scope. */
export async function GET(req: Request) {
  try {
    const user = await authorize('reports.read');
    const params = new URL(req.url).searchParams;
    const table = reportTableKey.parse(params.get('table') ?? 'colonies');
    const report = await getSeasonReport(user, parseReportQuery(params));
    if (!report) throw new HttpError(404, 'There is no such report.');
    const settings = await getSettings();
    const t = seasonTables(report, { weightSystem: settings.weightSystem, currency: settings.currency })[table];
    const csv = toCsv(
      t.csvColumns,
      t.rows.map((r) => r.csv),
    );
    return new Response(`\uFEFF${csv}\r\n`, {
      headers: {
        'Content-Type': 'text/csv; charset=utf-8',
        'Content-Disposition': `attachment; filename="season-${report.season}-${table}.csv"`,
        'Cache-Control': 'private, no-store',
        'X-Content-Type-Options': 'nosniff',
      },
    });
  } catch (err) {
    return handleRouteError(err);
  }
}
