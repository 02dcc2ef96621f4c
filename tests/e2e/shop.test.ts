import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { BrowserContext, Page } from 'playwright-core';
import { closeDb, getDb } from '@/lib/db';
import { BASE, DEMO_LOGINS, openBrowser, signIn, waitForMail } from './support';

let browser: BrowserContext;
beforeAll(async () => {
  browser = await openBrowser();
});
afterAll(async () => {
  await browser?.close();
  await closeDb();
});

type Live = { id: number; slug: string; name: string; available: number };
const catalogue = async () => ((await (await fetch(`${BASE()}/api/products`)).json()) as { products: Live[] }).products;
const onHand = async (productId: number) =>
  (await getDb().models.StockLevel.sum('onHand', { where: { productId } })) ?? 0;

const customer = { name: 'Ash Merriden', email: `ash-${Date.now()}@example.test`, password: 'quiet meadow bees' };

async function addToCart(page: Page, slug: string) {
  await page.goto(`${BASE()}/products/${slug}`);
  await page.getByRole('button', { name: 'Add to cart' }).click();
  await page.getByRole('status').filter({ hasText: 'Added' }).waitFor();
}

async function payOnFakePage(page: Page, card: string) {
  await page.getByLabel('Card number').fill(card);
  await page.getByLabel('Expiry (MM / YY)').fill('12 / 34');
  await page.getByLabel('Security code (CVC)').fill('123');
  await page.getByLabel('Name on card').fill(customer.name);
  await page.getByRole('button', { name: /^Pay / }).click();
}

async function checkOut(page: Page) {
  await page.goto(`${BASE()}/cart`);
  await page.getByRole('link', { name: 'Check out' }).click();
  await page.waitForURL('**/checkout');
  await page.getByRole('button', { name: 'Pay by card' }).click();
  await page.waitForURL((u) => u.pathname.startsWith('/pay/'), { timeout: 30_000 });
}

describe('the shop', () => {
  let paidNumber = '';
  let bought: Live[] = [];

  it('a new customer buys two products by card and sees the lots on the confirmation', async () => {
    const page = await browser.newPage();
    await page.goto(`${BASE()}/sign-up`);
    await page.getByLabel('Your name').fill(customer.name);
    await page.getByLabel('E-mail').fill(customer.email);
    await page.getByRole('button', { name: 'Create account' }).click();
    await page.getByRole('status').waitFor();
    // The account is confirmed through the mailed link, where the customer chooses a password.
    const welcome = await waitForMail(customer.email, /Finish creating your account/);
    const link = welcome.text.match(/https?:\/\/\S+reset-password\?token=\S+/)?.[0];
    expect(link).toBeTruthy();
    await page.goto(link!);
    await page.getByLabel('New password').fill(customer.password);
    await page.getByRole('button', { name: 'Save password' }).click();
    await page.getByRole('status').waitFor();
    await signIn(page, customer.email, customer.password);
    expect(new URL(page.url()).pathname).toBe('/account');

    bought = (await catalogue()).filter((p) => p.available > 2).slice(0, 2);
    expect(bought).toHaveLength(2);
    const before = await Promise.all(bought.map((p) => onHand(p.id)));
    await page.goto(`${BASE()}/products`);
    for (const p of bought) await addToCart(page, p.slug);
    await checkOut(page);
    await payOnFakePage(page, '4242 4242 4242 4242');

    await page.waitForURL((u) => u.pathname.startsWith('/orders/'), { timeout: 30_000 });
    await page.getByText('Thank you! Your payment was received').waitFor({ timeout: 30_000 });
    paidNumber = decodeURIComponent(new URL(page.url()).pathname.split('/').pop() ?? '');
    const table = await page.getByRole('table').textContent();
    for (const p of bought) expect(table).toContain(p.name);
    // The lots the webhook allocated (oldest best-before first; other tests may have added lots).
    const [rows] = await getDb().sequelize.query(
      `SELECT DISTINCT l.code FROM orders o JOIN order_lines ol ON ol.order_id = o.id JOIN order_allocations a ON a.order_line_id = ol.id
       JOIN lots l ON l.id = a.lot_id WHERE o.number = :number AND a.state = 'sold'`,
      { replacements: { number: paidNumber } },
    );
    const codes = (rows as { code: string }[]).map((r) => r.code);
    expect(codes.length).toBeGreaterThanOrEqual(1);
    for (const code of codes) expect(table).toContain(code);

    expect(await Promise.all(bought.map((p) => onHand(p.id)))).toEqual(before.map((n) => n - 1));
    const mail = await waitForMail(customer.email, new RegExp(`Order ${paidNumber} confirmed`));
    for (const code of codes) expect(mail.text).toContain(code);

    await page.goto(`${BASE()}/account`);
    expect(await page.getByRole('link', { name: paidNumber }).count()).toBe(1);
    await page.close();
  });

  it('a declined card leaves the stock and the order unpaid; leaving the card page releases the jars', async () => {
    const page = await browser.newPage();
    const p = bought[0];
    const [stockBefore, availableBefore] = [
      await onHand(p.id),
      (await catalogue()).find((x) => x.id === p.id)?.available,
    ];
    await addToCart(page, p.slug);
    await checkOut(page);
    await payOnFakePage(page, '4000 0000 0000 0002');
    await page.locator('form [role=alert]').waitFor();
    expect(await page.locator('form [role=alert]').textContent()).toMatch(/declined/i);

    const order = await getDb().models.Order.findOne({ where: { email: customer.email }, order: [['id', 'DESC']] });
    expect(order?.number).not.toBe(paidNumber);
    expect(order?.status).toBe('awaiting_payment');
    expect(order?.paidAt).toBeNull();
    expect(await onHand(p.id)).toBe(stockBefore);

    await page.getByRole('link', { name: 'Cancel and go back' }).click();
    await page.waitForURL('**/cart?cancelled=1');
    await order?.reload();
    expect(order?.status).toBe('cancelled');
    expect((await catalogue()).find((x) => x.id === p.id)?.available).toBe(availableBefore);
    await page.close();
  });

  it('staff refund the paid order, the jars go back to stock and the refund mail arrives', async () => {
    await browser.clearCookies();
    const page = await browser.newPage();
    await signIn(page, DEMO_LOGINS.crew.email, DEMO_LOGINS.crew.password);
    const order = await getDb().models.Order.findOne({ where: { number: paidNumber } });
    const before = await Promise.all(bought.map((p) => onHand(p.id)));
    await page.goto(`${BASE()}/admin/orders?status=paid`);
    await page.getByRole('link', { name: paidNumber }).click();
    await page.waitForURL(`**/admin/orders/${order?.id}`);
    const slip = await page.request.get(`${BASE()}/admin/orders/${order?.id}/packing-slip`);
    expect(slip.headers()['content-type']).toBe('application/pdf');
    page.on('dialog', (d) => void d.accept());
    await page.getByLabel('Reason (kept in the history)').fill('Changed their mind');
    await page.getByRole('button', { name: 'Refund to card' }).click();
    await page.getByRole('status').filter({ hasText: 'Refund sent' }).waitFor({ timeout: 30_000 });
    await order?.reload();
    expect(order?.status).toBe('refunded');
    expect(order?.refundedCents).toBe(order?.totalCents);
    expect(await Promise.all(bought.map((p) => onHand(p.id)))).toEqual(before.map((n) => n + 1));
    const mail = await waitForMail(customer.email, new RegExp(`Refund for order ${paidNumber}`));
    expect(mail.html).toContain(paidNumber);
    await page.close();
  });
});
