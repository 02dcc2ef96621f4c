import { describe, expect, it } from 'vitest';
import { localDate, todayIn } from '@/lib/domain/local-date';

describe('localDate', () => {
  it('gives the date in the business time zone, not UTC', () => {
    const lateEvening = new Date('2026-07-14T23:30:00Z');
    expect(localDate(lateEvening, 'UTC')).toBe('2026-07-14');
    expect(localDate(lateEvening, 'Europe/London')).toBe('2026-07-15'); // BST, UTC+1 in July
    expect(localDate(lateEvening, 'America/Chicago')).toBe('2026-07-14');
  });
  it('throws on an unknown zone', () => {
    expect(() => localDate(new Date(), 'Not/AZone')).toThrow(RangeError);
  });
});

// Calendar dates are the business's (its time zone setting), not UTC's: IANA time zone database.
describe('todayIn: dates in the business time zone, not UTC', () => {
  it('at 02:30 UTC on 2 March it is still 1 March in a UTC−5 zone', () => {
    const now = new Date('2026-03-02T02:30:00Z'); // New York is on EST (UTC−5) until 8 March 2026
    expect(todayIn('America/New_York', now)).toBe('2026-03-01');
    expect(todayIn('UTC', now)).toBe('2026-03-02');
  });
  it('at 23:30 UTC on 1 March it is already 2 March in Auckland (UTC+13)', () => {
    expect(todayIn('Pacific/Auckland', new Date('2026-03-01T23:30:00Z'))).toBe('2026-03-02');
  });
  it('falls back to UTC for an unknown zone rather than failing a write', () => {
    expect(todayIn('Not/AZone', new Date('2026-03-01T23:30:00Z'))).toBe('2026-03-01');
  });
});
