import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { closeDb, getDb } from '@/lib/db';
import { POST as uploadLabFile } from '@/app/api/lots/[id]/lab-files/route';
import { POST as uploadPhoto } from '@/app/api/products/[id]/photo/route';
import { DEMO, signInAs, setRequestHeaders } from '@/tests/support/session';
import { dbFingerprint } from '@/tests/support/db-fingerprint';
import { urlFor, type RouteFn } from '@/tests/support/matrix-calls';
import { TINY_PDF, TINY_PNG } from '@/tests/support/files';

afterAll(closeDb);

// No GET changes state. Every GET route handler is called for real (a real record, the
// owner signed in, the body read to its end) and the database must be exactly as before.
const routeModules = import.meta.glob<Record<string, unknown>>(['/app/**/route.ts']);

/** GETs that change something by design, and why; nothing else may. */
const WRITES_BY_DESIGN: Record<string, string> = {
  'app/(storefront)/checkout/cancelled/route.ts':
    "Stripe's cancel_url is a browser navigation; it releases the jars held for the order its HMAC token names (tests/data/shop/checkout.test.ts)",
  'app/api/auth/[...nextauth]/route.ts':
    "next-auth's own session/csrf/providers endpoints; sign-in and sign-out are POSTs",
};

const one = async (sql: string) => {
  const [row] = await getDb().sequelize.query<{ id: number }>(sql, { type: QueryTypes.SELECT });
  if (!row) throw new Error(`demo data has nothing for: ${sql}`);
  return row.id;
};

/** `as`: the e-mail of the user to call it as, for a route the owner may not call (default the owner). */
type Call = { params?: Record<string, string>; query?: string; expect: number; as?: string };
let calls: Record<string, Call[]> = {};

beforeAll(async () => {
  await signInAs(DEMO.owner);
  setRequestHeaders({});
  const lotId = await one(`SELECT id FROM lots ORDER BY id LIMIT 1`);
  const productId = await one(`SELECT id FROM products ORDER BY id LIMIT 1`);
  // A lab file and a product photo to read back (uploaded before the fingerprint is taken).
  const lab = new FormData();
  lab.set('file', new File([TINY_PDF], 'pollen.pdf', { type: 'application/pdf' }));
  expect(
    (
      await uploadLabFile(new Request(`http://t/api/lots/${lotId}/lab-files`, { method: 'POST', body: lab }), {
        params: Promise.resolve({ id: String(lotId) }),
      })
    ).status,
  ).toBe(201);
  const photo = new FormData();
  photo.set('photo', new File([TINY_PNG], 'jar.png', { type: 'image/png' }));
  expect(
    (
      await uploadPhoto(new Request(`http://t/api/products/${productId}/photo`, { method: 'POST', body: photo }), {
        params: Promise.resolve({ id: String(productId) }),
      })
    ).status,
  ).toBe(201);

  const orderId = await one(`SELECT id FROM orders WHERE status <> 'pending' ORDER BY id LIMIT 1`);
  const runId = await one(`SELECT id FROM jarring_runs ORDER BY id LIMIT 1`);
  const colonyId = await one(`SELECT id FROM colonies ORDER BY id LIMIT 1`);
  const keeperId = await one(`SELECT id FROM users WHERE role = 'keeper' ORDER BY id LIMIT 1`);
  const labFileId = await one(`SELECT id FROM lab_files ORDER BY id DESC LIMIT 1`);
  calls = {
    'app/(back-office)/admin/orders/[id]/packing-slip/route.ts': [{ params: { id: String(orderId) }, expect: 200 }],
    'app/api/account/orders/route.ts': [{ query: '?page=1&pageSize=25', expect: 200, as: DEMO.customer }],
    'app/api/colonies/detail/route.ts': [{ query: `?id=${colonyId}`, expect: 200 }],
    'app/api/colonies/route.ts': [{ query: '?page=1&pageSize=25', expect: 200 }],
    'app/api/health/route.ts': [{ expect: 200 }],
    'app/api/jarring/route.ts': [{ query: '?page=1&pageSize=25', expect: 200 }],
    'app/api/jarring/[id]/labels/route.ts': [
      { params: { id: String(runId) }, query: '?preview=1', expect: 200 },
      { params: { id: String(runId) }, expect: 200 },
    ],
    'app/api/lab-files/[id]/route.ts': [{ params: { id: String(labFileId) }, expect: 200 }],
    'app/api/lots/route.ts': [{ query: '?page=1&pageSize=25', expect: 200 }],
    'app/api/orders/route.ts': [{ query: '?page=1&pageSize=25&status=all', expect: 200 }],
    'app/api/products/[id]/photo/route.ts': [{ params: { id: String(productId) }, expect: 200 }],
    'app/api/products/route.ts': [{ expect: 200 }],
    'app/api/reports/csv/route.ts': [{ query: '?table=colonies', expect: 200 }],
    'app/api/reports/keeper-pdf/route.ts': [{ query: `?keeper=${keeperId}`, expect: 200 }],
    'app/api/settings/route.ts': [{ expect: 200 }],
    'app/api/stock/ledger/route.ts': [{ query: '?page=1&pageSize=25', expect: 200 }],
    'app/api/super-pulls/route.ts': [{ query: '?page=1&pageSize=25', expect: 200 }],
    'app/api/super-tags/sheet/route.ts': [{ expect: 200 }],
    'app/api/trace/recall/route.ts': [
      { query: `?lot=${lotId}&format=csv`, expect: 200 },
      { query: `?lot=${lotId}&format=pdf`, expect: 200 },
    ],
    'app/api/yards/route.ts': [{ query: '?page=1&pageSize=25', expect: 200 }],
    'app/welcome/route.ts': [{ expect: 303 }],
  };
});

async function call(file: string, fn: RouteFn, c: Call): Promise<number> {
  const params = c.params ?? {};
  if (c.as) await signInAs(c.as);
  try {
    const res = await fn(new Request(urlFor(file, params) + (c.query ?? '')), { params: Promise.resolve(params) });
    await res.arrayBuffer(); // streamed PDFs and CSVs do their work while they are read
    return res.status;
  } catch (err) {
    if ((err as { redirectTo?: string }).redirectTo) return 303; // next/navigation's redirect(), stubbed to throw
    throw err;
  } finally {
    if (c.as) await signInAs(DEMO.owner);
  }
}

describe('GET never changes state', () => {
  it('every GET route handler is either called here with a real record or listed with its reason', async () => {
    const gets: string[] = [];
    for (const [file, load] of Object.entries(routeModules))
      if (typeof (await load()).GET === 'function') gets.push(file.slice(1));
    const covered = new Set([...Object.keys(calls), ...Object.keys(WRITES_BY_DESIGN)]);
    expect(
      gets.filter((f) => !covered.has(f)),
      'GET handlers with no row here',
    ).toEqual([]);
    expect(
      [...covered].filter((f) => !gets.includes(f)),
      'rows for GET handlers that no longer exist',
    ).toEqual([]);
  });

  it('reading every list, detail, download, report and label sheet as the owner writes nothing', async () => {
    const before = await dbFingerprint();
    const answers: string[] = [];
    for (const [file, cases] of Object.entries(calls)) {
      const { GET } = await routeModules[`/${file}`]();
      for (const c of cases)
        answers.push(`${file}${c.query ?? ''} → ${await call(file, GET as RouteFn, c)} (want ${c.expect})`);
    }
    expect(answers.filter((a) => !/→ (\d+) \(want \1\)$/.test(a))).toEqual([]);
    expect(await dbFingerprint()).toBe(before);
  });
});
