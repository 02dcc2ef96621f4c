import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { closeDb, getDb } from '@/lib/db/index';
import { DEMO, setRequestHeaders, signInAs } from '@/tests/support/session';
import { yardFixture, key, printTags } from '@/tests/support/yard-fixtures';
import { addFeedingAction, addTreatmentAction, superOnAction } from '@/app/(back-office)/admin/colonies/actions';

afterAll(closeDb);
beforeEach(() => setRequestHeaders({}));

let f: Awaited<ReturnType<typeof yardFixture>>;
let allowedKindId: number;
beforeAll(async () => {
  f = await yardFixture('FOS');
  await printTags('FOS-0001', 'FOS-0002');
  const [k] = await getDb().models.TreatmentKind.findOrCreate({
    where: { name: 'Supers allowed FOS' },
    defaults: { name: 'Supers allowed FOS', supersAllowed: true, waitingDays: 0 },
  });
  allowedKindId = k.id;
  await signInAs(DEMO.keeper);
  for (const [colonyId, tagCode] of [
    [f.a1, 'FOS-0001'],
    [f.a2, 'FOS-0002'],
    [f.a2, null],
  ] as const)
    await superOnAction({
      colonyId,
      depth: 'deep',
      frameCount: 10,
      tagCode,
      putOnOn: '2026-06-01',
      idempotencyKey: key(),
    });
});

const syrup = (colonyId: number, extra: Record<string, unknown> = {}) => ({
  colonyId,
  kind: 'sugar_syrup' as const,
  amount: '2 L 1:1',
  startedOn: '2026-07-02',
  endedOn: '2026-07-05',
  idempotencyKey: key(),
  ...extra,
});
const open = (colonyId: number) =>
  getDb().models.SuperPull.findAll({ where: { colonyId, pulledOn: null, voidedAt: null }, order: [['id', 'ASC']] });

describe('feeding or treating over supers warns at once', () => {
  it('sugar syrup while supers are on: the form gets the warning naming them, and nothing is saved', async () => {
    await signInAs(DEMO.keeper);
    const r = await addFeedingAction(syrup(f.a2, { onSupers: 'ask' }));
    expect(r).toMatchObject({ ok: true, data: { saved: false, warning: { reason: /Sugar syrup fed 2026-07-02/ } } });
    expect(r.ok && r.data.warning?.supers.map((s) => s.label)).toEqual([
      'super FOS-0002',
      'untagged deep super put on 2026-06-01',
    ]);
    expect(await getDb().models.Feeding.count({ where: { colonyId: f.a2 } })).toBe(0);
    expect((await open(f.a2)).map((s) => s.flagged)).toEqual([false, false]);
  });

  it('"mark them" saves the feeding and flags the supers now', async () => {
    await signInAs(DEMO.keeper);
    const r = await addFeedingAction(syrup(f.a2, { onSupers: 'mark' }));
    expect(r).toMatchObject({ ok: true, data: { saved: true, warning: { supers: [{}, {}] } } });
    expect(await getDb().models.Feeding.count({ where: { colonyId: f.a2 } })).toBe(1);
    for (const s of await open(f.a2)) {
      expect(s.flagged).toBe(true);
      expect(s.flagReasons).toEqual(['Sugar syrup fed 2026-07-02 to 2026-07-05 while this super was on']);
    }
  });

  it('a queued entry (no answer to ask) is saved and flagged, and its result carries the warning', async () => {
    await signInAs(DEMO.keeper);
    const entry = syrup(f.a1);
    const r = await addFeedingAction(entry);
    expect(r).toMatchObject({ ok: true, data: { saved: true, warning: { supers: [{ label: 'super FOS-0001' }] } } });
    expect((await open(f.a1))[0].flagged).toBe(true);
    // The queue sends it again (no answer reached the phone): one feeding.
    expect(await addFeedingAction(entry)).toMatchObject({ ok: true, data: { saved: true } });
    expect(await getDb().models.Feeding.count({ where: { colonyId: f.a1 } })).toBe(1);
  });

  it('a treatment whose label forbids supers asks for confirmation; one that allows them just saves', async () => {
    await signInAs(DEMO.keeper);
    const treat = (treatmentKindId: number, onSupers: 'ask' | 'mark') =>
      addTreatmentAction({
        colonyId: f.a1,
        treatmentKindId,
        productName: 'Test strip',
        appliedOn: '2026-07-10',
        removedOn: null,
        idempotencyKey: key(),
        onSupers,
      });
    expect(await treat(f.noSupersKindId, 'ask')).toMatchObject({
      ok: true,
      data: { saved: false, warning: { reason: /its label does not allow honey supers/ } },
    });
    expect(await getDb().models.Treatment.count({ where: { colonyId: f.a1 } })).toBe(0);
    expect(await treat(allowedKindId, 'ask')).toMatchObject({ ok: true, data: { saved: true, warning: null } });
    expect(await treat(f.noSupersKindId, 'mark')).toMatchObject({ ok: true, data: { saved: true } });
    expect(await getDb().models.Treatment.count({ where: { colonyId: f.a1 } })).toBe(2);
  });

  it('pollen substitute over supers is no conflict and saves without a warning', async () => {
    await signInAs(DEMO.keeper);
    expect(await addFeedingAction(syrup(f.a3, { kind: 'pollen_substitute', onSupers: 'ask' }))).toMatchObject({
      ok: true,
      data: { saved: true, warning: null },
    });
  });
});
