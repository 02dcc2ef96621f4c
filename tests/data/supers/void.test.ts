import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { closeDb, getDb } from '@/lib/db/index';
import { DEMO, setRequestHeaders, signInAs } from '@/tests/support/session';
import { yardFixture, key, printTags } from '@/tests/support/yard-fixtures';
import { recordPullsAction } from '@/app/(back-office)/admin/yards/actions';
import { addFeedingAction, superOnAction } from '@/app/(back-office)/admin/colonies/actions';
import { voidSuperPullAction } from '@/app/(back-office)/admin/supers/actions';
import { createLotAction, pickSupersAction, scanSuperAction } from '@/app/(back-office)/admin/lots/actions';
import { GET as listPullsRoute } from '@/app/api/super-pulls/route';
import { addSupersById, listPullableSupers } from '@/lib/data/lots/supers';
import { getColony } from '@/lib/data/colonies/read';
import { createColony } from '@/lib/data/colonies/write';
import { colonyTimeline } from '@/lib/data/colonies/timeline';
import { getSeasonReport } from '@/lib/data/reports/yield-report';
import { listColonySupers, type PullRow } from '@/lib/data/supers/pulls';
import { voidSuperPull } from '@/lib/data/supers/void';
import { down as undoVoidPutOn } from '@/migrations/20261203000500-void-put-on';

afterAll(closeDb);
beforeEach(() => setRequestHeaders({}));

let f: Awaited<ReturnType<typeof yardFixture>>;
beforeAll(async () => {
  f = await yardFixture('VOI');
  await printTags('VOI-T1', 'VOI-T2', 'VOI-LOT1', 'VOI-ON-T1', 'VOI-ON-T2');
});

/** Records one pull as whoever is signed in and returns its id. */
async function pull(colonyId: number, pulledOn: string, extra: Record<string, unknown> = {}): Promise<number> {
  const r = await recordPullsAction({
    entries: [
      {
        colonyId,
        pulledOn,
        depth: 'medium',
        frameCount: 10,
        weight: 25,
        weightUnit: 'kg',
        idempotencyKey: key(),
        ...extra,
      },
    ],
  });
  const first = r.ok ? r.data.results[0] : null;
  if (!first || !first.ok) throw new Error(`pull not recorded: ${JSON.stringify(r)}`);
  return first.id;
}
const row = (id: number) => getDb().models.SuperPull.findByPk(id);
const voidAudits = (id: number) =>
  getDb().models.AuditEntry.findAll({
    where: { action: 'super.void', entityType: 'super_pull', entityId: String(id) },
  });
const ownerView = () => ({ id: f.owner.id, name: f.owner.name, email: f.owner.email, role: 'owner' as const });
const pullsOf = async (query: string) =>
  (
    (await (await listPullsRoute(new Request(`http://127.0.0.1:3100/api/super-pulls?${query}`))).json()) as {
      rows: PullRow[];
    }
  ).rows;
const supersPulledIn = async (colonyId: number) => {
  const report = (await getSeasonReport(ownerView(), { season: 2026, yardId: f.yardA }))!;
  return {
    colony: report.colonies.find((c) => c.colonyId === colonyId)?.supersPulled,
    yard: report.yards.find((y) => y.id === f.yardA)?.supersPulled,
  };
};

