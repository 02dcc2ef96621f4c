/**
 * Seeds a large synthetic business into its OWN database for the report/trace benchmark:
 * about 2,000 colonies, 15,000 super pulls, 500 lots (20 of them blends), 20,000 paid orders.
 * Everything is generated inside PostgreSQL with INSERT … SELECT generate_series (seconds, not minutes).
 *
 *   TEST_PGPORT=54355 npx tsx tests/bench/seed-large.ts        # creates/replaces database combtrace_bench
 *
 * Uses the throw-away test cluster (lib/db/pg.sh) on TEST_PGPORT, never a developer database.
 */
import { execFileSync } from 'node:child_process';
import path from 'node:path';
import { ROOT, pgEnv, testDbUrl, TEST_PGPORT } from '@/tests/support/test-env';

export const BENCH_DB = 'combtrace_bench';
export const BENCH_SEASON = 2026;

function psql(db: string, sql: string): void {
  execFileSync(
    'psql',
    ['-h', '127.0.0.1', '-p', TEST_PGPORT, '-U', 'postgres', '-d', db, '-v', 'ON_ERROR_STOP=1', '-qc', sql],
    { stdio: 'inherit' },
  );
}

const SEED_SQL = `
SELECT setseed(0.42);
INSERT INTO business_settings (id, business_name, created_at, updated_at) VALUES (1, 'Bench Apiaries', NOW(), NOW());
-- 1 owner, 20 keepers, 6,000 customers
INSERT INTO users (email, name, role, session_version, created_at, updated_at)
  SELECT 'owner@bench.test', 'Bench Owner', 'owner', 1, NOW(), NOW();
INSERT INTO users (email, name, role, session_version, created_at, updated_at)
  SELECT 'keeper' || g || '@bench.test', 'Keeper ' || g, 'keeper', 1, NOW(), NOW() FROM generate_series(1, 20) g;
INSERT INTO users (email, name, role, session_version, created_at, updated_at)
  SELECT 'customer' || g || '@bench.test', 'Customer ' || g, 'customer', 1, NOW(), NOW() FROM generate_series(1, 6000) g;

INSERT INTO yards (name, created_at, updated_at) SELECT 'Yard ' || lpad(g::text, 2, '0'), NOW(), NOW() FROM generate_series(1, 50) g;

-- 2,000 colonies; every 8th is a split of the one before it
INSERT INTO colonies (code, yard_id, keeper_id, origin, started_on, created_at, updated_at)
  SELECT 'C' || lpad(g::text, 4, '0'), (SELECT min(id) FROM yards) + (g % 50),
         (SELECT min(id) FROM users WHERE role = 'keeper') + ((g % 50) % 20), 'nucleus', DATE '2024-04-01', NOW(), NOW()
  FROM generate_series(1, 2000) g;
UPDATE colonies c SET parent_colony_id = p.id, origin = 'split'
  FROM colonies p WHERE p.code = 'C' || lpad((substring(c.code, 2)::int - 1)::text, 4, '0') AND substring(c.code, 2)::int % 8 = 0;

-- 500 lots: 420 this season, 60 last season, 20 blends this season
INSERT INTO lots (code, extracted_on, stage, net_grams, created_at, updated_at)
  SELECT 'BL' || CASE WHEN g <= 60 THEN '25' ELSE '26' END || '-' || lpad(g::text, 3, '0'),
         CASE WHEN g <= 60 THEN DATE '2025-08-01' ELSE DATE '2026-07-01' + (g % 60) END, 'released', 0, NOW(), NOW()
  FROM generate_series(1, 480) g;
INSERT INTO lots (code, extracted_on, stage, is_blend, net_grams, created_at, updated_at)
  SELECT 'BL26-B' || lpad(g::text, 2, '0'), DATE '2026-09-15', 'released', true, 0, NOW(), NOW() FROM generate_series(1, 20) g;

-- 15,000 super pulls, 70 % weighed; each into one of the 480 plain lots
INSERT INTO super_pulls (colony_id, tag_code, depth, frame_count, put_on_on, pulled_on, full_grams, empty_grams, capped_frames, lot_id, created_at, updated_at)
  SELECT (SELECT min(id) FROM colonies) + (g * 7919) % 2000,
         'T' || lpad(g::text, 6, '0'),
         (ARRAY['deep', 'medium', 'shallow'])[1 + g % 3], 10,
         l.extracted_on - 60, l.extracted_on - 2,
         CASE WHEN g % 10 < 7 THEN 20000 + (random() * 14000)::int END,
         CASE WHEN g % 10 < 7 THEN 6500 + (random() * 1500)::int END,
         (4 + (g % 7))::numeric, l.id, NOW(), NOW()
  FROM generate_series(1, 15000) g
  JOIN lots l ON l.code = 'BL' || CASE WHEN 1 + g % 480 <= 60 THEN '25' ELSE '26' END || '-' || lpad((1 + g % 480)::text, 3, '0');

UPDATE lots l SET net_grams = s.w FROM (
  SELECT lot_id, (SUM(CASE WHEN full_grams > empty_grams THEN full_grams - empty_grams ELSE 15000 END) * 0.95)::int AS w FROM super_pulls GROUP BY lot_id
) s WHERE s.lot_id = l.id;

-- Each blend takes 20 kg from two parent lots of this season
INSERT INTO lot_parents (child_lot_id, parent_lot_id, grams, created_at, updated_at)
  SELECT b.id, p.id, 20000, NOW(), NOW()
  FROM (SELECT id, row_number() OVER (ORDER BY code) AS n FROM lots WHERE is_blend) b
  JOIN LATERAL (SELECT id FROM lots WHERE code IN ('BL26-' || lpad((60 + b.n * 2)::text, 3, '0'), 'BL26-' || lpad((61 + b.n * 2)::text, 3, '0'))) p ON true;
UPDATE lots l SET net_grams = 40000 WHERE is_blend;
INSERT INTO moisture_readings (lot_id, method, scale_water_pct, water_pct, taken_on, created_at, updated_at)
  SELECT id, 'scale', 16.5 + (id % 30) / 10.0, 16.5 + (id % 30) / 10.0, extracted_on, NOW(), NOW() FROM lots;

INSERT INTO products (slug, name, net_grams, declared_amount, container_kind, container_grams, price_cents, created_at, updated_at) VALUES
  ('small', 'Small jar', 227, 227, 'glass jar', 180, 799, NOW(), NOW()),
  ('jar', 'Jar', 340, 340, 'glass jar', 220, 1099, NOW(), NOW()),
  ('large', 'Large jar', 454, 454, 'glass jar', 260, 1399, NOW(), NOW());
INSERT INTO jarring_runs (lot_id, product_id, jar_count, run_on, rule_set, fill_pass, honey_used_grams, created_at, updated_at)
  SELECT l.id, p.id, 60, l.extracted_on + 7, 'oiml', true, 60 * p.net_grams, NOW(), NOW() FROM lots l CROSS JOIN products p;
INSERT INTO stock_levels (product_id, lot_id, on_hand, reserved, best_before_on, created_at, updated_at)
  SELECT p.id, l.id, 10, 0, l.extracted_on + 730, NOW(), NOW() FROM lots l CROSS JOIN products p;

-- 20,000 orders, one line each, jars from one or two lots; 5 % refunded in part
INSERT INTO orders (number, customer_id, email, name, phone, status, fulfilment, subtotal_cents, shipping_cents, total_cents, refunded_cents, currency, paid_at, created_at, updated_at)
  SELECT 'B-' || (100000 + g), u.id, u.email, u.name, '555-' || lpad((g % 10000)::text, 4, '0'),
         (ARRAY['paid', 'packed', 'shipped', 'picked_up'])[1 + g % 4], CASE WHEN g % 3 = 0 THEN 'pickup' ELSE 'ship' END,
         (1 + g % 4) * 1099, 0, (1 + g % 4) * 1099, CASE WHEN g % 20 = 0 THEN 1099 ELSE 0 END, 'usd', NOW(), NOW(), NOW()
  FROM generate_series(1, 20000) g JOIN users u ON u.email = 'customer' || (1 + g % 6000) || '@bench.test';
INSERT INTO order_lines (order_id, product_id, product_name, quantity, unit_price_cents, created_at, updated_at)
  SELECT o.id, (SELECT id FROM products WHERE slug = 'jar'), 'Jar', o.subtotal_cents / 1099, 1099, NOW(), NOW() FROM orders o;
INSERT INTO order_allocations (order_line_id, lot_id, quantity, state, created_at, updated_at)
  SELECT ol.id, (SELECT min(id) FROM lots) + (ol.id * 31) % 500, CASE WHEN ol.quantity > 1 THEN ol.quantity - 1 ELSE 1 END, 'sold', NOW(), NOW()
  FROM order_lines ol;
INSERT INTO order_allocations (order_line_id, lot_id, quantity, state, created_at, updated_at)
  SELECT ol.id, (SELECT min(id) FROM lots) + (ol.id * 37 + 11) % 500, 1, 'sold', NOW(), NOW() FROM order_lines ol WHERE ol.quantity > 1;
ANALYZE;
`;

