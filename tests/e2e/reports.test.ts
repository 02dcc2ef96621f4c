import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import pg from 'pg';
import type { BrowserContext } from 'playwright-core';
import { gs1HumanReadable } from '@/lib/domain/gs1';
import { BASE, DEMO_LOGINS, openBrowser, signIn, waitForMail } from './support';

let browser: BrowserContext;
beforeAll(async () => {
  browser = await openBrowser();
});
afterAll(async () => {
  await browser?.close();
});

async function freshPage() {
  for (const p of browser.pages()) await p.close();
  await browser.clearCookies();
  return browser.newPage();
}

/** A demo jar that was sold: its lot, product GTIN and best-before, and who bought it (read from the e2e database). */
async function soldJar() {
  const db = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await db.connect();
  try {
    const { rows } = await db.query<{ lot_id: number; code: string; gtin: string; best_before_on: string }>(
      `SELECT l.id AS lot_id, l.code, p.gtin, to_char(l.best_before_on, 'YYYY-MM-DD') AS best_before_on
       FROM order_allocations oa JOIN order_lines ol ON ol.id = oa.order_line_id JOIN products p ON p.id = ol.product_id JOIN lots l ON l.id = oa.lot_id
       WHERE oa.state = 'sold' AND p.gtin IS NOT NULL AND l.best_before_on IS NOT NULL ORDER BY l.code LIMIT 1`,
    );
    const jar = rows[0];
    const buyers = await db.query<{ name: string }>(
      `SELECT DISTINCT o.name FROM order_allocations oa JOIN order_lines ol ON ol.id = oa.order_line_id JOIN orders o ON o.id = ol.order_id
       WHERE oa.lot_id = $1 AND oa.state = 'sold'`,
      [jar.lot_id],
    );
    const colonies = await db.query<{ code: string }>(
      `SELECT DISTINCT c.code FROM super_pulls sp JOIN colonies c ON c.id = sp.colony_id WHERE sp.lot_id = $1`,
      [jar.lot_id],
    );
    return { ...jar, buyers: buyers.rows.map((r) => r.name), colonies: colonies.rows.map((r) => r.code) };
  } finally {
    await db.end();
  }
}

describe('season yield reports', () => {
  it('the owner opens the season report, downloads a keeper PDF, sends the reports and the keeper gets the PDF by mail', async () => {
    const page = await freshPage();
    await signIn(page, DEMO_LOGINS.owner.email, DEMO_LOGINS.owner.password);
    await page.goto(`${BASE()}/admin/reports`);
    await page.getByRole('heading', { level: 1, name: /Season \d{4} yield/ }).waitFor();
    const colonies = page.getByRole('table', { name: 'Colonies', exact: true });
    expect(await colonies.locator('tbody tr').count()).toBeGreaterThan(20);
    // The per-yard bar charts render in the browser (recharts measures its box first).
    await page.locator('.recharts-wrapper svg').first().waitFor({ timeout: 20_000 });
    await page.screenshot({ path: 'tests/.artifacts/reports-owner.png', fullPage: true });
    expect(await page.getByTestId('total-honey').innerText()).toMatch(/kg/);

    const download = page.waitForEvent('download');
    await page.getByRole('link', { name: 'PDF: Tobias Venn' }).click();
    const file = await download;
    expect(file.suggestedFilename()).toMatch(/^season-\d{4}-Tobias_Venn\.pdf$/);
    expect(
      readFileSync((await file.path())!)
        .subarray(0, 5)
        .toString(),
    ).toBe('%PDF-');

    await page.getByRole('button', { name: /Send \d{4} season reports/ }).click();
    await page
      .getByRole('status')
      .filter({ hasText: /Done: 2 of 2/ })
      .waitFor({ timeout: 60_000 });
    const mail = await waitForMail(DEMO_LOGINS.keeper.email, /season yield report/, 60_000);
    expect(mail.attachments).toHaveLength(1);
    expect(mail.attachments[0].contentType).toBe('application/pdf');
    expect(mail.attachments[0].filename).toMatch(/Tobias_Venn\.pdf$/);

    // Sending again queues nothing new.
    await page.reload();
    await page.getByRole('button', { name: /Send \d{4} season reports/ }).click();
    await page
      .getByRole('status')
      .filter({ hasText: /Done: 2 of 2/ })
      .waitFor({ timeout: 60_000 });
    expect(await page.getByText('already sent').count()).toBe(2);
  });

  it("a keeper sees only their own colonies and cannot download another keeper's PDF", async () => {
    const page = await freshPage();
    await signIn(page, DEMO_LOGINS.keeper.email, DEMO_LOGINS.keeper.password);
    await page.goto(`${BASE()}/admin/reports`);
    const keeperCells = await page
      .getByRole('table', { name: 'Colonies', exact: true })
      .locator('tbody tr td:nth-child(3)')
      .allInnerTexts();
    expect(keeperCells.length).toBeGreaterThan(0);
    expect(new Set(keeperCells)).toEqual(new Set(['Tobias Venn']));
    expect(await page.getByRole('button', { name: /Send/ }).count()).toBe(0);
    const other = await page.request.get(`${BASE()}/api/reports/keeper-pdf?keeper=999999`);
    expect(other.status()).toBe(404);
  });
});

describe('trace', () => {
  it('the crew scans a jar barcode and sees its colonies and customers', async () => {
    const jar = await soldJar();
    const page = await freshPage();
    await signIn(page, DEMO_LOGINS.crew.email, DEMO_LOGINS.crew.password);
    await page.goto(`${BASE()}/admin/trace`);
    await page
      .getByLabel('Lot, jar barcode, super tag or order')
      .fill(gs1HumanReadable({ gtin: jar.gtin, bestBefore: jar.best_before_on, lot: jar.code }));
    await page.getByRole('button', { name: 'Trace' }).click();
    await page.getByRole('heading', { level: 2, name: `Lot ${jar.code}` }).waitFor();
    expect(await page.getByText(`Jar of lot ${jar.code}`).count()).toBe(1);
    await page.screenshot({ path: 'tests/.artifacts/trace-crew.png', fullPage: true });
    expect(await page.getByTestId('trace-ms').innerText()).toMatch(/Traced in [\d.]+ ms/);
    const colonies = await page
      .getByRole('table', { name: 'Colonies' })
      .first()
      .locator('tbody tr td:first-child')
      .allInnerTexts();
    expect(new Set(colonies)).toEqual(new Set(jar.colonies));
    const customers = page.getByRole('table', { name: 'Orders and customers' }).first();
    for (const name of jar.buyers) expect(await customers.getByText(name).count()).toBeGreaterThan(0);

    const download = page.waitForEvent('download');
    await page.getByRole('link', { name: 'Recall list CSV' }).first().click();
    const csv = readFileSync((await (await download).path())!, 'utf8');
    for (const name of jar.buyers) expect(csv).toContain(name);
  });
});
