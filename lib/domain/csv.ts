/**
 * CSV export. Quoting per RFC 4180 (fields with comma, quote or line break are
 * quoted, quotes doubled, CRLF line ends) via papaparse `unparse`.
 * Formula injection: per the OWASP "CSV Injection" guidance, a text cell starting
 * with = + - @ tab or carriage return is prefixed with a single quote so spreadsheet
 * programs show it as text. Real numbers (typeof number) are left alone: their text
 * form cannot hold a formula, and "-12" must stay a number for a stock adjustment.
 */
import Papa from 'papaparse';

const FORMULA_START = /^[=+\-@\t\r]/;

function cellText(value: unknown): string {
  if (value === null || value === undefined) return '';
  if (typeof value === 'string') return value;
  if (value instanceof Date) return Number.isNaN(value.getTime()) ? '' : value.toISOString();
  if (typeof value === 'object') return JSON.stringify(value);
  return String(value);
}

/** One cell as text that a spreadsheet will not run as a formula. */
export function neutraliseCsvCell(value: unknown): string {
  const text = cellText(value);
  if (typeof value === 'number' || typeof value === 'bigint') return text;
  return FORMULA_START.test(text) ? `'${text}` : text;
}

/** A whole CSV document (header row first), every cell neutralised. */
export function toCsv(headers: string[], rows: unknown[][]): string {
  rows.forEach((row, i) => {
    if (row.length !== headers.length) {
      throw new RangeError(`Row ${i + 1} has ${row.length} cells; the header has ${headers.length}`);
    }
  });
  return Papa.unparse(
    { fields: headers.map(neutraliseCsvCell), data: rows.map((row) => row.map(neutraliseCsvCell)) },
    { newline: '\r\n', quotes: false, escapeFormulae: false },
  );
}
