import { z } from 'zod';
import { listQuery } from './list-query';
import { canonicalTag, chosenFile, safeString } from './fields';
import { LAB_FILE_MAX_BYTES } from '@/lib/domain/file-type';
import { HONEY_SOURCES, type HoneySource } from '@/lib/domain/lab-results';

const id = z.coerce.number().int().positive();
const reason = (what: string) =>
  safeString().trim().min(5, `Write a reason for ${what} (at least 5 characters).`).max(1000);
const weight = (label: string) =>
  z.coerce
    .number({ error: `${label}: enter a number.` })
    .nonnegative(`${label} cannot be negative.`)
    .max(100_000, `${label} looks too large.`);
/** A number as typed into a small form: a decimal comma reads as a point, and a blank is no number (not 0). */
const typedNumber = <T extends z.ZodType>(schema: T) =>
  z.preprocess((v) => (typeof v === 'string' ? (v.trim() === '' ? undefined : v.trim().replace(',', '.')) : v), schema);
const optionalNumber = z.preprocess(
  (v) => (v === '' || v === null || v === undefined || (typeof v === 'number' && Number.isNaN(v)) ? undefined : v),
  z.coerce.number().optional(),
);
const day = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Pick a date.');

export const weightUnit = z.enum(['kg', 'lb']);

/** The floral sources 2001/110/EC Annex II names (lib/domain/lab-results.ts HONEY_SOURCES); '' = none of them. */
export const annexSource = z.union([
  z.literal(''),
  z.enum(Object.keys(HONEY_SOURCES) as [HoneySource, ...HoneySource[]]),
]);

export const lotInput = z.object({
  floralSource: safeString().trim().max(80, 'At most 80 characters.'),
  heather: z.boolean().default(false),
  honeyOrigin: z.enum(['blossom', 'honeydew', 'honeydew-blossom-blend']).default('blossom'),
  annexSource: annexSource.default(''),
  bakers: z.boolean().default(false),
  pressed: z.boolean().default(false),
  tropical: z.boolean().default(false),
  lowEnzyme: z.boolean().default(false),
  extractedOn: z.union([z.literal(''), day]).optional(),
  notes: safeString().trim().max(2000).default(''),
});
export type LotInput = z.input<typeof lotInput>;

export const lotDetailsInput = lotInput.extend({ lotId: id });
export type LotDetailsInput = z.input<typeof lotDetailsInput>;

export const scanSuperInput = z.object({
  lotId: id,
  tagCode: safeString().trim().min(1, 'Scan or type a tag code.').max(30).transform(canonicalTag),
  overrideReason: safeString().trim().max(1000).optional(),
});
export type ScanSuperInput = z.input<typeof scanSuperInput>;

export const pickSupersInput = z.object({
  lotId: id,
  superPullIds: z.array(id).min(1, 'Tick at least one super.').max(200),
});
export type PickSupersInput = z.input<typeof pickSupersInput>;

export const removeSuperInput = z.object({ lotId: id, superPullId: id, reason: reason('taking the super out') });
export type RemoveSuperInput = z.input<typeof removeSuperInput>;

export const emptyWeightInput = z.object({
  lotId: id,
  superPullId: id,
  empty: typedNumber(weight('Empty weight').positive('Empty weight must be above 0.')),
  unit: weightUnit,
});
export type EmptyWeightInput = z.input<typeof emptyWeightInput>;

export const containerInput = z
  .object({
    lotId: id,
    containerTypeId: z.preprocess((v) => (v === '' || v === null ? undefined : v), id.optional()),
    label: safeString().trim().max(40).default(''),
    gross: weight('Gross weight').positive('Gross weight must be above 0.'),
    tare: weight('Tare'),
    unit: weightUnit,
  })
  .refine((v) => v.gross > v.tare, { path: ['gross'], message: 'Gross weight must be more than the tare.' });
export type ContainerInput = z.input<typeof containerInput>;

export const waxInput = z.object({ lotId: id, wax: typedNumber(weight('Cappings wax')), unit: weightUnit });
export type WaxInput = z.input<typeof waxInput>;

export const readingInput = z.discriminatedUnion('method', [
  z.object({
    lotId: id,
    method: z.literal('ri'),
    refractiveIndex: z.coerce.number({ error: 'Enter the refractive index, e.g. 1.4900.' }).min(1.3).max(1.6),
    temperatureC: z.coerce.number({ error: 'Enter the sample temperature.' }).min(-10).max(60),
    takenOn: day,
  }),
  z.object({
    lotId: id,
    method: z.literal('scale'),
    scaleWaterPct: z.coerce.number({ error: 'Enter the % water read on the scale.' }).min(5).max(40),
    temperatureC: optionalNumber,
    takenOn: day,
  }),
]);
export type ReadingInput = z.input<typeof readingInput>;

