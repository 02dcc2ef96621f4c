import { describe, expect, it } from 'vitest';
import {
  DEFAULT_SUPER_ESTIMATES,
  NOT_ATTRIBUTED,
  allocateByWeight,
  allocateLotTree,
  allocateRevenue,
  roundLotShares,
  superHoneyGrams,
  type LotNode,
} from '@/lib/domain/yield-allocation';
import { GRAMS_PER_POUND } from '@/lib/domain/units';

const sum = (r: Record<string, number>) => Object.values(r).reduce((a, b) => a + b, 0);

describe('allocateByWeight', () => {
  it('adds up exactly and stays within 1 g of the proportional share', () => {
    const shares = [
      { id: 'a', grams: 12_473 },
      { id: 'b', grams: 17_011 },
      { id: 'c', grams: 29_483 },
      { id: 'd', grams: 7 },
    ];
    const weightSum = shares.reduce((a, s) => a + s.grams, 0);
    for (const total of [0, 1, 3, 999, 58_974, 123_457]) {
      const result = allocateByWeight(total, shares);
      expect(sum(result)).toBe(total);
      for (const s of shares) {
        expect(Number.isInteger(result[s.id])).toBe(true);
        expect(Math.abs(result[s.id] - (total * s.grams) / weightSum)).toBeLessThan(1);
      }
    }
  });

  it('gives leftovers to the largest remainders (Hamilton)', () => {
    // 11 split 1:1:1:2 → quotas 2.2, 2.2, 2.2, 4.4; floors add to 10; the one left goes to d (remainder 0.4)
    expect(
      allocateByWeight(11, [
        { id: 'a', grams: 1 },
        { id: 'b', grams: 1 },
        { id: 'c', grams: 1 },
        { id: 'd', grams: 2 },
      ]),
    ).toEqual({ a: 2, b: 2, c: 2, d: 5 });
  });

  it('breaks ties by id, whatever the input order', () => {
    const shares = [
      { id: 'z', grams: 5 },
      { id: 'm', grams: 5 },
      { id: 'a', grams: 5 },
    ];
    expect(allocateByWeight(10, shares)).toEqual({ a: 4, m: 3, z: 3 });
    expect(allocateByWeight(10, [...shares].reverse())).toEqual({ a: 4, m: 3, z: 3 });
  });

  it('gives zero-weight shares 0 and keeps them in the result', () => {
    expect(
      allocateByWeight(100, [
        { id: 'a', grams: 0 },
        { id: 'b', grams: 40 },
        { id: 'c', grams: -5 },
      ]),
    ).toEqual({ a: 0, b: 100, c: 0 });
  });

  it('handles one share', () => {
    expect(allocateByWeight(26_000, [{ id: 'only', grams: 1 }])).toEqual({ only: 26_000 });
  });

  it('throws with nothing to weigh by or a bad total', () => {
    expect(() => allocateByWeight(10, [])).toThrow(RangeError);
    expect(() => allocateByWeight(10, [{ id: 'a', grams: 0 }])).toThrow(RangeError);
    expect(() => allocateByWeight(10.5, [{ id: 'a', grams: 1 }])).toThrow(RangeError);
    expect(() => allocateByWeight(-1, [{ id: 'a', grams: 1 }])).toThrow(RangeError);
    expect(() =>
      allocateByWeight(10, [
        { id: 'a', grams: 1 },
        { id: 'a', grams: 2 },
      ]),
    ).toThrow(RangeError);
  });

  it('shares revenue the same way, in cents', () => {
    const shares = [
      { id: 'a', grams: 3 },
      { id: 'b', grams: 3 },
      { id: 'c', grams: 3 },
    ];
    expect(allocateRevenue(10_000, shares)).toEqual(allocateByWeight(10_000, shares));
    expect(sum(allocateRevenue(10_000, shares))).toBe(10_000);
  });
});

