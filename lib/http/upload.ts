import { HttpError } from './json';
import { readBodyLimited } from './body';

/** Room for the multipart envelope (boundaries, other fields) around a file of the allowed size. */
const ENVELOPE_BYTES = 64 * 1024;

type Messages = { tooLarge: string; notAForm: string; missing: string };

/**
 * The multipart form of an upload: 413 as soon as more than `maxBytes` (plus the form's envelope) has
 * arrived, before reading when the declared length is already over; 400 when the body is not a form.
 */
export async function readUploadForm(
  req: Request,
  maxBytes: number,
  m: Pick<Messages, 'tooLarge' | 'notAForm'>,
): Promise<FormData> {
  // Counted while it streams (a chunked body declares no length), then parsed from memory.
  const body = await readBodyLimited(req, maxBytes + ENVELOPE_BYTES, m.tooLarge);
  const contentType = req.headers.get('content-type') ?? '';
  if (!/^multipart\/form-data;/i.test(contentType)) throw new HttpError(400, m.notAForm);
  try {
    return await new Response(body as BodyInit, { headers: { 'content-type': contentType } }).formData();
  } catch {
    throw new HttpError(400, m.notAForm);
  }
}

/** The file in `field`: 400 when there is none, 413 when it is over `maxBytes`. */
export function uploadedFile(
  form: FormData,
  field: string,
  maxBytes: number,
  m: Pick<Messages, 'tooLarge' | 'missing'>,
): File {
  const file = form.get(field);
  if (!(file instanceof File)) throw new HttpError(400, m.missing);
  if (file.size > maxBytes) throw new HttpError(413, m.tooLarge);
  return file;
}
