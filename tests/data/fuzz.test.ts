import { afterAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { closeDb, getDb } from '@/lib/db';
import { POST as checkoutPOST } from '@/app/api/checkout/route';
import { POST as webhookPOST } from '@/app/api/stripe/webhook/route';
import { POST as labFilePOST } from '@/app/api/lots/[id]/lab-files/route';
import { createYardAction } from '@/app/(back-office)/admin/yards/actions';
import { adjustStockAction } from '@/app/(back-office)/admin/stock/actions';
import { signInAs, setRequestHeaders } from '@/tests/support/session';
import { callRoute, type ActionFn, type RouteFn } from '@/tests/support/matrix-calls';
import { dbFingerprint } from '@/tests/support/db-fingerprint';

afterAll(closeDb);

// Input validation (ASVS 2.2.1, 15.3.3): hostile input to every action and route handler, as the owner
// (who may call everything): always a readable refusal, never a crash, never a change in the database.
const actionModules = import.meta.glob<Record<string, unknown>>(['/app/**/actions.ts']);
const routeModules = import.meta.glob<Record<string, unknown>>(['/app/**/route.ts']);

const FIELDS = [
  'id',
  'userId',
  'yardId',
  'colonyId',
  'lotId',
  'productId',
  'orderId',
  'runId',
  'name',
  'email',
  'password',
  'code',
  'tagCode',
  'role',
  'status',
  'stage',
  'reason',
  'notes',
  'quantity',
  'jarCount',
  'grossKg',
  'tareKg',
  'weight',
  'fullWeight',
  'priceCents',
  'amountCents',
  'page',
  'pageSize',
  'sort',
  'dir',
  'date',
  'pulledOn',
  'refractiveIndex',
  'temperatureC',
  'items',
  'lines',
  'samples',
  'token',
  'businessName',
];
const fill = (value: unknown) => Object.fromEntries(FIELDS.map((f) => [f, value]));
const MB = 'x'.repeat(1_000_000);
const PAYLOADS: [string, unknown][] = [
  ['wrong types', Object.fromEntries(FIELDS.map((f, i) => [f, i % 2 ? [1, 2] : { nested: true }]))],
  ['huge numbers', fill(1e308)],
  ['unsafe integers', fill(Number.MAX_SAFE_INTEGER + 2)],
  ['negative quantities', fill(-5)],
  ['1 MB strings', fill(MB)],
  ['SQL metacharacters', fill("'; DROP TABLE users; --")],
  [
    '__proto__ keys',
    JSON.parse('{"__proto__": {"role": "owner", "ok": true}, "constructor": {"prototype": {"polluted": 1}}}'),
  ],
  ['not an object', 'just a string'],
  ['null', null],
];
const QUERIES = [
  '?page=-1&pageSize=1e309&sort=__proto__&dir=sideways',
  '?page=1&sort=id;DROP TABLE lots&q=%27%20OR%201%3D1--',
  `?q=${'y'.repeat(20_000)}`,
];

async function allExports(
  modules: Record<string, () => Promise<Record<string, unknown>>>,
  filter: (n: string) => boolean,
) {
  const out: { file: string; name: string; fn: unknown }[] = [];
  for (const [file, load] of Object.entries(modules))
    for (const [name, fn] of Object.entries(await load()))
      if (typeof fn === 'function' && filter(name)) out.push({ file: file.slice(1), name, fn });
  return out;
}

describe('fuzzing every action and route handler', () => {
  it('server actions answer hostile input with a readable refusal and change nothing', async () => {
    await signInAs('owner@hollowmere.test');
    setRequestHeaders({});
    const before = await dbFingerprint();
    const problems: string[] = [];
    for (const a of await allExports(actionModules, (n) => n.endsWith('Action'))) {
      for (const [label, payload] of PAYLOADS) {
        try {
          const r = (await (a.fn as ActionFn)(payload)) as { ok?: boolean; message?: string };
          if (r?.ok !== false) problems.push(`${a.file}#${a.name} accepted ${label}`);
          else if (!r.message || r.message.length > 300)
            problems.push(`${a.file}#${a.name} gave no readable message for ${label}`);
        } catch (err) {
          problems.push(`${a.file}#${a.name} threw on ${label}: ${(err as Error).message.slice(0, 120)}`);
        }
      }
    }
    expect(problems).toEqual([]);
    expect(await dbFingerprint()).toBe(before);
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
  });

  it('route handlers answer hostile bodies and queries with 4xx, never 5xx, and change nothing', async () => {
    await signInAs('owner@hollowmere.test');
    setRequestHeaders({});
    const before = await dbFingerprint();
    const problems: string[] = [];
    for (const r of await allExports(routeModules, (n) => ['GET', 'POST', 'PUT', 'PATCH', 'DELETE'].includes(n))) {
      if (r.file.includes('[...nextauth]')) continue; // next-auth's own handler, fronted by our throttle
      const cases: [string, unknown, string][] =
        r.name === 'GET'
          ? QUERIES.map((q) => [`query ${q.slice(0, 40)}`, undefined, q])
          : PAYLOADS.map(([l, p]) => [l, p, '']);
      for (const [label, body, query] of cases) {
        const status = await callRoute(r.file, r.name, r.fn as RouteFn, body, query);
        if (status >= 500) problems.push(`${r.file}#${r.name} → ${status} on ${label}`);
      }
    }
    expect(problems).toEqual([]);
    expect(await dbFingerprint()).toBe(before);
  });
});

/** A body of `totalBytes` sent in 64 KB chunks with no Content-Length (chunked), counting what the reader pulled. */
function countingBody(totalBytes: number, head = '') {
  const chunk = new Uint8Array(64 * 1024).fill(0x61);
  const pulled = { bytes: 0 };
  let sent = 0;
  const stream = new ReadableStream<Uint8Array>({
    pull(controller) {
      if (sent === 0 && head) {
        const h = new TextEncoder().encode(head);
        sent += h.byteLength;
        pulled.bytes += h.byteLength;
        controller.enqueue(h);
        return;
      }
      if (sent >= totalBytes) return controller.close();
      sent += chunk.byteLength;
      pulled.bytes += chunk.byteLength;
      controller.enqueue(chunk);
    },
  });
  return { stream, pulled };
}

const FIFTY_MB = 50 * 1024 * 1024;
const chunked = (url: string, body: ReadableStream<Uint8Array>, headers: Record<string, string> = {}) =>
  new Request(url, { method: 'POST', body, headers, duplex: 'half' } as RequestInit);

describe('bodies over the limit are refused while they stream (a 50 MB chunked body, no Content-Length)', () => {
  it('POST /api/checkout: 413 after reading little more than its 50 KB limit', async () => {
    await signInAs(null);
    setRequestHeaders({});
    const { stream, pulled } = countingBody(FIFTY_MB, '{"items":[');
    const res = await checkoutPOST(
      chunked('http://127.0.0.1/api/checkout', stream, { 'content-type': 'application/json' }),
    );
    expect(res.status).toBe(413);
    expect(pulled.bytes).toBeLessThan(1024 * 1024);
  });

  it('POST /api/stripe/webhook: 413 after reading little more than its 1 MB limit', async () => {
    const { stream, pulled } = countingBody(FIFTY_MB);
    const res = await webhookPOST(
      chunked('http://127.0.0.1/api/stripe/webhook', stream, { 'stripe-signature': 't=1,v1=00' }),
    );
    expect(res.status).toBe(413);
    expect(pulled.bytes).toBeLessThan(2 * 1024 * 1024);
  });

  it('a lab-file upload: 413 after reading little more than the 10 MB file limit', async () => {
    await signInAs('owner@hollowmere.test');
    setRequestHeaders({});
    const [lot] = await getDb().sequelize.query<{ id: number }>(`SELECT id FROM lots ORDER BY id LIMIT 1`, {
      type: QueryTypes.SELECT,
    });
    const boundary = 'fuzzboundary';
    const head = `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="big.pdf"\r\nContent-Type: application/pdf\r\n\r\n%PDF-1.4\n`;
    const { stream, pulled } = countingBody(FIFTY_MB, head);
    const res = await labFilePOST(
      chunked(`http://127.0.0.1/api/lots/${lot.id}/lab-files`, stream, {
        'content-type': `multipart/form-data; boundary=${boundary}`,
      }),
      { params: Promise.resolve({ id: String(lot.id) }) },
    );
    expect(res.status).toBe(413);
    expect(pulled.bytes).toBeLessThan(12 * 1024 * 1024);
  });
});

describe('input PostgreSQL would refuse is a clear 4xx, never a 500', () => {
  it('a NUL character in a checkout name, address or notes is a 400', async () => {
    await signInAs(null);
    setRequestHeaders({});
    const [product] = await getDb().sequelize.query<{ id: number }>(
      `SELECT id FROM products WHERE active ORDER BY id LIMIT 1`,
      { type: QueryTypes.SELECT },
    );
    const base = {
      items: [{ productId: product.id, quantity: 1 }],
      email: 'nul@example.test',
      name: 'Ada',
      phone: '',
      fulfilment: 'ship',
      address: { line1: '1 Reed St', city: 'Marrow', postalCode: 'MV1 2AB', country: 'US' },
    };
    const before = await dbFingerprint();
    for (const body of [
      { ...base, name: 'Ada\u0000Fenwick' },
      { ...base, address: { ...base.address, line1: '1 Reed\u0000 St' } },
    ]) {
      const res = await checkoutPOST(
        new Request('http://127.0.0.1/api/checkout', {
          method: 'POST',
          headers: { 'x-forwarded-for': '2001:db8::fuzz:1' },
          body: JSON.stringify(body),
        }),
      );
      expect(res.status).toBe(400);
    }
    expect(await dbFingerprint()).toBe(before);
  });

  it('a NUL in a server action text field and a stock adjustment of 3,000,000,000 jars are refusals, not crashes', async () => {
    await signInAs('owner@hollowmere.test');
    setRequestHeaders({});
    const [row] = await getDb().sequelize.query<{ productId: number; lotId: number }>(
      `SELECT product_id AS "productId", lot_id AS "lotId" FROM stock_levels ORDER BY product_id, lot_id LIMIT 1`,
      { type: QueryTypes.SELECT },
    );
    const before = await dbFingerprint();
    const yard = await createYardAction({ name: 'North\u0000 field', notes: 'x\u0000' } as never).catch(
      (e: Error) => e,
    );
    expect(yard).toMatchObject({ ok: false });
    const notes = await adjustStockAction({
      productId: row.productId,
      lotId: row.lotId,
      kind: 'adjustment',
      delta: 2,
      reason: 'Count\u0000ed',
    }).catch((e: Error) => e);
    expect(notes).toMatchObject({ ok: false });
    for (const delta of [3_000_000_000, -3_000_000_000]) {
      const huge = await adjustStockAction({
        productId: row.productId,
        lotId: row.lotId,
        kind: 'adjustment',
        delta,
        reason: 'Recount',
      }).catch((e: Error) => e);
      expect(huge).toMatchObject({ ok: false, fieldErrors: { delta: expect.anything() } });
    }
    expect(await dbFingerprint()).toBe(before);
  });
});
