import { ZodError } from 'zod';
import { AuthError } from '@/lib/auth/session';
import { OriginError } from './origin';
import { toFieldErrors } from '@/lib/schemas/result';
import { DomainError, type RefusalKind } from '@/lib/domain/errors';
import { readTextLimited } from './body';
import { containsNul } from '@/lib/schemas/fields';

/** A JSON answer with a message a person understands. */
export function jsonError(
  status: 400 | 401 | 403 | 404 | 409 | 413 | 415 | 422 | 429 | 503,
  message: string,
  extra?: Record<string, unknown>,
): Response {
  return Response.json({ error: message, ...extra }, { status, headers: { 'Cache-Control': 'no-store' } });
}

/** The HTTP status of each kind of refusal that lib/data raises. */
export const STATUS_OF: Record<RefusalKind, 400 | 403 | 404 | 409 | 413 | 415 | 422 | 429 | 503> = {
  invalid: 422,
  forbidden: 403,
  'not-found': 404,
  conflict: 409,
  'too-large': 413,
  'unsupported-type': 415,
  'too-many': 429,
  unavailable: 503,
};

/** A refusal made at the edge itself (route handlers, uploads, request bodies): a status and a message. */
export class HttpError extends Error {
  constructor(
    public status: 400 | 404 | 409 | 413 | 415 | 422 | 503,
    message: string,
  ) {
    super(message);
  }
}

/** Maps the errors our handlers throw to 4xx answers; anything else is logged and becomes a plain 500 with a reference. */
export function handleRouteError(err: unknown): Response {
  if (err instanceof AuthError) return jsonError(err.status, err.message);
  if (err instanceof OriginError) return jsonError(403, err.message);
  if (err instanceof HttpError) return jsonError(err.status, err.message);
  if (err instanceof DomainError) return jsonError(STATUS_OF[err.kind], err.message);
  if (err instanceof ZodError) return jsonError(400, 'Some fields are not valid.', { fieldErrors: toFieldErrors(err) });
  const ref = crypto.randomUUID().slice(0, 8);
  console.error(`[error ${ref}]`, err);
  return Response.json({ error: `Something went wrong on our side. Reference ${ref}.` }, { status: 500 });
}

/** Reads a JSON body without trusting it: over `maxBytes` is a 413 while it streams, bad JSON a 400, not a crash. */
export async function readJson(req: Request, maxBytes = 1_000_000): Promise<unknown> {
  const text = await readTextLimited(req, maxBytes);
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch {
    throw new HttpError(400, 'The request body is not valid JSON.');
  }
  // PostgreSQL refuses U+0000 in text: refused here for every JSON route, whatever its schema says.
  if (containsNul(value)) throw new HttpError(400, 'Some text contains a character that is not allowed (NUL).');
  return value;
}
