import 'server-only';
import { UniqueConstraintError, type Transaction } from 'sequelize';
import { getDb } from '@/lib/db/index';
import { ConflictError, InvalidError, NotFoundError } from '@/lib/domain/errors';
import type { SessionUser } from '@/lib/auth/session';
import {
  assessFill,
  assessFillUs,
  fillCheckReasons,
  fillChecksPass,
  maximumAllowableVariation,
  namedFillChecks,
  nominalGrams,
  runReferenceTest,
  type NamedFillCheck,
} from '@/lib/domain/fill-check';
import { bestBeforeDate, honeyUsedByRun, jarsLotCanFill } from '@/lib/domain/jars';
import { nextStage, type LotRole } from '@/lib/domain/lot-stage';
import { formatWeight } from '@/lib/domain/units';
import { parseSampleWeights, type JarringRunData } from '@/lib/schemas/jarring';
import type { FillReport, FillRuleSet } from '@/models/jarring-run';
import { recordAudit } from '@/lib/data/audit';
import { getSettings } from '@/lib/data/settings/settings';
import { addStockEntry } from '@/lib/data/stock/stock';

/** Raised when the US rule set is chosen and no MAV is encoded for this size (the form asks for it). */
export class MavNeededError extends InvalidError {
  constructor(nominalGrams: number) {
    super(
      `Enter the MAV for a ${Math.round(nominalGrams)} g package, in grams, from NIST Handbook 133 (Appendix A, Table 2-5): Combtrace does not hold that table.`,
    );
  }
}

/**
 * Fill check by the owner's rule set. EU/OIML: the 76/211/EEC Annex II reference test with the run's
 * jar count as the batch, and the producer's own check (OIML R 87 / 76/211/EEC Annex I TNE, at most
 * floor(2.5 %) below T1, none below T2). US: NIST Handbook 133 (average + MAV), no reference test.
 */
function checkFill(
  ruleSet: FillRuleSet,
  nominal: number,
  jarCount: number,
  samples: number[],
  mavGrams?: number | null,
): FillReport {
  if (ruleSet === 'oiml')
    return { ...assessFill(nominal, samples), reference: runReferenceTest(nominal, jarCount, samples) };
  const mav = maximumAllowableVariation(nominal) ?? mavGrams ?? null;
  if (mav === null) throw new MavNeededError(nominal);
  return assessFillUs(nominal, samples, mav);
}

export type RunResult = {
  runId: number;
  pass: boolean;
  reasons: string[];
  /** Each check by name (reference test and producer's check under EU/OIML), with its one-line result. */
  checks: NamedFillCheck[];
  stocked: boolean;
  packedOut: boolean;
  duplicate: boolean;
};

async function existingRun(key: string, t?: Transaction): Promise<RunResult | null> {
  const run = await getDb().models.JarringRun.findOne({ where: { idempotencyKey: key }, transaction: t });
  if (!run) return null;
  const checks = namedFillChecks(run.ruleSet, run.fillReport);
  return {
    runId: run.id,
    pass: run.fillPass,
    reasons: fillCheckReasons(checks),
    checks,
    stocked: run.fillPass || !!run.overrideReason,
    packedOut: false,
    duplicate: true,
  };
}

/** Net sample weights: as typed, or gross minus the product's empty container. */
function netSamples(data: JarringRunData, containerGrams: number): number[] {
  const typed = parseSampleWeights(data.samples);
  const net = data.sampleMode === 'gross' ? typed.map((g) => g - containerGrams) : typed;
  if (net.some((g) => g <= 0))
    throw new InvalidError(
      `A gross weight is not above the empty ${containerGrams} g container: check the weights or choose “net”.`,
    );
  return net.map((g) => Math.round(g * 10) / 10);
}

/**
 * Records a jarring run: locks the lot, refuses to draw more honey than it has left, checks the
 * fill, and (if it passes) puts the jars into stock. When what is left cannot fill one more jar
 * of any active product the lot becomes packed out. One idempotency key → one run.
 */
