/**
 * npm run bench — one command, one table of the speed targets, against a production build and the large
 * synthetic dataset (tests/bench/seed-large.ts: ~2,000 colonies, 15,000 super pulls, 500 lots,
 * 20,000 orders) in its own PostgreSQL cluster:
 *   - the catalogue page, the product JSON route and a back-office list route, each against the
 *     trivial /api/health of the same server in the same run (autocannon, 10 connections); the
 *     catalogue twice: as most visitors see it (signed out, from the short public page cache) and
 *     signed in (rendered every time), the second for information only;
 *   - the season report and a recall trace against their plain SQL (tests/bench/reports.ts);
 *   - the 1,000-label PDF (tests/bench/labels.ts).
 * Env: BENCH_SECONDS (10), BENCH_CONNECTIONS (10), BENCH_PORT (3290), BENCH_PGPORT (54345), RESEED=1.
 */
import { execFileSync, spawn, spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import autocannon from 'autocannon';
import { sessionCookie } from './session-cookie';

const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const PGPORT = process.env.BENCH_PGPORT ?? '54345';
const PORT = Number(process.env.BENCH_PORT ?? 3290);
const SECONDS = Number(process.env.BENCH_SECONDS ?? 10);
const CONNECTIONS = Number(process.env.BENCH_CONNECTIONS ?? 10);
const BASE = `http://127.0.0.1:${PORT}`;
const env: NodeJS.ProcessEnv = { ...process.env, TEST_PGPORT: PGPORT, TEST_PGDATA: path.join(ROOT, '.pg-bench/data') };
delete env.DATABASE_URL;
const DB_URL = `postgres://postgres@127.0.0.1:${PGPORT}/combtrace_bench`;
const tsx = (args: string[]) =>
  spawnSync(process.execPath, [path.join(ROOT, 'node_modules/tsx/dist/cli.mjs'), ...args], {
    cwd: ROOT,
    env,
    encoding: 'utf8',
  });
const psql = (sql: string) =>
  execFileSync('psql', ['-h', '127.0.0.1', '-p', PGPORT, '-U', 'postgres', '-d', 'combtrace_bench', '-tAc', sql], {
    encoding: 'utf8',
  }).trim();

type Row = { what: string; value: string; baseline: string; ratio: string; target: string; ok: boolean };
const rows: Row[] = [];

async function http(
  name: string,
  url: string,
  headers: Record<string, string>,
  target: (rps: number, p99: number, base: { rps: number; p99: number }) => [string, boolean],
  base?: { rps: number; p99: number },
) {
  const warm = await fetch(url, { headers });
  if (!warm.ok) throw new Error(`${url} answered ${warm.status}`);
  const r = await autocannon({ url, connections: CONNECTIONS, duration: SECONDS, headers });
  const failed = r.non2xx + r.errors + r.timeouts;
  const rps = r.requests.average;
  const p99 = r.latency.p99;
  const b = base ?? { rps, p99 };
  const [targetText, ok] = target(rps, p99, b);
  rows.push({
    what: name,
    value: `${rps.toFixed(0)} req/s, p99 ${p99} ms`,
    baseline: base ? `${b.rps.toFixed(0)} req/s, p99 ${b.p99} ms` : '—',
    ratio: base ? `${(rps / b.rps).toFixed(2)}× req/s` : '—',
    target: `${targetText}; ${failed} errors`,
    ok: ok && failed === 0,
  });
  return { rps, p99 };
}

async function main() {
  execFileSync('bash', ['lib/db/pg.sh', 'start'], {
    cwd: ROOT,
    env: { ...env, PGPORT, PGDATA: env.TEST_PGDATA, PGDATABASE: 'postgres' },
    stdio: 'inherit',
  });
  const exists = execFileSync(
    'psql',
    [
      '-h',
      '127.0.0.1',
      '-p',
      PGPORT,
      '-U',
      'postgres',
      '-tAc',
      `SELECT 1 FROM pg_database WHERE datname = 'combtrace_bench'`,
    ],
    { encoding: 'utf8' },
  ).trim();
  if (!exists || process.env.RESEED === '1') {
    const seeded = tsx(['tests/bench/seed-large.ts']);
    if (seeded.status !== 0) throw new Error(seeded.stderr || seeded.stdout);
  } else {
    // A dataset seeded by an older checkout gets this checkout's migrations first.
    const migrated = spawnSync(
      process.execPath,
      [path.join(ROOT, 'node_modules/tsx/dist/cli.mjs'), 'lib/db/migrate.ts', 'up'],
      { cwd: ROOT, env: { ...env, DATABASE_URL: DB_URL }, encoding: 'utf8' },
    );
    if (migrated.status !== 0) throw new Error(migrated.stderr || migrated.stdout);
  }
  // The synthetic owner gets a password so the back-office route can be measured signed in.
  const hash = tsx([
    '-e',
    "import('./lib/auth/password.ts').then(async (m) => console.log(await m.hashPassword('bench-owner-pass')))",
  ]).stdout.trim();
  psql(`UPDATE users SET password_hash = '${hash}', session_version = 1 WHERE email = 'owner@bench.test'`);

  if (!existsSync(path.join(ROOT, '.next/BUILD_ID')))
    execFileSync(process.execPath, ['node_modules/next/dist/bin/next', 'build'], { cwd: ROOT, stdio: 'inherit' });
  const server = spawn(
    process.execPath,
    ['node_modules/next/dist/bin/next', 'start', '-H', '127.0.0.1', '-p', String(PORT)],
    {
      cwd: ROOT,
      detached: true,
      stdio: 'ignore',
      env: {
        ...env,
        NODE_ENV: 'production',
        DATABASE_URL: DB_URL,
        NEXTAUTH_URL: BASE,
        APP_URL: BASE,
        NEXTAUTH_SECRET: 'bench-secret-0000000000000000000000',
        MAIL_TIMER: 'off',
      },
    },
  );
  try {
    for (let i = 0; i < 120; i++) {
      if (
        await fetch(`${BASE}/api/health`).then(
          (r) => r.ok,
          () => false,
        )
      )
        break;
      await new Promise((r) => setTimeout(r, 500));
    }
    const cookie = await sessionCookie(BASE, 'owner@bench.test', 'bench-owner-pass');
    const health = await http('trivial route /api/health', `${BASE}/api/health`, {}, () => ['baseline', true]);
    await http(
      'catalogue page /products (signed out)',
      `${BASE}/products`,
      {},
      (rps, _p, b) => [`≥ 0.3× trivial req/s`, rps >= 0.3 * b.rps],
      health,
    );
    // For the record, not a target: signed-in visitors bypass the public page cache (lib/http/public-page-cache.ts).
    await http(
      'catalogue page, signed in (rendered each time)',
      `${BASE}/products`,
      { cookie },
      () => ['none (information)', true],
      health,
    );
    await http(
      'product JSON /api/products',
      `${BASE}/api/products`,
      {},
      (rps, _p, b) => [`≥ 0.3× trivial req/s`, rps >= 0.3 * b.rps],
      health,
    );
    await http(
      'back-office list /api/lots',
      `${BASE}/api/lots?page=1&pageSize=25`,
      { cookie },
      (_r, p99) => [`p99 ≤ 100 ms`, p99 <= 100],
      health,
    );
  } finally {
    try {
      if (server.pid) process.kill(-server.pid, 'SIGTERM');
    } catch {
      /* gone */
    }
  }

  const reports = tsx(['--conditions=react-server', 'tests/bench/reports.ts']);
  const out = reports.stdout;
  const rep = out.match(/Report (\d+) ms = ([\d.]+)× its SQL baseline/);
  const tr = out.match(/Trace (\d+) ms \(jar (\d+) ms\), recall SQL (\d+) ms/);
  const sqlBase =
    out.match(/seasonColonyTotals[^\n]*median\s+([\d.]+) ms/) ?? out.match(/SQL[^\n]*median\s+([\d.]+) ms/);
  if (rep)
    rows.push({
      what: 'season report',
      value: `${rep[1]} ms`,
      baseline: sqlBase ? `${Number(sqlBase[1]).toFixed(0)} ms (its SQL)` : 'its SQL',
      ratio: `${rep[2]}×`,
      target: '< 1000 ms and ≤ 2×',
      ok: Number(rep[1]) < 1000 && Number(rep[2]) <= 2,
    });
  if (tr)
    rows.push({
      what: 'recall trace (lot / jar)',
      value: `${tr[1]} ms / ${tr[2]} ms`,
      baseline: `${tr[3]} ms (recall SQL)`,
      ratio: `${(Number(tr[1]) / Math.max(1, Number(tr[3]))).toFixed(1)}×`,
      target: '< 200 ms',
      ok: Number(tr[1]) < 200 && Number(tr[2]) < 200,
    });
  if (!rep || !tr)
    rows.push({
      what: 'report/trace bench',
      value: 'failed',
      baseline: '',
      ratio: '',
      target: (reports.stderr || out).slice(-200),
      ok: false,
    });

  const labels = tsx(['tests/bench/labels.ts']).stdout;
  const secs = labels.match(/elapsed: ([\d.]+) s/);
  const mb = labels.match(/peak RSS: (\d+) MB/);
  rows.push({
    what: '1,000-label PDF',
    value: `${secs?.[1] ?? '?'} s, ${mb?.[1] ?? '?'} MB peak`,
    baseline: '—',
    ratio: '—',
    target: '≤ 5 s, ≤ 300 MB',
    ok: Number(secs?.[1]) <= 5 && Number(mb?.[1]) <= 300,
  });

  const cols: (keyof Row)[] = ['what', 'value', 'baseline', 'ratio', 'target'];
  const width = (k: keyof Row) => Math.max(k.length, ...rows.map((r) => String(r[k]).length));
  console.log(
    `\nCombtrace benchmark — ${CONNECTIONS} connections × ${SECONDS} s per route, synthetic dataset, production build\n`,
  );
  console.log([...cols.map((c) => c.padEnd(width(c))), 'result'].join('  '));
  for (const r of rows)
    console.log([...cols.map((c) => String(r[c]).padEnd(width(c))), r.ok ? 'ok' : 'MISSED'].join('  '));
  process.exit(rows.every((r) => r.ok) ? 0 : 1);
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
