import { afterAll, describe, expect, it } from 'vitest';
import { closeDb, getDb } from '@/lib/db/index';
import { parseLotCode } from '@/lib/domain/lot-code';
import {
  saveContainerTypeAction,
  createLotAction,
  scanSuperAction,
  pickSupersAction,
  removeSuperAction,
  addContainerAction,
  changeStageAction,
} from '@/app/(back-office)/admin/lots/actions';
import { GET as listLotsRoute } from '@/app/api/lots/route';
import { DEMO, signInAs } from '@/tests/support/session';
import { makePulledSupers } from '@/tests/support/lot-fixtures';
import { listPullableSupers } from '@/lib/data/lots/supers';
import { failOnce } from '@/tests/support/fail-once';

afterAll(closeDb);

describe('lot codes', () => {
  it('20 lots created at once get 20 consecutive codes: no duplicate, no gap', async () => {
    await signInAs(DEMO.crew);
    const results = await Promise.all(
      Array.from({ length: 20 }, (_, i) =>
        createLotAction({ floralSource: `Parallel ${i}`, heather: false, notes: '' }),
      ),
    );
    expect(results.every((r) => r.ok)).toBe(true);
    const codes = results.map((r) => (r.ok ? r.data.code : ''));
    expect(new Set(codes).size).toBe(20);
    const seqs = codes.map((c) => parseLotCode(c)!.sequence).sort((a, b) => a - b);
    for (let i = 1; i < seqs.length; i++) expect(seqs[i]).toBe(seqs[i - 1] + 1);
    // and the sequence row agrees with the highest code handed out
    const { prefix, year2 } = parseLotCode(codes[0])!;
    const [row] = await getDb().sequelize.query(
      `SELECT last_value FROM lot_sequences WHERE prefix = :prefix AND year % 100 = :y`,
      { replacements: { prefix, y: year2 }, plain: false },
    );
    expect(Math.max(...(row as { last_value: number }[]).map((r) => r.last_value))).toBe(seqs[seqs.length - 1]);
    const audits = await getDb().models.AuditEntry.count({
      where: { action: 'lot.create', entityId: results.map((r) => String(r.ok ? r.data.id : 0)) },
    });
    expect(audits).toBe(20);
  });

  it('a lot that fails after taking its number gives the number back (the sequence is taken in the lot’s transaction)', async () => {
    await signInAs(DEMO.crew);
    const a = await createLotAction({ floralSource: 'Before', heather: false, notes: '' });
    if (!a.ok) throw new Error('lot not made');
    // The lot's own row is inserted after takeLotCode, in the same transaction: fail that insert once,
    // and name the code the lot was given, so the number was really taken before the failure.
    const cleanUp = await failOnce('ct_fail_lot_insert', 'lots', `NEW.floral_source = 'Fails once'`, 'NEW.code');
    let failedCode = '';
    try {
      const failed = await createLotAction({ floralSource: 'Fails once', heather: false, notes: '' }).then(
        () => null,
        (e: unknown) => e,
      );
      failedCode = /injected failure \(ct_fail_lot_insert\): (\S+)/.exec(String(failed))?.[1] ?? '';
    } finally {
      await cleanUp();
    }
    expect(parseLotCode(failedCode)?.sequence).toBe(parseLotCode(a.data.code)!.sequence + 1);
    expect(await getDb().models.Lot.count({ where: { floralSource: 'Fails once' } })).toBe(0);
    const b = await createLotAction({ floralSource: 'After', heather: false, notes: '' });
    expect(b).toMatchObject({ ok: true, data: { code: failedCode } });
  });

  it('keepers and customers cannot create lots', async () => {
    await signInAs(DEMO.keeper);
    expect(await createLotAction({ floralSource: 'No', heather: false, notes: '' })).toMatchObject({
      ok: false,
      message: /not allowed/,
    });
    await signInAs(DEMO.customer);
    expect(await createLotAction({ floralSource: 'No', heather: false, notes: '' })).toMatchObject({ ok: false });
  });
});

