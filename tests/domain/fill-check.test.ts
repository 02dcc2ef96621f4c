import { describe, expect, it } from 'vitest';
import {
  assessFill,
  assessFillUs,
  assessReferenceTest,
  maximumAllowableVariation,
  meanCheck,
  referenceTestPlan,
  studentTQuantile,
  tolerableNegativeError,
} from '@/lib/domain/fill-check';

describe('tolerableNegativeError', () => {
  it('matches the published worked values', () => {
    expect(tolerableNegativeError(1000)).toBe(15); // OIML R 87 / 76/211/EEC worked value, Qn 1000 g → 15 g
    expect(tolerableNegativeError(200)).toBe(9); // OIML R 87 / 76/211/EEC worked value, Qn 200 g → 9 g
  });

  // OIML R 87 and 76/211/EEC Annex I TNE table; each band edge, where the bands meet
  const edges: [number, number, string][] = [
    [5, 0.5, '9 % of 5 g = 0.45, rounded up to 0.5'],
    [50, 4.5, '9 % of 50 = 4.5 = fixed 4.5 g'],
    [100, 4.5, 'fixed 4.5 g = 4.5 % of 100'],
    [200, 9, '4.5 % of 200 = 9 = fixed 9 g'],
    [300, 9, 'fixed 9 g = 3 % of 300'],
    [500, 15, '3 % of 500 = 15 = fixed 15 g'],
    [1000, 15, 'fixed 15 g = 1.5 % of 1000'],
    [10_000, 150, '1.5 % of 10 000 = 150 = fixed 150 g'],
    [15_000, 150, 'fixed 150 g = 1 % of 15 000'],
  ];
  it.each(edges)('band edge Qn %i g → %f g (%s)', (qn, tne) => expect(tolerableNegativeError(qn)).toBe(tne));

  // OIML R 87 and 76/211/EEC Annex I, same table: inside each band, percentages rounded up to the next 0.1 g
  const inside: [number, number, string][] = [
    [20, 1.8, '9 % band: 1.8 exactly, not pushed to 1.9 by float noise'],
    [30, 2.7, '9 % band'],
    [33, 3.0, '9 % band: 2.97 → 3.0'],
    [75, 4.5, '4.5 g band'],
    [125, 5.7, '4.5 % band: 5.625 → 5.7'],
    [250, 9, '9 g band'],
    [340, 10.2, '3 % band'],
    [454, 13.7, '3 % band: 13.62 → 13.7'],
    [680, 15, '15 g band'],
    [1500, 22.5, '1.5 % band'],
    [12_000, 150, '150 g band'],
    [20_000, 200, '1 % band'],
    [300_000, 3000, '1 % band (a drum)'],
  ];
  it.each(inside)('Qn %i g → %f g (%s)', (qn, tne) => expect(tolerableNegativeError(qn)).toBe(tne));

  it('throws below 5 g', () => {
    // OIML R 87 and 76/211/EEC Annex I: the TNE table starts at 5 g
    expect(() => tolerableNegativeError(4.9)).toThrow(RangeError);
    expect(() => tolerableNegativeError(Number.NaN)).toThrow(RangeError);
  });
});

describe('assessFill (EU/OIML rules)', () => {
  const qn = 500; // TNE 15 g (OIML R 87 / 76/211/EEC Annex I TNE table: 500–1000 g → 15 g): T1 485, T2 470

  it('passes a good run', () => {
    const result = assessFill(qn, [502, 505, 498, 501, 503, 499, 500, 504]);
    expect(result).toMatchObject({ pass: true, tne: 15, t1: 485, t2: 470, belowT1: 0, belowT2: 0, allowedBelowT1: 0 });
    expect(result.mean).toBeCloseTo(501.5, 10);
    expect(result.reasons).toEqual([]);
  });

  it('fails a mean below Qn', () => {
    const result = assessFill(qn, [499, 499, 500]);
    expect(result.pass).toBe(false);
    expect(result.reasons[0]).toBe('Mean fill 499.3 g is below the nominal 500 g');
  });

  it('counts a jar exactly on T1 as not below it', () => {
    expect(assessFill(qn, [485, 515]).belowT1).toBe(0);
  });

  it('allows floor(2.5 %) of the samples below T1: none under 40 samples', () => {
    // OIML R 87 / 76/211/EEC Annex I: at most 2.5 % of a batch below T1; floor(39 × 2.5 %) = 0, floor(40 × 2.5 %) = 1
    const thirtyNine = [484, ...Array.from({ length: 38 }, () => 505)];
    expect(assessFill(qn, thirtyNine)).toMatchObject({ pass: false, belowT1: 1, allowedBelowT1: 0 });
    const forty = [484, ...Array.from({ length: 39 }, () => 505)];
    expect(assessFill(qn, forty)).toMatchObject({ pass: true, belowT1: 1, allowedBelowT1: 1 });
  });

  it('allows none below T2 even when the mean is fine', () => {
    const samples = [469, ...Array.from({ length: 79 }, () => 510)];
    const result = assessFill(qn, samples);
    expect(result).toMatchObject({ pass: false, belowT1: 1, belowT2: 1, allowedBelowT1: 2 });
    expect(result.reasons).toEqual(['1 jar(s) below T2 (470.0 g); none allowed']);
  });

  it('needs samples', () => {
    expect(() => assessFill(qn, [])).toThrow(RangeError);
  });
});

