import { describe, expect, it } from 'vitest';
import { superConflicts, supersAtRisk, type FeedingRecord, type TreatmentRecord } from '@/lib/domain/conflicts';

const onSuper = { putOn: '2026-05-10', pulled: '2026-07-20' };
const none = { feedings: [] as FeedingRecord[], treatments: [] as TreatmentRecord[] };

function treatment(over: Partial<TreatmentRecord>): TreatmentRecord {
  return {
    kindName: 'Formic acid',
    productName: null,
    supersAllowed: false,
    waitingDays: 0,
    appliedOn: '2026-04-01',
    removedOn: '2026-04-20',
    ...over,
  };
}

describe('superConflicts: feedings', () => {
  it('is clean without records', () => {
    expect(superConflicts(onSuper, none)).toEqual({ flagged: false, reasons: [] });
  });

  it('flags sugar syrup fed while the super was on, with dates', () => {
    const result = superConflicts(onSuper, {
      ...none,
      feedings: [{ kind: 'sugar_syrup', startedOn: '2026-05-02', endedOn: '2026-05-12' }],
    });
    expect(result.flagged).toBe(true);
    expect(result.reasons).toEqual(['Sugar syrup fed 2026-05-02 to 2026-05-12 while this super was on']);
  });

  it('counts both ends of a range (inclusive)', () => {
    const endsOnPutOn = { kind: 'fondant' as const, startedOn: '2026-05-01', endedOn: '2026-05-10' };
    const endsDayBefore = { kind: 'fondant' as const, startedOn: '2026-05-01', endedOn: '2026-05-09' };
    const startsOnPull = { kind: 'sugar_syrup' as const, startedOn: '2026-07-20', endedOn: '2026-07-30' };
    const startsDayAfter = { kind: 'sugar_syrup' as const, startedOn: '2026-07-21', endedOn: '2026-07-30' };
    expect(superConflicts(onSuper, { ...none, feedings: [endsOnPutOn] }).flagged).toBe(true);
    expect(superConflicts(onSuper, { ...none, feedings: [endsDayBefore] }).flagged).toBe(false);
    expect(superConflicts(onSuper, { ...none, feedings: [startsOnPull] }).flagged).toBe(true);
    expect(superConflicts(onSuper, { ...none, feedings: [startsDayAfter] }).flagged).toBe(false);
  });

  it('treats an open feeding as running through the pull date', () => {
    const open = superConflicts(onSuper, {
      ...none,
      feedings: [{ kind: 'fondant', startedOn: '2026-03-01', endedOn: null }],
    });
    expect(open.reasons).toEqual(['Fondant fed from 2026-03-01 (still ongoing) while this super was on']);
    const afterPull = superConflicts(onSuper, {
      ...none,
      feedings: [{ kind: 'fondant', startedOn: '2026-08-01', endedOn: null }],
    });
    expect(afterPull.flagged).toBe(false);
  });

  it('ignores pollen substitute and other feeds', () => {
    const feedings: FeedingRecord[] = [
      { kind: 'pollen_substitute', startedOn: '2026-05-01', endedOn: null },
      { kind: 'other', startedOn: '2026-06-01', endedOn: '2026-06-02' },
    ];
    expect(superConflicts(onSuper, { ...none, feedings }).flagged).toBe(false);
  });
});

