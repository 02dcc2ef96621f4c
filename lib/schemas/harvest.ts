import { z } from 'zod';

const isoDay = z.iso.date('Use a date like 2026-07-14');
const optionalDay = z.union([isoDay, z.literal('').transform(() => null), z.null()]).optional().transform((v) => v ?? null);
const id = z.coerce.number().int().positive();
const idempotencyKey = z.string().trim().min(8, 'Missing entry key').max(80);
const code = z.string().trim().min(1, 'Required').max(30, 'At most 30 characters').regex(/^[A-Za-z0-9][A-Za-z0-9._-]*$/, 'Letters, digits, dot, dash or underscore');
const tagCode = z.union([code, z.literal('').transform(() => null), z.null()]).optional().transform((v) => v ?? null);
/** An optional number: blank, NaN (an empty number input) and missing all become null. */
const blankToNull = (schema: z.ZodType<number, unknown>) =>
  z.union([z.literal(''), z.null(), z.nan(), schema]).optional()
    .transform((v): number | null => (typeof v === 'number' && !Number.isNaN(v) ? v : null));

export const SUPER_DEPTHS = ['deep', 'medium', 'shallow'] as const;
export const depth = z.enum(SUPER_DEPTHS, 'Choose deep, medium or shallow');

// ---- lists (route handlers and pages) ----
const page = z.coerce.number().int().min(1).default(1);
const pageSize = z.coerce.number().int().min(1).max(100, 'At most 100 per page').default(25);
const dir = z.enum(['asc', 'desc']).default('asc');

export const yardListQuery = z.object({
  page, pageSize, dir,
  sort: z.enum(['name', 'colonies']).default('name'),
  q: z.string().trim().max(80).optional(),
});
export type YardListQuery = z.output<typeof yardListQuery>;

export const colonyListQuery = z.object({
  page, pageSize, dir,
  sort: z.enum(['code', 'yard', 'status', 'queenYear']).default('code'),
  yardId: id.optional(),
  status: z.enum(['active', 'dead_out', 'combined', 'sold']).optional(),
  q: z.string().trim().max(30).optional(),
});
export type ColonyListQuery = z.output<typeof colonyListQuery>;

export const pullListQuery = z.object({
  page, pageSize,
  dir: z.enum(['asc', 'desc']).default('desc'),
  sort: z.enum(['pulledOn', 'colony', 'fullGrams']).default('pulledOn'),
  yardId: id.optional(),
  colonyId: id.optional(),
  flagged: z.enum(['yes', 'no']).optional(),
  /** Voided pulls are listed (struck through) unless asked for: no = standing pulls only, yes = voided only. */
  voided: z.enum(['yes', 'no']).optional(),
  from: isoDay.optional(),
  to: isoDay.optional(),
});
export type PullListQuery = z.output<typeof pullListQuery>;

/** URLSearchParams or a Next searchParams object → a plain record with blanks dropped. */
export function queryRecord(params: URLSearchParams | Record<string, string | string[] | undefined>): Record<string, string> {
  const entries = params instanceof URLSearchParams ? [...params.entries()] : Object.entries(params).map(([k, v]) => [k, Array.isArray(v) ? v[0] : v] as const);
  return Object.fromEntries(entries.filter((e): e is [string, string] => typeof e[1] === 'string' && e[1] !== ''));
}

// ---- yards ----
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

// ---- colonies ----
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
  notes: z.string().trim().max(2000).default(''),
});
export type ColonyInput = z.input<typeof colonyInput>;
export const colonyUpdateInput = colonyInput.omit({ yardId: true }).extend({ colonyId: id });

export const moveInput = z.object({ colonyId: id, yardId: id, occurredOn: isoDay, note: z.string().trim().max(500).default('') });
export const statusInput = z.object({
  colonyId: id,
  status: z.enum(['active', 'dead_out', 'combined', 'sold']),
  combinedIntoCode: z.string().trim().max(30).optional(),
  occurredOn: isoDay,
  note: z.string().trim().max(500).default(''),
});
export const splitInput = z.object({ colonyId: id, newCode: code, occurredOn: isoDay, queenYear, note: z.string().trim().max(500).default(''), idempotencyKey });
export const noteInput = z.object({ colonyId: id, occurredOn: isoDay, note: z.string().trim().min(1, 'Write the note').max(2000), idempotencyKey });

