import { describe, expect, it } from 'vitest';
import { formatDateTime } from '@/lib/domain/order-dates';

describe('formatDateTime', () => {
  // 23:30 UTC on 30 June is already 1 July in London (BST, UTC+1).
  it('shows the business time zone', () =>
    expect(formatDateTime(new Date('2026-06-30T23:30:00Z'), 'Europe/London')).toBe('1 Jul 2026, 00:30'));
  it('date only', () =>
    expect(formatDateTime(new Date('2026-06-30T23:30:00Z'), 'America/Chicago', false)).toBe('30 Jun 2026'));
  it('falls back to UTC for an unknown zone', () =>
    expect(formatDateTime(new Date('2026-01-02T03:04:00Z'), 'Not/AZone')).toBe('2 Jan 2026, 03:04 UTC'));
});
