import { authorize } from '@/lib/auth/session';
import { getDb } from '@/lib/db';
import { listSeasons } from '@/lib/data/yield-sql';
import { handleRouteError, HttpError } from '@/lib/http/json';
import { pdfResponse } from '@/lib/pdf/response';
import { keeperReportPdf } from '@/lib/reports/keeper-pdf';
import { idParam, parseReportQuery } from '@/lib/schemas/reports';

export const dynamic = 'force-dynamic';

/** A keeper's season report as a PDF. A keeper gets only their own; anyone else's is a 404. */
export async function GET(req: Request, ctx: { params: Promise<{ keeperId: string }> }) {
  try {
    const user = await authorize('reports.read');
    const keeperId = idParam.safeParse((await ctx.params).keeperId);
    if (!keeperId.success) throw new HttpError(404, 'There is no such report.');
    if (user.role !== 'owner' && user.id !== keeperId.data) throw new HttpError(404, 'There is no such report.');
    const keeper = await getDb().models.User.findByPk(keeperId.data);
    if (!keeper || keeper.role !== 'keeper') throw new HttpError(404, 'There is no such report.');
    const season = parseReportQuery(new URL(req.url).searchParams).season ?? (await listSeasons())[0] ?? new Date().getUTCFullYear();
    const pdf = await keeperReportPdf(user, keeper.id, season, keeper.name);
    if (!pdf) throw new HttpError(404, 'There is no such report.');
    return pdfResponse(pdf.bytes, pdf.filename);
  } catch (err) {
    return handleRouteError(err);
  }
}
