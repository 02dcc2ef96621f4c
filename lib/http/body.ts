import { HttpError } from './json';

/**
 * Reads a request body up to `maxBytes` while it streams: a declared Content-Length over the limit
 * is refused before any byte is read, and a chunked body (no length) is cut off, and the stream
 * cancelled, as soon as one byte too many has arrived. Nothing past the limit is ever buffered.
 */
export async function readBodyLimited(
  req: Request,
  maxBytes: number,
  tooLarge = 'The request is too large.',
): Promise<Uint8Array> {
  const declared = req.headers.get('content-length');
  if (declared !== null && Number(declared) > maxBytes) {
    await req.body?.cancel().catch(() => undefined);
    throw new HttpError(413, tooLarge);
  }
  if (!req.body) return new Uint8Array(0);
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > maxBytes) {
      await reader.cancel().catch(() => undefined);
      throw new HttpError(413, tooLarge);
    }
    chunks.push(value);
  }
  const body = new Uint8Array(total);
  let at = 0;
  for (const c of chunks) {
    body.set(c, at);
    at += c.byteLength;
  }
  return body;
}

/** The body as UTF-8 text, at most `maxBytes` (see readBodyLimited). */
export async function readTextLimited(req: Request, maxBytes: number, tooLarge?: string): Promise<string> {
  return new TextDecoder().decode(await readBodyLimited(req, maxBytes, tooLarge));
}
