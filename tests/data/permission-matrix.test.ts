import { afterAll, describe, expect, it } from 'vitest';
import { closeDb } from '@/lib/db';
import { ACTIONS, ROUTES, type Allowed, type Who } from '@/tests/support/permission-matrix';
import { signInAs, setRequestHeaders } from '@/tests/support/session';
import { callRoute, isAuthRefusal, routeRefused, type ActionFn, type RouteFn } from '@/tests/support/matrix-calls';

afterAll(closeDb);

// Every server action module and route handler in the app, found by file, not by hand.
const actionModules = import.meta.glob<Record<string, unknown>>(['/app/**/actions.ts']);
const routeModules = import.meta.glob<Record<string, unknown>>(['/app/**/route.ts']);
const WHO: Who[] = ['anonymous', 'customer', 'keeper', 'crew', 'owner'];
const LOGIN: Record<Exclude<Who, 'anonymous'>, string> = {
  customer: 'customer@hollowmere.test',
  keeper: 'keeper@hollowmere.test',
  crew: 'crew@hollowmere.test',
  owner: 'owner@hollowmere.test',
};
const HTTP = ['GET', 'POST', 'PUT', 'PATCH', 'DELETE'];

const allows = (allowed: Allowed, who: Who) => allowed === 'anyone' || allowed.includes(who);
async function actAs(who: Who) {
  setRequestHeaders({});
  await signInAs(who === 'anonymous' ? null : LOGIN[who]);
}

async function exportsOf(
  modules: Record<string, () => Promise<Record<string, unknown>>>,
  filter: (name: string) => boolean,
) {
  const out: { key: string; fn: unknown; file: string }[] = [];
  for (const [file, load] of Object.entries(modules)) {
    const mod = await load();
    for (const [name, fn] of Object.entries(mod))
      if (typeof fn === 'function' && filter(name))
        out.push({ key: `${file.slice(1)}#${name}`, fn, file: file.slice(1) });
  }
  return out;
}

describe('permission matrix (ASVS 8.1.1, 8.2.1)', () => {
  it('lists every server action and route handler, and nothing that no longer exists', async () => {
    const actions = await exportsOf(actionModules, (n) => n.endsWith('Action'));
    const routes = await exportsOf(routeModules, (n) => HTTP.includes(n));
    expect(
      actions.map((a) => a.key).filter((k) => !(k in ACTIONS)),
      'actions missing from the matrix',
    ).toEqual([]);
    expect(
      routes.map((r) => r.key).filter((k) => !(k in ROUTES)),
      'routes missing from the matrix',
    ).toEqual([]);
    expect(
      Object.keys(ACTIONS).filter((k) => !actions.some((a) => a.key === k)),
      'stale action rows',
    ).toEqual([]);
    expect(
      Object.keys(ROUTES).filter((k) => !routes.some((r) => r.key === k)),
      'stale route rows',
    ).toEqual([]);
  });

  it('server actions refuse every role the matrix does not list, and only those', async () => {
    const actions = await exportsOf(actionModules, (n) => n.endsWith('Action'));
    const wrong: string[] = [];
    for (const who of WHO) {
      await actAs(who);
      for (const a of actions) {
        const allowed = ACTIONS[a.key];
        if (!allowed || allowed === 'anyone') continue;
        // Empty input: an allowed role gets a validation answer, a refused one an auth refusal.
        const result = await (a.fn as ActionFn)({}).catch((err: Error) => ({
          ok: false,
          message: `threw ${err.message}`,
        }));
        const refused = isAuthRefusal(result);
        if (allows(allowed, who) === refused) wrong.push(`${a.key} as ${who}: ${JSON.stringify(result).slice(0, 160)}`);
      }
    }
    expect(wrong).toEqual([]);
  });

  it('route handlers answer 401/403/404 to every role the matrix does not list', async () => {
    const routes = await exportsOf(routeModules, (n) => HTTP.includes(n));
    const wrong: string[] = [];
    for (const who of WHO) {
      await actAs(who);
      for (const r of routes) {
        const allowed = ROUTES[r.key];
        if (!allowed || allowed === 'anyone') continue;
        const status = await callRoute(r.file, r.key.split('#')[1], r.fn as RouteFn, {});
        // An allowed role asking for a made-up id ([id] = 999999) rightly gets 404; only 401/403 refuse it.
        const ok = allows(allowed, who) ? status !== 401 && status !== 403 : routeRefused(status);
        if (!ok) wrong.push(`${r.key} as ${who}: ${status}`);
      }
    }
    expect(wrong).toEqual([]);
  });
});
