import { describe, expect, it } from 'vitest';
import { neutraliseCsvCell, toCsv } from '@/lib/domain/csv';

describe('neutraliseCsvCell', () => {
  // OWASP CSV Injection guidance: cells starting with = + - @ tab or carriage return
  it.each(['=1+1', '+1', '-2+3', '@SUM(A1)', '\tcmd', '\rcmd', '=HYPERLINK("http://example.invalid")'])(
    'prefixes %j',
    (text) => {
      expect(neutraliseCsvCell(text)).toBe(`'${text}`);
    },
  );

  it('leaves ordinary text and real numbers alone', () => {
    expect(neutraliseCsvCell('Linden Row')).toBe('Linden Row');
    expect(neutraliseCsvCell('HH26-014')).toBe('HH26-014');
    expect(neutraliseCsvCell(-12)).toBe('-12');
    expect(neutraliseCsvCell(18.6)).toBe('18.6');
  });

  it('turns other values into text', () => {
    expect(neutraliseCsvCell(null)).toBe('');
    expect(neutraliseCsvCell(undefined)).toBe('');
    expect(neutraliseCsvCell(true)).toBe('true');
    expect(neutraliseCsvCell(new Date(Date.UTC(2026, 4, 2)))).toBe('2026-05-02T00:00:00.000Z');
  });
});

describe('toCsv', () => {
  it('quotes per RFC 4180 with CRLF line ends', () => {
    // RFC 4180 §2: CRLF line breaks; fields with commas, quotes or line breaks quoted; quotes doubled
    const csv = toCsv(
      ['lot', 'note'],
      [
        ['HH26-014', 'linden, light'],
        ['HH26-015', 'said "dark"'],
        ['HH26-016', 'two\nlines'],
      ],
    );
    expect(csv).toBe('lot,note\r\nHH26-014,"linden, light"\r\nHH26-015,"said ""dark"""\r\nHH26-016,"two\nlines"');
  });

  it('neutralises every cell, headers included', () => {
    const csv = toCsv(
      ['=name', 'grams'],
      [
        ['=cmd|calc', -340],
        ['@x', 340],
      ],
    );
    expect(csv).toBe("'=name,grams\r\n'=cmd|calc,-340\r\n'@x,340");
  });

  it('refuses ragged rows', () => {
    expect(() => toCsv(['a', 'b'], [['only one']])).toThrow(RangeError);
  });
});
