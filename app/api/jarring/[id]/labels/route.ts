import { runLabelsQuery } from '@/lib/schemas/labels';
import { authorize } from '@/lib/auth/session';
import { handleRouteError, HttpError } from '@/lib/http/json';
import { pdfResponse, safePdfFilename } from '@/lib/pdf/response';
import { renderRunLabels } from '@/lib/data/labels/run-labels';

type Ctx = { params: Promise<{ id: string }> };

/**
 * A jarring run's labels as one PDF (owner and crew). `?preview=1` gives only the first page,
 * inline, for the preview frame; otherwise the whole run as a download.
 */
export async function GET(req: Request, { params }: Ctx): Promise<Response> {
  try {
    await authorize('labels.print');
    const id = Number((await params).id);
    if (!Number.isInteger(id) || id <= 0) throw new HttpError(404, 'No such jarring run.');
    const q = runLabelsQuery.parse(Object.fromEntries(new URL(req.url).searchParams));
    const preview = q.preview === '1';
    const { bytes, filename } = await renderRunLabels(id, {
      layoutKey: q.layout,
      startSlot: q.start,
      copies: q.copies,
      firstPageOnly: preview,
    });
    const res = pdfResponse(bytes, filename);
    if (preview) res.headers.set('Content-Disposition', `inline; filename="${safePdfFilename(`preview-${filename}`)}"`);
    return res;
  } catch (err) {
    return handleRouteError(err);
  }
}
