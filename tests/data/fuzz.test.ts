import { afterAll, describe, expect, it } from 'vitest';
import { closeDb } from '@/lib/db';
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