describe('a keeper voids a pull recorded by mistake', () => {
  it('is voided with who, when and why, audited, and drops out of the pick list, last-pulled date, flagged count and yield counts', async () => {
    await signInAs(DEMO.keeper);
    // Sugar fed in early August: the August pull is flagged, the July one is clear.
    expect(
      (
        await addFeedingAction({
          colonyId: f.a1,
          kind: 'sugar_syrup',
          amount: '1 L',
          startedOn: '2026-08-01',
          endedOn: '2026-08-05',
          idempotencyKey: key(),
        })
      ).ok,
    ).toBe(true);
    const july = await pull(f.a1, '2026-07-10', { tagCode: 'VOI-T1' });
    const august = await pull(f.a1, '2026-08-20', { tagCode: 'VOI-T2' });
    expect((await row(august))?.flagged).toBe(true);

    const pickable = async () => (await listPullableSupers({ yardId: f.yardA })).map((s) => s.id);
    expect(await pickable()).toEqual(expect.arrayContaining([july, august]));
    expect(await getColony(ownerView(), f.a1)).toMatchObject({ lastPulledOn: '2026-08-20', flaggedSupers: 1 });
    const before = await supersPulledIn(f.a1);
    expect(before.colony).toBe(2);

    const r = await voidSuperPullAction({
      superPullId: august,
      reason: '  Entered on the wrong colony; the box came off VOI-A2.  ',
    });
    expect(r).toMatchObject({
      ok: true,
      data: {
        id: august,
        colonyId: f.a1,
        void: { reason: 'Entered on the wrong colony; the box came off VOI-A2.', byName: f.keeperA.name },
      },
    });

    const voided = await row(august);
    expect(voided?.voidedAt).toBeInstanceOf(Date);
    expect(voided).toMatchObject({
      voidedByUserId: f.keeperA.id,
      voidReason: 'Entered on the wrong colony; the box came off VOI-A2.',
      lotId: null,
    });
    const audits = await voidAudits(august);
    expect(audits).toHaveLength(1);
    expect(audits[0]).toMatchObject({
      actorUserId: f.keeperA.id,
      reason: 'Entered on the wrong colony; the box came off VOI-A2.',
    });
    expect(audits[0].after).toMatchObject({ colonyId: f.a1, tagCode: 'VOI-T2', pulledOn: '2026-08-20' });

    // Not offered to the crew, and refused if they scan or tick it anyway.
    expect(await pickable()).toContain(july);
    expect(await pickable()).not.toContain(august);
    await signInAs(DEMO.crew);
    const lot = await createLotAction({ floralSource: 'Void test', heather: false, notes: '' });
    if (!lot.ok) throw new Error('lot not made');
    expect(await scanSuperAction({ lotId: lot.data.id, tagCode: 'VOI-T2' })).toMatchObject({
      ok: false,
      message: /voided by its keeper/,
    });
    expect(await pickSupersAction({ lotId: lot.data.id, superPullIds: [august] })).toMatchObject({
      ok: false,
      message: /voided by its keeper/,
    });
    expect((await row(august))?.lotId).toBeNull();

    // Counts and dates no longer include it.
    expect(await getColony(ownerView(), f.a1)).toMatchObject({ lastPulledOn: '2026-07-10', flaggedSupers: 0 });
    const after = await supersPulledIn(f.a1);
    expect(after.colony).toBe(1);
    expect(after.yard).toBe((before.yard ?? 0) - 1);

    // Still visible in the colony timeline and the pull list, with who, when and why; filterable.
    const entry = (await colonyTimeline(f.a1, (g) => `${g} g`)).find((e) => e.key === `pull-${august}`);
    expect(entry?.voided).toMatchObject({
      byName: f.keeperA.name,
      reason: 'Entered on the wrong colony; the box came off VOI-A2.',
    });
    expect(entry?.voidablePullId).toBeUndefined();
    await signInAs(DEMO.keeper);
    expect((await pullsOf(`colonyId=${f.a1}`)).map((p) => [p.id, p.voided?.reason ?? null])).toEqual([
      [august, 'Entered on the wrong colony; the box came off VOI-A2.'],
      [july, null],
    ]);
    expect((await pullsOf(`colonyId=${f.a1}&voided=no`)).map((p) => p.id)).toEqual([july]);
    expect((await pullsOf(`colonyId=${f.a1}&voided=yes`)).map((p) => p.id)).toEqual([august]);
  });

  it('re-checks the colony’s other pulls: a conflict the mistaken pull was hiding is flagged again', async () => {
    await signInAs(DEMO.keeper);
    // Syrup 1–3 June. A pull mistakenly entered for 4 June makes the real July pull (no put-on date)
    // look as if it went on after 4 June, so the July super is clear; voiding the mistake flags it.
    expect(
      (
        await addFeedingAction({
          colonyId: f.a2,
          kind: 'sugar_syrup',
          startedOn: '2026-06-01',
          endedOn: '2026-06-03',
          idempotencyKey: key(),
        })
      ).ok,
    ).toBe(true);
    const mistake = await pull(f.a2, '2026-06-04');
    const real = await pull(f.a2, '2026-07-10');
    expect((await row(real))?.flagged).toBe(false);
    const r = await voidSuperPullAction({ superPullId: mistake, reason: 'Wrong date: nothing was pulled in June' });
    expect(r).toMatchObject({ ok: true, data: { reflagged: 1 } });
    const now = await row(real);
    expect(now?.flagged).toBe(true);
    expect(now?.flagReasons).toContain('Put-on date not recorded: checked from 2026-01-01');
    // The voided one keeps the flag it had, but no longer counts.
    expect((await row(mistake))?.flagged).toBe(true);
    expect((await getColony(ownerView(), f.a2))?.flaggedSupers).toBe(1);
  });

  it('the owner may void any keeper’s pull', async () => {
    await signInAs(DEMO.keeper2);
    const id = await pull(f.b1, '2026-07-02');
    await signInAs(DEMO.owner);
    expect(await voidSuperPullAction({ superPullId: id, reason: 'Duplicate of the field sheet import' })).toMatchObject(
      { ok: true },
    );
    expect((await row(id))?.voidedByUserId).toBe(f.owner.id);
  });
});

