import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import pg from 'pg';
import type { BrowserContext } from 'playwright-core';
import { BASE, DEMO_LOGINS, openBrowser, signIn } from './support';

let browser: BrowserContext;
beforeAll(async () => {
  browser = await openBrowser();
});
afterAll(async () => {
  await browser?.close();
});

// The server runs as the app's own role (tests/support/e2e-setup.ts gives it only
// APP_DATABASE_URL); every other e2e file then shows the whole app works under that role.
describe("the server's database role", () => {
  it('every connection the server holds is combtrace_app, none is the owner', async () => {
    const page = await browser.newPage();
    await signIn(page, DEMO_LOGINS.crew.email, DEMO_LOGINS.crew.password);
    await page.goto(`${BASE()}/admin/lots`);
    expect(new URL(page.url()).pathname).toBe('/admin/lots');
    // This test's own connection is the owner's (DATABASE_URL) and unnamed; the server names itself 'combtrace'.
    const db = new pg.Client({ connectionString: process.env.DATABASE_URL });
    await db.connect();
    try {
      const { rows } = await db.query<{ usename: string }>(
        `SELECT DISTINCT usename FROM pg_stat_activity WHERE datname = current_database() AND application_name = 'combtrace'`,
      );
      expect(rows.map((r) => r.usename)).toEqual(['combtrace_app']);
    } finally {
      await db.end();
    }
  });
});
