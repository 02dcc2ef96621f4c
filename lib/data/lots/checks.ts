import 'server-only';
import type { Transaction } from 'sequelize';
import { getDb } from '@/lib/db/index';
import {
  assessComposition,
  type CompositionFailure,
  type CompositionResults,
  type HoneyCategory,
} from '@/lib/domain/lab-results';
import { blendWaterPct, remainingGrams } from '@/lib/domain/lot-weights';
import { gradeMoisture, moistureSummary, type MoistureLimits } from '@/lib/domain/moisture';
import type { StageContext } from '@/lib/domain/lot-stage';
import type { Settings } from '@/lib/data/settings/settings';
import type { Lot } from '@/models/lot';
import type { LabFile } from '@/models/lab-file';

export function moistureLimits(s: Settings): MoistureLimits {
  return {
    generalPct: Number(s.moistureLimitPct),
    heatherPct: Number(s.moistureLimitHeatherPct),
    gradeAPct: Number(s.moistureGradeAPct),
  };
}
/** The lot's honey category for 2001/110/EC Annex II; the older heather flag reads as Calluna. */
export function lotCategory(
  lot: Pick<Lot, 'honeyOrigin' | 'bakers' | 'pressed' | 'tropical' | 'lowEnzyme' | 'annexSource' | 'heather'>,
): HoneyCategory {
  return {
    origin: lot.honeyOrigin ?? 'blossom',
    bakers: lot.bakers ?? false,
    pressed: lot.pressed ?? false,
    tropical: lot.tropical ?? false,
    lowEnzyme: lot.lowEnzyme ?? false,
    source: lot.annexSource ?? (lot.heather ? 'calluna' : undefined),
  };
}

type LabValues = Pick<
  LabFile,
  | 'hmfMgKg'
  | 'diastaseSchade'
  | 'insolubleG100g'
  | 'fructoseGlucoseG100g'
  | 'sucroseG100g'
  | 'conductivityMsCm'
  | 'freeAcidMeqKg'
>;
export const LAB_VALUE_COLUMNS = [
  'hmfMgKg',
  'diastaseSchade',
  'insolubleG100g',
  'fructoseGlucoseG100g',
  'sucroseG100g',
  'conductivityMsCm',
  'freeAcidMeqKg',
] as const;

/** A lab report's results as the composition check takes them (DECIMAL columns arrive as strings). */
export function labComposition(f: Partial<LabValues>): CompositionResults {
  const n = (v: number | string | null | undefined) => (v === null || v === undefined ? undefined : Number(v));
  return {
    hmfMgKg: n(f.hmfMgKg),
    diastaseSchade: n(f.diastaseSchade),
    insolubleG100g: n(f.insolubleG100g),
    fructoseGlucoseG100g: n(f.fructoseGlucoseG100g),
    sucroseG100g: n(f.sucroseG100g),
    conductivityMsCm: n(f.conductivityMsCm),
    freeAcidMeqKg: n(f.freeAcidMeqKg),
  };
}

const CRITERION_WORDS: Record<CompositionFailure['criterion'], [string, string]> = {
  water: ['Water', '%'],
  sugars: ['Fructose + glucose', 'g/100 g'],
  sucrose: ['Sucrose', 'g/100 g'],
  insoluble: ['Water-insoluble content', 'g/100 g'],
  conductivity: ['Electrical conductivity', 'mS/cm'],
  'free-acid': ['Free acid', 'meq/kg'],
  diastase: ['Diastase activity', 'Schade'],
  hmf: ['HMF', 'mg/kg'],
};
const MINIMUM: ReadonlySet<string> = new Set(['sugars', 'diastase']);

/** One plain sentence for a failed composition criterion. */
export function compositionFailureText(f: CompositionFailure): string {
  const [name, unit] = CRITERION_WORDS[f.criterion];
  const min = MINIMUM.has(f.criterion) || (f.criterion === 'conductivity' && f.value < f.limit);
  return min
    ? `${name} ${f.value} ${unit} is below the ${f.limit} ${unit} minimum (2001/110/EC Annex II)`
    : `${name} ${f.value} ${unit} is above the ${f.limit} ${unit} limit (2001/110/EC Annex II)`;
}

/** The lab report against Annex II for the lot's category, failures in words. */
export function checkLabFile(lot: Parameters<typeof lotCategory>[0], f: Partial<LabValues>) {
  const result = assessComposition(labComposition(f), lotCategory(lot));
  return { ...result, failureTexts: result.failures.map(compositionFailureText) };
}

export type LotWater = { highest: number; mean: number; count: number; fromParents: boolean } | null;

/**
 * The lot's water figures: its own non-voided readings; a blend without readings of its own
 * takes the weight-weighted mean of its parents' mean water (recursively).
 */
export async function lotWater(lotId: number, t?: Transaction, depth = 0): Promise<LotWater> {
  const { models } = getDb();
  const readings = await models.MoistureReading.findAll({
    where: { lotId, voidedAt: null },
    attributes: ['waterPct'],
    transaction: t,
  });
  const own = moistureSummary(readings.map((r) => Number(r.waterPct)));
  if (own) return { ...own, fromParents: false };
  if (depth > 10) return null;
  const links = await models.LotParent.findAll({ where: { childLotId: lotId }, transaction: t });
  if (links.length === 0) return null;
  const parts = [];
  for (const l of links)
    parts.push({ grams: l.grams, waterPct: (await lotWater(l.parentLotId, t, depth + 1))?.mean ?? null });
  const mean = blendWaterPct(parts);
  return mean === null ? null : { highest: mean, mean, count: 0, fromParents: true };
}

export type LotChecks = StageContext & { failures: string[] };

/** Everything nextStage needs to know about a lot, with the plain reasons for any failing check. */
export async function lotChecks(
  lot: Lot,
  settings: Settings,
  t?: Transaction,
): Promise<Omit<LotChecks, 'role' | 'reason'>> {
  const { models } = getDb();
  const failures: string[] = [];
  const containerCount = await models.LotContainer.count({ where: { lotId: lot.id, voidedAt: null }, transaction: t });
  const water = await lotWater(lot.id, t);
  let moistureOk: boolean | null = null;
  if (water) {
    // The highest reading decides: one wet bucket is enough to ferment.
    const grade = gradeMoisture(water.highest, moistureLimits(settings), { heather: lot.heather });
    moistureOk = grade.withinLimit;
    if (!grade.withinLimit) failures.push(`Moisture ${grade.label}`);
  }
  const files = await models.LabFile.findAll({
    where: { lotId: lot.id, voidedAt: null },
    attributes: [...LAB_VALUE_COLUMNS],
    transaction: t,
  });
  let labOk: boolean | null = null;
  for (const f of files) {
    if (LAB_VALUE_COLUMNS.every((k) => f[k] === null || f[k] === undefined)) continue;
    // Council Directive 2001/110/EC Annex II for this lot's category, not one global limit.
    const check = checkLabFile(lot, f);
    labOk = (labOk ?? true) && check.pass;
    failures.push(...check.failureTexts);
  }
  const unresolvedFlaggedSupers = await models.SuperPull.count({
    where: { lotId: lot.id, flagged: true, overrideReason: null },
    transaction: t,
  });
  return {
    hasWeights: lot.isBlend ? lot.netGrams > 0 : containerCount > 0,
    moistureOk,
    labOk,
    unresolvedFlaggedSupers,
    remainingGrams: remainingGrams(lot),
    failures,
  };
}
