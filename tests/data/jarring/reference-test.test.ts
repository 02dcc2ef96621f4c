import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb, getDb } from '@/lib/db/index';
import { DEMO, signInAs } from '@/tests/support/session';
import { createJarringRunAction } from '@/app/(back-office)/admin/jarring/actions';
import { getJarringRun } from '@/lib/data/jarring/read';
import { key, product, releasedLot, samples, weighed } from '@/tests/support/jarring-fixtures';

afterAll(closeDb);

// Council Directive 76/211/EEC Annex II: the run's jar count is the batch. Qn 340 g → TNE 3 % = 10.2 g
// (Annex I), T1 = 329.8 g, T2 = 319.6 g. A batch of 100–500 takes a first sample of 30 (accept ≤ 1,
// reject ≥ 3 below T1) and, in between, a second sample of 30 (60 in all: accept ≤ 4, reject ≥ 5).
const REF = 'Reference test (76/211/EEC Annex II)';
const PRODUCER = 'Producer’s check';

async function run(jarCount: number, typed: string) {
  const lot = await releasedLot(100_000);
  const jar = await product({ netGrams: 340 });
  const res = await createJarringRunAction({
    lotId: lot.id,
    productId: jar.id,
    jarCount,
    runOn: '2026-09-03',
    sampleMode: 'net',
    samples: typed,
    idempotencyKey: key(),
  });
  if (!res.ok) throw new Error(res.message);
  const stock = await getDb().models.StockLevel.findOne({ where: { productId: jar.id, lotId: lot.id } });
  return { ...res.data, onHand: stock?.onHand ?? 0 };
}

describe('jarring run judged by the 76/211/EEC Annex II reference test (EU/OIML rule set)', () => {
  beforeAll(async () => {
    await signInAs(DEMO.crew);
    await getDb().models.BusinessSetting.update({ fillRuleSet: 'oiml', expectedLossPct: 2 }, { where: { id: 1 } });
  });

  it('a batch of 200 with a first sample of 30 good jars is accepted and goes into stock', async () => {
    const r = await run(200, weighed(30, 342, 343, 341, 344));
    expect(r).toMatchObject({ pass: true, stocked: true, reasons: [] });
    expect(r.onHand).toBe(200);
    expect(r.checks.map((c) => [c.name, c.pass])).toEqual([
      [REF, true],
      [PRODUCER, true],
    ]);
    expect(r.checks[0].summary).toMatch(/^accept — 30 of 30 jars weighed, 0 below T1, mean 342\.5 g > limit 339\.4 g$/);
    expect(r.checks[1].summary).toBe('pass');
    // the run screen reads the same named checks back
    const crew = await getDb().models.User.findOne({ where: { email: DEMO.crew } });
    const row = await getJarringRun({ id: crew!.id, name: crew!.name, email: crew!.email, role: 'crew' }, r.runId);
    expect(row?.checks.map((c) => `${c.name}: ${c.summary}`)).toEqual(r.checks.map((c) => `${c.name}: ${c.summary}`));
  });

  it('too few jars weighed for a batch of 200: asks for 30 and puts nothing in stock, though the producer’s check passes', async () => {
    const r = await run(200, weighed(12, 342, 343));
    expect(r).toMatchObject({ pass: false, stocked: false });
    expect(r.onHand).toBe(0);
    expect(r.checks.map((c) => [c.name, c.pass])).toEqual([
      [REF, false],
      [PRODUCER, true],
    ]);
    expect(r.checks[0].summary).toBe('weigh-more — 12 of 30 jars weighed, 0 below T1');
    expect(r.reasons).toEqual([`${REF}: Weigh 30 jars for the first sample: 12 weighed`]);
  });

  it('a batch under 100 is weighed whole: 24 jars with 3 weighed is not stocked', async () => {
    const r = await run(24, samples(342, 344, 341));
    expect(r).toMatchObject({ pass: false, stocked: false });
    expect(r.checks[0].summary).toBe('weigh-more — 3 of 24 jars weighed, 0 below T1');
  });

  it('second sample: 2 of the first 30 below T1 call for 30 more; with 60 weighed the reference test accepts', async () => {
    const first = [...weighed(28, 343, 344, 342).split(', ').map(Number), 328, 327];
    const r1 = await run(200, samples(...first));
    expect(r1).toMatchObject({ pass: false, stocked: false });
    expect(r1.onHand).toBe(0);
    expect(r1.checks[0].summary).toMatch(/^weigh-more — 30 of 60 jars weighed, 2 below T1, mean 342\.\d g > limit/);
    expect(r1.reasons.join(' ')).toMatch(/weigh a second sample of 30 \(30 of 60 weighed\)/);

    // 60 jars, still 2 below T1 (≤ 4 accepts). The producer's own check allows floor(2.5 % × 60) = 1
    // below T1, so it fails: the run is flagged for the owner, both results named.
    const r2 = await run(200, samples(...first, ...weighed(30, 342, 343, 344).split(', ').map(Number)));
    expect(r2.checks.map((c) => [c.name, c.pass])).toEqual([
      [REF, true],
      [PRODUCER, false],
    ]);
    expect(r2.checks[0].summary).toMatch(/^accept — 60 of 60 jars weighed, 2 below T1, mean 342\.\d g > limit/);
    expect(r2).toMatchObject({ pass: false, stocked: false });
    expect(r2.reasons.join(' ')).toMatch(
      /^Producer’s check: 2 of 60 jars are below T1 \(329\.8 g\); at most 1 allowed$/,
    );

    // 80 jars: the reference test counts the first 60 (2 below T1) and the producer's check allows 2 of 80.
    const r3 = await run(200, samples(...first, ...weighed(50, 342, 343, 344).split(', ').map(Number)));
    expect(r3).toMatchObject({ pass: true, stocked: true });
    expect(r3.onHand).toBe(200);
  });

  it('a jar below T2 rejects the batch whatever the count', async () => {
    const r = await run(200, samples(...weighed(29, 343, 344).split(', ').map(Number), 319));
    expect(r.checks[0].pass).toBe(false);
    expect(r.checks[0].summary).toMatch(/^reject — 30 of 30 jars weighed, 1 below T1, 1 below T2/);
    expect(r.stocked).toBe(false);
  });
});
