import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { BrowserContext } from 'playwright-core';
import { closeDb, getDb } from '@/lib/db/index';
import { saveYard } from '@/lib/data/yards/yards';
import { createColony } from '@/lib/data/colonies/write';
import { addFeeding } from '@/lib/data/colonies/records';
import { BASE, DEMO_LOGINS, openBrowser, PHONE, signIn } from './support';

let browser: BrowserContext;
const codes = ['HW-01', 'HW-02', 'HW-03'];
const ids: number[] = [];

beforeAll(async () => {
  // Our own yard with three colonies for the demo keeper; HW-03 is being fed sugar syrup.
  const { User } = getDb().models;
  const owner = await User.findOne({ where: { email: DEMO_LOGINS.owner.email } });
  const keeper = await User.findOne({ where: { email: DEMO_LOGINS.keeper.email } });
  if (!owner || !keeper) throw new Error('demo users missing');
  const yardId = await saveYard(owner.id, null, {
    name: 'Hawthorn Gate (e2e)',
    place: 'Marrow Valley, top field',
    latitude: null,
    longitude: null,
    forageNotes: '',
    keeperIds: [keeper.id],
  });
  for (const code of codes) {
    ids.push(
      await createColony(owner, {
        code,
        yardId,
        keeperId: keeper.id,
        origin: 'nucleus',
        parentColonyId: null,
        queenYear: 2026,
        startedOn: null,
        notes: '',
      }),
    );
  }
  const started = new Date(Date.now() - 10 * 86_400_000).toISOString().slice(0, 10);
  await addFeeding(keeper, {
    colonyId: ids[2],
    kind: 'sugar_syrup',
    amount: '2 L',
    startedOn: started,
    endedOn: null,
    note: '',
    idempotencyKey: crypto.randomUUID(),
  });
  browser = await openBrowser(PHONE);
});
afterAll(async () => {
  await browser?.close();
  await closeDb();
});

describe('keeper on a phone', () => {
  it('records supers pulled for three colonies in one pass and sees them on the colony pages, the flagged one with its reason', async () => {
    const page = await browser.newPage();
    await signIn(page, DEMO_LOGINS.keeper.email, DEMO_LOGINS.keeper.password);
    await page.getByRole('navigation', { name: 'Back office' }).getByRole('link', { name: 'Yards' }).click();
    await page.getByRole('link', { name: /Hawthorn Gate/ }).click();
    await page.getByRole('link', { name: 'Record pulls' }).click();
    await page.getByRole('radio', { name: 'shallow' }).click();

    for (const code of codes) {
      await page.getByRole('button', { name: `Pulled a super from ${code}` }).click();
      await page
        .getByRole('listitem', { name: `Colony ${code}` })
        .getByText('Super 1: recorded')
        .waitFor();
    }
    await page.getByText('3 supers recorded in this pass.').waitFor();
    const flaggedEntry = await page.getByRole('listitem', { name: 'Colony HW-03' }).textContent();
    expect(flaggedEntry).toMatch(/Flagged:\s*Sugar syrup fed .* \(still ongoing\) while this super was on/);
    for (const code of ['HW-01', 'HW-02'])
      expect(await page.getByRole('listitem', { name: `Colony ${code}` }).textContent()).not.toMatch(/Flagged/);
    // Works at 360 px: nothing wider than the screen.
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(PHONE.width);
    // The box depth is remembered on this phone for the next pass.
    await page.reload();
    // (read after hydration: the remembered depth is applied in an effect)
    await page.waitForFunction(
      () => document.querySelector('[role=radio][aria-checked=true]')?.textContent === 'shallow',
      undefined,
      { timeout: 10_000 },
    );
    expect(await page.getByRole('radio', { name: 'shallow' }).getAttribute('aria-checked')).toBe('true');

    for (const [i, code] of codes.entries()) {
      await page.goto(`${BASE()}/admin/colonies/${ids[i]}`);
      await page.getByRole('heading', { name: `Colony ${code}` }).waitFor();
      const timeline = page.getByRole('region', { name: 'Timeline' });
      expect(await timeline.getByText('Super pulled').count()).toBe(1);
      expect(await timeline.getByText(/shallow, 10 frames/).count()).toBe(1);
      const supers = page.getByRole('region', { name: 'Supers' });
      if (code === 'HW-03') {
        expect(await supers.getByText('flagged', { exact: true }).count()).toBe(1);
        expect(await supers.getByText(/Sugar syrup fed .* while this super was on/).count()).toBe(1);
      } else {
        expect(await supers.getByText('clear', { exact: true }).count()).toBe(1);
      }
    }
    const counts = await getDb().models.SuperPull.count({ where: { colonyId: ids } });
    expect(counts).toBe(3);
  });

  it('voids a pull recorded by mistake from the colony timeline: it stays, struck through, with who and why', async () => {
    const page = await browser.newPage(); // still signed in as the keeper
    await page.goto(`${BASE()}/admin/colonies/${ids[0]}`);
    await page.getByRole('heading', { name: `Colony ${codes[0]}` }).waitFor();
    const timeline = page.getByRole('region', { name: 'Timeline' });
    await timeline.getByRole('button', { name: /Void this pull…/ }).click();
    const confirm = timeline.getByRole('button', { name: 'Void pull' });
    expect(await confirm.isDisabled()).toBe(true); // no reason yet
    await timeline.getByLabel('Why void this pull?').fill('Tapped the wrong colony in the pass');
    await confirm.click();
    await timeline.getByText(/Voided \d{4}-\d{2}-\d{2} by .+: Tapped the wrong colony in the pass/).waitFor();
    expect(await timeline.getByText('voided', { exact: true }).count()).toBe(1);
    expect(await timeline.getByRole('button', { name: /Void this pull/ }).count()).toBe(0);
    expect(await page.getByRole('region', { name: 'Supers' }).getByText('voided', { exact: true }).count()).toBe(1);
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(PHONE.width);
    expect((await getDb().models.SuperPull.findOne({ where: { colonyId: ids[0] } }))?.voidReason).toBe(
      'Tapped the wrong colony in the pass',
    );

    // The pull list keeps it (struck through) under the "Voided only" filter.
    await page.goto(`${BASE()}/admin/supers?voided=yes`);
    const rows = page.locator('table.data-table tbody tr');
    await rows.first().waitFor();
    const texts = await rows.allTextContents();
    for (const t of texts) expect(t).toMatch(/voided/);
    expect(texts.some((t) => t.includes(codes[0]) && t.includes('Tapped the wrong colony in the pass'))).toBe(true);
  });

  it('another keeper cannot open these colonies (404 page and API)', async () => {
    await browser.clearCookies();
    const page = await browser.newPage();
    await signIn(page, DEMO_LOGINS.keeper2.email, DEMO_LOGINS.keeper2.password);
    const res = await page.goto(`${BASE()}/admin/colonies/${ids[0]}`);
    expect(res?.status()).toBe(404);
    expect((await page.request.get(`${BASE()}/api/colonies/detail?id=${ids[0]}`)).status()).toBe(404);
  });
});
