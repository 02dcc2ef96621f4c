/**
 * Fill-weight acceptance of a jarring run, in grams.
 * EU/OIML: tolerable negative error (TNE) by nominal quantity Qn — OIML R 87 and
 * Council Directive 76/211/EEC Annex I (TNE table); percentages are rounded up
 * to the next 0.1 g. Rules applied here: mean ≥ Qn; at most floor(2.5 % of the
 * samples) below T1 = Qn − TNE; none below T2 = Qn − 2·TNE. This is a producer's
 * check on the samples taken, not the Directive's statistical reference test
 * (Annex II), which also corrects the mean by the sample standard deviation.
 * Fewer than 2 jars never pass: one jar says nothing about a run.
 * US: NIST Handbook 133 — the average at least equals the label, and no package is
 * short by more than its maximum allowable variation (MAV).
 */

import { GRAMS_PER_OUNCE } from './units';

/** The labelled quantity of a product in grams, unrounded: 12 oz is 340.19 g, not the stored 340 g. */
export function nominalGrams(p: { netGrams: number; declaredUnit: 'g' | 'oz'; declaredAmount: number }): number {
  return p.declaredUnit === 'oz' ? Number(p.declaredAmount) * GRAMS_PER_OUNCE : Number(p.declaredAmount) || p.netGrams;
}

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
  if (sampleGrams.length < 2) reasons.push('Weigh at least 2 jars: one jar says nothing about the run');
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
  if (sampleGrams.length < 2) reasons.push('Weigh at least 2 jars: one jar says nothing about the run');
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

// ---------------------------------------------------------------------------------------------
// The reference test for a batch of prepackages: Council Directive 76/211/EEC, Annex II.
// Checked against the Annex text: 2.1.3 (under 100, the non-destructive test is 100 %), the
// 2.2.1 double sampling plan, the 2.2.2 single plan for destructive testing and the sample sizes
// of 2.3.3 (30 for 100–500, 50 above 500, 20 destructive). A "defective" jar is one below
// T1 = Qn − TNE (Annex I); none may be below T2 = Qn − 2·TNE.

export type ReferencePlan =
  | { inspectAll: true }
  | {
      inspectAll: false;
      first: { sample: number; accept: number; reject: number };
      second: { sample: number; aggregate: number; accept: number; reject: number } | null;
      meanSample: number;
    };

/** The reference-test plan for a batch (76/211/EEC Annex II 2.1.3, 2.2.1, 2.2.2, 2.3.3). */
export function referenceTestPlan(batchSize: number, destructive = false): ReferencePlan {
  if (!Number.isInteger(batchSize) || batchSize < 1) {
    throw new RangeError(`A batch is a positive whole number of jars (got ${batchSize})`);
  }
  if (destructive) {
    // 2.2.2: used only for batches of 100 or more; 20 jars, accept 1, reject 2; 2.3.3: mean on 20.
    if (batchSize < 100)
      throw new RangeError('Destructive testing is only for batches of 100 or more (Annex II 2.2.2)');
    return { inspectAll: false, first: { sample: 20, accept: 1, reject: 2 }, second: null, meanSample: 20 };
  }
  if (batchSize < 100) return { inspectAll: true }; // 2.1.3
  if (batchSize <= 500) {
    return {
      inspectAll: false,
      first: { sample: 30, accept: 1, reject: 3 },
      second: { sample: 30, aggregate: 60, accept: 4, reject: 5 },
      meanSample: 30,
    };
  }
  if (batchSize <= 3200) {
    return {
      inspectAll: false,
      first: { sample: 50, accept: 2, reject: 5 },
      second: { sample: 50, aggregate: 100, accept: 6, reject: 7 },
      meanSample: 50,
    };
  }
  return {
    inspectAll: false,
    first: { sample: 80, accept: 3, reject: 7 },
    second: { sample: 80, aggregate: 160, accept: 8, reject: 9 },
    meanSample: 50, // 2.3.3: "> 500" → 50, also above 3 200
  };
}

