/**
 * Lot weights: net honey from containers, extraction yield and blend water content.
 * Net = Σ (gross − tare) over the containers that are not voided.
 * A blend's water content is the weight-weighted mean of its parents' water (docs/trade-rules.md, "Lot weights and blends").
 */

export type ContainerWeight = { grossGrams: number; tareGrams: number; voided?: boolean };

/** Net grams of honey in the containers that count (voided ones do not). */
export function containersNetGrams(containers: ContainerWeight[]): number {
  let net = 0;
  for (const c of containers) {
    if (c.voided) continue;
    if (!Number.isInteger(c.grossGrams) || !Number.isInteger(c.tareGrams))
      throw new RangeError('Weights must be whole grams');
    if (c.tareGrams < 0 || c.grossGrams <= c.tareGrams) throw new RangeError('Gross weight must be above the tare');
    net += c.grossGrams - c.tareGrams;
  }
  return net;
}

/**
 * Extraction yield: the lot's net weight against the honey its supers held (measured
 * full − empty, or estimated). Null when the supers hold nothing to compare against.
 */
export function extractionYield(
  lotNetGrams: number,
  superHoney: { grams: number; measured: boolean }[],
): {
  expectedGrams: number;
  pct: number | null;
  measuredCount: number;
  estimatedCount: number;
  /** Set when the lot weighs more than its supers held: something was weighed or estimated wrong. */
  warning: string | null;
} {
  const expectedGrams = superHoney.reduce((sum, s) => sum + Math.max(0, s.grams), 0);
  const measuredCount = superHoney.filter((s) => s.measured).length;
  const pct = expectedGrams > 0 ? (lotNetGrams / expectedGrams) * 100 : null;
  return {
    expectedGrams,
    pct,
    measuredCount,
    estimatedCount: superHoney.length - measuredCount,
    warning:
      pct !== null && pct > 100
        ? 'The lot weighs more than its supers held. Check the container weights, the super weights and the honey-per-box estimates in the settings.'
        : null,
  };
}

/** Weight-weighted mean water % of a blend's parts; null if any part has no water figure or no weight. */
export function blendWaterPct(parts: { grams: number; waterPct: number | null }[]): number | null {
  if (parts.length === 0) return null;
  let grams = 0;
  let weighted = 0;
  for (const p of parts) {
    if (p.waterPct === null || !Number.isFinite(p.waterPct)) return null;
    if (!Number.isFinite(p.grams) || p.grams <= 0) throw new RangeError('Each blend part needs a weight above 0 g');
    grams += p.grams;
    weighted += p.grams * p.waterPct;
  }
  return weighted / grams;
}

/** Grams a lot still has for jarring or blending. */
export function remainingGrams(lot: { netGrams: number; usedGrams: number }): number {
  return Math.max(0, lot.netGrams - lot.usedGrams);
}
