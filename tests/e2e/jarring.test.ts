import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { BrowserContext, Page } from 'playwright-core';
import { closeDb, getDb } from '@/lib/db';
import { makeGtin } from '@/lib/domain/gs1';
import { BASE, DEMO_LOGINS, openBrowser, signIn } from './support';

let browser: BrowserContext;
let page: Page;
let lotId = 0;
let lotCode = '';
let productId = 0;
let productName = '';

// A released lot and a product of our own, made directly (the honey-house screens are another feature).
beforeAll(async () => {
  const { Lot, Product } = getDb().models;
  const tag = Date.now().toString(36).slice(-5).toUpperCase();
  const lot = await Lot.create({
    code: `EJ-${tag}`,
    floralSource: 'Linden',
    extractedOn: '2026-07-10',
    stage: 'released',
    netGrams: 40_000,
    usedGrams: 0,
    createdBy: null,
  });
  const product = await Product.create({
    slug: `e2e-linden-${tag.toLowerCase()}`,
    name: `Linden jar ${tag}`,
    netGrams: 340,
    declaredUnit: 'g',
    declaredAmount: 340,
    containerKind: 'glass jar',
    containerGrams: 200,
    priceCents: 950,
    gtin: makeGtin('0614141', `9${String(Date.now() % 10_000).padStart(4, '0')}`),
    active: true,
  });
  [lotId, lotCode, productId, productName] = [lot.id, lot.code, product.id, product.name];
  browser = await openBrowser();
  page = await browser.newPage();
  await signIn(page, DEMO_LOGINS.crew.email, DEMO_LOGINS.crew.password);
});
afterAll(async () => {
  await browser?.close();
  await closeDb();
});

async function onHand(): Promise<number> {
  await page.goto(`${BASE()}/admin/stock`);
  const row = page.getByTestId('stock-totals').getByRole('row').filter({ hasText: productName });
  return Number(await row.getByRole('cell').nth(1).textContent());
}

async function runJarring(jars: string, samples: string) {
  await page.goto(`${BASE()}/admin/jarring`);
  const form = page.getByRole('form', { name: 'New jarring run' });
  await form.getByLabel('Lot (released)').selectOption(String(lotId));
  await form.getByLabel('Product').selectOption(String(productId));
  await form.getByLabel('Jars filled').fill(jars);
  await form.getByLabel('Sample fill weights, g').fill(samples);
  await form.getByRole('button', { name: 'Record jarring run' }).click();
  return form;
}

describe('jarring in the honey house', () => {
  it('the crew runs a jarring run from a released lot, sees stock rise, and downloads the label PDF', async () => {
    expect(await onHand()).toBe(0);
    await page.goto(`${BASE()}/admin/jarring`);
    await page.getByRole('form', { name: 'New jarring run' }).getByLabel('Lot (released)').selectOption(String(lotId));
    await page.getByLabel('Product').selectOption(String(productId));
    // 40 kg less the 2 % expected loss fills floor(39 200 / 340) = 115 jars
    expect(await page.getByTestId('can-fill').textContent()).toBe('115');

    // The run's 24 jars are the batch: under 100, every jar is weighed (76/211/EEC Annex II 2.1.3).
    await page.getByLabel('Jars filled').fill('24');
    expect(await page.getByTestId('jars-to-weigh').textContent()).toBe('24');
    const weights = Array.from({ length: 24 }, (_, i) => [342, 344, 341][i % 3]).join(', ');
    const form = await runJarring('24', weights);
    const ok = form.getByRole('status').filter({ hasText: 'Fill check passed' });
    await ok.waitFor();
    expect(await ok.textContent()).toMatch(/Reference test \(76\/211\/EEC Annex II\): accept — 24 of 24 jars weighed/);
    expect(await ok.textContent()).toMatch(/Producer’s check: pass/);
    expect(await onHand()).toBe(24);
    await page.screenshot({ path: 'tests/.artifacts/jarring-stock.png', fullPage: true });

    await page.goto(`${BASE()}/admin/jarring`);
    await page.screenshot({ path: 'tests/.artifacts/jarring-page.png', fullPage: true });
    const preview = page.waitForResponse((r) => r.url().includes('/labels?') && r.url().includes('preview=1'));
    await page
      .getByRole('row')
      .filter({ hasText: lotCode })
      .filter({ hasText: 'passed' })
      .first()
      .getByRole('link')
      .click();
    await page.getByRole('heading', { name: /Jarring run #\d+/ }).waitFor();
    expect(await page.getByTestId('fill-checks').textContent()).toMatch(
      /Reference test \(76\/211\/EEC Annex II\): accept/,
    );
    // The print preview frame loads the first page of the run's PDF.
    const previewRes = await preview;
    expect(previewRes.status()).toBe(200);
    expect(previewRes.headers()['content-type']).toBe('application/pdf');
    await page.screenshot({ path: 'tests/.artifacts/jarring-run.png', fullPage: true });
    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('link', { name: /Download 24 labels/ }).click(),
    ]);
    expect(download.suggestedFilename()).toMatch(new RegExp(`^labels-${lotCode}.*\\.pdf$`));
    const bytes = readFileSync((await download.path())!);
    expect(bytes.subarray(0, 5).toString()).toBe('%PDF-');
    expect(bytes.byteLength).toBeGreaterThan(10_000);
  });

  it('a run with an under-filled sample is flagged and its jars stay out of stock', async () => {
    const form = await runJarring('12', '343, 318, 342');
    const alert = form.locator('[role=alert]').filter({ hasText: 'Fill check failed' });
    await alert.waitFor();
    // OIML R 87: Qn 340 g → TNE 10.2 g; 318 g is below T1 = 329.8 g and T2 = 319.6 g
    expect(await alert.textContent()).toMatch(/below T2 \(319\.6 g\)/);
    expect(await onHand()).toBe(24);
    await page.goto(`${BASE()}/admin/jarring`);
    const flagged = page.getByRole('row').filter({ hasText: lotCode }).filter({ hasText: 'failed · not in stock' });
    expect(await flagged.count()).toBe(1);
    await page.screenshot({ path: 'tests/.artifacts/jarring-flagged.png', fullPage: true });
  });

  it('the jar’s QR target, the public lot page, opens without signing in', async () => {
    await browser.clearCookies();
    const p = await browser.newPage();
    const res = await p.goto(`${BASE()}/lot/${lotCode}`);
    expect(res?.status()).toBe(200);
    expect(await p.getByRole('heading', { level: 1 }).textContent()).toBe(`Lot ${lotCode}`);
    expect(await p.getByText('Best before').count()).toBeGreaterThan(0);
    await p.screenshot({ path: 'tests/.artifacts/jarring-public-lot.png', fullPage: true });
    // The demo blend (seeders/20261201000200-demo-season.ts): harvest months and yards come from its parent lots.
    await p.goto(`${BASE()}/lot/HH26-005`);
    const harvested = p.locator('dt', { hasText: 'Harvested' }).locator('xpath=following-sibling::dd[1]');
    expect(await harvested.textContent()).toMatch(/2026/);
    const yards = p.locator('dt', { hasText: 'Yards' }).locator('xpath=following-sibling::dd[1]');
    expect(await yards.textContent()).not.toBe('—');
    expect(await p.content()).not.toMatch(/latitude|longitude/i);
    expect((await p.goto(`${BASE()}/lot/NO-SUCH-LOT`))?.status()).toBe(404);
    await p.close();
  });
});
