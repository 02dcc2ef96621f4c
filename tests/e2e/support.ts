import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { chromium, type BrowserContext, type Page } from 'playwright-core';

export const BASE = () => process.env.E2E_BASE_URL ?? 'http://127.0.0.1:3199';
export const MAIL = () => process.env.E2E_MAIL_URL ?? 'http://127.0.0.1:1199';
export const STRIPE = () => process.env.E2E_STRIPE_URL ?? 'http://127.0.0.1:12199';

export const PHONE = { width: 360, height: 740 };
export const DESKTOP = { width: 1280, height: 900 };

/** Debian's Chromium, headless, with a fresh profile (a new temporary user-data directory). */
export async function openBrowser(viewport = DESKTOP): Promise<BrowserContext> {
  return chromium.launchPersistentContext(mkdtempSync(path.join(tmpdir(), 'combtrace-e2e-')), {
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    headless: true,
    viewport,
    acceptDownloads: true,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-dev-shm-usage',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
      '--no-first-run',
      '--disable-quic',
    ],
  });
}

export async function signIn(page: Page, email: string, password: string): Promise<void> {
  await page.goto(`${BASE()}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((url) => !url.pathname.startsWith('/sign-in') && !url.pathname.startsWith('/welcome'), {
    timeout: 30_000,
  });
}

export type FakeMail = {
  id: string;
  subject: string;
  text: string;
  html: string | null;
  to: string;
  attachments: { index: number; filename: string; contentType: string; size: number; url: string }[];
};

/** Polls the fake inbox until a message for `to` matching `subject` arrives. */
export async function waitForMail(to: string, subject: RegExp, timeoutMs = 30_000): Promise<FakeMail> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    const res = await fetch(`${MAIL()}/api/messages?to=${encodeURIComponent(to)}`);
    const list = (await res.json()) as FakeMail[];
    const hit = list.find((m) => subject.test(m.subject));
    if (hit) return hit;
    await new Promise((r) => setTimeout(r, 300));
  }
  throw new Error(`No mail to ${to} matching ${subject}`);
}

export const DEMO_LOGINS = {
  owner: { email: 'owner@hollowmere.test', password: 'demo-owner-pass' },
  keeper: { email: 'keeper@hollowmere.test', password: 'demo-keeper-pass' },
  keeper2: { email: 'keeper2@hollowmere.test', password: 'demo-keeper-pass' },
  crew: { email: 'crew@hollowmere.test', password: 'demo-crew-pass' },
  customer: { email: 'customer@hollowmere.test', password: 'demo-customer-pass' },
} as const;
