import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { closeDb, getDb } from '@/lib/db/index';
import { DEMO, setRequestHeaders, signInAs } from '@/tests/support/session';
import { yardFixture, key, printTags } from '@/tests/support/yard-fixtures';
import { recordPullsAction } from '@/app/(back-office)/admin/yards/actions';
import {
  addFeedingAction,
  addTreatmentAction,
  endTreatmentAction,
  superOnAction,
} from '@/app/(back-office)/admin/colonies/actions';
import { POST as postPulls } from '@/app/api/super-pulls/route';

afterAll(closeDb);
beforeEach(() => setRequestHeaders({}));

let f: Awaited<ReturnType<typeof yardFixture>>;
beforeAll(async () => {
  f = await yardFixture('PUL');
  await printTags('PUL-T1', 'PUL-T2', 'PUL-T9');
});

const entry = (colonyId: number, extra: Record<string, unknown> = {}) => ({
  colonyId,
  pulledOn: '2026-07-10',
  depth: 'medium' as const,
  frameCount: 10,
  idempotencyKey: key(),
  ...extra,
});

describe('idempotent pull entry', () => {
  it('a double tap or a retry with the same key records one super', async () => {
    await signInAs(DEMO.keeper);
    const e = entry(f.a1, { weight: 55, weightUnit: 'lb' });
    const first = await recordPullsAction({ entries: [e] });
    const again = await recordPullsAction({ entries: [e] });
    const [x, y] = await Promise.all([recordPullsAction({ entries: [e] }), recordPullsAction({ entries: [e] })]);
    const body = JSON.stringify({ entries: [e] });
    const viaApi = await postPulls(new Request('http://127.0.0.1:3100/api/super-pulls', { method: 'POST', body }));
    expect(viaApi.status).toBe(200);
    const rows = await getDb().models.SuperPull.findAll({ where: { idempotencyKey: e.idempotencyKey } });
    expect(rows).toHaveLength(1);
    expect(rows[0].fullGrams).toBe(24948); // 55 lb × 453.59237 g = 24 947.58 g → 24 948
    for (const r of [first, again, x, y]) expect(r.ok && r.data.results[0]).toMatchObject({ ok: true, id: rows[0].id });
    expect(first.ok && first.data.results[0]).toMatchObject({ created: true });
    expect(again.ok && again.data.results[0]).toMatchObject({ created: false });
  });

  it('two concurrent copies of a new entry still make one row (unique index)', async () => {
    await signInAs(DEMO.keeper);
    const e = entry(f.a2);
    await Promise.all(Array.from({ length: 5 }, () => recordPullsAction({ entries: [e] })));
    expect(await getDb().models.SuperPull.count({ where: { idempotencyKey: e.idempotencyKey } })).toBe(1);
  });

  it('pulling closes the super that was put on, keeping its put-on date', async () => {
    await signInAs(DEMO.keeper);
    const on = await superOnAction({
      colonyId: f.a3,
      depth: 'shallow',
      frameCount: 8,
      tagCode: 'PUL-T1',
      putOnOn: '2026-06-01',
      idempotencyKey: key(),
    });
    expect(on.ok).toBe(true);
    const r = await recordPullsAction({
      entries: [entry(f.a3, { depth: 'shallow', frameCount: 8, pulledOn: '2026-06-20', cappedFrames: 7 })],
    });
    expect(r.ok && r.data.results[0]).toMatchObject({ ok: true, id: on.ok ? on.data.id : -1 });
    const row = await getDb().models.SuperPull.findByPk(on.ok ? on.data.id : -1);
    expect(row).toMatchObject({ putOnOn: '2026-06-01', pulledOn: '2026-06-20', tagCode: 'PUL-T1', cappedFrames: 7 });
  });

  it('a late retry of the put-on after the pull finds the same super; a pull retry too (no second super)', async () => {
    await signInAs(DEMO.keeper);
    const onInput = {
      colonyId: f.a3,
      depth: 'medium' as const,
      frameCount: 10,
      tagCode: 'PUL-T9',
      putOnOn: '2026-06-02',
      idempotencyKey: key(),
    };
    const on = await superOnAction(onInput);
    const pull = entry(f.a3, { pulledOn: '2026-06-28', tagCode: 'PUL-T9' });
    const pulled = await recordPullsAction({ entries: [pull] });
    const id = on.ok ? on.data.id : -1;
    expect(pulled.ok && pulled.data.results[0]).toMatchObject({ ok: true, id, created: true });
    // The phone never heard back from the put-on and sends it again, after the pull went through.
    const retriedOn = await superOnAction(onInput);
    expect(retriedOn.ok && retriedOn.data.id).toBe(id);
    const retriedPull = await recordPullsAction({ entries: [pull] });
    expect(retriedPull.ok && retriedPull.data.results[0]).toMatchObject({ ok: true, id, created: false });
    const rows = await getDb().models.SuperPull.findAll({ where: { colonyId: f.a3, tagCode: 'PUL-T9' } });
    expect(rows.map((r) => ({ id: r.id, pulledOn: r.pulledOn }))).toEqual([{ id, pulledOn: '2026-06-28' }]);
  });
});

