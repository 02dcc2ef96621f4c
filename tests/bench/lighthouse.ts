/**
 * Lighthouse scores (targets: performance ≥ 90, accessibility ≥ 95): shop home, catalogue, a product page, cart, the back-office
 * dashboard and a lot page, median of 3 runs each, performance and accessibility.
 *
 *   BASE=http://127.0.0.1:3100 npx tsx tests/bench/lighthouse.ts
 *
 * Needs a running production server with the demo data (npm run up) and Debian's Chromium.
 * Lighthouse 12 (the last to run on Node 20) is fetched by npx into npm's cache, outside the app.
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { sessionCookie } from './session-cookie';

const BASE = process.env.BASE ?? 'http://127.0.0.1:3100';
const RUNS = Number(process.env.RUNS ?? 3);
const TARGET = { performance: 90, accessibility: 95 };

async function main() {
  const owner = await sessionCookie(BASE, 'owner@hollowmere.test', 'demo-owner-pass');
  const pages: { name: string; url: string; cookie?: string }[] = [
    { name: 'shop home', url: `${BASE}/` },
    { name: 'catalogue', url: `${BASE}/products` },
    { name: 'product page', url: `${BASE}/products/honey-340g` },
    { name: 'cart', url: `${BASE}/cart` },
    { name: 'back-office dashboard', url: `${BASE}/admin`, cookie: owner },
    { name: 'lot page', url: `${BASE}/admin/lots/1`, cookie: owner },
  ];
  const rows: string[] = [];
  let failed = false;
  for (const p of pages) {
    const scores: { performance: number; accessibility: number }[] = [];
    for (let i = 0; i < RUNS; i++) {
      const dir = mkdtempSync(path.join(tmpdir(), 'lh-'));
      const out = path.join(dir, 'r.json');
      const args = [
        '--yes',
        'lighthouse@12.8.2',
        p.url,
        '--quiet',
        '--output=json',
        `--output-path=${out}`,
        '--only-categories=performance,accessibility',
        '--throttling-method=provided',
        '--form-factor=desktop',
        '--screenEmulation.disabled',
        `--chrome-flags=--headless=new --no-sandbox --disable-gpu --disable-background-networking --disable-component-update --disable-sync --no-first-run --user-data-dir=${dir}/profile`,
      ];
      if (p.cookie) args.push(`--extra-headers=${JSON.stringify({ Cookie: p.cookie })}`);
      execFileSync('npx', args, {
        stdio: 'ignore',
        env: { ...process.env, CHROME_PATH: process.env.CHROME_PATH ?? '/usr/bin/chromium' },
      });
      const r = JSON.parse(readFileSync(out, 'utf8')) as { categories: Record<string, { score: number }> };
      scores.push({
        performance: Math.round(r.categories.performance.score * 100),
        accessibility: Math.round(r.categories.accessibility.score * 100),
      });
    }
    const median = (k: 'performance' | 'accessibility') =>
      scores.map((s) => s[k]).sort((a, b) => a - b)[Math.floor(scores.length / 2)];
    const perf = median('performance');
    const a11y = median('accessibility');
    const ok = perf >= TARGET.performance && a11y >= TARGET.accessibility;
    failed ||= !ok;
    rows.push(
      `${p.name.padEnd(24)} ${String(perf).padStart(11)} ${String(a11y).padStart(13)}  ${ok ? 'ok' : 'BELOW TARGET'}`,
    );
  }
  console.log(
    `${'page'.padEnd(24)} ${'performance'.padStart(11)} ${'accessibility'.padStart(13)}  (median of ${RUNS}; targets ${TARGET.performance}/${TARGET.accessibility})`,
  );
  for (const r of rows) console.log(r);
  process.exit(failed ? 1 : 0);
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
