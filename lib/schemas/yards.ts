import { z } from 'zod';
import { blankToNull, id } from './fields';

const page = z.coerce.number().int().min(1).default(1);
const pageSize = z.coerce.number().int().min(1).max(100, 'At most 100 per page').default(25);
const dir = z.enum(['asc', 'desc']).default('asc');

export const yardListQuery = z.object({
  page, pageSize, dir,
  sort: z.enum(['name', 'colonies']).default('name'),
  q: z.string().trim().max(80).optional(),
});
export type YardListQuery = z.output<typeof yardListQuery>;

const coordinate = (max: number) => blankToNull(z.coerce.number().min(-max).max(max, `Between -${max} and ${max}`));
export const yardInput = z.object({
  name: z.string().trim().min(1, 'Give the yard a name').max(80).regex(/^[\p{L}\p{N}]/u, 'Start the name with a letter or digit'),
  place: z.string().trim().max(500).default(''),
  latitude: coordinate(90),
  longitude: coordinate(180),
  forageNotes: z.string().trim().max(2000).default(''),
  keeperIds: z.array(z.coerce.number().int().positive()).max(50).default([]),
});
export type YardInput = z.input<typeof yardInput>;
export const yardUpdateInput = yardInput.extend({ yardId: id });

