import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb, getDb } from '@/lib/db/index';
import { saveYard } from '@/lib/data/yards/yards';
import { createColony } from '@/lib/data/colonies/write';
import { DEMO, signInAs } from '@/tests/support/session';
import { GET as listYardsRoute } from '@/app/api/yards/route';

afterAll(closeDb);

// The yards list pages and sorts through listQuery, like every other list route.
const NAMES = ['LYQ Alder', 'LYQ Birch', 'LYQ Cedar', 'LYQ Damson', 'LYQ Elder'];
const COLONIES: Record<string, number> = { 'LYQ Birch': 3, 'LYQ Damson': 1 };

beforeAll(async () => {
  const { User } = getDb().models;
  const [owner, keeper] = await Promise.all(
    [DEMO.owner, DEMO.keeper].map((email) => User.findOne({ where: { email } })),
  );
  if (!owner || !keeper) throw new Error('demo users missing');
  for (const name of NAMES) {
    const keeperIds = name === 'LYQ Cedar' ? [keeper.id] : [];
    const yardId = await saveYard(owner.id, null, {
      name,
      place: '',
      latitude: null,
      longitude: null,
      forageNotes: '',
      keeperIds,
    });
    for (let i = 1; i <= (COLONIES[name] ?? 0); i++) {
      await createColony(owner, {
        code: `LYQ-${name.split(' ')[1]}-${i}`,
        yardId,
        origin: 'swarm',
        parentColonyId: null,
        queenYear: null,
        startedOn: null,
        notes: '',
      });
    }
  }
});

const get = async (query: string) => listYardsRoute(new Request(`http://127.0.0.1:3100/api/yards${query}`));
type Body = { rows: { name: string; activeColonies: number }[]; total: number; page: number; pageSize: number };

describe('GET /api/yards', () => {
  it('pages: with more yards than the page size there is a page 2, sorted by name by default', async () => {
    await signInAs(DEMO.owner);
    const first = await get('?q=LYQ&pageSize=2');
    expect(first.status).toBe(200);
    const one = (await first.json()) as Body;
    expect(one).toMatchObject({ total: 5, page: 1, pageSize: 2 });
    expect(one.rows.map((r) => r.name)).toEqual(['LYQ Alder', 'LYQ Birch']);
    const two = (await (await get('?q=LYQ&pageSize=2&page=2')).json()) as Body;
    expect(two).toMatchObject({ total: 5, page: 2, pageSize: 2 });
    expect(two.rows.map((r) => r.name)).toEqual(['LYQ Cedar', 'LYQ Damson']);
    const last = (await (await get('?q=LYQ&pageSize=2&page=3')).json()) as Body;
    expect(last.rows.map((r) => r.name)).toEqual(['LYQ Elder']);
  });

  it('sorts by an allowed field in either direction', async () => {
    await signInAs(DEMO.owner);
    const byName = (await (await get('?q=LYQ&sort=name&dir=desc')).json()) as Body;
    expect(byName.rows.map((r) => r.name)).toEqual([...NAMES].reverse());
    const byColonies = (await (await get('?q=LYQ&sort=colonies&dir=desc&pageSize=2')).json()) as Body;
    expect(byColonies.rows.map((r) => [r.name, r.activeColonies])).toEqual([
      ['LYQ Birch', 3],
      ['LYQ Damson', 1],
    ]);
  });

  it('an unknown sort, a bad direction or too large a page is a 400 with a readable message', async () => {
    await signInAs(DEMO.owner);
    const badSort = await get('?sort=password');
    expect(badSort.status).toBe(400);
    expect(await badSort.json()).toMatchObject({
      error: 'Some fields are not valid.',
      fieldErrors: { sort: 'Sort by one of: name, colonies.' },
    });
    expect((await get('?dir=sideways')).status).toBe(400);
    const tooMany = await get('?pageSize=500');
    expect(tooMany.status).toBe(400);
    expect(await tooMany.json()).toMatchObject({ fieldErrors: { pageSize: 'At most 100 rows per page.' } });
  });

  it('a keeper pages through their own yards only', async () => {
    await signInAs(DEMO.keeper);
    const mine = (await (await get('?q=LYQ')).json()) as Body;
    expect(mine).toMatchObject({ total: 1, page: 1, pageSize: 25 });
    expect(mine.rows.map((r) => r.name)).toEqual(['LYQ Cedar']);
  });
});
