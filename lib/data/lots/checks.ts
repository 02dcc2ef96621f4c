import 'server-only';
import type { Transaction } from 'sequelize';
import { getDb } from '@/lib/db/index';
import { checkLabResults, type LabLimits } from '@/lib/domain/lab-results';
import { blendWaterPct, remainingGrams } from '@/lib/domain/lot-weights';
import { gradeMoisture, moistureSummary, type MoistureLimits } from '@/lib/domain/moisture';
import type { StageContext } from '@/lib/domain/lot-stage';
import type { Settings } from '@/lib/data/settings/settings';
import type { Lot } from '@/models/lot';

export function moistureLimits(s: Settings): MoistureLimits {
  return {
    generalPct: Number(s.moistureLimitPct),
    heatherPct: Number(s.moistureLimitHeatherPct),
    gradeAPct: Number(s.moistureGradeAPct),
  };
}
export function labLimits(s: Settings): LabLimits {
  return {
    hmfMaxMgKg: Number(s.hmfMaxMgKg),
    diastaseMinSchade: Number(s.diastaseMinSchade),
    insolubleMaxG100g: Number(s.insolubleMaxG100g),
  };
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
    attributes: ['hmfMgKg', 'diastaseSchade', 'insolubleG100g'],
    transaction: t,
  });
  let labOk: boolean | null = null;
  for (const f of files) {
    if (f.hmfMgKg === null && f.diastaseSchade === null && f.insolubleG100g === null) continue;
    const check = checkLabResults(
      { hmfMgKg: f.hmfMgKg, diastaseSchade: f.diastaseSchade, insolubleG100g: f.insolubleG100g },
      labLimits(settings),
    );
    labOk = (labOk ?? true) && check.pass;
    failures.push(...check.failures);
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
