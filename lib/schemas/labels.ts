import { z } from 'zod';
import { safeString } from './fields';

const mm = (label: string, min = 0) =>
  z.coerce
    .number({ error: `${label}: enter millimetres.` })
    .min(min)
    .max(500);
export const labelLayoutInput = z.object({
  layoutId: z.coerce.number().int().positive().optional(),
  name: safeString().trim().min(1, 'Name the layout.').max(60),
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

/** A run's label sheet: layout (built-in b… or saved s…), first slot, copies, or a one-page preview. */
export const runLabelsQuery = z.object({
  layout: z
    .string()
    .regex(/^[bs]\d{1,9}$/)
    .optional(),
  start: z.coerce.number().int().min(0).max(500).optional(),
  copies: z.coerce.number().int().min(1).max(10_000).optional(),
  preview: z.enum(['1']).optional(),
});
