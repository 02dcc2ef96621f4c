import { describe, expect, it } from 'vitest';
import { seasonBounds, seasonLabel, seasonOf } from '@/lib/domain/season';

// Common practice: a season is named by the year it starts in; the start month is the owner's setting.
describe('the season is not the calendar year', () => {
  it('a July start puts November and the following February in one season', () => {
    expect(seasonOf('2026-11-20', 7)).toBe(2026);
    expect(seasonOf('2027-02-10', 7)).toBe(2026);
    expect(seasonOf('2027-07-01', 7)).toBe(2027);
    expect(seasonOf('2027-06-30', 7)).toBe(2026);
  });
  it('a January start is the calendar year', () => {
    expect(seasonOf('2026-01-01', 1)).toBe(2026);
    expect(seasonOf('2026-12-31', 1)).toBe(2026);
  });
  it('bounds run from the 1st of the start month to the 1st of it a year on', () => {
    expect(seasonBounds(2026, 7)).toEqual({ from: '2026-07-01', to: '2027-07-01' });
    expect(seasonBounds(2026, 1)).toEqual({ from: '2026-01-01', to: '2027-01-01' });
  });
  it('labels a season across New Year with both years', () => {
    expect(seasonLabel(2026, 1)).toBe('2026');
    expect(seasonLabel(2026, 7)).toBe('2026–27');
    expect(seasonLabel(2099, 9)).toBe('2099–00');
  });
  it('refuses a month outside 1–12', () => {
    expect(() => seasonOf('2026-01-01', 0)).toThrow(RangeError);
    expect(() => seasonBounds(2026, 13)).toThrow(RangeError);
  });
});
