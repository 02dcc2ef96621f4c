import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import type { BrowserContext, Page } from 'playwright-core';
import { closeDb, getDb } from '@/lib/db/index';
import { saveYard } from '@/lib/data/yards/yards';
import { createColony } from '@/lib/data/colonies/write';
import { waitingKey, type WaitingPull } from '@/components/yards/pull-queue';
import { BASE, DEMO_LOGINS, openBrowser, PHONE, signIn } from './support';

let browser: BrowserContext;
let keeperId = 0;
let yardId = 0;
const codes = ['OF-01', 'OF-02', 'OF-03', 'OF-04'];
const ids: number[] = [];
let elsewhereId = 0;

const passPath = () => `/admin/yards/${yardId}/pulls`;
const colony = (page: Page, code: string) => page.getByRole('listitem', { name: `Colony ${code}` });
const tap = (page: Page, code: string) => page.getByRole('button', { name: `Pulled a super from ${code}` });
const stored = (page: Page) => page.evaluate((k) => localStorage.getItem(k), waitingKey(keeperId));
const pullsOf = (colonyIds: number[]) =>
  getDb().models.SuperPull.findAll({ where: { colonyId: colonyIds }, order: [['colonyId', 'ASC']] });
const KEPT = 'waiting to send — saved on this phone';

/** Opens the pass and waits until it has started (its buttons are disabled until then). */
async function openPass(page: Page, firstCode = 'OF-01'): Promise<void> {
  await page.goto(`${BASE()}${passPath()}`);
  await tap(page, firstCode)
    .or(page.getByRole('button', { name: `Pulled another super from ${firstCode}` }))
    .click({ trial: true });
}

