import { authorize } from '@/lib/auth/session';
import { handleRouteError, HttpError } from '@/lib/http/json';
import { assertSameOrigin } from '@/lib/http/origin';
import { readUploadForm, uploadedFile } from '@/lib/http/upload';
import { getSettings } from '@/lib/data/settings/settings';
import { commitImport, MAX_IMPORT_BYTES, previewImport } from '@/lib/data/supers/import';
import { importMapping } from '@/lib/schemas/supers';
import { todayIn } from '@/lib/domain/local-date';

export const dynamic = 'force-dynamic';

const CSV_TYPES = new Set(['text/csv', 'application/csv', 'text/plain', 'application/vnd.ms-excel', '']);

/** Reads the uploaded field sheet: a CSV file of at most 5 MB, or a clear refusal. */
const TOO_LARGE = 'The file is larger than 5 MB. Split it into smaller files.';

async function readSheet(form: FormData): Promise<string> {
  const file = uploadedFile(form, 'file', MAX_IMPORT_BYTES, {
    missing: 'Choose a CSV file to upload.',
    tooLarge: TOO_LARGE,
  });
  if (!/\.csv$/i.test(file.name) || !CSV_TYPES.has(file.type))
    throw new HttpError(415, 'Only CSV files (.csv) can be imported. Save the spreadsheet as CSV first.');
  const bytes = new Uint8Array(await file.arrayBuffer());
  if (bytes.includes(0)) throw new HttpError(415, 'This file is not plain CSV text.');
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    throw new HttpError(415, 'The file is not UTF-8 text. Save it as "CSV UTF-8".');
  }
}

/**
 * multipart/form-data: file, mode=preview|commit, mapping (JSON, optional for preview), expectedValid (commit).
 * Preview checks every row; commit stores all valid rows in one transaction or none.
 */
export async function POST(req: Request) {
  try {
    await assertSameOrigin(req.headers);
    const user = await authorize('supers.import');
    const form = await readUploadForm(req, MAX_IMPORT_BYTES, {
      tooLarge: TOO_LARGE,
      notAForm: 'Upload the file as a form (multipart/form-data).',
    });
    const text = await readSheet(form);
    const mode = form.get('mode') === 'commit' ? 'commit' : 'preview';
    const mappingText = form.get('mapping');
    let mappingJson: unknown = null;
    if (typeof mappingText === 'string' && mappingText) {
      try {
        mappingJson = JSON.parse(mappingText);
      } catch {
        throw new HttpError(400, 'The column mapping is not valid JSON.');
      }
    }
    const today = todayIn((await getSettings()).timeZone);
    if (mode === 'preview') {
      const mapping = mappingJson === null ? null : importMapping.parse(mappingJson);
      return Response.json(await previewImport(user, text, mapping, today));
    }
    const mapping = importMapping.parse(mappingJson);
    const expected = form.get('expectedValid');
    return Response.json(
      await commitImport(
        user,
        text,
        mapping,
        today,
        typeof expected === 'string' && expected ? Number(expected) : undefined,
      ),
    );
  } catch (err) {
    return handleRouteError(err);
  }
}
