import { describe, expect, it } from 'vitest';
import { lotCode, parseLotCode } from '@/lib/domain/lot-code';

describe('lotCode', () => {
  it('pads year and sequence', () => {
    expect(lotCode('HH', 2026, 14)).toBe('HH26-014'); // prefix, two-digit year, sequence (docs/trade-rules.md, "Lot codes")
    expect(lotCode('HH', 2005, 1)).toBe('HH05-001');
  });

  it('grows past 999', () => {
    expect(lotCode('HH', 2026, 999)).toBe('HH26-999');
    expect(lotCode('HH', 2026, 1203)).toBe('HH26-1203');
  });

  it('allows a prefix ending in a digit or no prefix', () => {
    expect(lotCode('B2', 2026, 7)).toBe('B226-007');
    expect(lotCode('', 2026, 7)).toBe('26-007');
  });

  it('rejects prefixes unsafe for GS1 AI (10) and bad numbers', () => {
    // GS1 General Specifications: AI (10) uses character set 82 — no space, #, $, @
    expect(() => lotCode('H H', 2026, 1)).toThrow(RangeError);
    expect(() => lotCode('HH#', 2026, 1)).toThrow(RangeError);
    expect(() => lotCode('ABCDEFGHI', 2026, 1)).toThrow(RangeError);
    expect(() => lotCode('HH', 2026, 0)).toThrow(RangeError);
    expect(() => lotCode('HH', 2026.5, 1)).toThrow(RangeError);
  });

  it('fits GS1 AI (10), at most 20 characters', () => {
    // GS1 General Specifications: AI (10) batch/lot, 1–20 characters
    expect(lotCode('ABCDEFGH', 2026, 999_999).length).toBeLessThanOrEqual(20);
  });
});

describe('parseLotCode', () => {
  it('reads the parts back', () => {
    expect(parseLotCode('HH26-014')).toEqual({ prefix: 'HH', year2: 26, sequence: 14 });
    expect(parseLotCode('HH26-1203')).toEqual({ prefix: 'HH', year2: 26, sequence: 1203 });
    expect(parseLotCode('B226-007')).toEqual({ prefix: 'B2', year2: 26, sequence: 7 });
    expect(parseLotCode('26-007')).toEqual({ prefix: '', year2: 26, sequence: 7 });
    // the year is always the two digits before the hyphen, so a prefix may end in digits
    expect(parseLotCode('HH2026-014')).toEqual({ prefix: 'HH20', year2: 26, sequence: 14 });
  });

  it('round-trips with lotCode', () => {
    for (const [prefix, year, seq] of [
      ['HH', 2026, 14],
      ['Q9', 2031, 1000],
      ['', 2099, 5],
    ] as const) {
      const parsed = parseLotCode(lotCode(prefix, year, seq));
      expect(parsed).toEqual({ prefix, year2: year % 100, sequence: seq });
    }
  });

  it('returns null for anything else', () => {
    for (const bad of ['', 'HH26014', 'HH26-14', 'HH26-0014', 'HH26-000', 'HH 26-014', 'LHH26-014x']) {
      expect(parseLotCode(bad)).toBeNull();
    }
  });
});