describe('supers into a lot', () => {
  it('a scanned tag goes in once; a second lot is told where it is', async () => {
    await signInAs(DEMO.crew);
    const { tags } = await makePulledSupers(2);
    const lot1 = await createLotAction({ floralSource: 'Linden', heather: false, notes: '' });
    const lot2 = await createLotAction({ floralSource: 'Linden', heather: false, notes: '' });
    if (!lot1.ok || !lot2.ok) throw new Error('lot not made');
    expect(await scanSuperAction({ lotId: lot1.data.id, tagCode: ` ${tags[0].toLowerCase()} ` })).toMatchObject({
      ok: true,
      data: { tagCode: tags[0] },
    });
    expect(await scanSuperAction({ lotId: lot2.data.id, tagCode: tags[0] })).toMatchObject({
      ok: false,
      message: new RegExp(`already in lot ${lot1.data.code}`),
    });
    expect(await scanSuperAction({ lotId: lot1.data.id, tagCode: 'NO-SUCH-TAG' })).toMatchObject({
      ok: false,
      message: /No super with tag/,
    });
  });

  it('a flagged super is refused without an owner override, and recorded when the owner overrides', async () => {
    const { tags, supers } = await makePulledSupers(2, { flagged: [true, false] });
    await signInAs(DEMO.crew);
    const lot = await createLotAction({ floralSource: 'Wildflower', heather: false, notes: '' });
    if (!lot.ok) throw new Error('lot not made');
    const crewTry = await scanSuperAction({
      lotId: lot.data.id,
      tagCode: tags[0],
      overrideReason: 'crew says it is fine',
    });
    expect(crewTry).toMatchObject({ ok: false, message: /flagged.*Only the owner/ });
    expect(await pickSupersAction({ lotId: lot.data.id, superPullIds: [supers[1].id, supers[0].id] })).toMatchObject({
      ok: false,
      message: /flagged/,
    });
    // all or nothing: the unflagged one did not go in either
    expect((await getDb().models.SuperPull.findByPk(supers[1].id))!.lotId).toBeNull();

    await signInAs(DEMO.owner);
    expect(await scanSuperAction({ lotId: lot.data.id, tagCode: tags[0] })).toMatchObject({
      ok: false,
      message: /Write an override reason/,
    });
    const ok = await scanSuperAction({
      lotId: lot.data.id,
      tagCode: tags[0],
      overrideReason: 'Syrup ended 6 weeks before the super went on; checked the log',
    });
    expect(ok).toMatchObject({ ok: true, data: { overridden: true } });
    const sp = await getDb().models.SuperPull.findByPk(supers[0].id);
    expect(sp!.lotId).toBe(lot.data.id);
    expect(sp!.overrideReason).toMatch(/Syrup ended/);
    const owner = await getDb().models.User.findOne({ where: { email: DEMO.owner } });
    expect(sp!.overrideBy).toBe(owner!.id);
    const audit = await getDb().models.AuditEntry.findOne({
      where: { action: 'super.override', entityId: String(sp!.id) },
    });
    expect(audit?.reason).toMatch(/Syrup ended/);
    expect(audit?.actorUserId).toBe(owner!.id);
  });
});

describe('the list of pulled supers to pick from', () => {
  it('filters by yard and by tag or colony, and drops a super once it is in a lot', async () => {
    await signInAs(DEMO.crew);
    const { tags, supers, yard, colony } = await makePulledSupers(2, { flagged: [false, true] });
    const byYard = await listPullableSupers({ yardId: yard.id });
    expect(byYard.map((s) => s.tagCode).sort()).toEqual([...tags].sort());
    expect(byYard.find((s) => s.id === supers[1].id)).toMatchObject({
      flagged: true,
      yardName: yard.name,
      colonyCode: colony.code,
    });
    expect((await listPullableSupers({ q: colony.code })).length).toBe(2);
    expect((await listPullableSupers({ q: tags[0] })).map((s) => s.id)).toEqual([supers[0].id]);
    const lot = await createLotAction({ floralSource: 'Pick test', heather: false, notes: '' });
    if (!lot.ok) throw new Error('lot not made');
    expect(await pickSupersAction({ lotId: lot.data.id, superPullIds: [supers[0].id] })).toMatchObject({ ok: true });
    expect((await listPullableSupers({ yardId: yard.id })).map((s) => s.id)).toEqual([supers[1].id]);
  });
});

