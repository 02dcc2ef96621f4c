import { z } from 'zod';
import { email, personName } from './auth';

export const staffInput = z.object({
  name: personName,
  email,
  role: z.enum(['owner', 'keeper', 'crew'], 'Pick a role.'),
});
export type StaffInput = z.input<typeof staffInput>;

export const staffUpdateInput = z.object({
  userId: z.coerce.number().int().positive(),
  role: z.enum(['owner', 'keeper', 'crew']).optional(),
  disabled: z.boolean().optional(),
});
export type StaffUpdateInput = z.input<typeof staffUpdateInput>;