async function main() {
  const started = Date.now();
  execFileSync('bash', [path.join(ROOT, 'lib/db/pg.sh'), 'start'], { env: pgEnv(), stdio: 'inherit' });
  psql('postgres', `DROP DATABASE IF EXISTS ${BENCH_DB} WITH (FORCE)`);
  psql('postgres', `CREATE DATABASE ${BENCH_DB}`);
  const url = testDbUrl(BENCH_DB);
  execFileSync('npx', ['tsx', path.join(ROOT, 'lib/db/migrate.ts'), 'up'], {
    cwd: ROOT,
    env: { ...process.env, DATABASE_URL: url },
    stdio: 'inherit',
  });
  psql(BENCH_DB, SEED_SQL);
  psql(
    BENCH_DB,
    `SELECT (SELECT count(*) FROM colonies) AS colonies, (SELECT count(*) FROM super_pulls) AS super_pulls,
    (SELECT count(*) FROM lots) AS lots, (SELECT count(*) FROM orders) AS orders, (SELECT count(*) FROM order_allocations) AS allocations`.replace(
      '-qc',
      '',
    ),
  );
  console.log(`Seeded ${BENCH_DB} in ${((Date.now() - started) / 1000).toFixed(1)} s: ${url}`);
}

if (process.argv[1] && path.resolve(process.argv[1]) === path.resolve(ROOT, 'tests/bench/seed-large.ts')) {
  main().catch((err) => {
    console.error(err);
    process.exit(1);
  });
}
