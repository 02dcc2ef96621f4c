/**
 * Extraction lot codes: owner prefix, two-digit year, hyphen, sequence padded to
 * three digits and growing past 999 — "HH26-014", "HH26-1203". The code goes into
 * GS1 AI (10) (1–20 characters of GS1 character set 82) and after "L" on EU labels
 * (Directive 2011/91/EU Art. 3), so the prefix is kept to letters and digits.
 */

export type ParsedLotCode = { prefix: string; year2: number; sequence: number };

const PREFIX = /^[A-Za-z0-9]{0,8}$/;
const CODE = /^([A-Za-z0-9]{0,8}?)(\d{2})-(\d{3,})$/;

/** Lot code for a prefix, calendar year and sequence number (1, 2, 3 … within the year). */
export function lotCode(prefix: string, year: number, sequence: number): string {
  if (!PREFIX.test(prefix)) throw new RangeError(`Lot-code prefix must be up to 8 letters or digits: "${prefix}"`);
  if (!Number.isInteger(year) || year < 0) throw new RangeError(`Not a calendar year: ${year}`);
  if (!Number.isInteger(sequence) || sequence < 1)
    throw new RangeError(`Lot sequence must be a whole number ≥ 1: ${sequence}`);
  return `${prefix}${String(year % 100).padStart(2, '0')}-${String(sequence).padStart(3, '0')}`;
}

/**
 * The parts of a lot code made by lotCode, or null. Only the canonical form parses
 * ("HH26-14" and "HH26-0014" do not), so parse and format round-trip.
 */
export function parseLotCode(code: string): ParsedLotCode | null {
  const match = CODE.exec(code.trim());
  if (!match) return null;
  const [, prefix, year, digits] = match;
  const sequence = Number(digits);
  if (sequence < 1 || String(sequence).padStart(3, '0') !== digits) return null;
  return { prefix, year2: Number(year), sequence };
}
