import { describe, expect, it } from 'vitest';
import {
  gs1CheckDigit,
  gs1HumanReadable,
  gs1RawElementString,
  gtin14,
  isGs1Cset82,
  isValidGtin,
  makeGtin,
  gs1Year,
  parseGs1ElementString,
} from '@/lib/domain/gs1';

const GS = '\x1d';

describe('check digit', () => {
  it('matches published worked examples', () => {
    expect(gs1CheckDigit('629104150021')).toBe(3); // GS1 General Specifications §7.9.1 worked example
    expect(gs1CheckDigit('0952123454321')).toBe(3); // demonstration GTIN (01)09521234543213 (GS1 prefix 952 is for examples)
    expect(gs1CheckDigit('0950110153000')).toBe(3); // example GTIN 09501101530003, as in the scanner-output test below
    expect(gs1CheckDigit('03600029145')).toBe(2); // UPC-A 036000291452 (from memory)
    expect(gs1CheckDigit('9638507')).toBe(4); // EAN-8 96385074 (from memory)
  });
  it('gives 0 when the weighted sum is a multiple of ten', () => {
    // 3×1 + 1×7 = 10 → (10 − 0) mod 10 = 0 (GS1 General Specifications §7.9.1 formula)
    expect(gs1CheckDigit('71')).toBe(0);
  });
  it('refuses non-digits', () => expect(() => gs1CheckDigit('12a4')).toThrow());
});

describe('GTIN validity', () => {
  it('accepts GTIN-8, -12, -13 and -14 with a right check digit', () => {
    expect(isValidGtin('96385074')).toBe(true); // from memory, as above
    expect(isValidGtin('036000291452')).toBe(true); // from memory, as above
    expect(isValidGtin('9521234543213')).toBe(true); // the demonstration GTIN without its leading 0
    expect(isValidGtin('09521234543213')).toBe(true); // the demonstration GTIN, 14 digits
  });
  it('rejects wrong check digits, lengths and characters', () => {
    expect(isValidGtin('09521234543214')).toBe(false);
    expect(isValidGtin('952123454321')).toBe(false); // 12 digits, wrong check for a GTIN-12
    expect(isValidGtin('95212345432')).toBe(false); // 11 digits: no such GTIN
    expect(isValidGtin('0952123454321 ')).toBe(false);
    expect(isValidGtin('')).toBe(false);
  });
  it('pads to 14 digits', () => {
    expect(gtin14('9521234543213')).toBe('09521234543213');
    expect(gtin14('96385074')).toBe('00000096385074');
    expect(() => gtin14('123')).toThrow();
  });
});

describe('makeGtin', () => {
  it('builds the demonstration GTIN from a 9-digit prefix and item reference', () => {
    expect(makeGtin('952123454', '321')).toBe('9521234543213');
  });
  it('zero-pads the item reference and can add an indicator digit', () => {
    expect(makeGtin('9521234', '5')).toBe(`95212340000${5}${gs1CheckDigit('952123400005')}`);
    const g14 = makeGtin('9521234', '5', '1');
    expect(g14).toHaveLength(14);
    expect(isValidGtin(g14)).toBe(true);
    expect(g14.startsWith('1952123400005')).toBe(true);
  });
  it('throws when prefix and reference exceed 12 digits or are not digits', () => {
    expect(() => makeGtin('952123454', '3210')).toThrow();
    expect(() => makeGtin('9521234543210', '')).toThrow();
    expect(() => makeGtin('95A', '1')).toThrow();
    expect(() => makeGtin('952', '1', '12')).toThrow();
  });
});

