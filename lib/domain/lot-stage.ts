/**
 * Extraction lot stages and who may move a lot (docs/trade-rules.md, "Lot stages").
 *
 *   from → to              who           needs
 *   gathering → extracted  owner, crew   container weights recorded
 *   extracted → released   owner, crew   a moisture reading (else refused); moisture within
 *                                        the limit, lab results (if any) passing and no
 *                                        unresolved flagged super — if any of these fails the
 *                                        lot goes to held instead, with the reasons
 *   held → released        owner         written reason (≥ 5 characters); an override
 *   held → extracted       owner         written reason (≥ 5 characters)
 *   released → packed_out  owner, crew   remaining honey under 1 g (called when the last run empties it)
 *   any other → held       owner, crew   written reason (≥ 5 characters)
 *   anything else          nobody        (keepers and customers never move lots)
 */

export const LOT_STAGES = ['gathering', 'extracted', 'released', 'packed_out', 'held'] as const;
export type LotStage = (typeof LOT_STAGES)[number];
export type LotRole = 'owner' | 'crew' | 'keeper' | 'customer';

export type StageContext = {
  role: LotRole;
  hasWeights: boolean;
  moistureOk: boolean | null;
  labOk: boolean | null;
  unresolvedFlaggedSupers: number;
  remainingGrams: number;
  reason?: string;
};
export type StageResult =
  { ok: true; stage: LotStage; holdReasons?: string[] } | { ok: false; error: string; holdReasons?: string[] };

const MIN_REASON_LENGTH = 5;

function hasReason(ctx: StageContext): boolean {
  return (ctx.reason ?? '').trim().length >= MIN_REASON_LENGTH;
}

function refuse(error: string): StageResult {
  return { ok: false, error };
}

function releaseChecks(ctx: StageContext): string[] {
  const reasons: string[] = [];
  if (ctx.moistureOk === false) reasons.push('Moisture is over the limit');
  if (ctx.labOk === false) reasons.push('Lab results fail the limits');
  if (ctx.unresolvedFlaggedSupers > 0) {
    const n = ctx.unresolvedFlaggedSupers;
    reasons.push(`${n} super${n === 1 ? '' : 's'} flagged for a feeding or treatment conflict, not resolved`);
  }
  return reasons;
}

/** The stage a lot moves to when `target` is asked for, or why it cannot. */
export function nextStage(current: LotStage, target: LotStage, ctx: StageContext): StageResult {
  if (ctx.role !== 'owner' && ctx.role !== 'crew') return refuse('Only the owner or crew can change a lot’s stage');
  if (current === target) return refuse(`The lot is already ${current.replace('_', ' ')}`);

  if (target === 'held') {
    if (!hasReason(ctx)) return refuse('Write a reason (at least 5 characters) to hold the lot');
    return { ok: true, stage: 'held' };
  }

  if (current === 'held') {
    if (target !== 'released' && target !== 'extracted')
      return refuse(`A held lot cannot go to ${target.replace('_', ' ')}`);
    if (ctx.role !== 'owner') return refuse('Only the owner can take a lot out of held');
    if (!hasReason(ctx)) return refuse('Write a reason (at least 5 characters) to take the lot out of held');
    return { ok: true, stage: target };
  }

  if (current === 'gathering' && target === 'extracted') {
    return ctx.hasWeights
      ? { ok: true, stage: 'extracted' }
      : refuse('Record the container weights before marking the lot extracted');
  }

  if (current === 'extracted' && target === 'released') {
    if (ctx.moistureOk === null) return refuse('Record a moisture reading before releasing the lot');
    const holdReasons = releaseChecks(ctx);
    return holdReasons.length > 0 ? { ok: true, stage: 'held', holdReasons } : { ok: true, stage: 'released' };
  }

  if (current === 'released' && target === 'packed_out') {
    return ctx.remainingGrams < 1 ? { ok: true, stage: 'packed_out' } : refuse('The lot still has honey left to jar');
  }

  return refuse(`A lot cannot go from ${current.replace('_', ' ')} to ${target.replace('_', ' ')}`);
}
