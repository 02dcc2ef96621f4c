import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { closeDb, getDb } from '@/lib/db/index';
import { getSeasonReport } from '@/lib/data/reports/yield-report';
import { seasonColonyTotals, superEstimatesFrom } from '@/lib/data/reports/yield-sql';
import {
  allocateLotTree,
  superHoneyGrams,
  DEFAULT_SUPER_ESTIMATES,
  type LotNode,
  type SuperDepth,
} from '@/lib/domain/yield-allocation';
import type { SessionUser } from '@/lib/auth/session';
import { buildFixture, type Fixture } from '@/tests/support/report-fixtures';

const SEASON = 2031;
let fx: Fixture;
const owner = (id: number): SessionUser => ({ id, name: 'Owner', email: 'owner@hollowmere.test', role: 'owner' });

beforeAll(async () => {
  fx = await buildFixture(SEASON, 'RY');
});
afterAll(closeDb);

/** The pure reference: every lot through allocateLotTree, supers summed per colony. */
async function pureColonyGrams(lotIds: number[], own: Map<number, number>) {
  const { sequelize } = getDb();
  const supers = await sequelize.query<{
    id: number;
    colonyId: number;
    lotId: number;
    full: number | null;
    empty: number | null;
    depth: SuperDepth;
    frames: number;
    capped: number | null;
  }>(
    `SELECT id, colony_id AS "colonyId", lot_id AS "lotId", full_grams AS full, empty_grams AS empty, depth, frame_count AS frames, capped_frames AS capped
     FROM super_pulls WHERE lot_id IS NOT NULL`,
    { type: QueryTypes.SELECT },
  );
  const parents = await sequelize.query<{ child: number; parent: number; grams: number }>(
    `SELECT child_lot_id AS child, parent_lot_id AS parent, grams FROM lot_parents`,
    { type: QueryTypes.SELECT },
  );
  const lotSet = new Set([...supers.map((s) => s.lotId), ...parents.flatMap((p) => [p.child, p.parent])]);
  const colonyOf = new Map(supers.map((s) => [String(s.id), s.colonyId]));
  const result = new Map<number, number>();
  const sharesPerColony = new Map<number, number>();
  for (const lotId of lotIds) {
    const nodes: LotNode[] = [...lotSet].map((id) => ({
      id: String(id),
      netGrams: own.get(id) ?? 0,
      supers: supers
        .filter((s) => s.lotId === id)
        .map((s) => ({
          id: String(s.id),
          grams: superHoneyGrams(
            { fullGrams: s.full, emptyGrams: s.empty, depth: s.depth, frameCount: s.frames, cappedFrames: s.capped },
            DEFAULT_SUPER_ESTIMATES,
          ).grams,
        })),
      parents: parents.filter((p) => p.child === id).map((p) => ({ lotId: String(p.parent), grams: p.grams })),
    }));
    for (const [superId, grams] of Object.entries(allocateLotTree(nodes, String(lotId)))) {
      const colonyId = colonyOf.get(superId)!;
      result.set(colonyId, (result.get(colonyId) ?? 0) + grams);
      sharesPerColony.set(colonyId, (sharesPerColony.get(colonyId) ?? 0) + 1);
    }
  }
  return { grams: result, shares: sharesPerColony };
}

