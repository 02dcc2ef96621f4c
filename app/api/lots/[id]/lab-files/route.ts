import { z } from 'zod';
import { authorize } from '@/lib/auth/session';
import { addLabFile } from '@/lib/data/lots/records';
import { LAB_FILE_MAX_BYTES } from '@/lib/domain/file-type';
import { LAB_RESULT_FIELDS, labResultsFields } from '@/lib/schemas/lots';
import { handleRouteError } from '@/lib/http/json';
import { readUploadForm, uploadedFile } from '@/lib/http/upload';
import { assertSameOrigin } from '@/lib/http/origin';

export const dynamic = 'force-dynamic';

const lotId = z.coerce.number().int().positive();

/**
 * Uploads a lab report (multipart: file, optional hmfMgKg, diastaseSchade, insolubleG100g,
 * fructoseGlucoseG100g, sucroseG100g, conductivityMsCm, freeAcidMeqKg).
 * The type is read from the file's bytes; SVG, HTML and anything not PDF/PNG/JPEG/WebP is refused (415).
 */
export async function POST(req: Request, ctx: { params: Promise<{ id: string }> }) {
  try {
    await assertSameOrigin(req.headers);
    const user = await authorize('lots.write');
    const id = lotId.parse((await ctx.params).id);
    const messages = {
      tooLarge: 'The file is larger than 10 MB.',
      notAForm: 'Send the file as a multipart form.',
      missing: 'Choose a file to upload.',
    };
    const form = await readUploadForm(req, LAB_FILE_MAX_BYTES, messages);
    const file = uploadedFile(form, 'file', LAB_FILE_MAX_BYTES, messages);
    const results = labResultsFields.parse(
      Object.fromEntries(LAB_RESULT_FIELDS.map((k) => [k, form.get(k) ?? undefined])),
    );
    const saved = await addLabFile(user, id, {
      filename: file.name,
      bytes: new Uint8Array(await file.arrayBuffer()),
      ...results,
    });
    return Response.json(saved, { status: 201 });
  } catch (err) {
    return handleRouteError(err);
  }
}
