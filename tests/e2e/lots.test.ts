import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { BrowserContext, Page } from 'playwright-core';
import { closeDb } from '@/lib/db/index';
import { BASE, DEMO_LOGINS, DESKTOP, openBrowser, signIn } from './support';
import { makePulledSupers } from '@/tests/support/lot-fixtures';

let browser: BrowserContext;
let page: Page;
let tags: string[];

beforeAll(async () => {
  // Until the demo-season seeder is in, the pulled supers are made here (unique tag codes).
  ({ tags } = await makePulledSupers(4));
  browser = await openBrowser(DESKTOP);
  page = await browser.newPage();
  await signIn(page, DEMO_LOGINS.crew.email, DEMO_LOGINS.crew.password);
});
afterAll(async () => {
  await browser?.close();
  await closeDb();
});

async function newLot(floral: string): Promise<string> {
  await page.goto(`${BASE()}/admin/lots/new`);
  await page.getByLabel('Floral source').fill(floral);
  await page.getByRole('button', { name: 'Start the lot' }).click();
  await page.waitForURL(/\/admin\/lots\/\d+$/);
  return (await page.getByRole('heading', { level: 1 }).textContent()) ?? '';
}

/** What a keyboard-wedge scanner does: types the code and presses Enter into the focused input. */
async function scan(tag: string) {
  await page.keyboard.type(tag, { delay: 5 });
  await page.keyboard.press('Enter');
  await page.getByRole('list', { name: 'Added by scanning' }).getByText(tag).waitFor();
}

async function addContainer(gross: string, tare: string) {
  const form = page.getByRole('form', { name: 'Add a container' });
  await form.getByLabel('Gross weight').fill(gross);
  await form.getByLabel('Tare (empty container)').fill(tare);
  await form.getByRole('button', { name: 'Add container' }).click();
  await form.getByRole('status').filter({ hasText: 'Container recorded.' }).waitFor();
}

async function addScaleReading(pct: string) {
  const form = page.getByRole('form', { name: 'Add a moisture reading' });
  await form.getByLabel('Water on the scale, %').fill(pct);
  await form.getByRole('button', { name: 'Add reading' }).click();
  await form.getByRole('status').filter({ hasText: 'Reading saved' }).waitFor();
}

const stageChip = () => page.getByRole('region', { name: 'Stage' }).locator('.chip').first();

describe('honey house', () => {
  it('crew scans three supers into a new lot, weighs two containers, reads moisture and releases it', async () => {
    const title = await newLot('Linden e2e');
    expect(title).toMatch(/^Lot [A-Z]+\d{2}-\d{3,}$/);
    // The scan input has the focus from the start, so a scanner can fire straight away.
    expect(await page.evaluate(() => document.activeElement?.id)).toBe('scan-tag');
    for (const tag of tags.slice(0, 3)) await scan(tag);
    expect(await page.locator('#scan-tag').inputValue()).toBe('');
    await page
      .getByRole('table', { name: 'Supers in this lot' })
      .getByRole('cell', { name: tags[2], exact: true })
      .waitFor();

    await addContainer('30', '1');
    await addContainer('26.5', '1.5');
    await page.getByRole('table', { name: 'Containers of this lot' }).getByText('54.00 kg').waitFor();

    // Marking extracted asks for the date and shows the best-before it gives before confirming.
    await page.getByRole('button', { name: 'Mark extracted' }).click();
    await page.getByLabel('Extracted on').fill('2026-07-25');
    await page.getByText(/Best before 20\d\d-07-25 \(\d+ months after extraction/).waitFor();
    await page.getByRole('button', { name: 'Confirm extracted' }).click();
    await page
      .getByRole('region', { name: 'Stage' })
      .getByText(/The lot is now extracted\. Extracted on 2026-07-25, best before 20\d\d-07-25\./)
      .waitFor();
    // The page shows the new date at once: the details form and the stage summary, no reload.
    await page.waitForFunction(
      () =>
        (document.querySelector('form[aria-label="Lot details"] input[type="date"]') as HTMLInputElement)?.value ===
        '2026-07-25',
    );

    await addScaleReading('17.6');
    await page.getByRole('button', { name: 'Release the lot' }).click();
    await page.getByRole('region', { name: 'Stage' }).getByText('The lot is now released.').waitFor();
    // The page refresh that carries the new stage can land just after the action's answer.
    await stageChip()
      .filter({ hasText: /^released$/ })
      .waitFor();
    expect(await stageChip().textContent()).toBe('released');
    await page.getByRole('list', { name: 'Lot history' }).getByText('Released').first().waitFor();
  });

  it('an over-limit reading holds the lot instead of releasing it', async () => {
    await newLot('Wet lot e2e');
    await scan(tags[3]);
    await addContainer('20', '1');
    await page.getByRole('button', { name: 'Mark extracted' }).click();
    await page.getByRole('button', { name: 'Confirm extracted' }).click();
    await page.getByRole('region', { name: 'Stage' }).getByText('The lot is now extracted.').waitFor();
    await addScaleReading('21.4');
    await page.getByRole('button', { name: 'Release the lot' }).click();
    await page.getByRole('list', { name: 'Why the lot is held' }).waitFor();
    await stageChip()
      .filter({ hasText: /^held$/ })
      .waitFor();
    expect(await stageChip().textContent()).toBe('held');
    expect(await page.getByRole('list', { name: 'Why the lot is held' }).textContent()).toMatch(
      /over the limit of 20 %/,
    );
    // The crew cannot take it out of held: only the owner can.
    expect(await page.getByRole('button', { name: 'Release held lot' }).count()).toBe(0);
  });

  it('the lot list filters by stage and shows the stage as a word', async () => {
    await page.goto(`${BASE()}/admin/lots?stage=held`);
    const table = page.getByRole('table', { name: /Extraction lots/ });
    await table.getByText('Wet lot e2e').waitFor();
    expect(await table.getByText('Linden e2e').count()).toBe(0);
    expect(await table.locator('.chip').first().textContent()).toBe('held');
  });
});
