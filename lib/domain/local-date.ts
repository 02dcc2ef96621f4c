/** The calendar date (YYYY-MM-DD) at an instant in an IANA time zone, e.g. the business's "today". */
export function localDate(instant: Date, timeZone: string): string {
  const parts = new Intl.DateTimeFormat('en-CA', {
    timeZone,
    year: 'numeric',
    month: '2-digit',
    day: '2-digit',
  }).formatToParts(instant);
  const get = (type: string) => parts.find((p) => p.type === type)?.value ?? '';
  return `${get('year')}-${get('month')}-${get('day')}`;
}

/**
 * Today's calendar date (YYYY-MM-DD) for the business: the one helper for "today" wherever a
 * date is stamped or compared (extraction, blend, best-before, default season). Never UTC's date:
 * at 02:30 UTC on 2 March it is still 1 March in New York. An unknown zone falls back to UTC.
 */
export function todayIn(timeZone: string, now: Date = new Date()): string {
  try {
    return localDate(now, timeZone);
  } catch {
    return now.toISOString().slice(0, 10);
  }
}
