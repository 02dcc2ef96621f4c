import { z } from 'zod';
import { isValidGtin } from '@/lib/domain/gs1';
import { chosenFile } from './fields';
import { listQuery } from './list-query';

const money = z.coerce.number({ error: 'Enter a price.' }).min(0, 'A price cannot be negative.').max(100_000, 'That price is too high.');
const isoDate = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Pick a date.');

/** A product as the owner types it: net quantity in g or oz, price in money (stored as cents). */
export const productInput = z
  .object({
    productId: z.coerce.number().int().positive().optional(),
    name: z.string().trim().min(1, 'Enter a name.').max(120),
    slug: z.string().trim().max(80).regex(/^([a-z0-9]+(-[a-z0-9]+)*)?$/, 'Lower-case letters, digits and dashes only.').optional().default(''),
    description: z.string().trim().max(2000).optional().default(''),
    netAmount: z.coerce.number({ error: 'Enter the net quantity.' }).positive('Enter the net quantity.').max(100_000),
    netUnit: z.enum(['g', 'oz']),
    containerKind: z.string().trim().min(1, 'Say what the honey goes in (e.g. glass jar).').max(60),
    containerGrams: z.coerce.number({ error: 'Enter the empty container weight.' }).int('Whole grams.').min(0).max(20_000),
    price: money,
    active: z.boolean().default(true),
    gtinMode: z.enum(['none', 'typed', 'made']),
    gtin: z.string().trim().optional().default(''),
    itemReference: z.string().trim().optional().default(''),
  })
  .superRefine((v, ctx) => {
    if (v.gtinMode === 'typed' && !isValidGtin(v.gtin)) {
      ctx.addIssue({ code: 'custom', path: ['gtin'], message: 'Not a valid GTIN: 8, 12, 13 or 14 digits with a correct check digit.' });
    }
    if (v.gtinMode === 'made' && !/^\d{1,6}$/.test(v.itemReference)) {
      ctx.addIssue({ code: 'custom', path: ['itemReference'], message: 'Enter the item reference (digits).' });
    }
  });
export type ProductInput = z.input<typeof productInput>;
export type ProductData = z.output<typeof productInput>;

/** The product photo form (JPEG, PNG or WebP, at most 5 MB); the route handler checks the type by content. */
export const productPhotoInput = z.object({
  photo: chosenFile(5 * 1024 * 1024, { missing: 'Choose a photo first.', tooLarge: 'The photo is larger than 5 MB.' }),
});
export type ProductPhotoInput = z.input<typeof productPhotoInput>;

/** Sample weights typed as "452, 455 449": commas, spaces or new lines between them. */
export function parseSampleWeights(text: string): number[] {
  return text.split(/[\s,;]+/).filter(Boolean).map((s) => Number(s));
}

export const jarringRunInput = z.object({
  lotId: z.coerce.number().int().positive('Pick a lot.'),
  productId: z.coerce.number().int().positive('Pick a product.'),
  jarCount: z.coerce.number({ error: 'Enter the number of jars.' }).int('Whole jars.').positive('At least one jar.').max(100_000),
  runOn: isoDate,
  sampleMode: z.enum(['net', 'gross']),
  samples: z
    .string()
    .trim()
    .min(1, 'Weigh at least one jar and enter its weight.')
    .refine((s) => parseSampleWeights(s).every((n) => Number.isFinite(n) && n > 0 && n < 100_000), 'Weights in grams, separated by commas or spaces.')
    .refine((s) => parseSampleWeights(s).length <= 500, 'At most 500 sample weights.'),
  mavGrams: z.union([z.literal(''), z.coerce.number().positive('The MAV is a weight in grams above 0.').max(1000)]).optional(),
  idempotencyKey: z.string().min(8).max(80),
});
export type JarringRunInput = z.input<typeof jarringRunInput>;
export type JarringRunData = z.output<typeof jarringRunInput>;

export const overrideRunInput = z.object({
  runId: z.coerce.number().int().positive(),
  reason: z.string().trim().min(10, 'Write why these jars may be sold (at least 10 characters).').max(1000),
});
export type OverrideRunInput = z.input<typeof overrideRunInput>;

/** The jarring runs list: newest run first, optionally the runs of one lot. */
export const jarringRunListQuery = listQuery(['runOn'], {
  lotId: z.coerce.number().int().positive().optional(),
}, 'runOn', { defaultDir: 'desc' });
export type JarringRunListQuery = z.output<typeof jarringRunListQuery>;

export const ADJUSTMENT_KINDS = ['breakage', 'adjustment', 'return'] as const;
export const stockAdjustInput = z
  .object({
    productId: z.coerce.number().int().positive('Pick a product.'),
    lotId: z.coerce.number().int().positive('Pick a lot.'),
    kind: z.enum(ADJUSTMENT_KINDS),
    delta: z.coerce.number({ error: 'Enter a number of jars.' }).int('Whole jars.').refine((n) => n !== 0, 'Enter a change other than 0.'),
    reason: z.string().trim().min(3, 'Say why (at least 3 characters).').max(500),
  })
  .superRefine((v, ctx) => {
    if (v.kind === 'breakage' && v.delta > 0) ctx.addIssue({ code: 'custom', path: ['delta'], message: 'Breakage takes jars away: enter a negative number.' });
    if (v.kind === 'return' && v.delta < 0) ctx.addIssue({ code: 'custom', path: ['delta'], message: 'A return adds jars: enter a positive number.' });
  });
export type StockAdjustInput = z.input<typeof stockAdjustInput>;

const mm = (label: string, min = 0) => z.coerce.number({ error: `${label}: enter millimetres.` }).min(min).max(500);
export const labelLayoutInput = z.object({
  layoutId: z.coerce.number().int().positive().optional(),
  name: z.string().trim().min(1, 'Name the layout.').max(60),
  paper: z.enum(['letter', 'a4', 'roll']),
  labelWidthMm: mm('Width', 5),
  labelHeightMm: mm('Height', 5),
  columns: z.coerce.number().int('Whole number.').min(1).max(20),
  rows: z.coerce.number().int('Whole number.').min(1).max(40),
  marginTopMm: mm('Top margin'),
  marginLeftMm: mm('Left margin'),
  gapXMm: mm('Gap across'),
  gapYMm: mm('Gap down'),
  offsetXMm: z.coerce.number().min(-20, 'At most 20 mm.').max(20, 'At most 20 mm.'),
  offsetYMm: z.coerce.number().min(-20, 'At most 20 mm.').max(20, 'At most 20 mm.'),
});
export type LabelLayoutInput = z.input<typeof labelLayoutInput>;

export const labelLayoutIdInput = z.object({ layoutId: z.coerce.number().int().positive() });
export type LabelLayoutIdInput = z.input<typeof labelLayoutIdInput>;