describe('refusals change nothing', () => {
  it('another keeper’s pull, or one that does not exist, is not found (404); crew and customers are refused', async () => {
    await signInAs(DEMO.keeper2);
    const theirs = await pull(f.b1, '2026-07-15');
    await signInAs(DEMO.keeper);
    expect(await voidSuperPullAction({ superPullId: theirs, reason: 'Not mine to void' })).toEqual({
      ok: false,
      message: 'No such super pull.',
    });
    expect(await voidSuperPullAction({ superPullId: 2_000_000_000, reason: 'No such row' })).toEqual({
      ok: false,
      message: 'No such super pull.',
    });
    for (const who of [DEMO.crew, DEMO.customer]) {
      await signInAs(who);
      expect(await voidSuperPullAction({ superPullId: theirs, reason: 'Not allowed at all' })).toMatchObject({
        ok: false,
        message: expect.stringMatching(/not allowed/),
      });
    }
    expect((await row(theirs))?.voidedAt).toBeNull();
    expect(await voidAudits(theirs)).toHaveLength(0);
  });

  it('voiding twice is a 409 "already voided"; two at once void it once', async () => {
    await signInAs(DEMO.keeper);
    const id = await pull(f.a3, '2026-07-03');
    const [x, y] = await Promise.all([
      voidSuperPullAction({ superPullId: id, reason: 'Double tap in the yard' }),
      voidSuperPullAction({ superPullId: id, reason: 'Double tap, second phone' }),
    ]);
    expect([x.ok, y.ok].sort()).toEqual([false, true]);
    expect([x, y].find((r) => !r.ok)).toEqual({ ok: false, message: 'This pull is already voided.' });
    expect(await voidSuperPullAction({ superPullId: id, reason: 'And once more' })).toEqual({
      ok: false,
      message: 'This pull is already voided.',
    });
    expect(await voidAudits(id)).toHaveLength(1);
    expect((await row(id))?.voidReason).toBe(x.ok ? 'Double tap in the yard' : 'Double tap, second phone');
  });

  it('a super already in a lot is a 409 that sends them to the honey house, and nothing changes', async () => {
    await signInAs(DEMO.keeper);
    const id = await pull(f.a3, '2026-07-21', { tagCode: 'VOI-LOT1' });
    await signInAs(DEMO.crew);
    const lot = await createLotAction({ floralSource: 'Void lot test', heather: false, notes: '' });
    if (!lot.ok) throw new Error('lot not made');
    expect(await scanSuperAction({ lotId: lot.data.id, tagCode: 'VOI-LOT1' })).toMatchObject({ ok: true });
    const before = (await row(id))!.get({ plain: true });
    for (const who of [DEMO.keeper, DEMO.owner]) {
      await signInAs(who);
      const r = await voidSuperPullAction({ superPullId: id, reason: 'Wrong colony' });
      expect(r).toMatchObject({
        ok: false,
        message: expect.stringMatching(new RegExp(`already in lot ${lot.data.code}.*Ask the honey house`)),
      });
    }
    expect((await row(id))!.get({ plain: true })).toEqual(before);
    expect(await voidAudits(id)).toHaveLength(0);
  });

  it('a void racing the crew putting the super in a lot: exactly one wins, never both', async () => {
    await signInAs(DEMO.keeper);
    const id = await pull(f.a3, '2026-07-25');
    await signInAs(DEMO.crew);
    const lot = await createLotAction({ floralSource: 'Void race', heather: false, notes: '' });
    if (!lot.ok) throw new Error('lot not made');
    // Called as data functions, so each runs as its own user at the same time.
    const crew = (await getDb().models.User.findOne({ where: { email: DEMO.crew } }))!;
    const [picked, voided] = await Promise.allSettled([
      addSupersById({ id: crew.id, name: crew.name, email: crew.email, role: 'crew' }, lot.data.id, [id]),
      voidSuperPull(f.keeperA, id, 'Raced the honey house'),
    ]);
    expect([picked.status, voided.status].filter((s) => s === 'fulfilled')).toHaveLength(1);
    const loser = [picked, voided].find((r) => r.status === 'rejected') as PromiseRejectedResult;
    expect(loser.reason).toMatchObject({ kind: 'conflict' }); // a 409 at the edge
    const final = await row(id);
    expect(final?.voidedAt !== null && final?.lotId !== null).toBe(false);
    expect(final?.voidedAt !== null || final?.lotId !== null).toBe(true);
  });

  it('a super still on the hive cannot be voided as a pull', async () => {
    await signInAs(DEMO.keeper);
    const on = await getDb().models.SuperPull.create({
      colonyId: f.a3,
      depth: 'medium',
      frameCount: 10,
      putOnOn: '2026-08-01',
      putOnBy: f.keeperA.id,
    });
    expect(await voidSuperPullAction({ superPullId: on.id, reason: 'Not pulled yet' })).toMatchObject({
      ok: false,
      message: expect.stringMatching(/still on the hive/),
    });
    expect((await row(on.id))?.voidedAt).toBeNull();
  });

  it('a missing, too short or too long reason is a validation message on the reason field; nothing is written', async () => {
    await signInAs(DEMO.keeper);
    const id = await pull(f.a3, '2026-07-28');
    const cases: [unknown, RegExp][] = [
      [undefined, /^Say why this record is being voided\.$/],
      ['  ab  ', /at least 3 characters/],
      ['x'.repeat(501), /500 characters or fewer/],
    ];
    for (const [reason, message] of cases) {
      const r = await voidSuperPullAction({ superPullId: id, reason } as never);
      expect(r).toMatchObject({
        ok: false,
        message: 'Please fix the marked fields.',
        fieldErrors: { reason: expect.stringMatching(message) },
      });
    }
    expect((await row(id))?.voidedAt).toBeNull();
    expect(await voidAudits(id)).toHaveLength(0);
  });
});

