import type { z } from 'zod';

export type ActionResult<T = undefined> =
  | ({ ok: true } & (T extends undefined ? { data?: undefined } : { data: T }))
  | { ok: false; message?: string; fieldErrors?: Record<string, string> };

/** First message per field, keyed by the dotted path, for react-hook-form's setError. */
export function toFieldErrors(error: z.ZodError): Record<string, string> {
  const out: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = issue.path.join('.') || 'root';
    out[key] ??= issue.message;
  }
  return out;
}

export function fail(
  message: string,
  fieldErrors?: Record<string, string>,
): { ok: false; message: string; fieldErrors?: Record<string, string> } {
  return { ok: false, message, fieldErrors };
}
