import { z } from 'zod';
import { isValidGtin } from '@/lib/domain/gs1';
import { chosenFile, safeString } from './fields';

const money = z.coerce
  .number({ error: 'Enter a price.' })
  .min(0, 'A price cannot be negative.')
  .max(100_000, 'That price is too high.');

/** A product as the owner types it: net quantity in g or oz, price in money (stored as cents). */
export const productInput = z
  .object({
    productId: z.coerce.number().int().positive().optional(),
    name: safeString().trim().min(1, 'Enter a name.').max(120),
    slug: z
      .string()
      .trim()
      .max(80)
      .regex(/^([a-z0-9]+(-[a-z0-9]+)*)?$/, 'Lower-case letters, digits and dashes only.')
      .optional()
      .default(''),
    description: safeString().trim().max(2000).optional().default(''),
    netAmount: z.coerce.number({ error: 'Enter the net quantity.' }).positive('Enter the net quantity.').max(100_000),
    netUnit: z.enum(['g', 'oz']),
    containerKind: safeString().trim().min(1, 'Say what the honey goes in (e.g. glass jar).').max(60),
    containerGrams: z.coerce
      .number({ error: 'Enter the empty container weight.' })
      .int('Whole grams.')
      .min(0)
      .max(20_000),
    price: money,
    active: z.boolean().default(true),
    gtinMode: z.enum(['none', 'typed', 'made']),
    gtin: safeString().trim().optional().default(''),
    itemReference: safeString().trim().optional().default(''),
  })
  .superRefine((v, ctx) => {
    if (v.gtinMode === 'typed' && !isValidGtin(v.gtin)) {
      ctx.addIssue({
        code: 'custom',
        path: ['gtin'],
        message: 'Not a valid GTIN: 8, 12, 13 or 14 digits with a correct check digit.',
      });
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
