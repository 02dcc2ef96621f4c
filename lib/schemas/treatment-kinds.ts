import { z } from 'zod';
import { id, safeString } from './fields';

export const treatmentKindInput = z.object({
  id: id.optional(),
  name: z
    .string()
    .trim()
    .min(1, 'Name the kind')
    .max(80)
    .regex(/^[\p{L}\p{N}]/u, 'Start the name with a letter or digit'),
  supersAllowed: z.boolean(),
  waitingDays: z.coerce.number().int().min(0, '0 or more').max(365),
  notes: safeString().trim().max(1000).default(''),
  active: z.boolean().default(true),
});
export type TreatmentKindInput = z.input<typeof treatmentKindInput>;
