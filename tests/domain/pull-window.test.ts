import { describe, expect, it } from 'vitest';
import { flagReasons, pullWindow } from '@/lib/domain/pull-window';
import { superConflicts } from '@/lib/domain/conflicts';

describe('pullWindow', () => {
  it('uses the recorded put-on date', () => {
    expect(pullWindow('2026-07-20', '2026-06-01', ['2026-05-30'])).toEqual({
      putOn: '2026-06-01',
      pulled: '2026-07-20',
      putOnKnown: true,
    });
  });
  it('refuses a put-on date after the pull', () => {
    expect(() => pullWindow('2026-07-20', '2026-07-21', [])).toThrow(RangeError);
  });
  it('starts the day after the previous pull of the same season when put-on is unknown', () => {
    expect(
      pullWindow('2026-07-20', null, ['2025-08-01', '2026-06-30', '2026-06-10', '2026-07-20', '2026-08-01']).putOn,
    ).toBe('2026-07-01');
  });
  it('rolls over month and year ends', () => {
    expect(pullWindow('2026-03-02', null, ['2026-02-28']).putOn).toBe('2026-03-01');
    expect(pullWindow('2024-03-02', null, ['2024-02-28']).putOn).toBe('2024-02-29'); // leap year
  });
  it('falls back to the start of the season when the colony has no earlier pull', () => {
    expect(pullWindow('2026-07-20', null, [])).toEqual({
      putOn: '2026-01-01',
      pulled: '2026-07-20',
      putOnKnown: false,
    });
    // A season starting in July (southern hemisphere): a January pull belongs to the season begun last July.
    expect(pullWindow('2027-01-15', null, [], 7).putOn).toBe('2026-07-01');
  });
  // The season is not the calendar year: the window runs from the previous pull whatever the year.
  it('the season is not the calendar year: a January pull after a December pull is checked from the December pull', () => {
    const w = pullWindow('2027-01-15', null, ['2026-12-20']);
    expect(w.putOn).toBe('2026-12-21');
    const c = superConflicts(w, {
      feedings: [{ kind: 'sugar_syrup', startedOn: '2026-12-25', endedOn: '2026-12-26' }],
      treatments: [],
    });
    expect(c.flagged).toBe(true);
  });
  it('an unknown put-on date can only widen the check: spring syrup flags an unweighed first pull', () => {
    const w = pullWindow('2026-06-15', null, []);
    const c = superConflicts(w, {
      feedings: [{ kind: 'sugar_syrup', startedOn: '2026-03-10', endedOn: '2026-03-20' }],
      treatments: [],
    });
    expect(c.flagged).toBe(true);
    expect(flagReasons(w, c.reasons).at(-1)).toBe('Put-on date not recorded: checked from 2026-01-01');
  });
  it('adds no note to an unflagged super or a known window', () => {
    expect(flagReasons(pullWindow('2026-06-15', null, []), [])).toEqual([]);
    expect(flagReasons(pullWindow('2026-06-15', '2026-06-01', []), ['x'])).toEqual(['x']);
  });
});