/** The reading form: one flat form for both kinds of refractometer, sent as a `readingInput` of the chosen kind. */
export const readingFormInput = z
  .object({
    lotId: id,
    method: z.enum(['ri', 'scale']),
    refractiveIndex: safeString().trim(),
    scaleWaterPct: safeString().trim(),
    temperatureC: safeString().trim(),
    takenOn: day,
  })
  .superRefine((v, ctx) => {
    if (v.method === 'ri' && !/^1\.\d{3,5}$/.test(v.refractiveIndex))
      ctx.addIssue({ code: 'custom', path: ['refractiveIndex'], message: 'Enter the refractive index, e.g. 1.4900.' });
    if (v.method === 'ri' && v.temperatureC === '')
      ctx.addIssue({ code: 'custom', path: ['temperatureC'], message: 'Enter the sample temperature.' });
    if (v.method === 'scale' && !(Number(v.scaleWaterPct) > 0))
      ctx.addIssue({ code: 'custom', path: ['scaleWaterPct'], message: 'Enter the % water read on the scale.' });
  })
  .transform((v): ReadingInput =>
    v.method === 'ri'
      ? {
          lotId: v.lotId,
          method: 'ri',
          refractiveIndex: Number(v.refractiveIndex),
          temperatureC: Number(v.temperatureC),
          takenOn: v.takenOn,
        }
      : {
          lotId: v.lotId,
          method: 'scale',
          scaleWaterPct: Number(v.scaleWaterPct),
          temperatureC: v.temperatureC === '' ? undefined : Number(v.temperatureC),
          takenOn: v.takenOn,
        },
  );

export const voidInput = z.object({
  lotId: id,
  kind: z.enum(['container', 'reading', 'labFile']),
  recordId: id,
  reason: reason('the correction'),
});
export type VoidInput = z.input<typeof voidInput>;

export const stageInput = z.object({
  lotId: id,
  target: z.enum(['extracted', 'released', 'held']),
  reason: safeString().trim().max(1000).optional(),
  /** Marking a gathering lot extracted: the day it was extracted (the best-before counts from it). */
  extractedOn: z.union([z.literal('').transform(() => undefined), day]).optional(),
});
export type StageInput = z.input<typeof stageInput>;

export const blendFormInput = z.object({
  floralSource: safeString().trim().max(80),
  notes: safeString().trim().max(2000).default(''),
  unit: weightUnit,
  parts: z
    .array(z.object({ lotId: id, amount: z.coerce.number().positive('Take more than 0.') }))
    .min(1, 'Add at least one parent lot.')
    .max(20),
});
export type BlendFormInput = z.input<typeof blendFormInput>;

export const containerTypeInput = z.object({
  id: z.preprocess((v) => (v === '' || v === null ? undefined : v), id.optional()),
  name: safeString().trim().min(1, 'Name the container type.').max(60),
  usualTare: weight('Usual tare'),
  unit: weightUnit,
  active: z.boolean().default(true),
});
export type ContainerTypeInput = z.input<typeof containerTypeInput>;

export const labResultsFields = z.object({
  hmfMgKg: optionalNumber.pipe(z.number().min(0).max(2000).optional()),
  diastaseSchade: optionalNumber.pipe(z.number().min(0).max(100).optional()),
  insolubleG100g: optionalNumber.pipe(z.number().min(0).max(100).optional()),
  fructoseGlucoseG100g: optionalNumber.pipe(z.number().min(0).max(100).optional()),
  sucroseG100g: optionalNumber.pipe(z.number().min(0).max(100).optional()),
  conductivityMsCm: optionalNumber.pipe(z.number().min(0).max(20).optional()),
  freeAcidMeqKg: optionalNumber.pipe(z.number().min(0).max(1000).optional()),
});
export const LAB_RESULT_FIELDS = [
  'hmfMgKg',
  'diastaseSchade',
  'insolubleG100g',
  'fructoseGlucoseG100g',
  'sucroseG100g',
  'conductivityMsCm',
  'freeAcidMeqKg',
] as const;

const decimalText = z
  .string()
  .trim()
  .regex(/^(\d+([.,]\d+)?)?$/, 'A number, or leave empty.')
  .transform((s) => s.replace(',', '.'));

/** The lab report upload form: the file and the results as typed (empty = not measured); the route handler parses them again. */
export const labUploadFormInput = z.object({
  file: chosenFile(LAB_FILE_MAX_BYTES, { missing: 'Choose a file.', tooLarge: 'The file is larger than 10 MB.' }),
  hmfMgKg: decimalText,
  diastaseSchade: decimalText,
  insolubleG100g: decimalText,
  fructoseGlucoseG100g: decimalText,
  sucroseG100g: decimalText,
  conductivityMsCm: decimalText,
  freeAcidMeqKg: decimalText,
});
export type LabUploadFormInput = z.input<typeof labUploadFormInput>;

/** The lot list's query (page, pageSize, sort, dir and filters); sort fields come from an allow-list. */
export const LOT_SORTS = ['createdAt', 'code', 'extractedOn', 'netGrams'] as const;
export const lotListQuery = listQuery(
  LOT_SORTS,
  {
    stage: z.enum(['gathering', 'extracted', 'released', 'packed_out', 'held']).optional().catch(undefined),
    year: z.coerce.number().int().min(2000).max(2100).optional().catch(undefined),
    floral: safeString().trim().max(80).optional(),
  },
  'createdAt',
  { defaultDir: 'desc' },
);
export type LotListQuery = z.output<typeof lotListQuery>;
