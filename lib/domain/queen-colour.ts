/**
 * Queen marking colour by year (common practice, international five-colour cycle):
 * years ending 1 or 6 white, 2 or 7 yellow, 3 or 8 red, 4 or 9 green, 5 or 0 blue.
 * The year is the year the queen was reared (or introduced, where unknown).
 */

export type QueenMarkColour = 'white' | 'yellow' | 'red' | 'green' | 'blue';

// Index by (last digit) mod 5: 0 → years ending 5/0, 1 → 1/6, and so on.
const CYCLE: readonly QueenMarkColour[] = ['blue', 'white', 'yellow', 'red', 'green'];

/** Marking colour for a queen of the given calendar year (e.g. 2026 → 'white'). */
export function queenMarkColour(year: number): QueenMarkColour {
  if (!Number.isInteger(year) || year < 0) throw new RangeError(`Not a calendar year: ${year}`);
  return CYCLE[year % 5];
}
