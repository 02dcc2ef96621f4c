import { z } from 'zod';

/** Field schemas shared by the yard, colony and super forms. */
export const isoDay = z.iso.date('Use a date like 2026-07-14');
export const optionalDay = z
  .union([isoDay, z.literal('').transform(() => null), z.null()])
  .optional()
  .transform((v) => v ?? null);
export const id = z.coerce.number().int().positive();
export const idempotencyKey = z.string().trim().min(8, 'Missing entry key').max(80);
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
