import { z } from 'zod';
import { blankToNull, id, safeString } from './fields';
import { listQuery } from './list-query';

export const yardListQuery = listQuery(
  ['name', 'colonies'],
  {
    q: safeString().trim().max(80).optional(),
  },
  'name',
);
export type YardListQuery = z.output<typeof yardListQuery>;

const coordinate = (max: number) => blankToNull(z.coerce.number().min(-max).max(max, `Between -${max} and ${max}`));
export const yardInput = z.object({
  name: z
    .string()
    .trim()
    .min(1, 'Give the yard a name')
    .max(80)
    .regex(/^[\p{L}\p{N}]/u, 'Start the name with a letter or digit'),
  place: safeString().trim().max(500).default(''),
  latitude: coordinate(90),
  longitude: coordinate(180),
  forageNotes: safeString().trim().max(2000).default(''),
  keeperIds: z.array(z.coerce.number().int().positive()).max(50).default([]),
});
export type YardInput = z.input<typeof yardInput>;
export const yardUpdateInput = yardInput.extend({ yardId: id });
