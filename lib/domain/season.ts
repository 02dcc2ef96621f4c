/**
 * The beekeeping season is not the calendar year: it starts on the 1st of the owner's season start
 * month (a business setting; 1 = January for most of the northern hemisphere, 7 = July suits much
 * of the southern hemisphere, where a summer runs across New Year). A season is named by the year
 * it starts in.
 */

export function assertStartMonth(startMonth: number): void {
  if (!Number.isInteger(startMonth) || startMonth < 1 || startMonth > 12)
    throw new RangeError('The season start month is a whole number from 1 to 12');
}

/** The season a calendar date ('YYYY-MM-DD') belongs to. */
export function seasonOf(date: string, startMonth: number): number {
  assertStartMonth(startMonth);
  const m = /^(\d{4})-(\d{2})-\d{2}$/.exec(date);
  if (!m) throw new RangeError(`Not a YYYY-MM-DD date: ${date}`);
  const year = Number(m[1]);
  return Number(m[2]) >= startMonth ? year : year - 1;
}

/** The first day of a season and the first day of the next, as 'YYYY-MM-DD' (from inclusive, to exclusive). */
export function seasonBounds(season: number, startMonth: number): { from: string; to: string } {
  assertStartMonth(startMonth);
  const mm = String(startMonth).padStart(2, '0');
  return { from: `${season}-${mm}-01`, to: `${season + 1}-${mm}-01` };
}

/** "2026" for a season that starts in January, "2026–27" for one that runs across New Year. */
export function seasonLabel(season: number, startMonth: number): string {
  assertStartMonth(startMonth);
  return startMonth === 1 ? String(season) : `${season}–${String((season + 1) % 100).padStart(2, '0')}`;
}