describe('the database holds the rules whatever the app does', () => {
  it('who, when and why are set together; a void cannot be taken back; a voided pull cannot go into a lot', async () => {
    await signInAs(DEMO.keeper);
    const id = await pull(f.a3, '2026-07-30');
    const { sequelize } = getDb();
    const sql = (text: string) => sequelize.query(text, { replacements: { id, user: f.keeperA.id } });
    await expect(sql(`UPDATE super_pulls SET voided_at = now() WHERE id = :id`)).rejects.toThrow(/super_pulls_void_ck/);
    await expect(
      sql(`UPDATE super_pulls SET voided_at = now(), voided_by_user_id = :user, void_reason = '  ' WHERE id = :id`),
    ).rejects.toThrow(/super_pulls_void_ck/);
    expect(await voidSuperPullAction({ superPullId: id, reason: 'Checked against the field sheet' })).toMatchObject({
      ok: true,
    });
    await expect(
      sql(`UPDATE super_pulls SET voided_at = NULL, voided_by_user_id = NULL, void_reason = NULL WHERE id = :id`),
    ).rejects.toThrow(/stays voided/);
    await expect(sql(`UPDATE super_pulls SET void_reason = 'rewritten later' WHERE id = :id`)).rejects.toThrow(
      /stays voided/,
    );
    const [[lot]] = (await sequelize.query(`SELECT id FROM lots ORDER BY id LIMIT 1`)) as [{ id: number }[], unknown];
    await expect(sql(`UPDATE super_pulls SET lot_id = ${lot.id} WHERE id = :id`)).rejects.toThrow(
      /super_pulls_void_state_ck/,
    );
  });
});

