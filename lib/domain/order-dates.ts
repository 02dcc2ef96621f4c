/** A timestamp for screens, in the business's time zone (timestamps are stored in UTC). */
export function formatDateTime(at: Date, timeZone: string, withTime = true): string {
  const opts: Intl.DateTimeFormatOptions = withTime
    ? {
        year: 'numeric',
        month: 'short',
        day: 'numeric',
        hour: '2-digit',
        minute: '2-digit',
        hourCycle: 'h23',
        timeZone,
      }
    : { year: 'numeric', month: 'short', day: 'numeric', timeZone };
  try {
    return new Intl.DateTimeFormat('en-GB', opts).format(at);
  } catch {
    return new Intl.DateTimeFormat('en-GB', { ...opts, timeZone: 'UTC' }).format(at) + ' UTC';
  }
}