describe('superConflicts: treatments', () => {
  it('flags a treatment whose waiting period reaches the super, naming it', () => {
    const t = treatment({ productName: 'Strip X', removedOn: '2026-04-26', waitingDays: 14 }); // ends 2026-05-10
    const result = superConflicts(onSuper, { ...none, treatments: [t] });
    expect(result.reasons).toEqual([
      'Formic acid (Strip X) applied 2026-04-01, removed 2026-04-26, waiting period to 2026-05-10 while this super was on; its label does not allow honey supers',
    ]);
  });

  it('clears when the waiting period ends the day before the super goes on', () => {
    const t = treatment({ removedOn: '2026-04-25', waitingDays: 14 }); // ends 2026-05-09
    expect(superConflicts(onSuper, { ...none, treatments: [t] }).flagged).toBe(false);
  });

  it('ignores a treatment whose label allows supers', () => {
    const t = treatment({ supersAllowed: true, appliedOn: '2026-06-01', removedOn: null });
    expect(superConflicts(onSuper, { ...none, treatments: [t] }).flagged).toBe(false);
  });

  it('treats a treatment still on as running through the pull date', () => {
    const t = treatment({ kindName: 'Oxalic acid', appliedOn: '2026-07-20', removedOn: null });
    expect(superConflicts(onSuper, { ...none, treatments: [t] }).reasons[0]).toBe(
      'Oxalic acid applied 2026-07-20 (still on) while this super was on; its label does not allow honey supers',
    );
  });

  it('crosses month and year ends by calendar days, not clock time', () => {
    const winterSuper = { putOn: '2027-01-01', pulled: '2027-01-31' };
    const t = treatment({ appliedOn: '2026-12-01', removedOn: '2026-12-30', waitingDays: 2 }); // ends 2027-01-01
    expect(superConflicts(winterSuper, { ...none, treatments: [t] }).reasons[0]).toContain(
      'waiting period to 2027-01-01',
    );
  });

  it('collects every reason', () => {
    const result = superConflicts(onSuper, {
      feedings: [{ kind: 'sugar_syrup', startedOn: '2026-06-01', endedOn: '2026-06-03' }],
      treatments: [treatment({ appliedOn: '2026-07-01', removedOn: '2026-07-05' })],
    });
    expect(result.flagged).toBe(true);
    expect(result.reasons).toHaveLength(2);
  });
});

describe('superConflicts: bad input', () => {
  it('throws on malformed or impossible dates and reversed ranges', () => {
    expect(() => superConflicts({ putOn: '10/05/2026', pulled: '2026-07-20' }, none)).toThrow(RangeError);
    expect(() => superConflicts({ putOn: '2026-02-30', pulled: '2026-07-20' }, none)).toThrow(RangeError);
    expect(() => superConflicts({ putOn: '2026-07-21', pulled: '2026-07-20' }, none)).toThrow(RangeError);
    expect(() => superConflicts(onSuper, { ...none, treatments: [treatment({ waitingDays: -1 })] })).toThrow(
      RangeError,
    );
  });
});

describe('supersAtRisk: warn while recording a feeding or treatment over supers on the hive', () => {
  const on = [
    { id: 1, tagCode: 'WT-0001', depth: 'medium', putOnOn: '2026-06-01' },
    { id: 2, tagCode: null, depth: 'deep', putOnOn: '2026-06-01' },
    { id: 3, tagCode: 'WT-0003', depth: 'medium', putOnOn: '2026-08-01' },
  ];
  it('sugar syrup names every super on during the feeding, tag or depth and put-on day', () => {
    const r = supersAtRisk({ feeding: { kind: 'sugar_syrup', startedOn: '2026-07-01', endedOn: '2026-07-05' } }, on);
    expect(r?.supers.map((s) => s.label)).toEqual(['super WT-0001', 'untagged deep super put on 2026-06-01']);
    expect(r?.reason).toBe('Sugar syrup fed 2026-07-01 to 2026-07-05 while this super was on');
  });
  it('a feeding still going on reaches supers put on later', () => {
    const r = supersAtRisk({ feeding: { kind: 'fondant', startedOn: '2026-07-01', endedOn: null } }, on);
    expect(r?.supers.map((s) => s.id)).toEqual([1, 2, 3]);
  });
  it('pollen substitute and a treatment the label allows with supers do not warn', () => {
    expect(
      supersAtRisk({ feeding: { kind: 'pollen_substitute', startedOn: '2026-07-01', endedOn: null } }, on),
    ).toBeNull();
    const allowed = {
      kindName: 'Allowed',
      supersAllowed: true,
      waitingDays: 0,
      appliedOn: '2026-07-01',
      removedOn: null,
    };
    expect(supersAtRisk({ treatment: allowed }, on)).toBeNull();
  });
  it('a treatment whose label forbids supers counts through its waiting period', () => {
    const t = {
      kindName: 'Strip',
      supersAllowed: false,
      waitingDays: 30,
      appliedOn: '2026-06-20',
      removedOn: '2026-07-05',
    };
    expect(supersAtRisk({ treatment: t }, on)?.supers.map((s) => s.id)).toEqual([1, 2, 3]);
    expect(supersAtRisk({ treatment: { ...t, waitingDays: 0 } }, on)?.supers.map((s) => s.id)).toEqual([1, 2]);
  });
});