describe('character set 82', () => {
  it('has exactly 82 printable ASCII characters', () => {
    // "character set 82": 82 characters; GS1 General Specifications §7.11 (section from memory)
    const printable = Array.from({ length: 0x7f - 0x20 }, (_, i) => String.fromCharCode(0x20 + i));
    expect(printable.filter(isGs1Cset82)).toHaveLength(82);
  });
  it('excludes space, #, $ and @ (GS1 General Specifications, character set 82)', () => {
    for (const ch of [' ', '#', '$', '@', '[', '~', 'é']) expect(isGs1Cset82(`A${ch}`)).toBe(false);
    expect(isGs1Cset82('HH26-014')).toBe(true);
  });
});

describe('human-readable element string', () => {
  it('matches the GS1 human-readable form, fixed-length AIs first', () => {
    expect(gs1HumanReadable({ gtin: '09521234543213', bestBefore: '2027-12-31', lot: 'HH26-014' })).toBe(
      '(01)09521234543213(15)271231(10)HH26-014',
    ); // GS1 General Specifications: AIs in parentheses, fixed-length (01) and (15) before (10)
  });
  it('pads shorter GTINs and reads a Date in UTC', () => {
    expect(gs1HumanReadable({ gtin: '9521234543213', bestBefore: new Date('2027-12-31T23:30:00Z'), lot: 'A1' })).toBe(
      '(01)09521234543213(15)271231(10)A1',
    );
  });
  it('throws on a bad GTIN, lot or date', () => {
    const ok = { gtin: '09521234543213', bestBefore: '2027-12-31', lot: 'HH26-014' };
    expect(() => gs1HumanReadable({ ...ok, gtin: '09521234543214' })).toThrow(/GTIN/);
    expect(() => gs1HumanReadable({ ...ok, lot: '' })).toThrow(/Lot/);
    expect(() => gs1HumanReadable({ ...ok, lot: 'X'.repeat(21) })).toThrow(/1–20/); // AI (10): up to 20 (GS1 General Specifications)
    expect(() => gs1HumanReadable({ ...ok, lot: 'HH 26' })).toThrow(/character set 82/);
    expect(() => gs1HumanReadable({ ...ok, bestBefore: '2027-02-30' })).toThrow(/calendar/);
    expect(() => gs1HumanReadable({ ...ok, bestBefore: '31/12/2027' })).toThrow(/YYYY-MM-DD/);
    expect(() => gs1HumanReadable({ ...ok, bestBefore: new Date('nope') })).toThrow();
  });
  it('accepts a 20-character lot', () => {
    expect(gs1HumanReadable({ gtin: '09521234543213', bestBefore: '2027-12-31', lot: 'X'.repeat(20) })).toMatch(
      /\(10\)X{20}$/,
    );
  });
});

