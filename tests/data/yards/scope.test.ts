import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { closeDb, getDb } from '@/lib/db/index';
import { DEMO, setRequestHeaders, signInAs } from '@/tests/support/session';
import { yardFixture, key } from '@/tests/support/yard-fixtures';
import {
  addFeedingAction,
  addTreatmentAction,
  colonyNoteAction,
  colonyStatusAction,
  moveColonyAction,
  splitColonyAction,
  superOnAction,
  updateColonyAction,
  createColonyAction,
} from '@/app/(back-office)/admin/colonies/actions';
import { recordPullsAction, updateYardAction } from '@/app/(back-office)/admin/yards/actions';
import { GET as colonyDetailRoute } from '@/app/api/colonies/detail/route';
import { GET as listColoniesRoute } from '@/app/api/colonies/route';
import { GET as listYardsRoute } from '@/app/api/yards/route';
import { GET as listPullsRoute, POST as postPullsRoute } from '@/app/api/super-pulls/route';
import ColonyPage from '@/app/(back-office)/admin/colonies/[id]/page';

afterAll(closeDb);
beforeEach(() => setRequestHeaders({}));

let f: Awaited<ReturnType<typeof yardFixture>>;
beforeAll(async () => {
  f = await yardFixture('SCP');
});

const getColonyRoute = (req: Request) => colonyDetailRoute(req);
const url = (path: string) => new Request(`http://127.0.0.1:3100${path}`);
const rowsOf = async (res: Response) =>
  ((await res.json()) as { rows: { id: number; code?: string; colonyCode?: string }[] }).rows;

