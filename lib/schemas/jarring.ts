import { z } from 'zod';
import { safeString } from './fields';
import { listQuery } from './list-query';

const isoDate = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Pick a date.');

/** Sample weights typed as "452, 455 449": commas, spaces or new lines between them. */
export function parseSampleWeights(text: string): number[] {
  return text
    .split(/[\s,;]+/)
    .filter(Boolean)
    .map((s) => Number(s));
}

export const jarringRunInput = z.object({
  lotId: z.coerce.number().int().positive('Pick a lot.'),
  productId: z.coerce.number().int().positive('Pick a product.'),
  jarCount: z.coerce
    .number({ error: 'Enter the number of jars.' })
    .int('Whole jars.')
    .positive('At least one jar.')
    .max(100_000),
  runOn: isoDate,
  sampleMode: z.enum(['net', 'gross']),
  samples: z
    .string()
    .trim()
    .min(1, 'Weigh at least one jar and enter its weight.')
    .refine(
      (s) => parseSampleWeights(s).every((n) => Number.isFinite(n) && n > 0 && n < 100_000),
      'Weights in grams, separated by commas or spaces.',
    )
    .refine((s) => parseSampleWeights(s).length <= 500, 'At most 500 sample weights.'),
  mavGrams: z
    .union([z.literal(''), z.coerce.number().positive('The MAV is a weight in grams above 0.').max(1000)])
    .optional(),
  idempotencyKey: z.string().min(8).max(80),
});
export type JarringRunInput = z.input<typeof jarringRunInput>;
export type JarringRunData = z.output<typeof jarringRunInput>;

export const overrideRunInput = z.object({
  runId: z.coerce.number().int().positive(),
  reason: safeString().trim().min(10, 'Write why these jars may be sold (at least 10 characters).').max(1000),
});
export type OverrideRunInput = z.input<typeof overrideRunInput>;

/** The jarring runs list: newest run first, optionally the runs of one lot. */
export const jarringRunListQuery = listQuery(
  ['runOn'],
  {
    lotId: z.coerce.number().int().positive().optional(),
  },
  'runOn',
  { defaultDir: 'desc' },
);
export type JarringRunListQuery = z.output<typeof jarringRunListQuery>;
