/**
 * Fill-weight acceptance of a jarring run, in grams.
 * EU/OIML: tolerable negative error (TNE) by nominal quantity Qn — OIML R 87 and
 * Council Directive 76/211/EEC Annex I (TNE table); percentages are rounded up
 * to the next 0.1 g. Rules applied here: mean ≥ Qn; at most floor(2.5 % of the
 * samples) below T1 = Qn − TNE; none below T2 = Qn − 2·TNE. This is a producer's
 * check on the samples taken, not the Directive's statistical reference test
 * (Annex II), which also corrects the mean by the sample standard deviation.
 * US: NIST Handbook 133 — the average at least equals the label, and no package is
 * short by more than its maximum allowable variation (MAV).
 */

// [upper bound of Qn in g (inclusive), TNE as % of Qn or fixed g]. The bands meet at
// their edges (9 % of 50 g = 4.5 g, 4.5 % of 200 g = 9 g …), so the edge's band does not matter.
const TNE_BANDS: readonly [number, { pct: number } | { grams: number }][] = [
  [50, { pct: 9 }],
  [100, { grams: 4.5 }],
  [200, { pct: 4.5 }],
  [300, { grams: 9 }],
  [500, { pct: 3 }],
  [1000, { grams: 15 }],
  [10_000, { pct: 1.5 }],
  [15_000, { grams: 150 }],
  [Number.POSITIVE_INFINITY, { pct: 1 }],
];

/** Round up to the next 0.1 g, ignoring floating-point noise (1.8000000000000003 → 1.8). */
function ceilTenth(grams: number): number {
  return Math.ceil(Math.round(grams * 10 * 1e6) / 1e6) / 10;
}

/** TNE in grams for a nominal quantity (76/211/EEC Annex I; OIML R 87). Throws below 5 g. */
export function tolerableNegativeError(nominalGrams: number): number {
  if (!Number.isFinite(nominalGrams) || nominalGrams < 5) {
    throw new RangeError(`No tolerable negative error is set below 5 g (got ${nominalGrams})`);
  }
  const band = TNE_BANDS.find(([upTo]) => nominalGrams <= upTo)![1];
  return 'grams' in band ? band.grams : ceilTenth((nominalGrams * band.pct) / 100);
}

function meanOf(samples: number[]): number {
  if (samples.length === 0) throw new RangeError('At least one sample weight is needed');
  if (samples.some((s) => !Number.isFinite(s))) throw new RangeError('Sample weights must be finite numbers');
  return samples.reduce((a, b) => a + b, 0) / samples.length;
}

const EPS = 1e-9;

export type FillAssessment = {
  pass: boolean;
  mean: number;
  tne: number;
  t1: number;
  t2: number;
  belowT1: number;
  belowT2: number;
  allowedBelowT1: number;
  reasons: string[];
};

/**
 * EU/OIML fill check of sample net weights. allowedBelowT1 = floor(2.5 % × samples):
 * under 40 samples none may be below T1 (we read "at most 2.5 %" strictly).
 */
export function assessFill(nominalGrams: number, sampleGrams: number[]): FillAssessment {
  const tne = tolerableNegativeError(nominalGrams);
  const mean = meanOf(sampleGrams);
  const t1 = nominalGrams - tne;
  const t2 = nominalGrams - 2 * tne;
  const belowT1 = sampleGrams.filter((s) => s < t1 - EPS).length;
  const belowT2 = sampleGrams.filter((s) => s < t2 - EPS).length;
  const allowedBelowT1 = Math.floor((sampleGrams.length * 25) / 1000);
  const reasons: string[] = [];
  if (mean < nominalGrams - EPS) reasons.push(`Mean fill ${mean.toFixed(1)} g is below the nominal ${nominalGrams} g`);
  if (belowT1 > allowedBelowT1) {
    reasons.push(
      `${belowT1} of ${sampleGrams.length} jars are below T1 (${t1.toFixed(1)} g); at most ${allowedBelowT1} allowed`,
    );
  }
  if (belowT2 > 0) reasons.push(`${belowT2} jar(s) below T2 (${t2.toFixed(1)} g); none allowed`);
  return { pass: reasons.length === 0, mean, tne, t1, t2, belowT1, belowT2, allowedBelowT1, reasons };
}

/** US fill check (NIST Handbook 133): average ≥ label; no package short by more than the MAV given. */
export function assessFillUs(
  nominalGrams: number,
  sampleGrams: number[],
  mavGrams: number,
): { pass: boolean; mean: number; mav: number; lowerLimit: number; shortBeyondMav: number; reasons: string[] } {
  if (!Number.isFinite(nominalGrams) || nominalGrams <= 0) throw new RangeError('Nominal weight must be positive');
  if (!Number.isFinite(mavGrams) || mavGrams < 0) throw new RangeError('MAV must be a number ≥ 0');
  const mean = meanOf(sampleGrams);
  const lowerLimit = nominalGrams - mavGrams;
  const shortBeyondMav = sampleGrams.filter((s) => s < lowerLimit - EPS).length;
  const reasons: string[] = [];
  if (mean < nominalGrams - EPS)
    reasons.push(`Average fill ${mean.toFixed(1)} g is below the labeled ${nominalGrams} g`);
  if (shortBeyondMav > 0) {
    reasons.push(
      `${shortBeyondMav} jar(s) short by more than the MAV of ${mavGrams} g (below ${lowerLimit.toFixed(1)} g)`,
    );
  }
  return { pass: reasons.length === 0, mean, mav: mavGrams, lowerLimit, shortBeyondMav, reasons };
}

/**
 * MAV for a package labeled by weight — NIST Handbook 133, Appendix A, Table 2-5.
 * Not encoded: the handbook's table itself could not be consulted, and values are
 * not to be copied from second-hand sources. Returns null for every quantity; the
 * owner enters the MAV from the handbook and passes it to assessFillUs.
 */
export function maximumAllowableVariation(nominalGrams: number): number | null {
  if (!Number.isFinite(nominalGrams) || nominalGrams <= 0) throw new RangeError('Nominal weight must be positive');
  return null;
}
