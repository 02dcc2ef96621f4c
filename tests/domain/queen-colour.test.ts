import { describe, expect, it } from 'vitest';
import { queenMarkColour } from '@/lib/domain/queen-colour';

describe('queenMarkColour', () => {
  // common practice: international queen-marking cycle, by last digit of the year
  const cycle: [number, string][] = [
    [2021, 'white'],
    [2026, 'white'],
    [2022, 'yellow'],
    [2027, 'yellow'],
    [2023, 'red'],
    [2028, 'red'],
    [2024, 'green'],
    [2029, 'green'],
    [2025, 'blue'],
    [2030, 'blue'],
  ];
  it.each(cycle)('%i → %s', (year, colour) => {
    expect(queenMarkColour(year)).toBe(colour);
  });

  it('repeats every five years', () => {
    for (let year = 1990; year < 2040; year++) {
      expect(queenMarkColour(year + 5)).toBe(queenMarkColour(year));
    }
  });

  it('rejects a non-year', () => {
    expect(() => queenMarkColour(2026.5)).toThrow(RangeError);
    expect(() => queenMarkColour(Number.NaN)).toThrow(RangeError);
    expect(() => queenMarkColour(-1)).toThrow(RangeError);
  });
});
