import { z } from 'zod';

/** PostgreSQL text cannot hold U+0000, and no person types it: refused as a field error, not a 500. */
export const NO_NUL = {
  test: (s: string) => !s.includes('\u0000'),
  message: 'Contains a character that is not allowed.',
};

/** A string that cannot hold NUL; every text field of lib/schemas starts here (`safeString().trim().max(…)`). */
export const safeString = () => z.string().refine(NO_NUL.test, NO_NUL.message);

/** Field schemas shared by the yard, colony and super forms. */
export const isoDay = z.iso.date('Use a date like 2026-07-14');
export const optionalDay = z
  .union([isoDay, z.literal('').transform(() => null), z.null()])
  .optional()
  .transform((v) => v ?? null);
export const id = z.coerce.number().int().positive();
export const idempotencyKey = safeString().trim().min(8, 'Missing entry key').max(80);
export const code = z
  .string()
  .trim()
  .min(1, 'Required')
  .max(30, 'At most 30 characters')
  .regex(/^[A-Za-z0-9][A-Za-z0-9._-]*$/, 'Letters, digits, dot, dash or underscore');
/** One spelling of a printed tag: upper case, as the tag sheets print it ("wt-0001" is "WT-0001"). */
export const canonicalTag = (value: string) => value.trim().toUpperCase();
/** An optional super tag code, upper-cased on every path (forms, scan, import, API). */
export const tagCode = z
  .union([code.transform(canonicalTag), z.literal('').transform(() => null), z.null()])
  .optional()
  .transform((v) => v ?? null);
/** An optional number: blank, NaN (an empty number input) and missing all become null. */
export const blankToNull = (schema: z.ZodType<number, unknown>) =>
  z
    .union([z.literal(''), z.null(), z.nan(), schema])
    .optional()
    .transform((v): number | null => (typeof v === 'number' && !Number.isNaN(v) ? v : null));

/**
 * One file picked in an `<input type="file">` (a FileList, so browser forms only), at most
 * `maxBytes`. The route handler that receives it checks size and type again, by content.
 */
export const chosenFile = (maxBytes: number, messages: { missing: string; tooLarge: string }) =>
  z
    .custom<FileList>(
      (v) => typeof FileList !== 'undefined' && v instanceof FileList && v.length === 1 && v[0].size > 0,
      messages.missing,
    )
    .refine((v) => !v?.[0] || v[0].size <= maxBytes, messages.tooLarge);

/** A trimmed text field of at most `max` characters without NUL: names, addresses, notes, reasons. */
export const plainText = (max: number) => safeString().trim().max(max, `At most ${max} characters`);

/** Whether any string in this JSON-like value (keys included) holds a NUL character. */
export function containsNul(value: unknown, depth = 0): boolean {
  if (typeof value === 'string') return value.includes('\u0000');
  if (depth > 20 || value === null || typeof value !== 'object') return false;
  if (value instanceof Blob) return false;
  if (typeof FormData !== 'undefined' && value instanceof FormData) {
    for (const [k, v] of value.entries())
      if (k.includes('\u0000') || (typeof v === 'string' && v.includes('\u0000'))) return true;
    return false;
  }
  for (const [k, v] of Object.entries(value)) if (k.includes('\u0000') || containsNul(v, depth + 1)) return true;
  return false;
}