// Student's t distribution, computed: the regularized incomplete beta function by its continued
// fraction (modified Lentz), ln Γ by the Lanczos approximation (g = 7, 9 terms).
const LANCZOS = [
  0.99999999999980993, 676.5203681218851, -1259.1392167224028, 771.32342877765313, -176.61502916214059,
  12.507343278686905, -0.13857109526572012, 9.9843695780195716e-6, 1.5056327351493116e-7,
];
function lnGamma(x: number): number {
  if (x < 0.5) return Math.log(Math.PI / Math.sin(Math.PI * x)) - lnGamma(1 - x);
  x -= 1;
  let a = LANCZOS[0];
  const t = x + 7.5;
  for (let i = 1; i < 9; i++) a += LANCZOS[i] / (x + i);
  return 0.5 * Math.log(2 * Math.PI) + (x + 0.5) * Math.log(t) - t + Math.log(a);
}
function betaContinuedFraction(a: number, b: number, x: number): number {
  const tiny = 1e-300;
  let c = 1;
  let d = 1 - ((a + b) * x) / (a + 1);
  if (Math.abs(d) < tiny) d = tiny;
  d = 1 / d;
  let h = d;
  for (let m = 1; m <= 300; m++) {
    const m2 = 2 * m;
    let aa = (m * (b - m) * x) / ((a + m2 - 1) * (a + m2));
    d = 1 + aa * d;
    if (Math.abs(d) < tiny) d = tiny;
    c = 1 + aa / c;
    if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    h *= d * c;
    aa = (-(a + m) * (a + b + m) * x) / ((a + m2) * (a + m2 + 1));
    d = 1 + aa * d;
    if (Math.abs(d) < tiny) d = tiny;
    c = 1 + aa / c;
    if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    const delta = d * c;
    h *= delta;
    if (Math.abs(delta - 1) < 1e-15) break;
  }
  return h;
}
function regularizedBeta(x: number, a: number, b: number): number {
  if (x <= 0) return 0;
  if (x >= 1) return 1;
  const front = Math.exp(lnGamma(a + b) - lnGamma(a) - lnGamma(b) + a * Math.log(x) + b * Math.log(1 - x));
  return x < (a + 1) / (a + b + 2)
    ? (front * betaContinuedFraction(a, b, x)) / a
    : 1 - (front * betaContinuedFraction(b, a, 1 - x)) / b;
}
/** P(T ≤ t) for Student's t with ν degrees of freedom. */
export function studentTCdf(t: number, nu: number): number {
  const tail = 0.5 * regularizedBeta(nu / (nu + t * t), nu / 2, 0.5);
  return t >= 0 ? 1 - tail : tail;
}
/** The p-quantile (0.5 ≤ p < 1) of Student's t with ν degrees of freedom, by bisection. */
export function studentTQuantile(p: number, nu: number): number {
  if (!(p >= 0.5 && p < 1) || !(nu > 0)) throw new RangeError('Need 0.5 ≤ p < 1 and ν > 0');
  let lo = 0;
  let hi = 1;
  while (studentTCdf(hi, nu) < p) hi *= 2;
  for (let i = 0; i < 200 && hi - lo > 1e-12; i++) {
    const mid = (lo + hi) / 2;
    if (studentTCdf(mid, nu) < p) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

/**
 * The mean criterion of 76/211/EEC Annex II 2.3: with n jars, mean x̄ and sample standard
 * deviation s (n − 1 in the denominator, 2.3.2), the batch is acceptable for this check when
 * x̄ > Qn − t(0.995, n − 1)·s/√n (2.3.1). Fewer than 2 samples throws.
 */
export function meanCheck(
  nominalGrams: number,
  sampleGrams: number[],
): { mean: number; sd: number; limit: number; pass: boolean } {
  if (!Number.isFinite(nominalGrams) || nominalGrams <= 0) throw new RangeError('Nominal weight must be positive');
  if (sampleGrams.length < 2) throw new RangeError('The mean criterion needs at least 2 jars');
  const n = sampleGrams.length;
  const mean = meanOf(sampleGrams);
  const sd = Math.sqrt(sampleGrams.reduce((a, x) => a + (x - mean) ** 2, 0) / (n - 1));
  const limit = nominalGrams - (studentTQuantile(0.995, n - 1) * sd) / Math.sqrt(n);
  return { mean, sd, limit, pass: mean > limit };
}

export type ReferenceVerdict = 'accept' | 'reject' | 'weigh-more';

export type ReferenceTest = {
  plan: ReferencePlan;
  /** Jars to weigh now: the whole batch, the first sample, or first + second sample. */
  jarsNeeded: number;
  secondSampleNeeded: boolean;
  defectives: number;
  belowT2: number;
  mean: { mean: number; sd: number; limit: number; pass: boolean; sample: number } | null;
  verdict: ReferenceVerdict;
  reasons: string[];
};

/**
 * Judges a batch by the reference test (76/211/EEC Annex II) with the jars weighed, in the
 * order they were weighed: the first sample, then the second. Under 100 jars (2.1.3) every jar
 * is weighed; the mean of the whole batch must then not be below Qn (Annex I 2.1, no sampling
 * allowance since nothing is estimated) and at most floor(2.5 %) of the batch may be below T1
 * (our reading of Annex I 2.2). At any size no jar may be below T2 (Annex I 2.4).
 */
export function assessReferenceTest(
  nominalGrams: number,
  batchSize: number,
  sampleGrams: number[],
  destructive = false,
): ReferenceTest {
  const plan = referenceTestPlan(batchSize, destructive);
  const tne = tolerableNegativeError(nominalGrams);
  const t1 = nominalGrams - tne;
  const t2 = nominalGrams - 2 * tne;
  if (sampleGrams.some((s) => !Number.isFinite(s))) throw new RangeError('Sample weights must be finite numbers');
  const below = (jars: number[], limit: number) => jars.filter((s) => s < limit - EPS).length;
  const belowT2 = below(sampleGrams, t2);
  const reasons: string[] = [];
  const base = { plan, belowT2, reasons };
  if (batchSize < 2) {
    reasons.push('A batch of one jar cannot be judged: the reference test needs at least 2 jars');
    return { ...base, jarsNeeded: 2, secondSampleNeeded: false, defectives: 0, mean: null, verdict: 'reject' };
  }

  if (plan.inspectAll) {
    const defectives = below(sampleGrams, t1);
    if (sampleGrams.length < batchSize) {
      reasons.push(`Weigh every jar of a batch under 100: ${sampleGrams.length} of ${batchSize} weighed`);
      return {
        ...base,
        jarsNeeded: batchSize,
        secondSampleNeeded: false,
        defectives,
        mean: null,
        verdict: 'weigh-more',
      };
    }
    const mean = meanOf(sampleGrams);
    const allowed = Math.floor((batchSize * 25) / 1000);
    if (mean < nominalGrams - EPS)
      reasons.push(`Batch mean ${mean.toFixed(1)} g is below the nominal ${nominalGrams} g`);
    if (defectives > allowed) reasons.push(`${defectives} jar(s) below T1 (${t1.toFixed(1)} g); at most ${allowed}`);
    if (belowT2 > 0) reasons.push(`${belowT2} jar(s) below T2 (${t2.toFixed(1)} g); none allowed`);
    const sd = sampleGrams.length > 1 ? meanCheck(nominalGrams, sampleGrams).sd : 0;
    return {
      ...base,
      jarsNeeded: batchSize,
      secondSampleNeeded: false,
      defectives,
      mean: { mean, sd, limit: nominalGrams, pass: mean >= nominalGrams - EPS, sample: sampleGrams.length },
      verdict: reasons.length === 0 ? 'accept' : 'reject',
    };
  }

  const { first, second } = plan;
  const firstJars = sampleGrams.slice(0, first.sample);
  const firstDefectives = below(firstJars, t1);
  if (sampleGrams.length < first.sample) {
    reasons.push(`Weigh ${first.sample} jars for the first sample: ${sampleGrams.length} weighed`);
    return {
      ...base,
      jarsNeeded: first.sample,
      secondSampleNeeded: false,
      defectives: firstDefectives,
      mean: null,
      verdict: 'weigh-more',
    };
  }
  const meanSample = sampleGrams.slice(0, plan.meanSample);
  const m = meanCheck(nominalGrams, meanSample);
  const mean = { ...m, sample: meanSample.length };
  const meanReason = `Mean ${m.mean.toFixed(1)} g of ${meanSample.length} jars is not above ${m.limit.toFixed(1)} g (Qn − t·s/√n)`;
  const t2Reason = `${belowT2} jar(s) below T2 (${t2.toFixed(1)} g); none allowed`;

  let defectives = firstDefectives;
  let countVerdict: 'accept' | 'reject' | 'second';
  if (firstDefectives <= first.accept) countVerdict = 'accept';
  else if (firstDefectives >= first.reject || !second) countVerdict = 'reject';
  else countVerdict = 'second';
  if (countVerdict === 'second' && second) {
    if (sampleGrams.length < second.aggregate) {
      reasons.push(
        `${firstDefectives} jar(s) of the first ${first.sample} below T1 (${t1.toFixed(1)} g): weigh a second sample of ${second.sample} (${sampleGrams.length} of ${second.aggregate} weighed)`,
      );
      if (belowT2 > 0) reasons.push(t2Reason);
      if (!m.pass) reasons.push(meanReason);
      // a jar below T2 or a failed mean rejects the batch whatever the second sample shows
      const verdict = belowT2 > 0 || !m.pass ? 'reject' : 'weigh-more';
      return { ...base, jarsNeeded: second.aggregate, secondSampleNeeded: true, defectives, mean, verdict };
    }
    defectives = below(sampleGrams.slice(0, second.aggregate), t1);
    countVerdict = defectives <= second.accept ? 'accept' : 'reject';
    if (countVerdict === 'reject') {
      reasons.push(
        `${defectives} of ${second.aggregate} jars below T1 (${t1.toFixed(1)} g); the batch is rejected at ${second.reject}`,
      );
    }
  } else if (countVerdict === 'reject') {
    reasons.push(
      `${firstDefectives} of ${first.sample} jars below T1 (${t1.toFixed(1)} g); the batch is rejected at ${first.reject}`,
    );
  }
  if (belowT2 > 0) reasons.push(t2Reason);
  if (!m.pass) reasons.push(meanReason);
  return {
    ...base,
    jarsNeeded:
      countVerdict === 'accept' && firstDefectives <= first.accept ? first.sample : (second?.aggregate ?? first.sample),
    secondSampleNeeded: firstDefectives > first.accept && firstDefectives < first.reject && second !== null,
    defectives,
    mean,
    verdict: reasons.length === 0 ? 'accept' : 'reject',
  };
}

// ---------------------------------------------------------------------------------------------
// A jarring run under the EU/OIML rule set: the run's jar count is the batch. Two checks are made
// and both are kept: the reference test above (76/211/EEC Annex II) and the producer's own check
// (assessFill). The jars go into stock only when the reference test accepts and the producer's
// check passes. The US rule set (NIST Handbook 133) does not use the reference test.

export const REFERENCE_TEST_NAME = 'Reference test (76/211/EEC Annex II)';
export const PRODUCER_CHECK_NAME = 'Producer’s check';

/** The reference test as kept with a run (in its fill report). */
export type RunReferenceTest = {
  batchSize: number;
  weighed: number;
  verdict: ReferenceVerdict;
  jarsNeeded: number;
  /** The first sample is weighed and a second sample is called for (or was weighed). */
  secondSampleNeeded: boolean;
  /** Jars to weigh at first: the whole batch under 100, else the first sample. */
  firstSample: number;
  defectives: number;
  belowT2: number;
  /** limit is Qn itself for a batch weighed whole (≥), else Qn − t·s/√n (>). */
  mean: { mean: number; limit: number; pass: boolean; sample: number; wholeBatch: boolean } | null;
  reasons: string[];
};

/** Judges a run's weighed jars by the reference test, with its jar count as the batch. */
export function runReferenceTest(nominalGrams: number, batchSize: number, sampleGrams: number[]): RunReferenceTest {
  const r = assessReferenceTest(nominalGrams, batchSize, sampleGrams);
  const wholeBatch = r.plan.inspectAll;
  return {
    batchSize,
    weighed: sampleGrams.length,
    verdict: r.verdict,
    jarsNeeded: r.jarsNeeded,
    secondSampleNeeded: r.secondSampleNeeded,
    firstSample: r.plan.inspectAll ? batchSize : r.plan.first.sample,
    defectives: r.defectives,
    belowT2: r.belowT2,
    mean: r.mean
      ? { mean: r.mean.mean, limit: r.mean.limit, pass: r.mean.pass, sample: r.mean.sample, wholeBatch }
      : null,
    reasons: r.reasons,
  };
}

/** One line: "accept — 30 of 30 jars weighed, 0 below T1, mean 342.1 g > limit 339.6 g". */
export function describeReferenceTest(r: RunReferenceTest): string {
  const parts = [`${r.weighed} of ${r.jarsNeeded} jars weighed`, `${r.defectives} below T1`];
  if (r.belowT2 > 0) parts.push(`${r.belowT2} below T2`);
  if (r.mean) {
    const sign = r.mean.wholeBatch ? (r.mean.pass ? '≥' : '<') : r.mean.pass ? '>' : '≤';
    parts.push(
      `mean ${r.mean.mean.toFixed(1)} g ${sign} ${r.mean.wholeBatch ? 'Qn' : 'limit'} ${r.mean.limit.toFixed(1)} g`,
    );
  }
  return `${r.verdict} — ${parts.join(', ')}`;
}

export type NamedFillCheck = { name: string; pass: boolean; summary: string; reasons: string[] };

/**
 * The named checks of a run's stored fill report, for the run result and the run screen. EU runs
 * recorded before the reference test was wired in carry only the producer's check.
 */
export function namedFillChecks(
  ruleSet: 'oiml' | 'nist',
  report: (FillAssessment & { reference?: RunReferenceTest }) | { pass: boolean; reasons: string[] },
): NamedFillCheck[] {
  if (ruleSet === 'nist') {
    return [
      {
        name: 'NIST Handbook 133 (average and MAV)',
        pass: report.pass,
        summary: report.pass ? 'pass' : 'fail',
        reasons: report.reasons,
      },
    ];
  }
  const checks: NamedFillCheck[] = [];
  const ref = 'reference' in report ? report.reference : undefined;
  if (ref) {
    checks.push({
      name: REFERENCE_TEST_NAME,
      pass: ref.verdict === 'accept',
      summary: describeReferenceTest(ref),
      reasons: ref.reasons,
    });
  }
  checks.push({
    name: PRODUCER_CHECK_NAME,
    pass: report.pass,
    summary: report.pass ? 'pass' : 'fail',
    reasons: report.reasons,
  });
  return checks;
}

/** Whether the run's jars may go into stock without the owner: every named check passes. */
export function fillChecksPass(checks: NamedFillCheck[]): boolean {
  return checks.every((c) => c.pass);
}

/** The reasons of the failing checks, each named: "Reference test (76/211/EEC Annex II): …". */
export function fillCheckReasons(checks: NamedFillCheck[]): string[] {
  return checks.flatMap((c) => (c.pass ? [] : c.reasons.map((r) => `${c.name}: ${r}`)));
}