describe('taking a super out', () => {
  it('works while gathering, with a reason in the history; refused once extracted', async () => {
    await signInAs(DEMO.crew);
    const { tags, supers } = await makePulledSupers(2);
    const lot = await createLotAction({ floralSource: 'Out test', heather: false, notes: '' });
    if (!lot.ok) throw new Error('lot not made');
    for (const t of tags) await scanSuperAction({ lotId: lot.data.id, tagCode: t });
    expect(
      await removeSuperAction({ lotId: lot.data.id, superPullId: supers[0].id, reason: 'Scanned the wrong box' }),
    ).toEqual({ ok: true });
    expect((await getDb().models.SuperPull.findByPk(supers[0].id))!.lotId).toBeNull();
    const audit = await getDb().models.AuditEntry.findOne({
      where: { entityType: 'lot', entityId: String(lot.data.id), action: 'lot.super.remove' },
    });
    expect(audit?.reason).toBe('Scanned the wrong box');
    await addContainerAction({ lotId: lot.data.id, label: 'B', gross: 10, tare: 1, unit: 'kg' });
    await changeStageAction({ lotId: lot.data.id, target: 'extracted', extractedOn: '2026-07-25' });
    expect(
      await removeSuperAction({ lotId: lot.data.id, superPullId: supers[1].id, reason: 'Too late for this' }),
    ).toMatchObject({ ok: false, message: /only be taken out while the lot is gathering/ });
  });
});

describe('lot list (JSON route)', () => {
  it('pages and filters; a keeper sees only lots with their colonies’ supers; a customer is refused', async () => {
    await signInAs(DEMO.crew);
    const res = await listLotsRoute(new Request('http://t/api/lots?pageSize=5&floral=Parallel'));
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(body.rows).toHaveLength(5);
    expect(body.total).toBeGreaterThanOrEqual(20);
    expect(body.rows.every((r: { floralSource: string }) => r.floralSource.startsWith('Parallel'))).toBe(true);

    const { tags } = await makePulledSupers(1, { keeperEmail: DEMO.keeper2 });
    const lot = await createLotAction({ floralSource: 'Keeper2 only', heather: false, notes: '' });
    if (!lot.ok) throw new Error('lot not made');
    await scanSuperAction({ lotId: lot.data.id, tagCode: tags[0] });
    await signInAs(DEMO.keeper);
    const mine = await (await listLotsRoute(new Request('http://t/api/lots?floral=Keeper2'))).json();
    expect(mine.total).toBe(0);
    await signInAs(DEMO.keeper2);
    const theirs = await (await listLotsRoute(new Request('http://t/api/lots?floral=Keeper2'))).json();
    expect(theirs.rows.map((r: { code: string }) => r.code)).toEqual([lot.data.code]);
    await signInAs(DEMO.customer);
    expect((await listLotsRoute(new Request('http://t/api/lots'))).status).toBe(403);
    await signInAs(DEMO.crew);
    expect((await listLotsRoute(new Request('http://t/api/lots?sort=password'))).status).toBe(400);
    const byNet = await (
      await listLotsRoute(new Request('http://t/api/lots?sort=netGrams&dir=desc&pageSize=3'))
    ).json();
    expect(byNet.rows[0].netGrams).toBeGreaterThanOrEqual(byNet.rows[1].netGrams);
  });
});

describe('container types', () => {
  it('the owner adds and edits them (tare in lb → grams), names stay unique, the crew cannot', async () => {
    await signInAs(DEMO.owner);
    const made = await saveContainerTypeAction({ name: 'Tote 1000 L', usualTare: 130, unit: 'lb', active: true });
    expect(made.ok).toBe(true);
    const id = made.ok ? made.data.id : 0;
    // 130 lb × 453.59237 g/lb = 58 967.0081 g → 58 967 g
    expect((await getDb().models.ContainerType.findByPk(id))!.usualTareGrams).toBe(58_967);
    expect(
      await saveContainerTypeAction({ name: 'Tote 1000 L', usualTare: 1, unit: 'kg', active: true }),
    ).toMatchObject({ ok: false, message: /already a container type/ });
    expect(
      await saveContainerTypeAction({ id, name: 'Tote 1000 L', usualTare: 58, unit: 'kg', active: false }),
    ).toMatchObject({ ok: true });
    expect(await getDb().models.ContainerType.findByPk(id)).toMatchObject({ usualTareGrams: 58_000, active: false });
    await signInAs(DEMO.crew);
    expect(await saveContainerTypeAction({ name: 'Crew tub', usualTare: 1, unit: 'kg', active: true })).toMatchObject({
      ok: false,
      message: /not allowed/,
    });
  });
});
