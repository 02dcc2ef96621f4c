/**
 * GS1 identifiers and element strings for jar labels and the trace search.
 * Source: GS1 General Specifications — §7.9.1 (check digit) and its Application
 * Identifiers; the other section numbers cited below are from memory: §3 (AI
 * definitions 01, 10, 15), §7.11 (character set 82), §7.8.5 (predefined lengths).
 */

const GTIN_LENGTHS = new Set([8, 12, 13, 14]);

/** GS1 General Specifications §7.9.1: weights 3,1,3,1… from the right; (10 − sum mod 10) mod 10. */
export function gs1CheckDigit(dataDigits: string): number {
  if (!/^\d+$/.test(dataDigits)) throw new Error('GS1 check digit needs digits only');
  let sum = 0;
  for (let i = 0; i < dataDigits.length; i++) {
    const digit = dataDigits.charCodeAt(dataDigits.length - 1 - i) - 48;
    sum += digit * (i % 2 === 0 ? 3 : 1);
  }
  return (10 - (sum % 10)) % 10;
}

/** GTIN-8, -12, -13 or -14 (GS1 General Specifications, GTIN formats — section from memory): digits only, right check digit. */
export function isValidGtin(code: string): boolean {
  if (!/^\d+$/.test(code) || !GTIN_LENGTHS.has(code.length)) return false;
  // All zeros passes the check-digit sum but identifies no trade item (no company prefix is 0…0).
  if (/^0+$/.test(code)) return false;
  return gs1CheckDigit(code.slice(0, -1)) === Number(code.slice(-1));
}

/** Left-pads a GTIN-8/12/13 with zeros to the 14 digits AI (01) carries (GS1 General Specifications §3, AI (01), from memory). */
export function gtin14(code: string): string {
  if (!/^\d+$/.test(code) || !GTIN_LENGTHS.has(code.length)) {
    throw new Error(`Not a GTIN: "${code}" (8, 12, 13 or 14 digits)`);
  }
  return code.padStart(14, '0');
}

/**
 * GTIN-13 from a GS1 Company Prefix and an item reference (zero-padded on the left
 * so the two make 12 digits), plus check digit. With an indicator digit (1–8 for
 * groupings; GS1 General Specifications, from memory) the result is a GTIN-14.
 */
export function makeGtin(companyPrefix: string, itemReference: string, indicator = ''): string {
  if (!/^\d+$/.test(companyPrefix)) throw new Error('Company prefix must be digits');
  if (!/^\d*$/.test(itemReference)) throw new Error('Item reference must be digits');
  // Indicator digits 1–8 mark groupings; 0 would be a padded GTIN-13 and 9 is for variable-measure items (from memory).
  if (!/^[1-8]?$/.test(indicator)) throw new Error('Indicator must be one digit from 1 to 8');
  const free = 12 - companyPrefix.length;
  if (free < 0 || itemReference.length > free) {
    throw new Error('Company prefix and item reference are longer than 12 digits');
  }
  const data = indicator + companyPrefix + itemReference.padStart(free, '0');
  return data + String(gs1CheckDigit(data));
}

/** GS1 General Specifications §7.11, Figure 7.11-1: the 82 characters allowed in AI (10). */
const CSET82 = /^[!"%&'()*+,\-./0-9:;<=>?A-Z_a-z]*$/;

export function isGs1Cset82(s: string): boolean {
  return CSET82.test(s);
}

function yymmdd(date: Date | string): string {
  if (typeof date === 'string') {
    const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(date);
    if (!m) throw new Error(`Best-before date must be YYYY-MM-DD, got "${date}"`);
    const check = new Date(Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3])));
    if (check.getUTCDate() !== Number(m[3]) || check.getUTCMonth() !== Number(m[2]) - 1) {
      throw new Error(`Not a calendar date: "${date}"`);
    }
    return m[1].slice(2) + m[2] + m[3];
  }
  if (Number.isNaN(date.getTime())) throw new Error('Best-before date is invalid');
  const pad = (n: number) => String(n).padStart(2, '0');
  return pad(date.getUTCFullYear() % 100) + pad(date.getUTCMonth() + 1) + pad(date.getUTCDate());
}

export function assertGs1Lot(lot: string): void {
  // AI (10): 1–20 characters of character set 82 (GS1 General Specifications §3, section from memory).
  if (lot.length < 1 || lot.length > 20 || !isGs1Cset82(lot)) {
    throw new Error(`Lot "${lot}" must be 1–20 characters of GS1 character set 82 (no spaces)`);
  }
}

/**
 * Human-readable element string `(01)…(15)YYMMDD(10)lot`. Fixed-length AIs go first so
 * the variable-length (10) ends the symbol and needs no FNC1 separator (GS1 General
 * Specifications §7.8, concatenation — section from memory).
 * A Date contributes its UTC year, month and day.
 */
export function gs1HumanReadable({
  gtin,
  bestBefore,
  lot,
}: {
  gtin: string;
  bestBefore: Date | string;
  lot: string;
}): string {
  if (!isValidGtin(gtin)) throw new Error(`Invalid GTIN "${gtin}"`);
  assertGs1Lot(lot);
  return `(01)${gtin14(gtin)}(15)${yymmdd(bestBefore)}(10)${lot}`;
}

export type Gs1Fields = { gtin?: string; bestBefore?: string; lot?: string };

/**
 * GS1 General Specifications §7.8.5, Figure 7.8.5-2 (from memory): element strings whose total
 * length (AI + data) is fixed by their first two digits; every other one is
 * variable-length and ends at a GS (FNC1) or at the end of the data.
 */