describe('a super-on record entered by mistake can be voided too', () => {
  /** A fresh colony in yard A (keeper A) per test: no other supers on it. */
  let n = 0;
  const freshColony = () =>
    createColony(f.owner, {
      code: `VOI-ON${++n}`,
      yardId: f.yardA,
      keeperId: f.keeperA.id,
      origin: 'nucleus',
      parentColonyId: null,
      queenYear: 2025,
      startedOn: '2026-04-01',
      notes: '',
    });
  async function putOn(colonyId: number, putOnOn: string, extra: Record<string, unknown> = {}): Promise<number> {
    const r = await superOnAction({
      colonyId,
      depth: 'medium',
      frameCount: 10,
      tagCode: '',
      putOnOn,
      idempotencyKey: key(),
      ...extra,
    });
    if (!r.ok) throw new Error(`put-on not recorded: ${JSON.stringify(r)}`);
    return (r.data as { id: number }).id;
  }
  const onAudits = (id: number) =>
    getDb().models.AuditEntry.findAll({
      where: { action: 'super.on.void', entityType: 'super_pull', entityId: String(id) },
    });
  const onHive = async (colonyId: number) =>
    (await listColonySupers(colonyId)).filter((s) => !s.pulledOn && !s.voided).map((s) => s.id);

  it('the keeper voids their own mistaken put-on: voided, audited, no longer on the hive, and the next pulls do not close it', async () => {
    await signInAs(DEMO.keeper);
    const c = await freshColony();
    const mistake = await putOn(c, '2026-06-01', { tagCode: 'VOI-ON-T1' });
    const real = await putOn(c, '2026-06-10');
    expect(await onHive(c)).toEqual([real, mistake]);

    const r = await voidSuperPullAction({
      superPullId: mistake,
      record: 'on',
      reason: ' Put on the wrong colony in the app ',
    });
    expect(r).toMatchObject({
      ok: true,
      data: {
        id: mistake,
        colonyId: c,
        reflagged: 0,
        void: { reason: 'Put on the wrong colony in the app', byName: f.keeperA.name },
      },
    });
    expect(await row(mistake)).toMatchObject({
      voidedByUserId: f.keeperA.id,
      voidReason: 'Put on the wrong colony in the app',
      pulledOn: null,
      putOnOn: '2026-06-01',
    });
    const audits = await onAudits(mistake);
    expect(audits).toHaveLength(1);
    expect(audits[0]).toMatchObject({ actorUserId: f.keeperA.id, reason: 'Put on the wrong colony in the app' });
    expect(audits[0].after).toMatchObject({ colonyId: c, tagCode: 'VOI-ON-T1', putOnOn: '2026-06-01' });

    // Not on the hive any more: not in the colony's supers on, shown voided in the timeline with no button.
    expect(await onHive(c)).toEqual([real]);
    const timeline = await colonyTimeline(c, (g) => `${g} g`);
    expect(timeline.find((e) => e.key === `on-${mistake}`)).toMatchObject({
      voided: { reason: 'Put on the wrong colony in the app' },
      voidableOnId: undefined,
    });
    expect(timeline.find((e) => e.key === `on-${real}`)?.voidableOnId).toBe(real);

    // The next pull closes the real super (the voided one was put on earlier and would have been chosen).
    expect(await pull(c, '2026-07-01')).toBe(real);
    // With nothing left on, a pull is a new row; a pull naming the voided super's tag does not close it either.
    const next = await pull(c, '2026-07-02');
    const tagged = await pull(c, '2026-07-03', { tagCode: 'VOI-ON-T1' });
    expect(new Set([mistake, real, next, tagged]).size).toBe(4);
    expect(await row(next)).toMatchObject({ putOnOn: null, pulledOn: '2026-07-02' });
    expect(await row(mistake)).toMatchObject({ pulledOn: null, pullKey: null });
    // Its tag is free: the same super can go on a hive again.
    const again = await putOn(c, '2026-07-05', { tagCode: 'VOI-ON-T1' });
    expect(await onHive(c)).toEqual([again]);
  });

  it('a late retry of the voided put-on returns the same voided row and never puts a new super on', async () => {
    await signInAs(DEMO.keeper);
    const c = await freshColony();
    const entry = {
      colonyId: c,
      depth: 'medium',
      frameCount: 10,
      tagCode: 'VOI-ON-T2',
      putOnOn: '2026-06-05',
      idempotencyKey: key(),
    } as const;
    const first = await superOnAction(entry);
    if (!first.ok) throw new Error('put-on not recorded');
    const id = (first.data as { id: number }).id;
    expect(
      await voidSuperPullAction({ superPullId: id, record: 'on', reason: 'Tapped twice by mistake' }),
    ).toMatchObject({ ok: true });
    const retry = await superOnAction(entry);
    expect(retry).toMatchObject({ ok: true, data: { id } });
    expect(await getDb().models.SuperPull.count({ where: { colonyId: c } })).toBe(1);
    expect((await row(id))?.voidedAt).toBeInstanceOf(Date);
    expect(await onHive(c)).toEqual([]);
  });

  it('another keeper’s put-on is not found (404); crew and customers are refused; nothing changes', async () => {
    await signInAs(DEMO.keeper2);
    const theirs = await putOn(f.b1, '2026-06-03');
    await signInAs(DEMO.keeper);
    expect(await voidSuperPullAction({ superPullId: theirs, record: 'on', reason: 'Not mine to void' })).toEqual({
      ok: false,
      message: 'No such super-on record.',
    });
    for (const who of [DEMO.crew, DEMO.customer]) {
      await signInAs(who);
      expect(
        await voidSuperPullAction({ superPullId: theirs, record: 'on', reason: 'Not allowed at all' }),
      ).toMatchObject({ ok: false, message: expect.stringMatching(/not allowed/) });
    }
    expect((await row(theirs))?.voidedAt).toBeNull();
    expect(await onAudits(theirs)).toHaveLength(0);
    // The owner may void any keeper's.
    await signInAs(DEMO.owner);
    expect(
      await voidSuperPullAction({ superPullId: theirs, record: 'on', reason: 'Keeper asked by phone' }),
    ).toMatchObject({ ok: true });
    expect((await row(theirs))?.voidedByUserId).toBe(f.owner.id);
  });

  it('voiding twice is a 409 "already voided"; a super pulled meanwhile is a 409 and stays counted', async () => {
    await signInAs(DEMO.keeper);
    const c = await freshColony();
    const id = await putOn(c, '2026-06-07');
    expect(await voidSuperPullAction({ superPullId: id, record: 'on', reason: 'Wrong colony' })).toMatchObject({
      ok: true,
    });
    expect(await voidSuperPullAction({ superPullId: id, record: 'on', reason: 'Wrong colony again' })).toEqual({
      ok: false,
      message: 'This super-on record is already voided.',
    });
    expect(await onAudits(id)).toHaveLength(1);

    const pulledMeanwhile = await putOn(c, '2026-06-08');
    expect(await pull(c, '2026-07-08')).toBe(pulledMeanwhile);
    const r = await voidSuperPullAction({
      superPullId: pulledMeanwhile,
      record: 'on',
      reason: 'Saw it still on a minute ago',
    });
    expect(r).toMatchObject({ ok: false, message: expect.stringMatching(/was pulled on 2026-07-08.*void the pull/) });
    expect((await row(pulledMeanwhile))?.voidedAt).toBeNull();
  });

  it('the database allows a voided put-on but still never a voided row in a lot; undoing the migration refuses while one exists', async () => {
    await signInAs(DEMO.keeper);
    const c = await freshColony();
    const id = await putOn(c, '2026-06-09');
    expect(
      await voidSuperPullAction({ superPullId: id, record: 'on', reason: 'Entered on the wrong day' }),
    ).toMatchObject({ ok: true });
    const { sequelize } = getDb();
    const [[lot]] = (await sequelize.query(`SELECT id FROM lots ORDER BY id LIMIT 1`)) as [{ id: number }[], unknown];
    await expect(
      sequelize.query(`UPDATE super_pulls SET lot_id = :lot WHERE id = :id`, { replacements: { id, lot: lot.id } }),
    ).rejects.toThrow(/super_pulls_void_state_ck/);
    await expect(undoVoidPutOn({ context: sequelize.getQueryInterface() })).rejects.toThrow(
      /Cannot undo 20261203000500-void-put-on: .*voided super-on record/,
    );
    const [[still]] = (await sequelize.query(
      `SELECT pg_get_constraintdef(oid) AS def FROM pg_constraint WHERE conname = 'super_pulls_void_state_ck'`,
    )) as [{ def: string }[], unknown];
    expect(still.def).not.toMatch(/pulled_on/);
  });
});
