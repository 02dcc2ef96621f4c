/**
 * Shop load check: the catalogue page and the product JSON route against /api/health (a trivial
 * route of the same server), one after the other in the same run, so the ratios compare like with like.
 * Run against a production server (next start), never dev:
 *   BENCH_URL=http://127.0.0.1:3100 npx tsx tests/bench/shop-load.ts
 * Optional: BENCH_SECONDS (default 10), BENCH_CONNECTIONS (default 10).
 * Exits 1 when any request failed or answered non-2xx.
 */
type Result = {
  requests: { average: number };
  latency: { p50: number; p99: number; average: number };
  non2xx: number;
  errors: number;
  timeouts: number;
};
type Autocannon = (opts: { url: string; connections: number; duration: number }) => Promise<Result>;

const base = (process.env.BENCH_URL ?? '').replace(/\/$/, '');
if (!base) {
  console.error('Set BENCH_URL to a running production server, e.g. BENCH_URL=http://127.0.0.1:3100');
  process.exit(2);
}
const seconds = Number(process.env.BENCH_SECONDS ?? 10);
const connections = Number(process.env.BENCH_CONNECTIONS ?? 10);
const autocannon = ((await import('autocannon' as string)) as { default: Autocannon }).default;

const routes = [
  { name: 'health (baseline)', path: '/api/health' },
  { name: 'catalogue page', path: '/products' },
  { name: 'product JSON', path: '/api/products' },
];

// Warm up each route once (first render compiles nothing in production, but fills DB pools).
for (const r of routes) {
  const res = await fetch(base + r.path);
  if (!res.ok) throw new Error(`${r.path} answered ${res.status}`);
}

const results: { name: string; rps: number; p50: number; p99: number; failed: number }[] = [];
for (const r of routes) {
  const out = await autocannon({ url: base + r.path, connections, duration: seconds });
  results.push({
    name: r.name,
    rps: out.requests.average,
    p50: out.latency.p50,
    p99: out.latency.p99,
    failed: out.non2xx + out.errors + out.timeouts,
  });
}

const [health] = results;
console.log(`\n${base}  ${connections} connections × ${seconds} s per route\n`);
console.log(
  'route'.padEnd(20) +
    'req/s'.padStart(9) +
    'p50 ms'.padStart(9) +
    'p99 ms'.padStart(9) +
    '  req/s vs health' +
    '  p99 vs health' +
    '  failed',
);
for (const r of results) {
  console.log(
    r.name.padEnd(20) +
      r.rps.toFixed(0).padStart(9) +
      String(r.p50).padStart(9) +
      String(r.p99).padStart(9) +
      (r.rps / health.rps).toFixed(2).padStart(17) +
      (r.p99 / Math.max(1, health.p99)).toFixed(2).padStart(15) +
      String(r.failed).padStart(8),
  );
}
if (results.some((r) => r.failed > 0)) process.exit(1);
export {};
