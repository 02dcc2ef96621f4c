import { z } from 'zod';
import { safeString } from './fields';

const pct = (label: string) =>
  z.coerce
    .number({ error: `${label}: enter a number.` })
    .min(5, `${label}: at least 5 %.`)
    .max(40, `${label}: at most 40 %.`);

/** What the owner may change on the settings page. Unknown fields are dropped, never trusted. */
export const settingsInput = z.object({
  businessName: safeString().trim().min(1, 'Enter the business name.').max(120),
  address: safeString().trim().max(500),
  region: safeString().trim().max(120),
  contactEmail: z.union([z.literal(''), safeString().trim().email('Enter a valid e-mail address.')]),
  story: safeString().trim().max(2000),
  publicLotNote: safeString().trim().max(1000),
  timeZone: z
    .string()
    .trim()
    .refine(
      (tz) => Intl.supportedValuesOf('timeZone').includes(tz) || tz === 'UTC',
      'Pick a time zone such as Europe/London.',
    ),
  currency: z.enum(['usd', 'eur', 'gbp', 'cad', 'aud', 'nzd'], 'Pick a currency.'),
  weightSystem: z.enum(['metric', 'us']),
  gs1CompanyPrefix: z
    .string()
    .trim()
    .regex(/^(\d{6,11})?$/, 'A GS1 company prefix is 6 to 11 digits.'),
  lotCodePrefix: z
    .string()
    .trim()
    .regex(/^[A-Z]{1,4}$/, 'Use 1 to 4 capital letters.'),
  moistureLimitPct: pct('General moisture limit'),
  moistureLimitHeatherPct: pct('Heather moisture limit'),
  moistureGradeAPct: pct('US Grade A water limit'),
  bestBeforeMonths: z.coerce.number().int('Whole months.').min(1).max(120),
  /** The month the beekeeping season starts (1 = January); reports group by it. */
  seasonStartMonth: z.coerce
    .number({ error: 'Pick the month the season starts.' })
    .int('Pick the month the season starts.')
    .min(1, 'Pick the month the season starts.')
    .max(12, 'Pick the month the season starts.'),
  expectedLossPct: z.coerce.number().min(0).max(20),
  /** Left out (an older client): the stored choice stays as it is. */
  allowUntaggedSupers: z.boolean().optional(),
  fillRuleSet: z.enum(['oiml', 'nist']),
  labelDeclaration: z.enum(['us-dual', 'metric']),
  barcodeKind: z.enum(['gs1-128', 'gs1datamatrix']),
});
export type SettingsInput = z.input<typeof settingsInput>;