describe('assessFillUs (NIST Handbook 133 rules, MAV given)', () => {
  // NIST Handbook 133 example, 113 g (¼ lb) → MAV 7.2 g
  it('passes when the average meets the label and no jar is short by more than the MAV', () => {
    const result = assessFillUs(113, [114, 113, 106, 119], 7.2);
    expect(result).toMatchObject({ pass: true, mav: 7.2, shortBeyondMav: 0 });
    expect(result.lowerLimit).toBeCloseTo(105.8, 10);
  });

  it('fails one jar short by more than the MAV', () => {
    const result = assessFillUs(113, [105.7, 120, 120], 7.2);
    expect(result).toMatchObject({ pass: false, shortBeyondMav: 1 });
  });

  it('fails an average below the label', () => {
    expect(assessFillUs(113, [112, 113], 7.2).reasons).toEqual(['Average fill 112.5 g is below the labeled 113 g']);
  });
});

describe('maximumAllowableVariation', () => {
  it('is not encoded: NIST HB 133 Appendix A Table 2-5 was not available to us', () => {
    expect(maximumAllowableVariation(113)).toBeNull();
    expect(maximumAllowableVariation(454)).toBeNull();
  });
});

// Council Directive 76/211/EEC, Annex II: the reference test for a batch of prepackages.
describe('referenceTestPlan (76/211/EEC Annex II)', () => {
  // 2.2.1 double sampling plan, non-destructive (checked against the Annex text)
  const band100to500 = {
    inspectAll: false,
    first: { sample: 30, accept: 1, reject: 3 },
    second: { sample: 30, aggregate: 60, accept: 4, reject: 5 },
    meanSample: 30, // 2.3.3: 100 to 500 → 30
  };
  const band501to3200 = {
    inspectAll: false,
    first: { sample: 50, accept: 2, reject: 5 },
    second: { sample: 50, aggregate: 100, accept: 6, reject: 7 },
    meanSample: 50, // 2.3.3: > 500 → 50
  };
  const band3201up = {
    inspectAll: false,
    first: { sample: 80, accept: 3, reject: 7 },
    second: { sample: 80, aggregate: 160, accept: 8, reject: 9 },
    meanSample: 50, // 2.3.3: > 500 → 50
  };

  it('2.1.3: a batch under 100 is inspected whole (99, and 1)', () => {
    expect(referenceTestPlan(99)).toEqual({ inspectAll: true });
    expect(referenceTestPlan(1)).toEqual({ inspectAll: true });
  });
  it.each([
    [100, band100to500],
    [500, band100to500],
    [501, band501to3200],
    [3200, band501to3200],
    [3201, band3201up],
    [10_000, band3201up],
  ])('2.2.1: batch of %i', (batch, plan) => expect(referenceTestPlan(batch)).toEqual(plan));

  it('2.2.2: destructive testing is one sample of 20, accept 1, reject 2, at any batch ≥ 100', () => {
    const plan = { inspectAll: false, first: { sample: 20, accept: 1, reject: 2 }, second: null, meanSample: 20 };
    for (const batch of [100, 500, 501, 3200, 3201]) expect(referenceTestPlan(batch, true)).toEqual(plan);
  });
  it('refuses destructive testing under 100 and batches that are not positive whole numbers', () => {
    expect(() => referenceTestPlan(99, true)).toThrow(RangeError);
    for (const bad of [0, -5, 100.5, Number.NaN, Number.POSITIVE_INFINITY]) {
      expect(() => referenceTestPlan(bad)).toThrow(RangeError);
    }
  });
});

describe('studentTQuantile', () => {
  // NIST/SEMATECH e-Handbook of Statistical Methods, table of upper critical values of the t
  // distribution, column 0.005 (= the 0.995 quantile), three decimals
  it.each([
    [1, 63.657],
    [2, 9.925],
    [3, 5.841],
    [10, 3.169],
    [19, 2.861],
    [29, 2.756],
    [30, 2.75],
    [40, 2.704],
    [60, 2.66],
    [100, 2.626],
  ])('t(0.995, %i) = %f', (nu, t) => expect(studentTQuantile(0.995, nu)).toBeCloseTo(t, 3));
  it('t(0.995, 49) ≈ 2.680 (from memory; between the tables’ 45 → 2.690 and 50 → 2.678)', () =>
    expect(studentTQuantile(0.995, 49)).toBeCloseTo(2.68, 3));
  it('gives the Annex II 2.3.3 factors t/√n (from memory: 0.640 for 20, 0.503 for 30, 0.379 for 50)', () => {
    expect(studentTQuantile(0.995, 19) / Math.sqrt(20)).toBeCloseTo(0.64, 3);
    expect(studentTQuantile(0.995, 29) / Math.sqrt(30)).toBeCloseTo(0.503, 3);
    expect(studentTQuantile(0.995, 49) / Math.sqrt(50)).toBeCloseTo(0.379, 3);
  });
});

