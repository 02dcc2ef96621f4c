import { z } from 'zod';
import { id, safeString } from './fields';
import { listQuery } from './list-query';

/** One adjustment moves at most this many jars (stock columns are 32-bit integers; no shelf holds more). */
export const MAX_ADJUST_JARS = 100_000;

export const ADJUSTMENT_KINDS = ['breakage', 'adjustment', 'return'] as const;
export const stockAdjustInput = z
  .object({
    productId: z.coerce.number().int().positive('Pick a product.'),
    lotId: z.coerce.number().int().positive('Pick a lot.'),
    kind: z.enum(ADJUSTMENT_KINDS),
    delta: z.coerce
      .number({ error: 'Enter a number of jars.' })
      .int('Whole jars.')
      .min(-MAX_ADJUST_JARS, `At most ${MAX_ADJUST_JARS.toLocaleString('en')} jars in one adjustment.`)
      .max(MAX_ADJUST_JARS, `At most ${MAX_ADJUST_JARS.toLocaleString('en')} jars in one adjustment.`)
      .refine((n) => n !== 0, 'Enter a change other than 0.'),
    reason: safeString().trim().min(3, 'Say why (at least 3 characters).').max(500),
  })
  .superRefine((v, ctx) => {
    if (v.kind === 'breakage' && v.delta > 0)
      ctx.addIssue({ code: 'custom', path: ['delta'], message: 'Breakage takes jars away: enter a negative number.' });
    if (v.kind === 'return' && v.delta < 0)
      ctx.addIssue({ code: 'custom', path: ['delta'], message: 'A return adds jars: enter a positive number.' });
  });
export type StockAdjustInput = z.input<typeof stockAdjustInput>;

/** The stock ledger's query: newest entries first, optionally for one product or lot. */
export const ledgerListQuery = listQuery(
  ['createdAt'],
  {
    productId: id.optional(),
    lotId: id.optional(),
  },
  'createdAt',
  { defaultDir: 'desc' },
);
export type LedgerListQuery = z.output<typeof ledgerListQuery>;
