import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { closeDb, getDb } from '@/lib/db/index';
import { DEMO, setRequestHeaders, signInAs } from '@/tests/support/session';
import { yardFixture, key, printTags } from '@/tests/support/yard-fixtures';
import { recordPullsAction } from '@/app/(back-office)/admin/yards/actions';
import { superOnAction } from '@/app/(back-office)/admin/colonies/actions';
import { POST as postPulls } from '@/app/api/super-pulls/route';
import { repairTagCase } from '@/migrations/20261204000200-tag-case';

afterAll(closeDb);
beforeEach(() => setRequestHeaders({}));

let f: Awaited<ReturnType<typeof yardFixture>>;
beforeAll(async () => {
  f = await yardFixture('TAG');
  await printTags('TAG-0001', 'TAG-0002', 'TAG-0003', 'TAG-0004', 'TAG-0005');
});

const on = (colonyId: number, tagCode: string | null, putOnOn = '2026-06-01') =>
  superOnAction({ colonyId, depth: 'medium', frameCount: 10, tagCode, putOnOn, idempotencyKey: key() });
const pull = (colonyId: number, tagCode: string | null, pulledOn = '2026-07-01') =>
  recordPullsAction({
    entries: [{ colonyId, pulledOn, depth: 'medium', frameCount: 10, tagCode, idempotencyKey: key() }],
  });

async function setUntagged(allowed: boolean) {
  await getDb().models.BusinessSetting.update({ allowUntaggedSupers: allowed }, { where: { id: 1 } });
}

describe('one spelling of a tag code', () => {
  it('a tag typed in lower case on Super on is closed by its upper-case pull (no ghost super)', async () => {
    await signInAs(DEMO.keeper);
    const put = await on(f.a1, 'tag-0001');
    expect(put).toMatchObject({ ok: true });
    const id = put.ok ? put.data.id : -1;
    expect((await getDb().models.SuperPull.findByPk(id))?.tagCode).toBe('TAG-0001');
    const pulled = await pull(f.a1, 'TAG-0001');
    expect(pulled.ok && pulled.data.results[0]).toMatchObject({ ok: true, id });
    const rows = await getDb().models.SuperPull.findAll({ where: { colonyId: f.a1 } });
    expect(rows.map((r) => [r.tagCode, r.putOnOn, r.pulledOn])).toEqual([['TAG-0001', '2026-06-01', '2026-07-01']]);
  });

  it('a pull through the API in lower case closes the upper-case put-on too', async () => {
    await signInAs(DEMO.keeper);
    const put = await on(f.a2, 'TAG-0004');
    const body = JSON.stringify({
      entries: [
        {
          colonyId: f.a2,
          pulledOn: '2026-07-02',
          depth: 'medium',
          frameCount: 10,
          tagCode: ' tag-0004 ',
          idempotencyKey: key(),
        },
      ],
    });
    const res = await postPulls(new Request('http://127.0.0.1:3100/api/super-pulls', { method: 'POST', body }));
    expect(res.status).toBe(200);
    const row = await getDb().models.SuperPull.findByPk(put.ok ? put.data.id : -1);
    expect(row).toMatchObject({ tagCode: 'TAG-0004', putOnOn: '2026-06-01', pulledOn: '2026-07-02' });
  });
});

describe('only printed tags, each on one hive', () => {
  it('an unknown tag is refused on Super on and on a pull, with a message, and nothing is written', async () => {
    await signInAs(DEMO.keeper);
    const before = await getDb().models.SuperPull.count();
    expect(await on(f.a1, 'NOPE-9999')).toMatchObject({ ok: false, message: /NOPE-9999 is not on your tag list/ });
    const r = await pull(f.a1, 'nope-9999');
    expect(r.ok && r.data.results[0]).toMatchObject({ ok: false, message: /NOPE-9999 is not on your tag list/ });
    expect(await getDb().models.SuperPull.count()).toBe(before);
  });

  it('a tag already on another hive is refused, naming that hive', async () => {
    await signInAs(DEMO.keeper);
    expect(await on(f.a1, 'TAG-0002')).toMatchObject({ ok: true });
    expect(await on(f.a2, 'tag-0002')).toMatchObject({ ok: false, message: /TAG-0002 is already on hive TAG-A1/ });
    const r = await pull(f.a2, 'TAG-0002');
    expect(r.ok && r.data.results[0]).toMatchObject({ ok: false, message: /TAG-0002 is on hive TAG-A1, not this one/ });
    expect(await getDb().models.SuperPull.count({ where: { tagCode: 'TAG-0002' } })).toBe(1);
  });

  it('a pull dated before its tag went on is refused rather than recorded as a second box', async () => {
    await signInAs(DEMO.keeper);
    expect(await on(f.a3, 'TAG-0003', '2026-07-10')).toMatchObject({ ok: true });
    const r = await pull(f.a3, 'TAG-0003', '2026-07-01');
    expect(r.ok && r.data.results[0]).toMatchObject({ ok: false, message: /went on on 2026-07-10/ });
    expect(await getDb().models.SuperPull.count({ where: { tagCode: 'TAG-0003' } })).toBe(1);
  });

  it('an untagged super needs the owner’s setting', async () => {
    await signInAs(DEMO.keeper);
    await setUntagged(false);
    try {
      expect(await on(f.a3, null)).toMatchObject({ ok: false, message: /Every super goes on with its tag/ });
      const r = await pull(f.a3, '');
      expect(r.ok && r.data.results[0]).toMatchObject({ ok: false, message: /Every pull names/ });
      await setUntagged(true);
      expect(await on(f.a3, null)).toMatchObject({ ok: true });
    } finally {
      await setUntagged(true);
    }
  });
});

describe('repairing stored tag codes (migration 20261204000200-tag-case)', () => {
  it('merges a lower-case put-on with its upper-case pull into one super and upper-cases the rest', async () => {
    const { SuperPull, SuperTag } = getDb().models;
    await SuperTag.create({ code: 'tag-0099', depth: 'medium' });
    const ghostOn = await SuperPull.create({
      colonyId: f.b1,
      depth: 'medium',
      frameCount: 10,
      tagCode: 'tag-0005',
      putOnOn: '2026-06-01',
      idempotencyKey: key(),
    });
    const ghostPull = await SuperPull.create({
      colonyId: f.b1,
      depth: 'medium',
      frameCount: 10,
      tagCode: 'TAG-0005',
      pulledOn: '2026-07-01',
      idempotencyKey: key(),
    });
    const loose = await SuperPull.create({
      colonyId: f.b1,
      depth: 'medium',
      frameCount: 10,
      tagCode: 'tag-0098',
      pulledOn: '2026-07-02',
      idempotencyKey: key(),
    });
    expect(await repairTagCase(getDb().sequelize)).toEqual({ merged: 1 });
    expect(await SuperPull.findByPk(ghostOn.id)).toBeNull();
    const merged = await SuperPull.findByPk(ghostPull.id);
    expect(merged).toMatchObject({
      tagCode: 'TAG-0005',
      putOnOn: '2026-06-01',
      pulledOn: '2026-07-01',
      idempotencyKey: ghostOn.idempotencyKey,
      pullKey: ghostPull.idempotencyKey,
    });
    expect((await SuperPull.findByPk(loose.id))?.tagCode).toBe('TAG-0098');
    expect(await SuperTag.count({ where: { code: 'TAG-0099' } })).toBe(1);
    expect(await repairTagCase(getDb().sequelize)).toEqual({ merged: 0 });
  });
});