const PREDEFINED_LENGTH: Record<string, number> = {
  '00': 20,
  '01': 16,
  '02': 16,
  '03': 16,
  '04': 18,
  '11': 8,
  '12': 8,
  '13': 8,
  '14': 8,
  '15': 8,
  '16': 8,
  '17': 8,
  '18': 8,
  '19': 8,
  '20': 4,
  '31': 10,
  '32': 10,
  '33': 10,
  '34': 10,
  '35': 10,
  '36': 10,
  '41': 16,
};

const GS = '\x1d';

/**
 * The full year of a two-digit year, by the GS1 General Specifications' century rule (§7.12,
 * "Determination of century in dates"; section and wording from memory): with d = YY minus the
 * last two digits of the current year, d from 51 to 99 is the previous century, d from −99 to −50
 * the next century, anything else the current one — a window from 49 years back to 50 ahead.
 */
export function gs1Year(yy: number, currentYear: number): number {
  if (!Number.isInteger(yy) || yy < 0 || yy > 99) throw new RangeError('A two-digit year is 0–99');
  const century = currentYear - (currentYear % 100);
  const d = yy - (currentYear % 100);
  if (d >= 51) return century - 100 + yy;
  if (d <= -50) return century + 100 + yy;
  return century + yy;
}

/** YYMMDD → YYYY-MM-DD, the century by gs1Year.
 * DD = 00 means the last day of the month (GS1 General Specifications, AI (15) best before date). */
function isoFromYymmdd(v: string, currentYear: number): string | undefined {
  if (!/^\d{6}$/.test(v)) return undefined;
  const year = gs1Year(Number(v.slice(0, 2)), currentYear);
  const month = Number(v.slice(2, 4));
  let day = Number(v.slice(4, 6));
  if (month < 1 || month > 12) return undefined;
  const lastDay = new Date(Date.UTC(year, month, 0)).getUTCDate();
  if (day === 0) day = lastDay;
  if (day > lastDay) return undefined;
  return `${year}-${String(month).padStart(2, '0')}-${String(day).padStart(2, '0')}`;
}

function collect(out: Gs1Fields, ai: string, value: string, currentYear: number): void {
  if (ai === '01' && isValidGtin(value)) out.gtin = value;
  else if (ai === '15') {
    const iso = isoFromYymmdd(value, currentYear);
    if (iso) out.bestBefore = iso;
  } else if (ai === '10' && value.length >= 1 && value.length <= 20 && isGs1Cset82(value)) out.lot = value;
}

/** Splits `(01)…(10)…` into AI/value pairs; [] when it does not start with an AI. */
function splitBracketed(s: string): { ai: string; value: string }[] {
  // An AI in brackets: 2–4 digits. A lot may itself contain brackets (set 82), so a
  // value runs to the next "(digits)" only; our own strings put (10) last anyway.
  const re = /\((\d{2,4})\)/g;
  const marks: { ai: string; start: number; end: number }[] = [];
  for (let m = re.exec(s); m; m = re.exec(s)) marks.push({ ai: m[1], start: m.index, end: re.lastIndex });
  if (marks.length === 0 || marks[0].start !== 0) return [];
  return marks.map((mark, i) => ({
    ai: mark.ai,
    value: s.slice(mark.end, i + 1 < marks.length ? marks[i + 1].start : s.length),
  }));
}

function parseBracketed(s: string, currentYear: number): Gs1Fields {
  const out: Gs1Fields = {};
  for (const { ai, value } of splitBracketed(s)) collect(out, ai, value, currentYear);
  return out;
}

/**
 * Bracketed element string to the data a scanner transmits (without symbology
 * identifier): AIs and values run together, with GS after each variable-length value
 * that is not last (GS1 General Specifications §7.8.5, from memory).
 */
export function gs1RawElementString(bracketed: string): string {
  const parts = splitBracketed(bracketed);
  if (parts.length === 0) throw new Error(`Not a bracketed GS1 element string: "${bracketed}"`);
  return parts
    .map(({ ai, value }, i) => {
      const fixed = PREDEFINED_LENGTH[ai.slice(0, 2)] !== undefined;
      return ai + value + (fixed || i === parts.length - 1 ? '' : GS);
    })
    .join('');
}

function parseRaw(s: string, currentYear: number): Gs1Fields {
  const out: Gs1Fields = {};
  let i = 0;
  while (i < s.length) {
    if (s[i] === GS) {
      i++;
      continue;
    }
    const head = s.slice(i, i + 2);
    if (!/^\d\d$/.test(head)) return out;
    const fixed = PREDEFINED_LENGTH[head];
    let end: number;
    if (fixed !== undefined) {
      end = i + fixed;
      if (end > s.length) return out;
    } else {
      const gs = s.indexOf(GS, i);
      end = gs === -1 ? s.length : gs;
    }
    // The three AIs we read are two digits long; others are skipped whole.
    if (head === '01' || head === '15' || head === '10') collect(out, head, s.slice(i + 2, end), currentYear);
    i = end;
  }
  return out;
}

/**
 * Reads GTIN, best-before (as YYYY-MM-DD) and lot from a human-readable element string
 * `(01)…(15)…(10)…`, from a scanner's raw output (optional symbology identifier `]C1`,
 * `]d2`, `]Q3`, `]e0`; GS separators after variable-length fields), or from a bare
 * GTIN. Never throws: fields that are missing or fail their check are left out. A two-digit
 * year is read by the GS1 century rule against `now`'s year (gs1Year).
 */
export function parseGs1ElementString(s: string, now: Date = new Date()): Gs1Fields {
  const currentYear = now.getUTCFullYear();
  let text = s.trim();
  if (/^\d+$/.test(text) && isValidGtin(text)) return { gtin: gtin14(text) };
  text = text.replace(/^\][A-Za-z]\d/, '');
  if (text.startsWith('(')) return parseBracketed(text, currentYear);
  return parseRaw(text, currentYear);
}
