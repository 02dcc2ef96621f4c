import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO, signInAs } from '@/tests/support/session';
import { closeDb } from '@/lib/db/index';
import { createJarringRunAction } from '@/app/(back-office)/admin/jarring/actions';
import { GET as listRunsRoute } from '@/app/api/jarring/route';
import { key, product, releasedLot, samples } from '@/tests/support/jarring-fixtures';

afterAll(closeDb);

// The jarring runs list pages through listQuery like every other list route.
let lotId = 0;
const DAYS = ['2026-09-02', '2026-09-04', '2026-09-03'];

beforeAll(async () => {
  await signInAs(DEMO.crew);
  const lot = await releasedLot(20_000);
  const jar = await product({ netGrams: 340 });
  lotId = lot.id;
  for (const runOn of DAYS) {
    const res = await createJarringRunAction({
      lotId,
      productId: jar.id,
      jarCount: 2,
      runOn,
      sampleMode: 'net',
      samples: samples(342, 341),
      idempotencyKey: key(),
    });
    expect(res.ok).toBe(true);
  }
});

const get = async (query: string) => listRunsRoute(new Request(`http://127.0.0.1:3100/api/jarring${query}`));
type Body = { rows: { runOn: string; lotId: number }[]; total: number; page: number; pageSize: number };

describe('GET /api/jarring', () => {
  it('pages one lot’s runs, newest first', async () => {
    await signInAs(DEMO.crew);
    const first = await get(`?lotId=${lotId}&pageSize=2`);
    expect(first.status).toBe(200);
    const one = (await first.json()) as Body;
    expect(one).toMatchObject({ total: 3, page: 1, pageSize: 2 });
    expect(one.rows.map((r) => r.runOn)).toEqual(['2026-09-04', '2026-09-03']);
    const two = (await (await get(`?lotId=${lotId}&pageSize=2&page=2`)).json()) as Body;
    expect(two).toMatchObject({ total: 3, page: 2, pageSize: 2 });
    expect(two.rows.map((r) => r.runOn)).toEqual(['2026-09-02']);
    const oldest = (await (await get(`?lotId=${lotId}&dir=asc&pageSize=1`)).json()) as Body;
    expect(oldest.rows.map((r) => r.runOn)).toEqual(['2026-09-02']);
  });

  it('a keeper may read the list; an unknown sort is a 400', async () => {
    await signInAs(DEMO.keeper);
    expect((await get(`?lotId=${lotId}`)).status).toBe(200);
    const bad = await get('?sort=createdBy');
    expect(bad.status).toBe(400);
    expect(await bad.json()).toMatchObject({ fieldErrors: { sort: 'Sort by one of: runOn.' } });
  });
});