describe('parsing scanned and typed element strings', () => {
  const expected = { gtin: '09521234543213', bestBefore: '2027-12-31', lot: 'HH26-014' };

  it('reads the bracketed form', () => {
    expect(parseGs1ElementString('(01)09521234543213(15)271231(10)HH26-014')).toEqual(expected);
  });
  it('reads GS1-128 scanner output with ]C1 (as @zxing/library decodes it with ASSUME_GS1)', () => {
    expect(parseGs1ElementString(']C101095212345432131527123110HH26-014')).toEqual(expected);
  });
  it('reads GS1 DataMatrix output with ]d2 or a leading GS (as @zxing/library decodes it)', () => {
    expect(parseGs1ElementString(']d201095212345432131527123110HH26-014')).toEqual(expected);
    expect(parseGs1ElementString(`${GS}01095212345432131527123110HH26-014`)).toEqual(expected);
  });
  it('uses GS to end a variable-length lot that is not last', () => {
    // @zxing/library Code128 output with ASSUME_GS1: "]C1…10LOT-24-017\x1d15261231"
    expect(parseGs1ElementString(`]C1010950110153000310LOT-24-017${GS}15261231`)).toEqual({
      gtin: '09501101530003',
      lot: 'LOT-24-017',
      bestBefore: '2026-12-31',
    });
  });
  it('treats DD = 00 as the last day of the month (GS1 General Specifications, AI (15))', () => {
    expect(parseGs1ElementString('(15)270200').bestBefore).toBe('2027-02-28');
    expect(parseGs1ElementString('(15)280200').bestBefore).toBe('2028-02-29'); // leap year
  });
  it('skips AIs it does not use, fixed or variable length', () => {
    expect(parseGs1ElementString('(01)09521234543213(21)SER9(17)281231(10)L7')).toEqual({
      gtin: '09521234543213',
      lot: 'L7',
    });
    expect(parseGs1ElementString(`010952123454321321SER9${GS}1728123110L7`)).toEqual({
      gtin: '09521234543213',
      lot: 'L7',
    });
  });
  it('accepts a bare GTIN from a retail barcode', () => {
    expect(parseGs1ElementString('9521234543213')).toEqual({ gtin: '09521234543213' });
  });
  it('leaves out what fails its check and never throws', () => {
    expect(parseGs1ElementString('(01)09521234543214(10)HH26-014')).toEqual({ lot: 'HH26-014' });
    expect(parseGs1ElementString('(15)271340(10)A')).toEqual({ lot: 'A' });
    expect(parseGs1ElementString('hello')).toEqual({});
    expect(parseGs1ElementString('')).toEqual({});
    expect(parseGs1ElementString(']C10109521')).toEqual({});
  });
  it('round-trips through the human-readable and raw forms', () => {
    for (const lot of ['HH26-014', 'A', 'x!"%&\'*+,-./:;<=>?_z', 'A(B)C']) {
      const hr = gs1HumanReadable({ gtin: '09521234543213', bestBefore: '2027-12-31', lot });
      expect(parseGs1ElementString(hr)).toEqual({ ...expected, lot });
      expect(parseGs1ElementString(`]C1${gs1RawElementString(hr)}`)).toEqual({ ...expected, lot });
    }
  });
  it('puts GS only after a variable-length value that is not last', () => {
    expect(gs1RawElementString('(01)09521234543213(10)HH26-014(15)271231')).toBe(
      `0109521234543213${'10HH26-014'}${GS}15271231`,
    );
    expect(gs1RawElementString('(01)09521234543213(15)271231(10)HH26-014')).toBe('01095212345432131527123110HH26-014');
  });
});

// GS1 General Specifications; the century rule is §7.12 and the indicator range 1–8 is from memory.
describe('GS1 edge cases', () => {
  it('a GTIN of all zeros is not valid, though its check digit sums', () => {
    for (const zeros of ['00000000', '000000000000', '0000000000000', '00000000000000'])
      expect(isValidGtin(zeros)).toBe(false);
    expect(parseGs1ElementString('(01)00000000000000(10)A1')).toEqual({ lot: 'A1' });
  });
  it('makeGtin takes indicator digits 1–8 only', () => {
    expect(makeGtin('9521234', '5', '8')).toHaveLength(14);
    expect(() => makeGtin('9521234', '5', '0')).toThrow();
    expect(() => makeGtin('9521234', '5', '9')).toThrow();
  });
  it('reads a two-digit year by the GS1 century rule, not always 20xx', () => {
    expect(gs1Year(27, 2026)).toBe(2027);
    expect(gs1Year(76, 2026)).toBe(2076); // 50 ahead: current century
    expect(gs1Year(77, 2026)).toBe(1977); // 51 ahead: previous century
    expect(gs1Year(1, 2098)).toBe(2101); // 97 behind: next century
    expect(gs1Year(48, 2098)).toBe(2148); // −50: next century
    expect(gs1Year(49, 2098)).toBe(2049); // −49: current century
    const now = new Date('2098-06-01T00:00:00Z');
    expect(parseGs1ElementString('(15)010630(10)A1', now).bestBefore).toBe('2101-06-30');
    expect(parseGs1ElementString('(15)990630(10)A1', new Date('2026-06-01T00:00:00Z')).bestBefore).toBe('1999-06-30');
  });
});
