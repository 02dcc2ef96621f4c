import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import pg from 'pg';
import { closeDb, getDb } from '@/lib/db';
import { APP_ROLE } from '@/lib/db/config';
import { listAudit } from '@/lib/data/audit';
import { addReadingAction, createLotAction, voidRecordAction } from '@/app/(back-office)/admin/lots/actions';
import { DEMO, signInAs } from '@/tests/support/session';
import { dropDatabase, migrate, recreateDatabase } from '@/tests/support/pg';

// Lots, readings and audit rows are append-only for the app's own database role.
// ASVS 4.0.3 V1.2.1 (application components run with low-privilege accounts) and V7.3.3 (security
// logs are protected from modification) — requirement numbers from memory.
//
// In this file the app itself (getDb(), the server actions) connects as combtrace_app, exactly as
// `next start` does; `owner` is the migrating role (postgres), for comparisons and clean-up only.

const ownerUrl = process.env.DATABASE_URL!;
function asAppRole(url: string): string {
  const u = new URL(url);
  u.username = APP_ROLE;
  u.password = '';
  return u.toString();
}

let owner: pg.Client;
beforeAll(async () => {
  await closeDb();
  process.env.APP_DATABASE_URL = asAppRole(ownerUrl);
  owner = new pg.Client({ connectionString: ownerUrl });
  await owner.connect();
});
afterAll(async () => {
  await closeDb();
  delete process.env.APP_DATABASE_URL;
  await owner?.end();
});

const q = (sql: string) => getDb().sequelize.query(sql);

/** Runs `sql` as the app and returns PostgreSQL's refusal (SQLSTATE and message); fails if it was allowed. */
async function refusal(sql: string): Promise<{ code: string; message: string }> {
  const t = await getDb().sequelize.transaction();
  try {
    await getDb().sequelize.query(sql, { transaction: t });
  } catch (err) {
    const cause = (err as { parent?: { code?: string; message?: string } }).parent;
    return { code: cause?.code ?? 'none', message: cause?.message ?? String(err) };
  } finally {
    await t.rollback();
  }
  throw new Error(`allowed for ${APP_ROLE}: ${sql}`);
}

/** Refused by the privilege system itself (42501 "permission denied"), before any trigger could run. */
async function expectPermissionDenied(sql: string, what: RegExp = /^permission denied for table /): Promise<void> {
  const r = await refusal(sql);
  expect(r, sql).toMatchObject({ code: '42501' });
  expect(r.message, sql).toMatch(what);
}

