import 'server-only';
import { getDb } from '@/lib/db/index';
import type { SessionUser } from '@/lib/auth/session';
import { ConflictError, InvalidError } from '@/lib/domain/errors';
import { bestBeforeDate } from '@/lib/domain/jars';
import { nextStage, type LotStage } from '@/lib/domain/lot-stage';
import { recordAudit } from '@/lib/data/audit';
import { lockLot } from './access';
import { lotChecks } from './checks';
import { getSettings } from '@/lib/data/settings/settings';
import { todayIn } from '@/lib/domain/local-date';

export type StageResult = {
  stage: LotStage;
  holdReasons: string[];
  extractedOn: string | null;
  bestBeforeOn: string | null;
};

/**
 * Moves a lot towards `target`; the one place that applies nextStage (lib/domain/lot-stage.ts).
 * A release whose checks fail puts the lot in *held* with the reasons; leaving *held* needs the
 * owner and a written reason. Marking a gathering lot extracted needs the extraction date (not
 * after today in the business's time zone) and sets the best-before from it (extraction + the
 * owner's months, lib/domain/jars.ts). Returns the stage the lot ended in and its dates.
 */
export async function changeLotStage(
  actor: SessionUser,
  lotId: number,
  target: LotStage,
  reason?: string,
  extractedOn?: string,
): Promise<StageResult> {
  const { sequelize } = getDb();
  const settings = await getSettings();
  return sequelize.transaction(async (t) => {
    const lot = await lockLot(lotId, t);
    const checks = await lotChecks(lot, settings, t);
    const result = nextStage(lot.stage, target, { ...checks, role: actor.role, reason });
    if (!result.ok) throw new ConflictError(result.error);
    const before = { stage: lot.stage, holdReasons: lot.holdReasons };
    let holdReasons: string[] = [];
    if (result.stage === 'held') {
      // A failed release holds with the specific failures (and any flagged supers); a manual hold with the person's reason.
      holdReasons = result.holdReasons
        ? [...checks.failures, ...result.holdReasons.filter((r) => r.includes('flagged'))]
        : [reason!.trim()];
      if (holdReasons.length === 0) holdReasons = result.holdReasons ?? [];
    }
    const patch: { stage: LotStage; holdReasons: string[]; extractedOn?: string; bestBeforeOn?: string } = {
      stage: result.stage,
      holdReasons,
    };
    if (lot.stage === 'gathering' && result.stage === 'extracted') {
      if (!extractedOn) throw new InvalidError('Give the extraction date: the best-before date is counted from it.');
      const today = todayIn(settings.timeZone);
      if (extractedOn > today) throw new InvalidError(`The extraction date cannot be after today (${today}).`);
      patch.extractedOn = extractedOn;
      // Nothing is jarred from a gathering lot yet, so nothing carries a best-before that could change.
      patch.bestBeforeOn = bestBeforeDate(extractedOn, settings.bestBeforeMonths);
    }
    await lot.update(patch, { transaction: t });
    const action =
      before.stage === 'held'
        ? result.stage === 'released'
          ? 'lot.release_override'
          : 'lot.unhold'
        : `lot.stage.${result.stage}`;
    await recordAudit(
      {
        actorUserId: actor.id,
        action,
        entityType: 'lot',
        entityId: lot.id,
        before,
        after: { ...patch, asked: target },
        reason: reason?.trim() || null,
      },
      t,
    );
    return {
      stage: result.stage,
      holdReasons,
      extractedOn: lot.extractedOn ?? null,
      bestBeforeOn: lot.bestBeforeOn ?? null,
    };
  });
}