export async function createJarringRun(user: SessionUser, data: JarringRunData): Promise<RunResult> {
  const { sequelize, models } = getDb();
  const settings = await getSettings();
  const earlier = await existingRun(data.idempotencyKey);
  if (earlier) return earlier;
  try {
    return await sequelize.transaction(async (t) => {
      const again = await existingRun(data.idempotencyKey, t);
      if (again) return again;
      const lot = await models.Lot.findByPk(data.lotId, { transaction: t, lock: t.LOCK.UPDATE });
      if (!lot) throw new NotFoundError('No such lot.');
      if (lot.stage !== 'released')
        throw new ConflictError(
          `Lot ${lot.code} is ${lot.stage.replace('_', ' ')}; only a released lot can be jarred.`,
        );
      const product = await models.Product.findByPk(data.productId, { transaction: t });
      if (!product) throw new NotFoundError('No such product.');
      if (!product.active) throw new ConflictError(`${product.name} is not active.`);

      const samples = netSamples(data, product.containerGrams);
      const nominal = nominalGrams(product);
      const report = checkFill(
        settings.fillRuleSet,
        nominal,
        data.jarCount,
        samples,
        data.mavGrams === '' ? null : data.mavGrams,
      );
      const checks = namedFillChecks(settings.fillRuleSet, report);
      const pass = fillChecksPass(checks);
      const reasons = fillCheckReasons(checks);
      const used = honeyUsedByRun(data.jarCount, nominal, samples);
      const remaining = lot.netGrams - lot.usedGrams;
      if (used > remaining) {
        const system = settings.weightSystem;
        throw new ConflictError(
          `This run takes ${formatWeight(used, system)} of honey; lot ${lot.code} has only ${formatWeight(Math.max(remaining, 0), system)} left.`,
        );
      }

      const bestBeforeOn = lot.bestBeforeOn ?? bestBeforeDate(lot.extractedOn ?? data.runOn, settings.bestBeforeMonths);
      const run = await models.JarringRun.create(
        {
          lotId: lot.id,
          productId: product.id,
          jarCount: data.jarCount,
          runOn: data.runOn,
          sampleGrams: samples,
          ruleSet: settings.fillRuleSet,
          fillPass: pass,
          fillReport: report,
          honeyUsedGrams: used,
          createdBy: user.id,
          idempotencyKey: data.idempotencyKey,
        },
        { transaction: t },
      );
      await lot.update({ usedGrams: lot.usedGrams + used, bestBeforeOn }, { transaction: t });
      if (pass) {
        await addStockEntry(
          {
            productId: product.id,
            lotId: lot.id,
            delta: data.jarCount,
            kind: 'jarring',
            reason: `Jarring run ${run.id}`,
            jarringRunId: run.id,
            createdBy: user.id,
          },
          t,
        );
      }
      const packedOut = await packOutIfEmpty(lot, user, t);
      await recordAudit(
        {
          actorUserId: user.id,
          action: 'jarring.run',
          entityType: 'jarring_run',
          entityId: run.id,
          after: {
            lot: lot.code,
            product: product.name,
            jarCount: data.jarCount,
            honeyUsedGrams: used,
            pass,
            checks: checks.map((c) => `${c.name}: ${c.summary}`),
            reasons,
            packedOut,
          },
        },
        t,
      );
      return {
        runId: run.id,
        pass,
        reasons,
        checks,
        stocked: pass,
        packedOut,
        duplicate: false,
      };
    });
  } catch (err) {
    if (err instanceof UniqueConstraintError) {
      const raced = await existingRun(data.idempotencyKey);
      if (raced) return raced;
    }
    throw err;
  }
}

/** Packs the lot out when its remaining honey cannot fill one jar of the smallest active product. */
async function packOutIfEmpty(
  lot: InstanceType<ReturnType<typeof getDb>['models']['Lot']>,
  user: SessionUser,
  t: Transaction,
): Promise<boolean> {
  const { Product } = getDb().models;
  const settings = await getSettings();
  const smallest = await Product.findOne({ where: { active: true }, order: [['netGrams', 'ASC']], transaction: t });
  const remaining = Math.max(0, lot.netGrams - lot.usedGrams);
  // "Worth jarring": whole jars of the smallest product after the expected loss; the rest is loss in the tank.
  const worthJarring = smallest
    ? jarsLotCanFill(remaining, smallest.netGrams, Number(settings.expectedLossPct)) * smallest.netGrams
    : remaining;
  const result = nextStage(lot.stage, 'packed_out', {
    role: user.role as LotRole,
    hasWeights: true,
    moistureOk: null,
    labOk: null,
    unresolvedFlaggedSupers: 0,
    remainingGrams: worthJarring,
  });
  if (!result.ok) return false;
  await lot.update({ stage: result.stage }, { transaction: t });
  await recordAudit(
    {
      actorUserId: user.id,
      action: 'lot.stage',
      entityType: 'lot',
      entityId: lot.id,
      before: { stage: 'released' },
      after: { stage: result.stage, leftInTankGrams: remaining },
      reason: 'Nothing worth jarring remains',
    },
    t,
  );
  return true;
}

/** The owner lets a failing run's jars into stock, with a written reason. */
export async function overrideJarringRun(user: SessionUser, runId: number, reason: string): Promise<void> {
  const { sequelize, models } = getDb();
  await sequelize.transaction(async (t) => {
    const run = await models.JarringRun.findByPk(runId, { transaction: t, lock: t.LOCK.UPDATE });
    if (!run) throw new NotFoundError('No such jarring run.');
    if (run.fillPass) throw new ConflictError('This run passed its fill checks; its jars are already in stock.');
    if (run.overrideReason) throw new ConflictError('This run was already overridden.');
    await run.update({ overrideReason: reason, overrideBy: user.id }, { transaction: t });
    await addStockEntry(
      {
        productId: run.productId,
        lotId: run.lotId,
        delta: run.jarCount,
        kind: 'jarring',
        reason: `Jarring run ${run.id} (override)`,
        jarringRunId: run.id,
        createdBy: user.id,
      },
      t,
    );
    await recordAudit(
      {
        actorUserId: user.id,
        action: 'jarring.override',
        entityType: 'jarring_run',
        entityId: run.id,
        before: { stocked: false },
        after: { stocked: true, jarCount: run.jarCount },
        reason,
      },
      t,
    );
  });
}
