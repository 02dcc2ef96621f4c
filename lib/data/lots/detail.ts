import 'server-only';
import { Op } from 'sequelize';
import { getDb } from '@/lib/db/index';
import type { SessionUser } from '@/lib/auth/session';
import type { LotStage } from '@/lib/domain/lot-stage';
import { extractionYield, remainingGrams } from '@/lib/domain/lot-weights';
import { fermentationRisk, gradeMoisture } from '@/lib/domain/moisture';
import { DEFAULT_SUPER_ESTIMATES, superHoneyGrams, type SuperEstimates } from '@/lib/domain/yield-allocation';
import { listAudit, type AuditRow } from '@/lib/data/audit';
import { canReadLot } from './access';
import {
  assessComposition,
  compositionLimits,
  COMPOSITION_CRITERIA,
  COMPOSITION_RESULT_KEY,
  type CompositionCriterion,
  type CompositionResults,
  type HoneyCategory,
} from '@/lib/domain/lab-results';
import type { LabFile } from '@/models/lab-file';
import {
  checkLabFile,
  labComposition,
  lotCategory,
  lotChecks,
  lotWater,
  moistureLimits,
  type LotWater,
} from './checks';
import { getSettings, type Settings } from '@/lib/data/settings/settings';

/** The owner's honey-per-super estimates (getSettings fills unset depths with the defaults). */
export function superEstimates(s: Settings): SuperEstimates {
  return { ...DEFAULT_SUPER_ESTIMATES, ...s.superEstimates };
}

export type LotSuper = {
  id: number;
  tagCode: string | null;
  colonyCode: string;
  yardName: string;
  keeperName: string;
  depth: string;
  frameCount: number;
  putOnOn: string | null;
  pulledOn: string | null;
  fullGrams: number | null;
  emptyGrams: number | null;
  flagged: boolean;
  flagReasons: string[];
  overrideReason: string | null;
  honeyGrams: number;
  measured: boolean;
};
type Voided = { voidedAt: Date | null; voidReason: string | null };
export type LotContainerRow = Voided & {
  id: number;
  typeName: string | null;
  label: string;
  grossGrams: number;
  tareGrams: number;
  netGrams: number;
};
export type LotReadingRow = Voided & {
  id: number;
  method: 'ri' | 'scale';
  refractiveIndex: number | null;
  scaleWaterPct: number | null;
  temperatureC: number | null;
  waterPct: number;
  takenOn: string;
};
export type LotLabFileRow = Voided & {
  id: number;
  filename: string;
  contentType: string;
  sizeBytes: number;
  sha256: string;
  hmfMgKg: number | null;
  diastaseSchade: number | null;
  insolubleG100g: number | null;
  fructoseGlucoseG100g: number | null;
  sucroseG100g: number | null;
  conductivityMsCm: number | null;
  freeAcidMeqKg: number | null;
  failures: string[];
  createdAt: Date;
};

export type CompositionRow = {
  criterion: CompositionCriterion;
  /** The latest non-voided lab value, or null when no report gives one. */
  value: number | null;
  min: number | null;
  max: number | null;
  /** null: not measured, or the Annex sets no limit for this category. */
  pass: boolean | null;
};

/**
 * The lot's composition verdict per 2001/110/EC Annex II criterion, from the latest non-voided
 * value of each. Release itself checks every report (lotChecks); this is the summary shown.
 */
function compositionVerdict(lot: Parameters<typeof lotCategory>[0], files: LabFile[]): CompositionRow[] {
  const live = files.filter((f) => !f.voidedAt);
  const latest: CompositionResults = {};
  for (const f of live) {
    for (const [k, v] of Object.entries(labComposition(f)) as [keyof CompositionResults, number | undefined][]) {
      if (v !== undefined) latest[k] = v;
    }
  }
  const limits = compositionLimits(lotCategory(lot), latest.hmfMgKg);
  const failed = new Set(assessComposition(latest, lotCategory(lot)).failures.map((f) => f.criterion));
  return COMPOSITION_CRITERIA.filter((c) => c !== 'water').map((criterion) => {
    const value = latest[COMPOSITION_RESULT_KEY[criterion]] ?? null;
    const limit = limits[criterion];
    return {
      criterion,
      value,
      min: limit?.min ?? null,
      max: limit?.max ?? null,
      pass: value === null || limit === null ? null : !failed.has(criterion),
    };
  });
}
export type TraceEvent = {
  kind: 'feeding' | 'treatment';
  colonyCode: string;
  what: string;
  from: string;
  to: string | null;
};
export type TraceRow = LotSuper & { viaLot: string | null; events: TraceEvent[] };