describe(`the app's database role (${APP_ROLE})`, () => {
  it('is what the app connects as: no superuser, no role or database creation, owns no table', async () => {
    const [[me]] =
      (await q(`SELECT current_user AS "user", r.rolsuper, r.rolcreatedb, r.rolcreaterole, r.rolreplication, r.rolbypassrls,
        (SELECT count(*)::int FROM pg_tables WHERE schemaname = 'public' AND tableowner = current_user) AS owned,
        pg_has_role(current_user, (SELECT tableowner FROM pg_tables WHERE tablename = 'audit_entries'), 'MEMBER') AS owner_rights
      FROM pg_roles r WHERE r.rolname = current_user`)) as [Record<string, unknown>[], unknown];
    expect(me).toEqual({
      user: APP_ROLE,
      rolsuper: false,
      rolcreatedb: false,
      rolcreaterole: false,
      rolreplication: false,
      rolbypassrls: false,
      owned: 0,
      owner_rights: false,
    });
  });

  it('runs the lot flow through the real actions: a lot, a reading, a voided reading, and its audit trail', async () => {
    await signInAs(DEMO.crew);
    const lot = await createLotAction({ floralSource: 'Role check clover', heather: false, notes: '' });
    if (!lot.ok) throw new Error(lot.message);
    expect(
      await addReadingAction({ lotId: lot.data.id, method: 'scale', scaleWaterPct: 17.4, takenOn: '2026-08-01' }),
    ).toMatchObject({ ok: true });
    const reading = await getDb().models.MoistureReading.findOne({ where: { lotId: lot.data.id } });
    // Voiding locks the reading row (SELECT … FOR UPDATE), which needs UPDATE: kept on readings.
    expect(
      await voidRecordAction({
        lotId: lot.data.id,
        kind: 'reading',
        recordId: reading!.id,
        reason: 'Sample taken from the wrong bucket',
      }),
    ).toMatchObject({ ok: true });
    const trail = await listAudit('lot', lot.data.id);
    expect(trail.map((a) => a.action)).toContain('lot.create');
  });

  it('inserts an audit row and reads it back, but cannot update, delete or truncate the audit log', async () => {
    const [[row]] = (await q(
      `INSERT INTO audit_entries (action, entity_type, entity_id, reason, created_at) VALUES ('role.check', 'test', 'app-role', 'written by ${APP_ROLE}', now()) RETURNING id`,
    )) as [{ id: number }[], unknown];
    const [[back]] = (await q(`SELECT reason FROM audit_entries WHERE id = ${Number(row.id)}`)) as [
      { reason: string }[],
      unknown,
    ];
    expect(back.reason).toBe(`written by ${APP_ROLE}`);
    await expectPermissionDenied(`UPDATE audit_entries SET reason = 'rewritten' WHERE id = ${Number(row.id)}`);
    await expectPermissionDenied(`DELETE FROM audit_entries WHERE id = ${Number(row.id)}`);
    await expectPermissionDenied(`TRUNCATE audit_entries`);
    // Locking audit rows would need UPDATE too: the app never does it.
    await expectPermissionDenied(`SELECT id FROM audit_entries WHERE id = ${Number(row.id)} FOR UPDATE`);
  });

  it('cannot update, delete or truncate the stock ledger', async () => {
    const [entry] = (await owner.query(`SELECT min(id)::int AS id FROM stock_entries`)).rows as [{ id: number }];
    expect(entry.id).toBeGreaterThan(0);
    await expectPermissionDenied(`UPDATE stock_entries SET delta = delta + 1 WHERE id = ${entry.id}`);
    await expectPermissionDenied(`DELETE FROM stock_entries WHERE id = ${entry.id}`);
    await expectPermissionDenied(`TRUNCATE stock_entries`);
  });

  it('updates and locks lots (stage changes) but cannot delete or truncate lots, containers, readings, lab files or blend parents', async () => {
    const t = await getDb().sequelize.transaction();
    try {
      const [locked] = await getDb().sequelize.query(`SELECT id FROM lots ORDER BY id LIMIT 1 FOR UPDATE`, {
        transaction: t,
      });
      expect(locked).toHaveLength(1);
      const [, meta] = await getDb().sequelize.query(
        `UPDATE lots SET notes = notes WHERE id = ${(locked[0] as { id: number }).id}`,
        { transaction: t },
      );
      expect((meta as { rowCount: number }).rowCount).toBe(1);
    } finally {
      await t.rollback();
    }
    for (const table of ['lots', 'lot_containers', 'moisture_readings', 'lab_files', 'lot_parents']) {
      await expectPermissionDenied(`DELETE FROM ${table} WHERE id = (SELECT min(id) FROM ${table})`);
      await expectPermissionDenied(`TRUNCATE ${table}`);
    }
  });

  it('cannot switch the append-only triggers off, change the schema or touch migration bookkeeping', async () => {
    await expectPermissionDenied(
      `ALTER TABLE audit_entries DISABLE TRIGGER ALL`,
      /^must be owner of table audit_entries/,
    );
    await expectPermissionDenied(`DROP TRIGGER audit_entries_append_only ON audit_entries`, /^must be owner of/);
    await expectPermissionDenied(
      `SET session_replication_role = replica`,
      /^permission denied to set parameter "session_replication_role"/,
    );
    await expectPermissionDenied(
      `CREATE TABLE public.role_check_scratch (id int)`,
      /^permission denied for schema public/,
    );
    await expectPermissionDenied(
      `CREATE TRIGGER role_check BEFORE INSERT ON lots FOR EACH ROW EXECUTE FUNCTION combtrace_append_only()`,
    );
    await expectPermissionDenied(
      `SELECT setval('order_number_seq', 1)`,
      /^permission denied for sequence order_number_seq/,
    );
    await expectPermissionDenied(`SELECT name FROM schema_migrations`);
    await expectPermissionDenied(`DELETE FROM schema_seeds`);
  });

  it('tables made by later migrations get row grants by default; an append-only one has to revoke them itself', async () => {
    await owner.query(`CREATE TABLE role_check_later (id serial PRIMARY KEY, note text)`);
    try {
      const { rows } = await owner.query(
        `SELECT has_table_privilege($1, 'role_check_later', 'SELECT, INSERT') AS write,
          has_table_privilege($1, 'role_check_later', 'DELETE') AS del, has_table_privilege($1, 'role_check_later', 'TRUNCATE') AS truncate,
          has_sequence_privilege($1, 'role_check_later_id_seq', 'USAGE') AS seq`,
        [APP_ROLE],
      );
      expect(rows[0]).toEqual({ write: true, del: true, truncate: false, seq: true });
    } finally {
      await owner.query(`DROP TABLE role_check_later`);
    }
  });
});

describe('the app-role migration in a cluster shared by several databases', () => {
  /** What another database in the cluster grants the role: its own rows in pg_shdepend, and CONNECT. */
  async function roleIn(url: string) {
    const db = new pg.Client({ connectionString: url });
    await db.connect();
    try {
      const { rows } = await db.query(
        `SELECT
          (SELECT count(*)::int FROM pg_roles WHERE rolname = $1) AS roles,
          (SELECT count(*)::int FROM pg_shdepend d JOIN pg_roles r ON r.oid = d.refobjid
            WHERE r.rolname = $1 AND d.dbid = (SELECT oid FROM pg_database WHERE datname = current_database())) AS grants,
          (SELECT coalesce(datacl::text, '') LIKE '%' || $1 || '=%' FROM pg_database WHERE datname = current_database()) AS connect`,
        [APP_ROLE],
      );
      return rows[0] as { roles: number; grants: number; connect: boolean };
    } finally {
      await db.end();
    }
  }

  it('down in one database revokes everything there but keeps the role the other databases still use', async () => {
    const name = `combtrace_role_${process.pid}`;
    const url = recreateDatabase(name);
    try {
      migrate(url, 'up');
      const up = await roleIn(url);
      expect(up.grants).toBeGreaterThan(20);
      expect(up).toMatchObject({ roles: 1, connect: true });
      migrate(url, 'down', '--to', '0');
      expect(await roleIn(url)).toEqual({ roles: 1, grants: 0, connect: false });
      // …and the database this suite runs on still lets the app in and keeps its grants.
      const [[still]] = (await q(`SELECT count(*)::int AS n FROM lots`)) as [{ n: number }[], unknown];
      expect(still.n).toBeGreaterThan(0);
    } finally {
      dropDatabase(name);
    }
  });
});