describe('superHoneyGrams', () => {
  it('uses the midpoints of the common-practice ranges for the estimates', () => {
    // common practice (trade rules of thumb): per full super shallow 25–30 lb, medium 35–40 lb, deep 60–70 lb
    expect(DEFAULT_SUPER_ESTIMATES.shallow).toEqual({
      gramsPerBox: Math.round(27.5 * GRAMS_PER_POUND),
      framesPerBox: 10,
    });
    expect(DEFAULT_SUPER_ESTIMATES.medium).toEqual({
      gramsPerBox: Math.round(37.5 * GRAMS_PER_POUND),
      framesPerBox: 10,
    });
    expect(DEFAULT_SUPER_ESTIMATES.deep).toEqual({ gramsPerBox: Math.round(65 * GRAMS_PER_POUND), framesPerBox: 10 });
  });

  it('measures full − empty when both are weighed', () => {
    expect(
      superHoneyGrams({ fullGrams: 24_000, emptyGrams: 6_500, depth: 'medium', frameCount: 10, cappedFrames: 4 }),
    ).toEqual({ grams: 17_500, measured: true });
  });

  it('estimates an unweighed super from capped frames, else the frame count', () => {
    const perFrame = DEFAULT_SUPER_ESTIMATES.medium.gramsPerBox / 10;
    expect(
      superHoneyGrams({ fullGrams: 24_000, emptyGrams: null, depth: 'medium', frameCount: 10, cappedFrames: 6 }),
    ).toEqual({ grams: Math.round(perFrame * 6), measured: false });
    expect(
      superHoneyGrams({ fullGrams: null, emptyGrams: null, depth: 'shallow', frameCount: 8, cappedFrames: null }),
    ).toEqual({ grams: Math.round((DEFAULT_SUPER_ESTIMATES.shallow.gramsPerBox / 10) * 8), measured: false });
  });

  it('does not trust a reversed or zero weighing', () => {
    expect(
      superHoneyGrams({ fullGrams: 5_000, emptyGrams: 6_000, depth: 'deep', frameCount: 10, cappedFrames: null })
        .measured,
    ).toBe(false);
    expect(
      superHoneyGrams({ fullGrams: 20_000, emptyGrams: 0, depth: 'deep', frameCount: 10, cappedFrames: null }).measured,
    ).toBe(false);
  });

  it('takes owner estimates and caps capped frames at the frame count', () => {
    const own = { ...DEFAULT_SUPER_ESTIMATES, deep: { gramsPerBox: 30_000, framesPerBox: 10 } };
    expect(
      superHoneyGrams({ fullGrams: null, emptyGrams: null, depth: 'deep', frameCount: 10, cappedFrames: 12 }, own)
        .grams,
    ).toBe(30_000);
  });
});

describe('allocateLotTree', () => {
  const lotA: LotNode = {
    id: 'A',
    netGrams: 50_000,
    supers: [
      { id: 's1', grams: 20_000 },
      { id: 's2', grams: 10_000 },
    ],
    parents: [],
  };
  const lotB: LotNode = { id: 'B', netGrams: 30_000, supers: [{ id: 's3', grams: 15_000 }], parents: [] };
  const blend: LotNode = {
    id: 'C',
    netGrams: 39_999,
    supers: [],
    parents: [
      { lotId: 'A', grams: 30_000 },
      { lotId: 'B', grams: 10_000 },
    ],
  };

  it('shares a plain lot to its supers', () => {
    expect(allocateLotTree([lotA], 'A')).toEqual({ s1: 33_333, s2: 16_667 });
  });

  it('passes a blend through its parents in proportion to the grams taken', () => {
    const result = allocateLotTree([lotA, lotB, blend], 'C');
    expect(sum(result)).toBe(39_999);
    // exact: A gets 29 999.25 → s1 2/3, s2 1/3; B gets 9 999.75 → s3
    expect(Math.abs(result.s1 - (39_999 * 0.75 * 2) / 3)).toBeLessThan(2);
    expect(Math.abs(result.s2 - (39_999 * 0.75) / 3)).toBeLessThan(2);
    expect(Math.abs(result.s3 - 39_999 * 0.25)).toBeLessThan(1);
  });

  it('adds up through a blend of blends, with a super reached twice', () => {
    const d: LotNode = {
      id: 'D',
      netGrams: 12_345,
      supers: [{ id: 's4', grams: 5_000 }],
      parents: [
        { lotId: 'C', grams: 7_000 },
        { lotId: 'A', grams: 3_000 },
      ],
    };
    const result = allocateLotTree([lotA, lotB, blend, d], 'D');
    expect(sum(result)).toBe(12_345);
    expect(Object.keys(result).sort()).toEqual(['s1', 's2', 's3', 's4']);
  });

  it('throws on an unknown lot, a cycle or nothing to share to', () => {
    expect(() => allocateLotTree([lotA], 'X')).toThrow(RangeError);
    const loop1: LotNode = { id: 'L1', netGrams: 10, supers: [], parents: [{ lotId: 'L2', grams: 1 }] };
    const loop2: LotNode = { id: 'L2', netGrams: 10, supers: [], parents: [{ lotId: 'L1', grams: 1 }] };
    expect(() => allocateLotTree([loop1, loop2], 'L1')).toThrow(/own ancestor/);
    expect(() =>
      allocateLotTree([{ id: 'E', netGrams: 100, supers: [{ id: 'x', grams: 0 }], parents: [] }], 'E'),
    ).toThrow(RangeError);
  });
});