beforeAll(async () => {
  const { User } = getDb().models;
  const owner = await User.findOne({ where: { email: DEMO_LOGINS.owner.email } });
  const keeper = await User.findOne({ where: { email: DEMO_LOGINS.keeper.email } });
  if (!owner || !keeper) throw new Error('demo users missing');
  keeperId = keeper.id;
  yardId = await saveYard(owner.id, null, {
    name: 'Sloe Hedge (e2e)',
    place: 'Marrow Valley, lower lane',
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
  // A yard the demo keeper is not assigned to: a pull kept for its colony is refused as "No such colony."
  const otherYard = await saveYard(owner.id, null, {
    name: 'Owner only (e2e)',
    place: '',
    latitude: null,
    longitude: null,
    forageNotes: '',
    keeperIds: [],
  });
  elsewhereId = await createColony(owner, {
    code: 'OF-X1',
    yardId: otherYard,
    keeperId: owner.id,
    origin: 'swarm',
    parentColonyId: null,
    queenYear: null,
    startedOn: null,
    notes: '',
  });
  browser = await openBrowser(PHONE);
  const page = await browser.newPage();
  await signIn(page, DEMO_LOGINS.keeper.email, DEMO_LOGINS.keeper.password);
  await page.close();
});
// A failed test must not leave the next one without a network.
afterEach(async () => {
  await browser?.setOffline(false);
});
afterAll(async () => {
  await browser?.close();
  await closeDb();
});

describe('keeper in a yard with no signal', () => {
  it('supers tapped offline stay on the phone after the page is closed, come back in a new page and are sent once when there is a connection', async () => {
    const page = await browser.newPage();
    await openPass(page);
    await browser.setOffline(true);
    // Where the first colony sits on the page: news of supers waiting must not push the list down under the thumb.
    const topOfFirst = () =>
      colony(page, 'OF-01').evaluate((el) => Math.round(el.getBoundingClientRect().top + window.scrollY));
    const before = await topOfFirst();
    for (const code of ['OF-01', 'OF-02']) {
      await tap(page, code).click();
      await colony(page, code).getByText(`Super 1: ${KEPT}`).waitFor();
    }
    await page
      .getByRole('status')
      .filter({ hasText: `2 supers ${KEPT}.` })
      .waitFor();
    expect(await topOfFirst()).toBe(before);
    expect(await page.getByRole('button', { name: 'Send now' }).isVisible()).toBe(true);
    expect(await page.getByRole('status').filter({ hasText: 'No signal' }).count()).toBe(1);
    // Offline taps never block the next one.
    expect(await page.getByRole('button', { name: 'Pulled another super from OF-01' }).isEnabled()).toBe(true);
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(PHONE.width);
    const kept = JSON.parse((await stored(page)) ?? '[]') as WaitingPull[];
    expect(kept.map((w) => [w.entry.colonyId, w.colonyCode])).toEqual([
      [ids[0], 'OF-01'],
      [ids[1], 'OF-02'],
    ]);
    expect(await pullsOf(ids.slice(0, 2))).toHaveLength(0);
    await page.close(); // the tab is closed (or the battery dies) before there is a signal

    await browser.setOffline(false);
    const again = await browser.newPage();
    // Hold the sends back until we have seen the restored entries, then let them through.
    let release = () => {};
    const gate = new Promise<void>((r) => {
      release = r;
    });
    let sends = 0;
    await again.route(
      (url) => url.pathname === passPath(),
      async (route) => {
        if (route.request().method() === 'POST') {
          sends++;
          await gate;
        }
        await route.continue();
      },
    );
    await openPass(again);
    for (const code of ['OF-01', 'OF-02']) await colony(again, code).getByText(`Super 1: ${KEPT}`).waitFor();
    await again
      .getByRole('status')
      .filter({ hasText: `2 supers ${KEPT}.` })
      .waitFor();
    release();
    // Sent without a tap: the page loaded with a connection.
    for (const code of ['OF-01', 'OF-02']) await colony(again, code).getByText('Super 1: recorded').waitFor();
    await again.getByText('2 supers recorded in this pass.').waitFor();
    expect(sends).toBe(2);
    expect(await again.getByRole('button', { name: 'Send now' }).count()).toBe(0);
    expect(await stored(again)).toBeNull();
    const rows = await pullsOf(ids.slice(0, 2));
    expect(rows.map((r) => [r.colonyId, r.idempotencyKey])).toEqual(
      kept.map((w) => [w.entry.colonyId, w.entry.idempotencyKey]),
    );
    await again.close();
  });

  it('a super tapped offline is sent by itself when the signal comes back while the pass is open', async () => {
    const page = await browser.newPage();
    await openPass(page, 'OF-03');
    await browser.setOffline(true);
    await tap(page, 'OF-03').click();
    await colony(page, 'OF-03').getByText(`Super 1: ${KEPT}`).waitFor();
    await page
      .getByRole('status')
      .filter({ hasText: `1 super ${KEPT}.` })
      .waitFor();
    expect(await page.getByRole('button', { name: 'Send now' }).isVisible()).toBe(true);
    await browser.setOffline(false); // the browser's `online` event
    await colony(page, 'OF-03').getByText('Super 1: recorded').waitFor();
    expect(await stored(page)).toBeNull();
    expect(await pullsOf([ids[2]])).toHaveLength(1);
    await page.close();
  });

  it('when the answer is lost on the way back, the super is kept and sent again with the same key, and recorded once', async () => {
    const page = await browser.newPage();
    await openPass(page, 'OF-04');
    let lost = 0;
    await page.route(
      (url) => url.pathname === passPath(),
      async (route) => {
        if (route.request().method() !== 'POST') return route.continue();
        lost++;
        await route.fetch(); // the server receives and records it…
        await route.abort('internetdisconnected'); // …but the phone never hears back
      },
    );
    await tap(page, 'OF-04').click();
    await colony(page, 'OF-04').getByText(`Super 1: ${KEPT}`).waitFor({ timeout: 20_000 });
    expect(lost).toBe(3); // the pass tried three times, all with one key
    expect(await pullsOf([ids[3]])).toHaveLength(1);
    const key = (JSON.parse((await stored(page)) ?? '[]') as WaitingPull[])[0]?.entry.idempotencyKey;
    expect(key).toBeTruthy();

    await page.unrouteAll({ behavior: 'wait' });
    await page.reload();
    await colony(page, 'OF-04').getByText('Super 1: recorded').waitFor();
    const rows = await pullsOf([ids[3]]);
    expect(rows.map((r) => r.idempotencyKey)).toEqual([key]);
    expect(await stored(page)).toBeNull();
    await page.close();
  });

  it('a super the server refuses is shown with the reason, not sent again, and goes when dismissed', async () => {
    const page = await browser.newPage();
    await openPass(page);
    // Kept on this phone for a colony that is no longer in the keeper's yards.
    const refusedEntry: WaitingPull = {
      entry: {
        colonyId: elsewhereId,
        pulledOn: '2026-07-01',
        depth: 'medium',
        frameCount: 10,
        weight: null,
        weightUnit: 'kg',
        cappedFrames: null,
        tagCode: null,
        idempotencyKey: crypto.randomUUID(),
      },
      colonyCode: 'OF-X1',
      yardName: 'Old yard',
      savedAt: new Date().toISOString(),
    };
    await page.evaluate(([k, v]) => localStorage.setItem(k, v), [waitingKey(keeperId), JSON.stringify([refusedEntry])]);
    await openPass(page);
    const other = page.getByRole('region', { name: 'Other colonies' });
    await other.getByText('OF-X1 (Old yard), 2026-07-01: not recorded — No such colony.').waitFor();
    await page.getByRole('status').filter({ hasText: '1 super not recorded' }).waitFor();
    expect(JSON.parse((await stored(page)) ?? '[]')[0]?.refused).toBe('No such colony.');

    // Not retried: a new load sends nothing and still shows it.
    let sends = 0;
    page.on('request', (r) => {
      if (r.method() === 'POST') sends++;
    });
    await openPass(page);
    await other.getByText(/not recorded — No such colony\./).waitFor();
    expect(sends).toBe(0);

    await other.getByRole('button', { name: 'Dismiss the super for OF-X1' }).click();
    expect(await other.count()).toBe(0);
    expect(await stored(page)).toBeNull();
    expect(await getDb().models.SuperPull.count({ where: { colonyId: elsewhereId } })).toBe(0);
    await page.close();
  });
});
