import { describe, expect, it } from 'vitest';
import { assessFill, assessFillUs, maximumAllowableVariation, tolerableNegativeError } from '@/lib/domain/fill-check';

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