describe('season report totals', () => {
  // A lot belongs to the season it was extracted in; one not yet extracted, to the season it was started in.
  const IN_2026 = (l: string) =>
    `EXTRACT(YEAR FROM COALESCE(${l}.extracted_on, (${l}.created_at AT TIME ZONE 'UTC')::date)) = 2026`;
  it('on the demo season: colonies + unattributed = lots own weight = Σ net − Σ given to blends', async () => {
    const { sequelize } = getDb();
    const [{ net, given }] = await sequelize.query<{ net: number; given: number }>(
      `SELECT (SELECT SUM(net_grams) FROM lots WHERE ${IN_2026('lots')})::bigint AS net,
              (SELECT COALESCE(SUM(lp.grams), 0) FROM lot_parents lp JOIN lots l ON l.id = lp.parent_lot_id
               WHERE ${IN_2026('l')})::bigint AS given`,
      { type: QueryTypes.SELECT },
    );
    expect(net).toBeGreaterThan(0);
    const report = (await getSeasonReport(owner(fx.owner), { season: 2026 }))!;
    expect(report.totals.lotGrams).toBe(net - given);
    expect(report.totals.honeyGrams + report.totals.unattributedGrams).toBe(report.totals.lotGrams);
    expect(report.colonies.length).toBeGreaterThan(20);
    expect(report.lots.some((l) => l.isBlend)).toBe(true);
  });

  it('adds up exactly to the sum of the lots own weights, blends counted once', async () => {
    const report = (await getSeasonReport(owner(fx.owner), { season: SEASON }))!;
    // own weight = net − given to blends: A 52 001 − 12 000, B 30 017 − 8 000, blend C 20 000, D 9 000
    expect(report.totals.lotGrams).toBe(40_001 + 22_017 + 20_000 + 9_000);
    expect(report.totals.unattributedGrams).toBe(0);
    expect(report.totals.honeyGrams).toBe(report.totals.lotGrams);
    expect(report.colonies.reduce((a, c) => a + c.honeyGrams, 0)).toBe(91_018);
    // Each lot's colony shares add up to the lot exactly.
    for (const lot of report.lots) {
      const shared = report.colonies.reduce((a, c) => a + (c.lotShares.find((s) => s.lotId === lot.id)?.grams ?? 0), 0);
      expect(shared).toBe(lot.ownGrams);
    }
  });

  it('matches the pure allocateLotTree per colony within 1 g per share', async () => {
    const report = (await getSeasonReport(owner(fx.owner), { season: SEASON }))!;
    const own = new Map(report.lots.map((l) => [l.id, l.ownGrams]));
    const pure = await pureColonyGrams(
      report.lots.map((l) => l.id),
      own,
    );
    for (const colonyId of [fx.c1, fx.c2, fx.c3]) {
      const row = report.colonies.find((c) => c.colonyId === colonyId)!;
      expect(Math.abs(row.honeyGrams - pure.grams.get(colonyId)!)).toBeLessThanOrEqual(pure.shares.get(colonyId)!);
    }
    expect(report.colonies.find((c) => c.colonyId === fx.c4)!.honeyGrams).toBe(0);
    expect([...pure.grams.values()].reduce((a, b) => a + b, 0)).toBe(report.totals.honeyGrams);
  });

  it('stays within 1 g and 1 cent per lot of the plain SQL aggregate (rounded once per colony)', async () => {
    const report = (await getSeasonReport(owner(fx.owner), { season: SEASON }))!;
    const plain = await seasonColonyTotals(SEASON, superEstimatesFrom({}));
    for (const colonyId of [fx.c1, fx.c2, fx.c3]) {
      const row = report.colonies.find((c) => c.colonyId === colonyId)!;
      const p = plain.find((x) => x.colonyId === colonyId)!;
      expect(Math.abs(row.honeyGrams - p.honeyGrams)).toBeLessThanOrEqual(row.lotShares.length);
      expect(Math.abs(row.revenueCents - p.revenueCents)).toBeLessThanOrEqual(report.lots.length);
    }
  });

  it('shares revenue of sold jars, less refunds, and ignores unpaid orders', async () => {
    const report = (await getSeasonReport(owner(fx.owner), { season: SEASON }))!;
    const lot = (id: number) => report.lots.find((l) => l.id === id)!;
    expect(lot(fx.lotA).revenueCents).toBe(3 * 1099); // the awaiting-payment order's reserved jars do not count
    expect(lot(fx.lotB).revenueCents).toBe(1099); // 2 jars, half the order refunded
    expect(lot(fx.lotC).revenueCents).toBe(1099);
    expect(report.totals.revenueCents).toBe(3 * 1099 + 1099 + 1099);
    // The blend's revenue goes back to A's and B's colonies; D's colony (c3) gets B's and C's part only.
    expect(report.colonies.find((c) => c.colonyId === fx.c4)!.revenueCents).toBe(0);
  });

  it('ranks colonies in their yard, lists the line and the colonies that made nothing', async () => {
    const report = (await getSeasonReport(owner(fx.owner), { season: SEASON }))!;
    const a1 = report.colonies.find((c) => c.colonyId === fx.c1)!;
    const a2 = report.colonies.find((c) => c.colonyId === fx.c2)!;
    expect(a1.rankInYard + a2.rankInYard).toBe(3);
    expect(a2.parentCode).toBe('RY-A1');
    expect(a1.splitCodes).toEqual(['RY-A2']);
    expect(report.lines.find((l) => l.lineCode === 'RY-A1')!.colonies.sort()).toEqual(['RY-A1', 'RY-A2']);
    expect(report.nothing.map((c) => c.code)).toContain('RY-B2');
    expect(a1.waterPct).toBe(17.2); // all its honey is lot A's (directly or through the blend)
  });
});
