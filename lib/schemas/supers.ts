import { z } from 'zod';
import { blankToNull, id, idempotencyKey, isoDay, tagCode } from './fields';
import { listQuery } from './list-query';

export const SUPER_DEPTHS = ['deep', 'medium', 'shallow'] as const;
export const depth = z.enum(SUPER_DEPTHS, 'Choose deep, medium or shallow');

export const pullListQuery = listQuery(
  ['pulledOn', 'colony', 'fullGrams'],
  {
    yardId: id.optional(),
    colonyId: id.optional(),
    flagged: z.enum(['yes', 'no']).optional(),
    /** Voided pulls are listed (struck through) unless asked for: no = standing pulls only, yes = voided only. */
    voided: z.enum(['yes', 'no']).optional(),
    from: isoDay.optional(),
    to: isoDay.optional(),
  },
  'pulledOn',
  { defaultDir: 'desc' },
);
export type PullListQuery = z.output<typeof pullListQuery>;

export const superOnInput = z.object({
  colonyId: id,
  depth,
  frameCount: z.coerce.number().int().min(1).max(12),
  tagCode,
  putOnOn: isoDay,
  idempotencyKey,
});

const weight = blankToNull(z.coerce.number().positive('More than 0').max(100, 'Too heavy for a super'));
export const pullEntry = z
  .object({
    colonyId: id,
    pulledOn: isoDay,
    depth,
    frameCount: z.coerce.number().int().min(1, '1 to 12').max(12, '1 to 12'),
    weight,
    weightUnit: z.enum(['kg', 'lb']).default('kg'),
    cappedFrames: blankToNull(z.coerce.number().min(0).max(12)),
    tagCode,
    idempotencyKey,
  })
  .refine((v) => v.cappedFrames === null || v.cappedFrames <= v.frameCount, {
    path: ['cappedFrames'],
    message: 'More capped frames than frames',
  });
export type PullEntry = z.input<typeof pullEntry>;
export const pullBatch = z.object({ entries: z.array(pullEntry).min(1, 'Nothing to record').max(100) });

/** A pull recorded by mistake is voided with a reason, never edited or deleted. */
export const voidPullInput = z.object({
  superPullId: id,
  /** What the keeper saw: a recorded pull, or a super still on the hive ("super on" entered by mistake). */
  record: z.enum(['pull', 'on'], { error: 'Choose a pull or a super-on record.' }).default('pull'),
  reason: z
    .string({ error: 'Say why this record is being voided.' })
    .trim()
    .min(3, 'Say why this record is being voided (at least 3 characters).')
    .max(500, 'Keep the reason to 500 characters or fewer.'),
});
export type VoidPullInput = z.input<typeof voidPullInput>;

export const tagBatchInput = z.object({
  prefix: z
    .string()
    .trim()
    .min(1)
    .max(12)
    .regex(/^[A-Za-z0-9-]+$/, 'Letters, digits and dashes'),
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

/** The super-tag sheet: which batch (tag prefix) and which label layout. */
export const tagSheetQuery = z.object({
  prefix: z
    .string()
    .trim()
    .max(12)
    .regex(/^[A-Za-z0-9-]*$/)
    .optional(),
  layout: z.string().max(80).optional(),
});

/**
 * The pull import wizard's two requests, checked in the browser before posting: a look at the sheet
 * (`preview`, first without a column mapping), then the import of its valid rows (`commit`). The
 * route handler checks the file again, by content.
 */
export const importSheetInput = z.object({
  file: z
    .custom<File>((v) => typeof File !== 'undefined' && v instanceof File, 'Choose a CSV file to upload.')
    .refine((f) => f.size <= 5 * 1024 * 1024, 'The file is larger than 5 MB. Split it into smaller files.')
    .refine((f) => /\.csv$/i.test(f.name), 'Only CSV files (.csv) can be imported. Save the spreadsheet as CSV first.'),
  mode: z.enum(['preview', 'commit']),
  mapping: importMapping.partial().optional(),
  expectedValid: z.number().int().min(0).optional(),
});
export type ImportSheetInput = z.output<typeof importSheetInput>;
