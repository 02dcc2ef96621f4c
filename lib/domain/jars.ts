/**
 * Jarring arithmetic in whole grams, and best-before dates.
 * Best-before: month arithmetic on calendar dates ('YYYY-MM-DD'), clamped to the
 * end of a shorter month (31 Jan + 1 month → 28/29 Feb). How many months honey
 * keeps is the owner's choice; EU Regulation 1169/2011 Annex X only sets the wording.
 */

const EPS = 1e-9;

/** Jars of nominalGrams a lot's remaining honey can fill after an expected loss (floor). */
export function jarsLotCanFill(remainingGrams: number, nominalGrams: number, expectedLossPct: number): number {
  if (!Number.isFinite(nominalGrams) || nominalGrams <= 0) throw new RangeError('Jar net weight must be positive');
  if (!Number.isFinite(expectedLossPct) || expectedLossPct < 0 || expectedLossPct >= 100) {
    throw new RangeError('Expected loss must be from 0 up to (not including) 100 %');
  }
  if (!Number.isFinite(remainingGrams)) throw new RangeError('Remaining weight must be a finite number');
  if (remainingGrams <= 0) return 0;
  const usable = (remainingGrams * (100 - expectedLossPct)) / 100;
  return Math.floor(usable / nominalGrams + EPS);
}

/**
 * Grams a jarring run took from its lot: jars × the larger of the nominal net weight
 * and the mean sample net weight (overfill is honey gone from the lot; an underfilled
 * mean is not credited back). Rounded to whole grams.
 */
export function honeyUsedByRun(jarCount: number, nominalGrams: number, samples: number[] = []): number {
  if (!Number.isInteger(jarCount) || jarCount < 0) throw new RangeError('Jar count must be a whole number ≥ 0');
  if (!Number.isFinite(nominalGrams) || nominalGrams <= 0) throw new RangeError('Jar net weight must be positive');
  if (samples.some((s) => !Number.isFinite(s) || s < 0)) throw new RangeError('Sample weights must be numbers ≥ 0');
  const mean = samples.length === 0 ? 0 : samples.reduce((a, b) => a + b, 0) / samples.length;
  return Math.round(jarCount * Math.max(nominalGrams, mean));
}

function parseIsoDate(date: string): [number, number, number] {
  const match = /^(\d{4})-(\d{2})-(\d{2})$/.exec(date);
  if (!match) throw new RangeError(`Not a YYYY-MM-DD date: ${date}`);
  const [y, m, d] = [Number(match[1]), Number(match[2]), Number(match[3])];
  if (m < 1 || m > 12 || d < 1 || d > daysInMonth(y, m)) throw new RangeError(`Not a calendar date: ${date}`);
  return [y, m, d];
}

function daysInMonth(year: number, month: number): number {
  return new Date(Date.UTC(year, month, 0)).getUTCDate();
}

/** extractedOn plus whole months, as 'YYYY-MM-DD', clamped to the month's last day. */
export function bestBeforeDate(extractedOn: string, months: number): string {
  if (!Number.isInteger(months) || months < 0) throw new RangeError('Months must be a whole number ≥ 0');
  const [y, m, d] = parseIsoDate(extractedOn);
  const monthIndex = y * 12 + (m - 1) + months;
  const year = Math.floor(monthIndex / 12);
  const month = (monthIndex % 12) + 1;
  const day = Math.min(d, daysInMonth(year, month));
  return `${String(year).padStart(4, '0')}-${String(month).padStart(2, '0')}-${String(day).padStart(2, '0')}`;
}

/** A lot's best-before: the date it was given (on first jarring, or when blended), else extractedOn + months. */
export function lotBestBefore(
  lot: { bestBeforeOn: string | null; extractedOn: string | null },
  months: number,
  today: string,
): string {
  return lot.bestBeforeOn ?? bestBeforeDate(lot.extractedOn ?? today, months);
}

/**
 * A blend is never better than its oldest honey: its best-before is the earliest of its parents'
 * best-before dates and the blend date + the owner's months.
 */
export function blendBestBefore(blendedOn: string, months: number, parentBestBefore: string[]): string {
  for (const d of parentBestBefore) parseIsoDate(d);
  return [bestBeforeDate(blendedOn, months), ...parentBestBefore].sort()[0];
}