export type LotDetail = {
  id: number;
  code: string;
  stage: LotStage;
  floralSource: string;
  heather: boolean;
  category: HoneyCategory;
  annexSource: string | null;
  /** Per Annex II criterion: the latest non-voided lab value and whether it meets the category's limit. */
  composition: CompositionRow[];
  extractedOn: string | null;
  /** Set when the lot is marked extracted (or first jarred); jars carry it. */
  bestBeforeOn: string | null;
  isBlend: boolean;
  notes: string;
  holdReasons: string[];
  netGrams: number;
  usedGrams: number;
  remainingGrams: number;
  cappingsWaxGrams: number | null;
  supers: LotSuper[];
  containers: LotContainerRow[];
  readings: LotReadingRow[];
  labFiles: LotLabFileRow[];
  parents: { lotId: number; code: string; grams: number }[];
  children: { lotId: number; code: string; grams: number }[];
  water: LotWater;
  grade: ReturnType<typeof gradeMoisture> | null;
  fermentation: ReturnType<typeof fermentationRisk> | null;
  yield: ReturnType<typeof extractionYield>;
  failures: string[];
  unresolvedFlaggedSupers: number;
  hasWeights: boolean;
  trace: TraceRow[];
  history: AuditRow[];
};

async function lotSupers(lotIds: number[], estimates: SuperEstimates) {
  const { models } = getDb();
  const rows = await models.SuperPull.findAll({
    where: { lotId: { [Op.in]: lotIds } },
    include: [
      {
        model: models.Colony,
        as: 'colony',
        attributes: ['id', 'code'],
        include: [
          { model: models.Yard, as: 'yard', attributes: ['name'] },
          { model: models.User, as: 'keeper', attributes: ['name'] },
        ],
      },
    ],
    order: [['id', 'ASC']],
  });
  return rows.map((r) => {
    const honey = superHoneyGrams(
      {
        fullGrams: r.fullGrams,
        emptyGrams: r.emptyGrams,
        depth: r.depth,
        frameCount: r.frameCount,
        cappedFrames: r.cappedFrames === null ? null : Number(r.cappedFrames),
      },
      estimates,
    );
    return {
      lotId: r.lotId!,
      colonyId: r.colonyId,
      row: {
        id: r.id,
        tagCode: r.tagCode,
        colonyCode: r.colony?.code ?? '',
        yardName: r.colony?.yard?.name ?? '',
        keeperName: r.colony?.keeper?.name ?? '',
        depth: r.depth,
        frameCount: r.frameCount,
        putOnOn: r.putOnOn,
        pulledOn: r.pulledOn,
        fullGrams: r.fullGrams,
        emptyGrams: r.emptyGrams,
        flagged: r.flagged,
        flagReasons: r.flagReasons ?? [],
        overrideReason: r.overrideReason,
        honeyGrams: honey.grams,
        measured: honey.measured,
      } satisfies LotSuper,
    };
  });
}

/** Ancestor lots of a blend (itself included), with their codes. */
async function lotTree(lotId: number): Promise<Map<number, string | null>> {
  const { models } = getDb();
  const seen = new Map<number, string | null>([[lotId, null]]);
  let frontier = [lotId];
  for (let depth = 0; frontier.length && depth < 10; depth++) {
    const links = await models.LotParent.findAll({
      where: { childLotId: { [Op.in]: frontier } },
      include: [{ model: models.Lot, as: 'parent', attributes: ['code'] }],
    });
    frontier = [];
    for (const l of links)
      if (!seen.has(l.parentLotId)) {
        seen.set(l.parentLotId, l.parent?.code ?? null);
        frontier.push(l.parentLotId);
      }
  }
  return seen;
}

/** Feedings and treatments on each super's colony while it was on the hive (put on … pulled). */
async function traceEvents(supers: { colonyId: number; row: LotSuper }[]): Promise<Map<number, TraceEvent[]>> {
  const { models } = getDb();
  const colonyIds = [...new Set(supers.map((s) => s.colonyId))];
  const out = new Map<number, TraceEvent[]>();
  if (!colonyIds.length) return out;
  const feedings = await models.Feeding.findAll({ where: { colonyId: { [Op.in]: colonyIds } } });
  const treatments = await models.Treatment.findAll({
    where: { colonyId: { [Op.in]: colonyIds } },
    include: [{ model: models.TreatmentKind, as: 'kind', attributes: ['name'] }],
  });
  const overlaps = (from: string, to: string | null, on: string | null, off: string | null) =>
    (off === null || from <= off) && (to === null || on === null || to >= on);
  for (const s of supers) {
    const on = s.row.putOnOn ?? s.row.pulledOn;
    const off = s.row.pulledOn;
    const events: TraceEvent[] = [];
    for (const f of feedings)
      if (f.colonyId === s.colonyId && overlaps(f.startedOn, f.endedOn, on, off)) {
        events.push({
          kind: 'feeding',
          colonyCode: s.row.colonyCode,
          what: `${f.kind.replace('_', ' ')}${f.amount ? ` (${f.amount})` : ''}`,
          from: f.startedOn,
          to: f.endedOn,
        });
      }
    for (const tr of treatments)
      if (tr.colonyId === s.colonyId && overlaps(tr.appliedOn, tr.removedOn, on, off)) {
        const name = tr.productName || tr.kind?.name || 'treatment';
        events.push({
          kind: 'treatment',
          colonyCode: s.row.colonyCode,
          what: `${name}${tr.supersAllowed ? ' (label allows supers)' : ' (label forbids supers)'}`,
          from: tr.appliedOn,
          to: tr.removedOn,
        });
      }
    out.set(
      s.row.id,
      events.sort((a, b) => a.from.localeCompare(b.from)),
    );
  }
  return out;
}

