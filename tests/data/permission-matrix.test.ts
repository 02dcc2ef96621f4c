import { afterAll, describe, expect, it } from 'vitest';
import { closeDb, getDb } from '@/lib/db';
import type { SessionUser } from '@/lib/auth/session';
import { canReadLot, readableLotIds } from '@/lib/data/lots/access';
import { getJarringRun } from '@/lib/data/jarring/read';
import { listStockLevels, stockTotals } from '@/lib/data/stock/stock';
import { GET as jarringGET } from '@/app/api/jarring/route';
import { GET as ledgerGET } from '@/app/api/stock/ledger/route';
import { GET as recallGET } from '@/app/api/trace/recall/route';
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

describe('per-record scope: a keeper reads only what came from their own colonies (KEEPER_SCOPE)', () => {
  async function keeperAndForeignLot() {
    const me = await signInAs(LOGIN.keeper);
    const keeper: SessionUser = { id: me!.id, name: 'Keeper', email: LOGIN.keeper, role: 'keeper' };
    const mine = (await readableLotIds(keeper)) ?? [];
    // A lot with a jarring run and stock that did not come from this keeper's colonies.
    const { JarringRun, Lot, Product, StockLevel, StockEntry } = getDb().models;
    const lot = await Lot.create({
      code: `FOREIGN-${process.pid % 100000}`,
      floralSource: 'Heath',
      stage: 'released',
      bestBeforeOn: '2029-06-30',
      createdBy: null,
    });
    const product = await Product.findOne({ order: [['id', 'ASC']] });
    const foreignRun = await JarringRun.create({
      lotId: lot.id,
      productId: product!.id,
      jarCount: 7,
      runOn: '2026-09-01',
      sampleGrams: [342, 341, 343],
      ruleSet: 'oiml',
      fillPass: true,
      fillReport: { mean: 342, reasons: [] } as never,
      honeyUsedGrams: 7 * 340,
      createdBy: null,
    });
    await StockLevel.create({
      productId: product!.id,
      lotId: lot.id,
      onHand: 7,
      reserved: 0,
      bestBeforeOn: '2029-06-30',
    });
    await StockEntry.create({
      productId: product!.id,
      lotId: lot.id,
      delta: 7,
      kind: 'adjustment',
      reason: 'scope test',
      createdBy: null,
    });
    return { keeper, mine, lot, foreignRun, productId: product!.id };
  }

  it("a keeper gets 'not found' for another keeper's jarring run, and never sees its stock, ledger or recall list", async () => {
    const { keeper, mine, lot, foreignRun, productId } = await keeperAndForeignLot();
    expect(mine).not.toContain(lot.id);
    expect(await canReadLot(keeper, lot.id)).toBe(false);
    // Jarring: the run page's data (404) and the list, also when asked for that lot by id.
    expect(await getJarringRun(keeper, foreignRun.id)).toBeNull();
    const runs = (await (await jarringGET(new Request('http://127.0.0.1/api/jarring?pageSize=100'))).json()) as {
      rows: { lotId: number }[];
    };
    expect(runs.rows.every((r) => mine.includes(r.lotId))).toBe(true);
    const asked = (await (await jarringGET(new Request(`http://127.0.0.1/api/jarring?lotId=${lot.id}`))).json()) as {
      rows: unknown[];
      total: number;
    };
    expect(asked).toMatchObject({ rows: [], total: 0 });
    // Stock rows and totals.
    expect((await listStockLevels(keeper)).every((r) => mine.includes(r.lotId))).toBe(true);
    expect((await stockTotals(keeper)).find((t) => t.productId === productId)?.onHand ?? 0).toBe(
      (await listStockLevels(keeper, { productId })).reduce((s, r) => s + r.onHand, 0),
    );
    // The ledger, listed and asked by lot.
    const ledger = (await (
      await ledgerGET(new Request(`http://127.0.0.1/api/stock/ledger?lotId=${lot.id}`))
    ).json()) as {
      total: number;
    };
    expect(ledger.total).toBe(0);
    const all = (await (await ledgerGET(new Request('http://127.0.0.1/api/stock/ledger?pageSize=100'))).json()) as {
      rows: { lotCode: string }[];
    };
    expect(all.rows.some((r) => r.lotCode === lot.code)).toBe(false);
    // Trace: owner and crew only.
    expect((await recallGET(new Request(`http://127.0.0.1/api/trace/recall?lot=${lot.id}`))).status).toBe(403);

    // The owner sees all of it: the rule scopes keepers, it does not hide records.
    const ownerRow = await signInAs(LOGIN.owner);
    const owner: SessionUser = { id: ownerRow!.id, name: 'Owner', email: LOGIN.owner, role: 'owner' };
    expect(await getJarringRun(owner, foreignRun.id)).not.toBeNull();
    expect((await listStockLevels(owner)).some((r) => r.lotId === lot.id)).toBe(true);
    const ownerLedger = (await (
      await ledgerGET(new Request(`http://127.0.0.1/api/stock/ledger?lotId=${lot.id}`))
    ).json()) as {
      total: number;
    };
    expect(ownerLedger.total).toBe(1);
  });
});
