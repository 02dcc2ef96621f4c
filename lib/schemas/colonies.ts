import { z } from 'zod';
import { blankToNull, code, id, idempotencyKey, isoDay, optionalDay, safeString } from './fields';
import { listQuery } from './list-query';

export const colonyListQuery = listQuery(
  ['code', 'yard', 'status', 'queenYear'],
  {
    yardId: id.optional(),
    status: z.enum(['active', 'dead_out', 'combined', 'sold']).optional(),
    q: safeString().trim().max(30).optional(),
  },
  'code',
);
export type ColonyListQuery = z.output<typeof colonyListQuery>;

export const COLONY_ORIGINS = ['package', 'nucleus', 'swarm', 'purchased', 'split'] as const;
const queenYear = blankToNull(z.coerce.number().int().min(1990, 'From 1990').max(2100));
export const colonyInput = z.object({
  code,
  yardId: id,
  keeperId: id.optional(),
  origin: z.enum(COLONY_ORIGINS),
  parentColonyId: blankToNull(z.coerce.number().int().positive()),
  queenYear,
  startedOn: optionalDay,
  notes: safeString().trim().max(2000).default(''),
});
export type ColonyInput = z.input<typeof colonyInput>;
export const colonyUpdateInput = colonyInput.omit({ yardId: true }).extend({ colonyId: id });

export const moveInput = z.object({
  colonyId: id,
  yardId: id,
  occurredOn: isoDay,
  note: safeString().trim().max(500).default(''),
});
export const statusInput = z.object({
  colonyId: id,
  status: z.enum(['active', 'dead_out', 'combined', 'sold']),
  combinedIntoCode: safeString().trim().max(30).optional(),
  occurredOn: isoDay,
  note: safeString().trim().max(500).default(''),
});
export const splitInput = z.object({
  colonyId: id,
  newCode: code,
  occurredOn: isoDay,
  queenYear,
  note: safeString().trim().max(500).default(''),
  idempotencyKey,
});
export const noteInput = z.object({
  colonyId: id,
  occurredOn: isoDay,
  note: safeString().trim().min(1, 'Write the note').max(2000),
  idempotencyKey,
});

// ---- feedings and treatments ----
/**
 * Supers on the hive during a sugar feeding or a treatment whose label forbids them: `ask` (the
 * form) saves nothing and returns the warning; `mark` saves and flags them now. Left out (a queued
 * entry, the API) means `mark`, so an entry is never lost and never saved without its warning.
 */
export const onSupers = z.enum(['ask', 'mark']).default('mark');
export const FEEDING_KINDS = ['sugar_syrup', 'fondant', 'pollen_substitute', 'other'] as const;
const endAfterStart = <T extends { startedOn: string; endedOn: string | null }>(v: T) =>
  v.endedOn === null || v.endedOn >= v.startedOn;
export const feedingInput = z
  .object({
    colonyId: id,
    kind: z.enum(FEEDING_KINDS),
    amount: safeString().trim().max(60).default(''),
    startedOn: isoDay,
    endedOn: optionalDay,
    note: safeString().trim().max(500).default(''),
    idempotencyKey,
    onSupers,
  })
  .refine(endAfterStart, { path: ['endedOn'], message: 'Ends before it starts' });
export const feedingEndInput = z.object({ feedingId: id, endedOn: isoDay });

export const treatmentInput = z
  .object({
    colonyId: id,
    treatmentKindId: id,
    productName: safeString().trim().max(120).default(''),
    appliedOn: isoDay,
    removedOn: optionalDay,
    note: safeString().trim().max(500).default(''),
    idempotencyKey,
    onSupers,
  })
  .refine((v) => v.removedOn === null || v.removedOn >= v.appliedOn, {
    path: ['removedOn'],
    message: 'Removed before it was applied',
  });
export const treatmentEndInput = z.object({ treatmentId: id, removedOn: isoDay });

/** One colony with its supers, by id. */
export const colonyDetailQuery = z.object({ id: z.coerce.number().int().positive('Give the colony id') });