describe('a lot with weighed and unweighed supers', () => {
  const est = (frames: number) =>
    superHoneyGrams({ fullGrams: null, emptyGrams: null, depth: 'medium', frameCount: 10, cappedFrames: frames }).grams;
  it('shares by measured honey and estimates together, exactly', () => {
    const supers = [
      {
        id: 'w1',
        grams: superHoneyGrams({
          fullGrams: 25_000,
          emptyGrams: 7_000,
          depth: 'medium',
          frameCount: 10,
          cappedFrames: null,
        }).grams,
      },
      { id: 'u1', grams: est(5) },
      { id: 'u2', grams: est(10) },
    ];
    const lot: LotNode = { id: 'L', netGrams: 40_003, supers, parents: [] };
    const result = allocateLotTree([lot], 'L');
    expect(sum(result)).toBe(40_003);
    const weightSum = supers.reduce((a, s) => a + s.grams, 0);
    for (const s of supers) expect(Math.abs(result[s.id] - (40_003 * s.grams) / weightSum)).toBeLessThan(1);
    expect(result.u2 - 2 * result.u1).toBeLessThanOrEqual(2); // 10 capped frames ≈ twice 5
  });

  it('gives a lot with one super all of it, whatever the super weighs', () => {
    expect(
      allocateLotTree([{ id: 'L', netGrams: 17_777, supers: [{ id: 'only', grams: est(3) }], parents: [] }], 'L'),
    ).toEqual({ only: 17_777 });
  });

  it("shares a blend's revenue back through its parents like its weight", () => {
    const a: LotNode = {
      id: 'A',
      netGrams: 0,
      supers: [
        { id: 's1', grams: 3 },
        { id: 's2', grams: 1 },
      ],
      parents: [],
    };
    const blend: LotNode = { id: 'C', netGrams: 10_001, supers: [], parents: [{ lotId: 'A', grams: 1 }] };
    const cents = allocateLotTree([a, { ...blend, netGrams: 2_199 }], 'C');
    expect(sum(cents)).toBe(2_199);
    expect(cents).toEqual({ s1: 1_649, s2: 550 }); // 2 199 × ¾ = 1 649.25, × ¼ = 549.75
  });
});

describe('roundLotShares', () => {
  it('rounds exact colony fractions to whole grams and cents that add up to the lot', () => {
    const shares = [
      { id: '1', frac: 0.5 },
      { id: '2', frac: 1 / 3 },
      { id: '3', frac: 1 / 6 },
    ];
    const { grams, cents } = roundLotShares(10_001, 1_099, shares);
    expect(sum(grams)).toBe(10_001);
    expect(sum(cents)).toBe(1_099);
    expect(grams).toEqual({ '1': 5_000, '2': 3_334, '3': 1_667 }); // 5000.5, 3333.67, 1666.83: the two left go to remainders .83 and .67
    expect(Object.keys(grams)).not.toContain(NOT_ATTRIBUTED);
  });

  it('keeps a part that reaches no super apart instead of pushing it onto the others', () => {
    const { grams } = roundLotShares(1_000, 0, [{ id: '1', frac: 0.25 }]);
    expect(grams).toEqual({ '1': 250, [NOT_ATTRIBUTED]: 750 });
    expect(roundLotShares(500, 0, []).grams).toEqual({ [NOT_ATTRIBUTED]: 500 });
  });
});