describe('meanCheck (76/211/EEC Annex II 2.3)', () => {
  it('worked by hand: Qn 500 g, jars 498, 502, 500, 504', () => {
    // mean 501; deviations −3, 1, −1, 3; squares sum 20; s² = 20/3; s = 2.5820
    // t(0.995, 3) = 5.841 (NIST/SEMATECH table); limit = 500 − 5.841 × 2.5820 / √4 = 492.459
    const r = meanCheck(500, [498, 502, 500, 504]);
    expect(r.mean).toBe(501);
    expect(r.sd).toBeCloseTo(2.582, 3);
    expect(r.limit).toBeCloseTo(492.459, 2);
    expect(r.pass).toBe(true);
  });
  it('fails a mean at or below the limit ("greater than", 2.3.1)', () => {
    // no spread: the limit is Qn itself, and a mean equal to it is not greater
    expect(meanCheck(500, [500, 500])).toMatchObject({ mean: 500, sd: 0, limit: 500, pass: false });
    expect(meanCheck(500, [501, 501]).pass).toBe(true);
    // 30 jars at 495 and 496 alternately: mean 495.5, s = 0.5085, limit ≈ 500 − 0.503 × 0.5085 ≈ 499.74
    const jars = Array.from({ length: 30 }, (_, i) => (i % 2 ? 496 : 495));
    expect(meanCheck(500, jars).pass).toBe(false);
  });
  it('needs at least 2 jars', () => {
    expect(() => meanCheck(500, [520])).toThrow(RangeError);
    expect(() => meanCheck(500, [])).toThrow(RangeError);
  });
});

describe('assessReferenceTest', () => {
  const qn = 500; // TNE 15 g: T1 485, T2 470 (76/211/EEC Annex I)
  const good = (n: number) => Array.from({ length: n }, (_, i) => 500 + (i % 5)); // 500..504

  it('a single weighed jar passes nothing', () => {
    expect(assessReferenceTest(qn, 1, [520]).verdict).toBe('reject'); // a batch of one cannot be judged
    expect(assessReferenceTest(qn, 50, [520]).verdict).toBe('weigh-more');
    expect(assessReferenceTest(qn, 300, [520]).verdict).toBe('weigh-more');
    expect(assessFill(qn, [520]).pass).toBe(false);
    expect(assessFillUs(113, [120], 7.2).pass).toBe(false);
  });
  it('batch under 100: every jar, mean ≥ Qn, none below T2', () => {
    expect(assessReferenceTest(qn, 10, good(10)).verdict).toBe('accept');
    expect(assessReferenceTest(qn, 10, good(9))).toMatchObject({ verdict: 'weigh-more', jarsNeeded: 10 });
    expect(assessReferenceTest(qn, 10, [...good(9), 484]).verdict).toBe('reject'); // 1 below T1 > floor(0.25)
  });
  it('2.2.1, 100–500: accept with ≤ 1 defective in 30, a second sample with 2, reject at 3', () => {
    const one = [484, ...good(29)];
    expect(assessReferenceTest(qn, 300, one)).toMatchObject({ verdict: 'accept', defectives: 1 });
    const two = [484, 484, ...good(28)];
    expect(assessReferenceTest(qn, 300, two)).toMatchObject({
      verdict: 'weigh-more',
      secondSampleNeeded: true,
      jarsNeeded: 60,
    });
    expect(assessReferenceTest(qn, 300, [...two, 484, 484, ...good(28)])).toMatchObject({
      verdict: 'accept',
      defectives: 4,
    });
    expect(assessReferenceTest(qn, 300, [...two, 484, 484, 484, ...good(27)])).toMatchObject({
      verdict: 'reject',
      defectives: 5,
    });
    expect(assessReferenceTest(qn, 300, [484, 484, 484, ...good(27)]).verdict).toBe('reject');
  });
  it('rejects any jar below T2 and a failed mean', () => {
    expect(assessReferenceTest(qn, 300, [469, ...good(29)]).verdict).toBe('reject');
    const low = Array.from({ length: 30 }, (_, i) => (i % 2 ? 496 : 495));
    expect(assessReferenceTest(qn, 300, low).mean?.pass).toBe(false);
    expect(assessReferenceTest(qn, 300, low).verdict).toBe('reject');
  });
  it('2.2.2 destructive: 20 jars, 1 defective accepted, 2 rejected', () => {
    expect(assessReferenceTest(qn, 200, [484, ...good(19)], true).verdict).toBe('accept');
    expect(assessReferenceTest(qn, 200, [484, 484, ...good(18)], true).verdict).toBe('reject');
  });
  it('above 3 200: 80 jars for the count, the first 50 for the mean', () => {
    const r = assessReferenceTest(qn, 5000, good(80));
    expect(r).toMatchObject({ verdict: 'accept', jarsNeeded: 80 });
    expect(r.mean?.sample).toBe(50);
  });
});
