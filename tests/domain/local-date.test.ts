import { describe, expect, it } from 'vitest';
import { localDate } from '@/lib/domain/local-date';

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