describe('conflict flags', () => {
  it('a super pulled after sugar syrup while it was on is flagged with the reason', async () => {
    await signInAs(DEMO.keeper);
    expect(
      (
        await addFeedingAction({
          colonyId: f.a3,
          kind: 'sugar_syrup',
          amount: '2 L 1:1',
          startedOn: '2026-07-02',
          endedOn: '2026-07-05',
          idempotencyKey: key(),
        })
      ).ok,
    ).toBe(true);
    await superOnAction({
      colonyId: f.a3,
      depth: 'medium',
      frameCount: 10,
      tagCode: 'PUL-T2',
      putOnOn: '2026-06-25',
      idempotencyKey: key(),
    });
    const r = await recordPullsAction({ entries: [entry(f.a3, { pulledOn: '2026-07-15' })] });
    const result = r.ok ? r.data.results[0] : null;
    expect(result).toMatchObject({ ok: true, flagged: true });
    expect(result && 'flagReasons' in result ? result.flagReasons : []).toEqual([
      'Sugar syrup fed 2026-07-02 to 2026-07-05 while this super was on',
    ]);
  });

  it('an unrelated pollen feeding does not flag', async () => {
    await signInAs(DEMO.keeper);
    await addFeedingAction({
      colonyId: f.a2,
      kind: 'pollen_substitute',
      startedOn: '2026-07-12',
      idempotencyKey: key(),
    });
    const r = await recordPullsAction({ entries: [entry(f.a2, { pulledOn: '2026-07-20' })] });
    expect(r.ok && r.data.results[0]).toMatchObject({ ok: true, flagged: false });
  });

  it('a treatment recorded later re-flags supers already pulled; ending it earlier clears the flag', async () => {
    await signInAs(DEMO.keeper);
    const on = await superOnAction({
      colonyId: f.a1,
      depth: 'deep',
      frameCount: 10,
      putOnOn: '2026-08-01',
      idempotencyKey: key(),
    });
    await recordPullsAction({ entries: [entry(f.a1, { depth: 'deep', pulledOn: '2026-08-20' })] });
    const id = on.ok ? on.data.id : -1;
    const { SuperPull } = getDb().models;
    expect((await SuperPull.findByPk(id))?.flagged).toBe(false);
    const t = await addTreatmentAction({
      colonyId: f.a1,
      treatmentKindId: f.noSupersKindId,
      productName: 'Strip X',
      appliedOn: '2026-07-01',
      idempotencyKey: key(),
    });
    expect(t).toMatchObject({ ok: true });
    const flagged = await SuperPull.findByPk(id);
    expect(flagged?.flagged).toBe(true);
    expect(flagged?.flagReasons[0]).toMatch(/No supers PUL \(Strip X\) applied 2026-07-01 \(still on\)/);
    // Removed 2026-07-20 + 7 waiting days = 2026-07-27, before the super went on (2026-08-01): no conflict.
    const treatment = await getDb().models.Treatment.findOne({ where: { colonyId: f.a1, productName: 'Strip X' } });
    expect((await endTreatmentAction({ colonyId: f.a1, treatmentId: treatment!.id, removedOn: '2026-07-20' })).ok).toBe(
      true,
    );
    expect((await SuperPull.findByPk(id))?.flagged).toBe(false);
  });
});
