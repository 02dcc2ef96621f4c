import { describe, expect, it } from 'vitest';
import { bestBeforeDate, blendBestBefore, honeyUsedByRun, jarsLotCanFill } from '@/lib/domain/jars';

describe('jarsLotCanFill', () => {
  it('floors after the expected loss', () => {
    expect(jarsLotCanFill(100_000, 340, 0)).toBe(294); // 294.1
    expect(jarsLotCanFill(100_000, 340, 2)).toBe(288); // 98 000 / 340 = 288.2
    expect(jarsLotCanFill(95_000, 500, 5)).toBe(180); // exactly 90 250 / 500 = 180.5
    expect(jarsLotCanFill(100_000, 500, 5)).toBe(190); // exactly 190, not 189 by float noise
  });

  it('gives 0 for an empty or overdrawn lot', () => {
    expect(jarsLotCanFill(0, 340, 2)).toBe(0);
    expect(jarsLotCanFill(-50, 340, 2)).toBe(0);
    expect(jarsLotCanFill(339, 340, 0)).toBe(0);
  });

  it('rejects bad inputs', () => {
    expect(() => jarsLotCanFill(1000, 0, 0)).toThrow(RangeError);
    expect(() => jarsLotCanFill(1000, 340, 100)).toThrow(RangeError);
    expect(() => jarsLotCanFill(1000, 340, -1)).toThrow(RangeError);
  });
});

describe('honeyUsedByRun', () => {
  it('uses the mean sample fill when it is over the nominal', () => {
    expect(honeyUsedByRun(120, 340, [342, 344, 343])).toBe(41_160); // 120 × 343
  });

  it('uses the nominal when samples are under it or missing', () => {
    expect(honeyUsedByRun(120, 340, [338, 339])).toBe(40_800);
    expect(honeyUsedByRun(120, 340)).toBe(40_800);
  });

  it('rounds to whole grams', () => {
    expect(honeyUsedByRun(3, 227, [227.4, 227.5])).toBe(682); // 3 × 227.45 = 682.35
  });

  it('rejects bad inputs', () => {
    expect(() => honeyUsedByRun(1.5, 340)).toThrow(RangeError);
    expect(() => honeyUsedByRun(10, 340, [Number.NaN])).toThrow(RangeError);
  });
});

describe('bestBeforeDate', () => {
  it('adds calendar months', () => {
    expect(bestBeforeDate('2026-08-15', 24)).toBe('2028-08-15');
    expect(bestBeforeDate('2026-11-30', 3)).toBe('2027-02-28');
    expect(bestBeforeDate('2026-08-15', 0)).toBe('2026-08-15');
  });

  it('clamps to the end of a shorter month, leap years included', () => {
    expect(bestBeforeDate('2026-01-31', 1)).toBe('2026-02-28');
    expect(bestBeforeDate('2027-01-31', 13)).toBe('2028-02-29'); // 2028 is a leap year (Gregorian rule)
    expect(bestBeforeDate('2026-03-31', 1)).toBe('2026-04-30');
    expect(bestBeforeDate('2028-02-29', 12)).toBe('2029-02-28');
  });

  it('rejects bad dates and months', () => {
    expect(() => bestBeforeDate('2026-02-30', 12)).toThrow(RangeError);
    expect(() => bestBeforeDate('15/08/2026', 12)).toThrow(RangeError);
    expect(() => bestBeforeDate('2026-08-15', 1.5)).toThrow(RangeError);
    expect(() => bestBeforeDate('2026-08-15', -1)).toThrow(RangeError);
  });
});

// A blend is never better than its oldest honey (the owner's months are a choice; Regulation (EU)
// No 1169/2011, Annex X sets only the wording).
describe('blend best-before: never later than its oldest honey', () => {
  it('takes a parent best-before earlier than blend date + months', () => {
    // Blended 1 Nov 2026 from a lot extracted 1 Jun 2025 (best before 1 Jun 2027), 24 months.
    expect(blendBestBefore('2026-11-01', 24, ['2027-06-01', '2028-08-15'])).toBe('2027-06-01');
  });
  it('takes blend date + months when every parent keeps longer', () => {
    expect(blendBestBefore('2026-11-01', 6, ['2027-06-01'])).toBe('2027-05-01');
  });
  it('refuses a malformed parent date', () => {
    expect(() => blendBestBefore('2026-11-01', 24, ['2027-6-1'])).toThrow(RangeError);
  });
});