/** Everything the lot page shows, or null when the lot is missing or not this user's to read (→ 404). */
export async function getLotDetail(user: SessionUser, lotId: number): Promise<LotDetail | null> {
  const { models } = getDb();
  if (!(await canReadLot(user, lotId))) return null;
  const lot = await models.Lot.findByPk(lotId);
  if (!lot) return null;
  const settings = await getSettings();
  const estimates = superEstimates(settings);
  const tree = await lotTree(lot.id);
  const allSupers = await lotSupers([...tree.keys()], estimates);
  const own = allSupers.filter((s) => s.lotId === lot.id);
  const events = await traceEvents(allSupers);
  const containers = await models.LotContainer.findAll({
    where: { lotId },
    include: [{ model: models.ContainerType, as: 'containerType', attributes: ['name'] }],
    order: [['id', 'ASC']],
  });
  const readings = await models.MoistureReading.findAll({
    where: { lotId },
    order: [
      ['takenOn', 'ASC'],
      ['id', 'ASC'],
    ],
  });
  const files = await models.LabFile.findAll({
    where: { lotId },
    attributes: { exclude: ['data'] },
    order: [['id', 'ASC']],
  });
  const parentLinks = await models.LotParent.findAll({
    where: { childLotId: lotId },
    include: [{ model: models.Lot, as: 'parent', attributes: ['code'] }],
  });
  const childLinks = await models.LotParent.findAll({
    where: { parentLotId: lotId },
    include: [{ model: models.Lot, as: 'child', attributes: ['code'] }],
  });
  const water = await lotWater(lot.id);
  const checks = await lotChecks(lot, settings);
  return {
    id: lot.id,
    code: lot.code,
    stage: lot.stage,
    floralSource: lot.floralSource,
    heather: lot.heather,
    category: lotCategory(lot),
    annexSource: lot.annexSource,
    composition: compositionVerdict(lot, files),
    extractedOn: lot.extractedOn,
    bestBeforeOn: lot.bestBeforeOn ?? null,
    isBlend: lot.isBlend,
    notes: lot.notes,
    holdReasons: lot.holdReasons ?? [],
    netGrams: lot.netGrams,
    usedGrams: lot.usedGrams,
    remainingGrams: remainingGrams(lot),
    cappingsWaxGrams: lot.cappingsWaxGrams,
    supers: own.map((s) => s.row),
    containers: containers.map((c) => ({
      id: c.id,
      typeName: c.containerType?.name ?? null,
      label: c.label,
      grossGrams: c.grossGrams,
      tareGrams: c.tareGrams,
      netGrams: c.grossGrams - c.tareGrams,
      voidedAt: c.voidedAt,
      voidReason: c.voidReason,
    })),
    readings: readings.map((r) => ({
      id: r.id,
      method: r.method,
      refractiveIndex: r.refractiveIndex,
      scaleWaterPct: r.scaleWaterPct,
      temperatureC: r.temperatureC,
      waterPct: Number(r.waterPct),
      takenOn: r.takenOn,
      voidedAt: r.voidedAt,
      voidReason: r.voidReason,
    })),
    labFiles: files.map((f) => ({
      id: f.id,
      filename: f.filename,
      contentType: f.contentType,
      sizeBytes: f.sizeBytes,
      sha256: f.sha256,
      hmfMgKg: f.hmfMgKg,
      diastaseSchade: f.diastaseSchade,
      insolubleG100g: f.insolubleG100g,
      fructoseGlucoseG100g: f.fructoseGlucoseG100g,
      sucroseG100g: f.sucroseG100g,
      conductivityMsCm: f.conductivityMsCm,
      freeAcidMeqKg: f.freeAcidMeqKg,
      failures: checkLabFile(lot, f).failureTexts,
      createdAt: f.createdAt,
      voidedAt: f.voidedAt,
      voidReason: f.voidReason,
    })),
    parents: parentLinks.map((l) => ({ lotId: l.parentLotId, code: l.parent?.code ?? '', grams: l.grams })),
    children: childLinks.map((l) => ({ lotId: l.childLotId, code: l.child?.code ?? '', grams: l.grams })),
    water,
    grade: water ? gradeMoisture(water.highest, moistureLimits(settings), { heather: lot.heather }) : null,
    fermentation: water ? fermentationRisk(water.highest) : null,
    yield: extractionYield(
      lot.netGrams,
      own.map((s) => ({ grams: s.row.honeyGrams, measured: s.row.measured })),
    ),
    failures: checks.failures,
    unresolvedFlaggedSupers: checks.unresolvedFlaggedSupers,
    hasWeights: checks.hasWeights,
    trace: allSupers.map((s) => ({
      ...s.row,
      viaLot: s.lotId === lot.id ? null : (tree.get(s.lotId) ?? null),
      events: events.get(s.row.id) ?? [],
    })),
    history: await listAudit('lot', lot.id),
  };
}
