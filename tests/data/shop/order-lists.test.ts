import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb, getDb } from '@/lib/db/index';
import { DEMO, signInAs } from '@/tests/support/session';
import { GET as deskRoute } from '@/app/api/orders/route';
import { GET as accountRoute } from '@/app/api/account/orders/route';

afterAll(closeDb);

// The order desk and a customer's own orders page through listQuery like every other list.
beforeAll(async () => {
  const { Order, User } = getDb().models;
  const customer = await User.findOne({ where: { email: DEMO.customer } });
  if (!customer) throw new Error('demo customer missing');
  const order = (n: number, status: 'paid' | 'packed' | 'shipped', customerId: number | null) =>
    Order.create({
      number: `OLQ-${n}`,
      customerId,
      email: customerId ? DEMO.customer : `guest${n}@olq.test`,
      name: `Olq Buyer ${n}`,
      status,
      fulfilment: 'pickup',
      subtotalCents: n * 100,
      totalCents: n * 100,
      currency: 'eur',
      createdAt: new Date(Date.UTC(2026, 0, n)),
    });
  await order(1, 'paid', customer.id);
  await order(2, 'packed', null);
  await order(3, 'shipped', customer.id);
  await order(4, 'paid', null);
  await order(5, 'paid', customer.id);
});

const get = async (route: (req: Request) => Promise<Response>, query: string) =>
  route(new Request(`http://127.0.0.1:3100/api/orders${query}`));
type Body = { rows: { number: string; createdAt: string }[]; total: number; page: number; pageSize: number };
const numbers = async (res: Response) => ((await res.json()) as Body).rows.map((r) => r.number);

describe('the order desk list', () => {
  it('shows the orders to pack and send, newest first, page by page', async () => {
    await signInAs(DEMO.crew);
    const one = await get(deskRoute, '?q=OLQ-&pageSize=2');
    const body = (await one.clone().json()) as Body;
    expect(body).toMatchObject({ total: 4, page: 1, pageSize: 2 });
    expect(await numbers(one)).toEqual(['OLQ-5', 'OLQ-4']);
    expect(await numbers(await get(deskRoute, '?q=OLQ-&pageSize=2&page=2'))).toEqual(['OLQ-2', 'OLQ-1']);
    expect(await numbers(await get(deskRoute, '?q=olq-&status=all&sort=totalCents&dir=asc'))).toEqual([
      'OLQ-1',
      'OLQ-2',
      'OLQ-3',
      'OLQ-4',
      'OLQ-5',
    ]);
    expect(await numbers(await get(deskRoute, '?q=OLQ-&status=shipped'))).toEqual(['OLQ-3']);
  });

  it('refuses an unknown status or sort with a readable 400, and the customer', async () => {
    await signInAs(DEMO.crew);
    const res = await get(deskRoute, '?status=lost');
    expect(res.status).toBe(400);
    expect(((await res.json()) as { fieldErrors: Record<string, string> }).fieldErrors.status).toBeTruthy();
    expect((await get(deskRoute, '?sort=email')).status).toBe(400);
    await signInAs(DEMO.customer);
    expect((await get(deskRoute, '')).status).toBe(403);
  });
});

describe("a customer's own orders", () => {
  it('lists only their orders, newest first, and pages', async () => {
    await signInAs(DEMO.customer);
    const all = (await (await get(accountRoute, '?pageSize=100')).json()) as Body;
    const mine = all.rows.map((r) => r.number).filter((n) => n.startsWith('OLQ-'));
    expect(mine).toEqual(['OLQ-5', 'OLQ-3', 'OLQ-1']);
    const dates = all.rows.map((r) => r.createdAt);
    expect([...dates].sort().reverse()).toEqual(dates);
    const page = (await (await get(accountRoute, `?pageSize=1&page=${all.total}`)).json()) as Body;
    expect(page).toMatchObject({ total: all.total, page: all.total, pageSize: 1 });
    expect(page.rows).toHaveLength(1);
    await signInAs(DEMO.crew);
    expect((await get(accountRoute, '')).status).toBe(403);
  });
});
