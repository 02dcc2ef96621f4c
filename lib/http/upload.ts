import { HttpError } from './json';

/** Room for the multipart envelope (boundaries, other fields) around a file of the allowed size. */
const ENVELOPE_BYTES = 64 * 1024;

type Messages = { tooLarge: string; notAForm: string; missing: string };

/**
 * The multipart form of an upload: refused before reading (413) when the declared length is already
 * over `maxBytes`, and 400 when the body is not a form.
 */
export async function readUploadForm(
  req: Request,
  maxBytes: number,
  m: Pick<Messages, 'tooLarge' | 'notAForm'>,
): Promise<FormData> {
  if (Number(req.headers.get('content-length') ?? 0) > maxBytes + ENVELOPE_BYTES) throw new HttpError(413, m.tooLarge);
  try {
    return await req.formData();
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
