import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { writeFileSync, mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { BrowserContext, Page } from 'playwright-core';
import { BASE, DEMO_LOGINS, DESKTOP, openBrowser, signIn } from './support';

let browser: BrowserContext;
let page: Page;
beforeAll(async () => {
  browser = await openBrowser(DESKTOP);
  page = await browser.newPage();
  await signIn(page, DEMO_LOGINS.owner.email, DEMO_LOGINS.owner.password);
});
afterAll(async () => {
  await browser?.close();
});

async function open(pathname: string) {
  const res = await page.goto(`${BASE()}${pathname}`);
  expect(res?.status(), pathname).toBe(200);
  expect(await page.getByText('Something went wrong').count(), pathname).toBe(0);
}

describe('owner yard, colony and super screens on the demo season', () => {
  it('every yards, colonies and supers page renders', async () => {
    for (const p of [
      '/admin/yards',
      '/admin/yards/new',
      '/admin/supers',
      '/admin/supers/import',
      '/admin/supers/tags',
      '/admin/treatment-kinds',
    ])
      await open(p);
    await open('/admin/yards');
    await page.getByRole('link', { name: /Orchard Terrace/ }).click();
    await page.getByRole('heading', { name: 'Orchard Terrace' }).waitFor();
    await page.getByRole('link', { name: 'OT-03' }).click();
    await page.getByRole('heading', { name: 'Colony OT-03' }).waitFor();
    expect(await page.getByRole('region', { name: 'Timeline' }).getByText('Split').count()).toBeGreaterThan(0);
    // The treatment form carries the caution.
    await page.getByText('Mite treatment', { exact: true }).click();
    expect(await page.getByRole('note', { name: 'Treatment caution' }).first().textContent()).toMatch(
      /product label governs/,
    );
  });

  it('the flagged filter shows only flagged supers, each with its reason', async () => {
    await open('/admin/supers?flagged=yes');
    const rows = page.locator('table.data-table tbody tr');
    expect(await rows.count()).toBeGreaterThanOrEqual(2);
    for (const text of await rows.allTextContents()) expect(text).toMatch(/flagged.*(while this super was on)/);
    // Sorting goes through /api/super-pulls.
    const answer = page.waitForResponse((r) => r.url().includes('/api/super-pulls?') && r.status() === 200);
    await page.getByRole('button', { name: 'Colony' }).click();
    expect(new URL((await answer).url()).searchParams.get('flagged')).toBe('yes');
    expect(await page.locator('th[aria-sort]').textContent()).toBe('Colony');
    for (const text of await rows.allTextContents()) expect(text).toMatch(/flagged/);
  });

  it('a field sheet is previewed row by row, and the valid rows are imported together', async () => {
    const dir = mkdtempSync(path.join(tmpdir(), 'sheet-'));
    const file = path.join(dir, 'field-sheet.csv');
    writeFileSync(
      file,
      'Colony,Date,Box,Weight,Unit,Tag\nOT-04,2026-09-01,medium,21.5,kg,E2E-IMP-1\nOT-04,2026-09-01,medium,21.5,kg,E2E-IMP-1\nXX-99,2026-09-01,deep,20,kg,\n',
    );
    await open('/admin/supers/import');
    await page.getByLabel(/Field sheet/).setInputFiles(file);
    await page.getByText('3 rows: 1 ready, 2 with problems.').waitFor();
    expect(await page.getByText('Unknown colony "XX-99"').count()).toBe(1);
    await page.getByRole('button', { name: 'Import 1 rows' }).click();
    await page.getByText(/Imported 1 super pulls\. 2 rows were not imported/).waitFor();
    const download = page.waitForEvent('download');
    await page.getByRole('button', { name: 'Download rejected rows (CSV)' }).click();
    expect((await download).suggestedFilename()).toBe('rejected-rows.csv');
  });

  it('a non-CSV file is refused with a clear message', async () => {
    const dir = mkdtempSync(path.join(tmpdir(), 'sheet-'));
    const file = path.join(dir, 'photo.png');
    writeFileSync(file, 'not a csv');
    await open('/admin/supers/import');
    await page.getByLabel(/Field sheet/).setInputFiles(file);
    expect(await page.locator('[role=alert]').filter({ hasText: 'Only CSV files' }).count()).toBe(1);
  });
});
