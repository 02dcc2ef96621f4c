import { authorize } from '@/lib/auth/session';
import { getSettings } from '@/lib/data/settings/settings';
import { todayIn } from '@/lib/domain/local-date';
import { seasonOf } from '@/lib/domain/season';
import { reportKeeper } from '@/lib/data/reports/scope';
import { listSeasons } from '@/lib/data/reports/yield-sql';
import { handleRouteError, HttpError } from '@/lib/http/json';
import { pdfResponse } from '@/lib/pdf/response';
import { keeperReportPdf } from '@/lib/reports/keeper-pdf';
import { parseReportQuery } from '@/lib/schemas/reports';

export const dynamic = 'force-dynamic';

/**
 * A keeper's season report as a PDF (?keeper=ID&season=YYYY). A keeper gets only their own
 * (keeper defaults to themselves); anyone else's is a 404. The owner must name the keeper.
 */
export async function GET(req: Request) {
  try {
    const user = await authorize('reports.read');
    const params = new URL(req.url).searchParams;
    const query = parseReportQuery(params);
    const keeperId = query.keeperId ?? (user.role === 'keeper' ? user.id : undefined);
    if (keeperId === undefined)
      throw new HttpError(
        400,
        params.has('keeper') ? 'The keeper is not valid.' : "Say which keeper's report you want.",
      );
    if (user.role !== 'owner' && user.id !== keeperId) throw new HttpError(404, 'There is no such report.');
    const keeper = await reportKeeper(keeperId);
    if (!keeper) throw new HttpError(404, 'There is no such report.');
    const settings = await getSettings();
    const season =
      query.season ?? (await listSeasons())[0] ?? seasonOf(todayIn(settings.timeZone), settings.seasonStartMonth);
    const pdf = await keeperReportPdf(user, keeper.id, season, keeper.name);
    if (!pdf) throw new HttpError(404, 'There is no such report.');
    return pdfResponse(pdf.bytes, pdf.filename);
  } catch (err) {
    return handleRouteError(err);
  }
}
