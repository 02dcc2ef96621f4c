import { z } from 'zod';
import { authorize } from '@/lib/auth/session';
import { canReadLot } from '@/lib/data/lots/access';
import { getLabFileData } from '@/lib/data/lots/records';
import { handleRouteError, HttpError } from '@/lib/http/json';

export const dynamic = 'force-dynamic';

/**
 * A stored lab report, always as a download with the type recorded at upload (read from its
 * bytes) and nosniff, so a browser never renders it as a page of our site.
 */
export async function GET(_req: Request, ctx: { params: Promise<{ id: string }> }) {
  try {
    const user = await authorize('lots.read');
    const id = z.coerce
      .number()
      .int()
      .positive()
      .parse((await ctx.params).id);
    const file = await getLabFileData(id);
    if (!file || !(await canReadLot(user, file.lotId))) throw new HttpError(404, 'No lab file with that id.');
    const ascii = file.filename.replace(/[^\x20-\x7e]/g, '_').replace(/["\\]/g, '_');
    return new Response(new Uint8Array(file.data), {
      headers: {
        'Content-Type': file.contentType,
        'Content-Length': String(file.data.length),
        'Content-Disposition': `attachment; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(file.filename)}`,
        'X-Content-Type-Options': 'nosniff',
        'Content-Security-Policy': "default-src 'none'; sandbox",
        'Cache-Control': 'private, no-store',
        ETag: `"${file.sha256}"`,
      },
    });
  } catch (err) {
    return handleRouteError(err);
  }
}