// ---- feedings and treatments ----
export const FEEDING_KINDS = ['sugar_syrup', 'fondant', 'pollen_substitute', 'other'] as const;
const endAfterStart = <T extends { startedOn: string; endedOn: string | null }>(v: T) => v.endedOn === null || v.endedOn >= v.startedOn;
export const feedingInput = z.object({
  colonyId: id,
  kind: z.enum(FEEDING_KINDS),
  amount: z.string().trim().max(60).default(''),
  startedOn: isoDay,
  endedOn: optionalDay,
  note: z.string().trim().max(500).default(''),
  idempotencyKey,
}).refine(endAfterStart, { path: ['endedOn'], message: 'Ends before it starts' });
export const feedingEndInput = z.object({ feedingId: id, endedOn: isoDay });

export const treatmentInput = z.object({
  colonyId: id,
  treatmentKindId: id,
  productName: z.string().trim().max(120).default(''),
  appliedOn: isoDay,
  removedOn: optionalDay,
  note: z.string().trim().max(500).default(''),
  idempotencyKey,
}).refine((v) => v.removedOn === null || v.removedOn >= v.appliedOn, { path: ['removedOn'], message: 'Removed before it was applied' });
export const treatmentEndInput = z.object({ treatmentId: id, removedOn: isoDay });

export const treatmentKindInput = z.object({
  id: id.optional(),
  name: z.string().trim().min(1, 'Name the kind').max(80).regex(/^[\p{L}\p{N}]/u, 'Start the name with a letter or digit'),
  supersAllowed: z.boolean(),
  waitingDays: z.coerce.number().int().min(0, '0 or more').max(365),
  notes: z.string().trim().max(1000).default(''),
  active: z.boolean().default(true),
});
export type TreatmentKindInput = z.input<typeof treatmentKindInput>;

// ---- supers ----
export const superOnInput = z.object({
  colonyId: id,
  depth,
  frameCount: z.coerce.number().int().min(1).max(12),
  tagCode,
  putOnOn: isoDay,
  idempotencyKey,
});

const weight = blankToNull(z.coerce.number().positive('More than 0').max(100, 'Too heavy for a super'));
export const pullEntry = z.object({
  colonyId: id,
  pulledOn: isoDay,
  depth,
  frameCount: z.coerce.number().int().min(1, '1 to 12').max(12, '1 to 12'),
  weight,
  weightUnit: z.enum(['kg', 'lb']).default('kg'),
  cappedFrames: blankToNull(z.coerce.number().min(0).max(12)),
  tagCode,
  idempotencyKey,
}).refine((v) => v.cappedFrames === null || v.cappedFrames <= v.frameCount, { path: ['cappedFrames'], message: 'More capped frames than frames' });
export type PullEntry = z.input<typeof pullEntry>;
export const pullBatch = z.object({ entries: z.array(pullEntry).min(1, 'Nothing to record').max(100) });

/** A pull recorded by mistake is voided with a reason, never edited or deleted. */
export const voidPullInput = z.object({
  superPullId: id,
  /** What the keeper saw: a recorded pull, or a super still on the hive ("super on" entered by mistake). */
  record: z.enum(['pull', 'on'], { error: 'Choose a pull or a super-on record.' }).default('pull'),
  reason: z.string({ error: 'Say why this record is being voided.' }).trim()
    .min(3, 'Say why this record is being voided (at least 3 characters).')
    .max(500, 'Keep the reason to 500 characters or fewer.'),
});
export type VoidPullInput = z.input<typeof voidPullInput>;

export const tagBatchInput = z.object({
  prefix: z.string().trim().min(1).max(12).regex(/^[A-Za-z0-9-]+$/, 'Letters, digits and dashes'),
  from: z.coerce.number().int().min(1).max(99999),
  count: z.coerce.number().int().min(1).max(500, 'At most 500 at a time'),
  depth,
  frameCount: z.coerce.number().int().min(1).max(12).default(10),
});

export const importMapping = z.object({
  colonyCode: z.string().min(1, 'Choose the colony column'),
  pulledOn: z.string().min(1, 'Choose the date column'),
  depth: z.string().min(1, 'Choose the box depth column'),
  frameCount: z.string().optional(),
  fullWeight: z.string().optional(),
  weightUnit: z.string().optional(),
  cappedFrames: z.string().optional(),
  tagCode: z.string().optional(),
});
