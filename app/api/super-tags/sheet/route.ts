import { tagSheetQuery } from '@/lib/schemas/supers';
import { authorize } from '@/lib/auth/session';
import { handleRouteError, HttpError } from '@/lib/http/json';
import { listTags } from '@/lib/data/supers/tags';
import { renderSuperTagSheet } from '@/lib/pdf/super-tags';
import { pdfResponse } from '@/lib/pdf/response';
import { BUILT_IN_LAYOUTS } from '@/lib/domain/label-layout';

export const dynamic = 'force-dynamic';

/** Owner: a PDF sheet of super tags (Code 128 barcode + code per label), streamed. */
export async function GET(req: Request) {
  try {
    await authorize('superTags.print');
    const q = tagSheetQuery.parse(Object.fromEntries(new URL(req.url).searchParams));
    const layout = q.layout ? BUILT_IN_LAYOUTS.find((l) => l.name === q.layout) : BUILT_IN_LAYOUTS[0];
    if (!layout)
      throw new HttpError(
        422,
        `Unknown label layout. Choose one of: ${BUILT_IN_LAYOUTS.map((l) => l.name).join(', ')}.`,
      );
    const tags = await listTags(q.prefix);
    if (tags.length === 0) throw new HttpError(422, 'No super tags to print. Create a batch of tags first.');
    const bytes = await renderSuperTagSheet(
      tags.map((t) => ({ code: t.code, caption: `${t.depth} · ${t.frameCount} frames` })),
      layout,
    );
    return pdfResponse(bytes, `super-tags${q.prefix ? `-${q.prefix}` : ''}.pdf`);
  } catch (err) {
    return handleRouteError(err);
  }
}
