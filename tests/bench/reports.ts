/**
 * Benchmark of the season report and the recall trace on the large synthetic database
 * (seed it first with tests/bench/seed-large.ts). Each is measured against the plain SQL
 * aggregate it depends on, in the same run, same connection pool, after a warm-up:
 * - season report (getSeasonReport: shares + lots + colonies + rounding + tables' data)
 *   vs. seasonColonyTotals: one plain SQL statement giving per-colony honey and revenue (the
 *   recursive walk through blends, lot own weights and revenue) without rounding, ranks or tables;
 * - trace of a lot code (traceInput: resolve + 8 queries for one step back/forward)
 *   vs. the recall aggregate alone (order_allocations → orders for the lot and its blends).
 * Targets: report < 1 s and ≤ 2× its SQL baseline; trace < 200 ms.
 *
 *   TEST_PGPORT=54355 npx tsx --conditions=react-server tests/bench/reports.ts
 */
import { performance } from 'node:perf_hooks';
import { testDbUrl } from '@/tests/support/test-env';
import { BENCH_DB, BENCH_SEASON } from './seed-large';

process.env.DATABASE_URL = testDbUrl(BENCH_DB);
const RUNS = Number(process.env.BENCH_RUNS ?? 9);

async function median(label: string, fn: () => Promise<unknown>): Promise<number> {
  await fn(); // warm-up: connections, plans, fonts
  const times: number[] = [];
  for (let i = 0; i < RUNS; i++) {
    const t = performance.now();
    await fn();
    times.push(performance.now() - t);
  }
  times.sort((a, b) => a - b);
  const m = times[Math.floor(times.length / 2)];
  console.log(
    `${label.padEnd(44)} median ${m.toFixed(1).padStart(7)} ms   min ${times[0].toFixed(1).padStart(7)}   max ${times[times.length - 1].toFixed(1).padStart(7)}`,
  );
  return m;
}

async function main() {
  const { getDb, closeDb } = await import('@/lib/db');
  const { getSeasonReport, getSeasonHistory } = await import('@/lib/data/reports/yield-report');
  const { seasonColonyTotals, superEstimatesFrom } = await import('@/lib/data/reports/yield-sql');
  const { getRecallList, traceInput } = await import('@/lib/data/trace/trace');
  const { sequelize } = getDb();
  const [owner] = await sequelize.query<{ id: number }>(`SELECT id FROM users WHERE role = 'owner' LIMIT 1`, {
    type: 'SELECT' as never,
  });
  const user = { id: owner.id, name: 'Bench Owner', email: 'owner@bench.test', role: 'owner' as const };
  // The lot with the most sold jars and children: the worst recall.
  const [lot] = await sequelize.query<{ id: number; code: string; jars: number }>(
    `SELECT l.id, l.code, SUM(oa.quantity)::int AS jars FROM lots l JOIN order_allocations oa ON oa.lot_id = l.id AND oa.state = 'sold'
     WHERE EXISTS (SELECT 1 FROM lot_parents lp WHERE lp.parent_lot_id = l.id) GROUP BY l.id ORDER BY jars DESC LIMIT 1`,
    { type: 'SELECT' as never },
  );
  const est = superEstimatesFrom({});

  console.log(`Database ${BENCH_DB}, season ${BENCH_SEASON}, ${RUNS} runs each (median after one warm-up)`);
  const base = await median('SQL baseline: per-colony honey and revenue', () => seasonColonyTotals(BENCH_SEASON, est));
  const report = await median('Season report (getSeasonReport)', () => getSeasonReport(user, { season: BENCH_SEASON }));
  const history = await median('Season-over-season chart data', () => getSeasonHistory(user, {}));
  const recallBase = await median(`SQL baseline: recall list of ${lot.code}`, () => getRecallList(lot.id));
  const trace = await median(`Trace ${lot.code} (traceInput)`, () => traceInput(lot.code));
  const jar = await median(`Trace jar barcode of ${lot.code}`, () =>
    traceInput(`(01)09506000134352(15)281231(10)${lot.code}`),
  );

  const r = await getSeasonReport(user, { season: BENCH_SEASON });
  const t = await traceInput(lot.code);
  console.log(
    `Report: ${r!.colonies.length} colonies, ${r!.lots.length} lots, ${r!.totals.honeyGrams} g = lots ${r!.totals.lotGrams} g; trace: ${t.lots[0].supers.length} supers, ${t.lots[0].recall.length} recall rows`,
  );
  console.log(
    `Report ${report.toFixed(0)} ms = ${(report / base).toFixed(2)}× its SQL baseline (target < 1000 ms and ≤ 2×): ${report < 1000 && report <= 2 * base ? 'PASS' : 'FAIL'}`,
  );
  console.log(
    `Trace ${trace.toFixed(0)} ms (jar ${jar.toFixed(0)} ms), recall SQL ${recallBase.toFixed(0)} ms (target < 200 ms): ${trace < 200 && jar < 200 ? 'PASS' : 'FAIL'}`,
  );
  console.log(`Chart data (season over season) ${history.toFixed(0)} ms`);
  await closeDb();
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