describe('keeper A and keeper B colonies', () => {
  it("keeper A reads their own colony through the route, but B's is a 404 in the route and the page", async () => {
    await signInAs(DEMO.keeper);
    expect((await getColonyRoute(url(`/api/colonies/detail?id=${f.a1}`))).status).toBe(200);
    const res = await getColonyRoute(url(`/api/colonies/detail?id=${f.b1}`));
    expect(res.status).toBe(404);
    expect((await res.json()).error).toBe('No such colony.');
    await expect(ColonyPage({ params: Promise.resolve({ id: String(f.b1) }) })).rejects.toThrow('NEXT_NOT_FOUND');
  });

  it("lists show only the keeper's own yards, colonies and supers", async () => {
    await signInAs(DEMO.keeper);
    const colonies = await rowsOf(await listColoniesRoute(url('/api/colonies?pageSize=100&q=SCP-')));
    expect(colonies.map((c) => c.code).sort()).toEqual(['SCP-A1', 'SCP-A2', 'SCP-A3']);
    const yards = await rowsOf(await listYardsRoute(url('/api/yards?q=SCP')));
    expect(yards.map((y) => y.id)).toEqual([f.yardA]);
    // Asking for B's colony by filter gives nothing, not B's supers.
    await signInAs(DEMO.owner);
    await postPullsRoute(
      new Request('http://127.0.0.1:3100/api/super-pulls', {
        method: 'POST',
        body: JSON.stringify({
          entries: [{ colonyId: f.b1, pulledOn: '2026-07-01', depth: 'medium', frameCount: 10, idempotencyKey: key() }],
        }),
      }),
    );
    await signInAs(DEMO.keeper);
    expect(await rowsOf(await listPullsRoute(url(`/api/super-pulls?colonyId=${f.b1}`)))).toEqual([]);
  });

  it("every write by keeper A on B's colony is refused and writes nothing", async () => {
    await signInAs(DEMO.keeper);
    const { SuperPull, Feeding, Treatment, ColonyEvent, Colony } = getDb().models;
    const before = await Promise.all(
      [SuperPull, Feeding, Treatment, ColonyEvent, Colony].map((m) => (m as typeof SuperPull).count()),
    );
    const c = f.b1;
    const results = [
      await updateColonyAction({ colonyId: c, code: 'SCP-HIJACK', origin: 'swarm', notes: '' }),
      await moveColonyAction({ colonyId: c, yardId: f.yardA, occurredOn: '2026-07-01' }),
      await colonyStatusAction({ colonyId: c, status: 'dead_out', occurredOn: '2026-07-01' }),
      await splitColonyAction({ colonyId: c, newCode: 'SCP-STOLEN', occurredOn: '2026-07-01', idempotencyKey: key() }),
      await colonyNoteAction({ colonyId: c, occurredOn: '2026-07-01', note: 'hello', idempotencyKey: key() }),
      await addFeedingAction({ colonyId: c, kind: 'sugar_syrup', startedOn: '2026-07-01', idempotencyKey: key() }),
      await addTreatmentAction({
        colonyId: c,
        treatmentKindId: f.noSupersKindId,
        appliedOn: '2026-07-01',
        idempotencyKey: key(),
      }),
      await superOnAction({
        colonyId: c,
        depth: 'medium',
        frameCount: 10,
        putOnOn: '2026-07-01',
        idempotencyKey: key(),
      }),
      await createColonyAction({ code: 'SCP-INB', yardId: f.yardB, origin: 'swarm' }),
    ];
    for (const r of results)
      expect(r).toMatchObject({ ok: false, message: expect.stringMatching(/No such (colony|yard)/) });
    const pulls = await recordPullsAction({
      entries: [{ colonyId: c, pulledOn: '2026-07-01', depth: 'medium', frameCount: 10, idempotencyKey: key() }],
    });
    expect(pulls.ok && pulls.data.results[0]).toMatchObject({ ok: false, message: 'No such colony.' });
    const viaApi = await postPullsRoute(
      new Request('http://127.0.0.1:3100/api/super-pulls', {
        method: 'POST',
        body: JSON.stringify({
          entries: [{ colonyId: c, pulledOn: '2026-07-01', depth: 'medium', frameCount: 10, idempotencyKey: key() }],
        }),
      }),
    );
    expect((await viaApi.json()).results[0]).toMatchObject({ ok: false, message: 'No such colony.' });
    const after = await Promise.all(
      [SuperPull, Feeding, Treatment, ColonyEvent, Colony].map((m) => (m as typeof SuperPull).count()),
    );
    expect(after).toEqual(before);
    expect((await Colony.findByPk(c))?.code).toBe('SCP-B1');
  });

  it('crew reads super pulls but cannot write colony records; a customer gets nothing', async () => {
    await signInAs(DEMO.crew);
    expect((await listPullsRoute(url('/api/super-pulls'))).status).toBe(200);
    expect(
      await addFeedingAction({ colonyId: f.a1, kind: 'other', startedOn: '2026-07-01', idempotencyKey: key() }),
    ).toMatchObject({ ok: false, message: expect.stringMatching(/not allowed/) });
    expect(
      (
        await recordPullsAction({
          entries: [{ colonyId: f.a1, pulledOn: '2026-07-01', depth: 'deep', frameCount: 10, idempotencyKey: key() }],
        })
      ).ok,
    ).toBe(false);
    await signInAs(DEMO.customer);
    for (const res of [
      await listPullsRoute(url('/api/super-pulls')),
      await listColoniesRoute(url('/api/colonies')),
      await getColonyRoute(url(`/api/colonies/detail?id=${f.a1}`)),
    ]) {
      expect(res.status).toBe(403);
    }
  });

  it('only the owner assigns keepers to yards', async () => {
    await signInAs(DEMO.keeper);
    const r = await updateYardAction({ yardId: f.yardB, name: 'Test B SCP', keeperIds: [f.keeperA.id] });
    expect(r).toMatchObject({ ok: false, message: expect.stringMatching(/not allowed/) });
  });

  it('query parameters are validated: pageSize over 100 and unknown sorts are 400', async () => {
    await signInAs(DEMO.owner);
    expect((await listColoniesRoute(url('/api/colonies?pageSize=500'))).status).toBe(400);
    expect((await listPullsRoute(url('/api/super-pulls?sort=password'))).status).toBe(400);
    const page = await (await listColoniesRoute(url('/api/colonies?q=SCP-&pageSize=2&page=2&sort=code'))).json();
    expect(page).toMatchObject({ total: 4, page: 2, pageSize: 2 });
    expect(page.rows.map((r: { code: string }) => r.code)).toEqual(['SCP-A3', 'SCP-B1']);
  });
});
