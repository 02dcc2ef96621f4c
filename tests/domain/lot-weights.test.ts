import { describe, expect, it } from 'vitest';
import { blendWaterPct, containersNetGrams, extractionYield, remainingGrams } from '@/lib/domain/lot-weights';

describe('containersNetGrams', () => {
  it('sums gross − tare and skips voided containers', () => {
    expect(
      containersNetGrams([
        { grossGrams: 30_500, tareGrams: 1_200 },
        { grossGrams: 29_000, tareGrams: 1_200 },
        { grossGrams: 99_000, tareGrams: 1_000, voided: true },
      ]),
    ).toBe(57_100);
  });
  it('is 0 with no containers', () => expect(containersNetGrams([])).toBe(0));
  it('refuses gross at or below tare', () =>
    expect(() => containersNetGrams([{ grossGrams: 1000, tareGrams: 1000 }])).toThrow(RangeError));
});

describe('extractionYield', () => {
  it('compares net against the supers’ measured and estimated honey', () => {
    const y = extractionYield(36_000, [
      { grams: 20_000, measured: true },
      { grams: 20_000, measured: false },
    ]);
    expect(y).toEqual({ expectedGrams: 40_000, pct: 90, measuredCount: 1, estimatedCount: 1, warning: null });
  });
  it('has no percentage without supers', () => expect(extractionYield(1000, []).pct).toBeNull());
  // A lot cannot hold more honey than its supers gave (conservation of mass): over 100 % is an error somewhere.
  it('an extraction yield over 100 % warns', () => {
    expect(extractionYield(40_001, [{ grams: 40_000, measured: true }]).warning).toMatch(
      /weighs more than its supers held/,
    );
    expect(extractionYield(40_000, [{ grams: 40_000, measured: true }]).warning).toBeNull();
  });
});

describe('blendWaterPct (weight-weighted mean)', () => {
  it('weights each parent by grams', () => {
    // 30 kg at 17 % and 10 kg at 19 % → (30·17 + 10·19) / 40 = 17.5 %
    expect(
      blendWaterPct([
        { grams: 30_000, waterPct: 17 },
        { grams: 10_000, waterPct: 19 },
      ]),
    ).toBeCloseTo(17.5, 10);
  });
  it('is null when a parent has no water figure', () =>
    expect(
      blendWaterPct([
        { grams: 1, waterPct: 17 },
        { grams: 1, waterPct: null },
      ]),
    ).toBeNull());
  it('refuses a part without weight', () =>
    expect(() => blendWaterPct([{ grams: 0, waterPct: 17 }])).toThrow(RangeError));
});

it('remainingGrams never goes below 0', () => {
  expect(remainingGrams({ netGrams: 10_000, usedGrams: 2_500 })).toBe(7_500);
  expect(remainingGrams({ netGrams: 10, usedGrams: 20 })).toBe(0);
});
