import { execFileSync } from 'node:child_process';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { Sequelize } from 'sequelize';
import { closeDb, getDb } from '@/lib/db';
import { dropDatabase } from '@/tests/support/pg';

const restored = `combtrace_restore_${process.pid}`;
afterAll(async () => {
  await closeDb();
  dropDatabase(restored);
});

// The figures a restore must bring back exactly: row counts and the sums that carry money and stock.
const CHECKS = `SELECT
  (SELECT count(*) FROM users) AS users,
  (SELECT count(*) FROM colonies) AS colonies,
  (SELECT count(*) FROM super_pulls) AS pulls,
  (SELECT count(*) FROM lots) AS lots,
  (SELECT count(*) FROM audit_entries) AS audit_rows,
  (SELECT coalesce(sum(on_hand), 0) FROM stock_levels) AS stock_on_hand,
  (SELECT coalesce(sum(delta), 0) FROM stock_entries) AS ledger_sum,
  (SELECT coalesce(sum(total_cents), 0) FROM orders WHERE paid_at IS NOT NULL) AS paid_cents,
  (SELECT coalesce(sum(net_grams), 0) FROM lots) AS lot_grams`;

// Who may do what: every table's and sequence's privileges, so the app's role comes back as restricted as it was.
// (an ACL of NULL means the owner's defaults, so both are compared in their written-out form).
const ACLS = `SELECT c.relname, coalesce(c.relacl, acldefault(CASE c.relkind WHEN 'S' THEN 's' ELSE 'r' END::"char", c.relowner))::text AS acl FROM pg_class c
  WHERE c.relnamespace = 'public'::regnamespace AND c.relkind IN ('r', 'S') ORDER BY c.relname`;
const APP_RIGHTS = `SELECT has_table_privilege('combtrace_app', 'audit_entries', 'INSERT') AS audit_insert,
  has_table_privilege('combtrace_app', 'audit_entries', 'DELETE') AS audit_delete,
  has_table_privilege('combtrace_app', 'lots', 'UPDATE') AS lots_update,
  has_table_privilege('combtrace_app', 'lots', 'DELETE') AS lots_delete`;

describe('backups (npm run db:backup / db:restore)', () => {
  it('restores the demo database into a new one with identical counts, sums and privileges', async () => {
    const before = await getDb().sequelize.query(CHECKS, { plain: true });
    const [aclsBefore] = await getDb().sequelize.query(ACLS);
    expect(Number((before as Record<string, number>).lots)).toBeGreaterThan(0);
    const file = path.join(mkdtempSync(path.join(tmpdir(), 'combtrace-backup-')), 'demo.dump');
    execFileSync('bash', ['lib/ops/backup.sh', 'backup', file], { env: process.env, stdio: 'pipe' });
    execFileSync('bash', ['lib/ops/backup.sh', 'restore', file, restored], { env: process.env, stdio: 'pipe' });
    const url = process.env.DATABASE_URL!.replace(/\/[^/]+$/, `/${restored}`);
    const copy = new Sequelize(url, { logging: false });
    try {
      const after = await copy.query(CHECKS, { plain: true });
      expect(after).toEqual(before);
      const [ck] = await copy.query(`SELECT count(*)::int AS n FROM pg_constraint WHERE conname = 'stock_levels_ck'`);
      expect((ck as { n: number }[])[0].n).toBe(1);
      const [aclsAfter] = await copy.query(ACLS);
      expect(aclsAfter).toEqual(aclsBefore);
      expect(await copy.query(APP_RIGHTS, { plain: true })).toEqual({
        audit_insert: true,
        audit_delete: false,
        lots_update: true,
        lots_delete: false,
      });
    } finally {
      await copy.close();
    }
  });
});
