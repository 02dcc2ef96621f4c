import { describe, expect, it } from 'vitest';
import { LOT_STAGES, nextStage, type LotStage, type StageContext } from '@/lib/domain/lot-stage';

const good: StageContext = {
  role: 'crew',
  hasWeights: true,
  moistureOk: true,
  labOk: null,
  unresolvedFlaggedSupers: 0,
  remainingGrams: 0,
};
const ctx = (over: Partial<StageContext>): StageContext => ({ ...good, ...over });

describe('nextStage: the stages', () => {
  it('lists the stages in order', () => {
    expect(LOT_STAGES).toEqual(['gathering', 'extracted', 'released', 'packed_out', 'held']); // docs/trade-rules.md, "Lot stages"
  });
});

describe('gathering → extracted', () => {
  it('needs weights', () => {
    expect(nextStage('gathering', 'extracted', good)).toEqual({ ok: true, stage: 'extracted' });
    expect(nextStage('gathering', 'extracted', ctx({ hasWeights: false })).ok).toBe(false);
  });
});

describe('extracted → released', () => {
  it('releases when every check passes', () => {
    expect(nextStage('extracted', 'released', good)).toEqual({ ok: true, stage: 'released' });
    expect(nextStage('extracted', 'released', ctx({ labOk: true, role: 'owner' }))).toEqual({
      ok: true,
      stage: 'released',
    });
  });

  it('refuses without a moisture reading', () => {
    const result = nextStage('extracted', 'released', ctx({ moistureOk: null }));
    expect(result).toEqual({ ok: false, error: 'Record a moisture reading before releasing the lot' });
  });

  it('holds the lot for each failed check, listing every reason', () => {
    // a lot is held whenever a check fails (moisture over the limit, a treatment or feeding conflict)
    expect(nextStage('extracted', 'released', ctx({ moistureOk: false }))).toEqual({
      ok: true,
      stage: 'held',
      holdReasons: ['Moisture is over the limit'],
    });
    expect(nextStage('extracted', 'released', ctx({ labOk: false }))).toEqual({
      ok: true,
      stage: 'held',
      holdReasons: ['Lab results fail the limits'],
    });
    expect(nextStage('extracted', 'released', ctx({ unresolvedFlaggedSupers: 1 }))).toEqual({
      ok: true,
      stage: 'held',
      holdReasons: ['1 super flagged for a feeding or treatment conflict, not resolved'],
    });
    const all = nextStage(
      'extracted',
      'released',
      ctx({ moistureOk: false, labOk: false, unresolvedFlaggedSupers: 3 }),
    );
    expect(all.ok && all.holdReasons).toHaveLength(3);
  });
});

describe('leaving held', () => {
  it('lets only the owner out, with a written reason', () => {
    // leaving held needs the owner and a written reason
    const reason = 'Re-tested at 18.2 %';
    expect(nextStage('held', 'released', ctx({ role: 'owner', reason }))).toEqual({ ok: true, stage: 'released' });
    expect(nextStage('held', 'extracted', ctx({ role: 'owner', reason }))).toEqual({ ok: true, stage: 'extracted' });
    expect(nextStage('held', 'released', ctx({ role: 'crew', reason })).ok).toBe(false);
    expect(nextStage('held', 'released', ctx({ role: 'owner', reason: '  ok  ' })).ok).toBe(false);
    expect(nextStage('held', 'released', ctx({ role: 'owner' })).ok).toBe(false);
    expect(nextStage('held', 'extracted', ctx({ role: 'owner', reason: 'abcd' })).ok).toBe(false);
    expect(nextStage('held', 'extracted', ctx({ role: 'owner', reason: 'abcde' })).ok).toBe(true);
  });

  it('does not go from held to gathering or packed out', () => {
    expect(nextStage('held', 'gathering', ctx({ role: 'owner', reason: 'start over' })).ok).toBe(false);
    expect(nextStage('held', 'packed_out', ctx({ role: 'owner', reason: 'all sold' })).ok).toBe(false);
  });
});

describe('released → packed_out', () => {
  it('only when no honey is left', () => {
    expect(nextStage('released', 'packed_out', ctx({ remainingGrams: 0 }))).toEqual({ ok: true, stage: 'packed_out' });
    expect(nextStage('released', 'packed_out', ctx({ remainingGrams: -3 })).ok).toBe(true);
    expect(nextStage('released', 'packed_out', ctx({ remainingGrams: 1 })).ok).toBe(false);
  });
});

describe('any stage → held', () => {
  it.each(['gathering', 'extracted', 'released', 'packed_out'] as const)(
    'from %s for owner and crew with a reason',
    (from) => {
      for (const role of ['owner', 'crew'] as const) {
        expect(nextStage(from, 'held', ctx({ role, reason: 'Customer complaint' }))).toEqual({
          ok: true,
          stage: 'held',
        });
        expect(nextStage(from, 'held', ctx({ role })).ok).toBe(false);
      }
    },
  );
});

describe('everything else is refused', () => {
  const allowed = new Set([
    'gathering>extracted',
    'extracted>released',
    'held>released',
    'held>extracted',
    'released>packed_out',
    'gathering>held',
    'extracted>held',
    'released>held',
    'packed_out>held',
  ]);
  const owner = ctx({ role: 'owner', reason: 'a long enough reason' });

  it('refuses every pair not in the table, even for the owner', () => {
    for (const from of LOT_STAGES) {
      for (const to of LOT_STAGES) {
        const result = nextStage(from, to as LotStage, owner);
        expect(result.ok, `${from} → ${to}`).toBe(allowed.has(`${from}>${to}`));
      }
    }
  });

  it('never lets keepers or customers move a lot', () => {
    for (const role of ['keeper', 'customer'] as const) {
      for (const from of LOT_STAGES) {
        for (const to of LOT_STAGES) {
          const result = nextStage(from, to, ctx({ role, reason: 'a long enough reason' }));
          expect(result.ok, `${role}: ${from} → ${to}`).toBe(false);
        }
      }
    }
  });

  it('says the lot is already there', () => {
    expect(nextStage('released', 'released', good)).toEqual({ ok: false, error: 'The lot is already released' });
  });
});
