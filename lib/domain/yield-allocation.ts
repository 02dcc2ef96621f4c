/**
 * Sharing a lot's net weight (or revenue) back to the supers that made it.
 * Rounding: largest-remainder (Hamilton) method — whole units that add up exactly to
 * the total, each within 1 unit of its exact proportional share; equal remainders go
 * to the smaller id (plain string order, not locale order).
 * Super estimates (common practice, trade rules of thumb; docs/trade-rules.md): extracted
 * honey per full 10-frame super — shallow 25–30 lb, medium 35–40 lb, deep 60–70 lb;
 * the midpoints are used, in grams.
 */
import { lbToGrams } from './units';

export type Share = { id: string; grams: number };
export type SuperDepth = 'deep' | 'medium' | 'shallow';
export type SuperEstimates = Record<SuperDepth, { gramsPerBox: number; framesPerBox: number }>;

export const DEFAULT_SUPER_ESTIMATES: SuperEstimates = {
  shallow: { gramsPerBox: lbToGrams(27.5), framesPerBox: 10 },
  medium: { gramsPerBox: lbToGrams(37.5), framesPerBox: 10 },
  deep: { gramsPerBox: lbToGrams(65), framesPerBox: 10 },
};

/** Split a whole-number total across shares in proportion to their weights (Hamilton). */
export function allocateByWeight(totalGrams: number, shares: Share[]): Record<string, number> {
  if (!Number.isInteger(totalGrams) || totalGrams < 0)
    throw new RangeError(`Total must be a whole number ≥ 0: ${totalGrams}`);
  const ids = new Set(shares.map((s) => s.id));
  if (ids.size !== shares.length) throw new RangeError('Share ids must be unique');
  const weighted = shares.filter((s) => Number.isFinite(s.grams) && s.grams > 0);
  if (weighted.length === 0) throw new RangeError('No share has any weight to allocate by');
  const weightSum = weighted.reduce((sum, s) => sum + s.grams, 0);

  const result: Record<string, number> = {};
  for (const s of shares) result[s.id] = 0;
  // Integer weights (the usual case: grams, cents) use exact integer remainders, so
  // ties are real ties; otherwise floating point.
  const exactInts =
    weighted.every((s) => Number.isInteger(s.grams)) && totalGrams * weightSum <= Number.MAX_SAFE_INTEGER;
  const parts = weighted.map((s) => {
    if (exactInts) {
      const remainder = (totalGrams * s.grams) % weightSum;
      return { id: s.id, whole: (totalGrams * s.grams - remainder) / weightSum, remainder: remainder / weightSum };
    }
    const exact = (totalGrams * s.grams) / weightSum;
    return { id: s.id, whole: Math.floor(exact), remainder: exact - Math.floor(exact) };
  });
  let left = totalGrams - parts.reduce((sum, p) => sum + p.whole, 0);
  parts.sort((a, b) => b.remainder - a.remainder || (a.id < b.id ? -1 : a.id > b.id ? 1 : 0));
  for (const p of parts) {
    result[p.id] = p.whole + (left > 0 ? 1 : 0);
    left -= 1;
  }
  return result;
}

/** Revenue in cents shared the same way as weight. */
export function allocateRevenue(totalCents: number, shares: { id: string; grams: number }[]): Record<string, number> {
  return allocateByWeight(totalCents, shares);
}

/**
 * Honey in one pulled super: measured (full − empty) when both weights are present,
 * positive and full > empty; otherwise estimated from the depth's per-frame honey ×
 * capped frames (or the frame count when capped frames are unknown).
 */
export function superHoneyGrams(
  s: {
    fullGrams: number | null;
    emptyGrams: number | null;
    depth: SuperDepth;
    frameCount: number;
    cappedFrames: number | null;
  },
  estimates: SuperEstimates = DEFAULT_SUPER_ESTIMATES,
): { grams: number; measured: boolean } {
  if (
    s.fullGrams !== null &&
    s.emptyGrams !== null &&
    s.fullGrams > 0 &&
    s.emptyGrams > 0 &&
    s.fullGrams > s.emptyGrams
  ) {
    return { grams: Math.round(s.fullGrams - s.emptyGrams), measured: true };
  }
  const { gramsPerBox, framesPerBox } = estimates[s.depth];
  const frames = Math.min(Math.max(s.cappedFrames ?? s.frameCount, 0), s.frameCount);
  return { grams: Math.round((gramsPerBox / framesPerBox) * frames), measured: false };
}

export type LotNode = { id: string; netGrams: number; supers: Share[]; parents: { lotId: string; grams: number }[] };

/**
 * A lot's net weight shared to the supers behind it, by super id. A blend passes its
 * weight to its parent lots in proportion to the grams taken from each, recursively;
 * a lot with both supers and parents shares across both at once. Adds up exactly to
 * the lot's netGrams; a super reached twice gets the sum.
 */
export function allocateLotTree(lots: LotNode[], lotId: string): Record<string, number> {
  const byId = new Map(lots.map((lot) => [lot.id, lot]));
  const result: Record<string, number> = {};

  const pass = (id: string, grams: number, path: string[]): void => {
    const lot = byId.get(id);
    if (!lot) throw new RangeError(`Unknown lot ${id}`);
    if (path.includes(id)) throw new RangeError(`Lot ${id} is its own ancestor (${[...path, id].join(' → ')})`);
    const shares: Share[] = [
      ...lot.supers.map((s) => ({ id: `s:${s.id}`, grams: s.grams })),
      ...lot.parents.map((p) => ({ id: `l:${p.lotId}`, grams: p.grams })),
    ];
    const hasWeight = shares.some((s) => Number.isFinite(s.grams) && s.grams > 0);
    if (grams > 0 && !hasWeight)
      throw new RangeError(`Lot ${id} has no weighed or estimated source to share ${grams} g to`);
    const split = hasWeight ? allocateByWeight(grams, shares) : Object.fromEntries(shares.map((s) => [s.id, 0]));
    for (const s of lot.supers) result[s.id] = (result[s.id] ?? 0) + split[`s:${s.id}`];
    for (const p of lot.parents) pass(p.lotId, split[`l:${p.lotId}`], [...path, id]);
  };

  const root = byId.get(lotId);
  if (!root) throw new RangeError(`Unknown lot ${lotId}`);
  pass(lotId, root.netGrams, []);
  return result;
}

/** The key of the part of a lot that reaches no super (e.g. a blend parent with no sources). */
export const NOT_ATTRIBUTED = 'none';

/**
 * One lot's exact fractions per colony (from the SQL walk through blends; they add up to 1
 * when every part of the lot reaches a super) rounded to whole grams and cents with
 * allocateByWeight, so each lot adds up exactly. A missing part stays under NOT_ATTRIBUTED
 * rather than being pushed onto the colonies that are known.
 */
export function roundLotShares(
  ownGrams: number,
  revenueCents: number,
  shares: { id: string; frac: number }[],
): { grams: Record<string, number>; cents: Record<string, number> } {
  const fracSum = shares.reduce((a, s) => a + (s.frac > 0 ? s.frac : 0), 0);
  const list: Share[] = shares.map((s) => ({ id: s.id, grams: s.frac }));
  if (fracSum < 1 - 1e-9) list.push({ id: NOT_ATTRIBUTED, grams: 1 - fracSum });
  return { grams: allocateByWeight(ownGrams, list), cents: allocateByWeight(revenueCents, list) };
}
