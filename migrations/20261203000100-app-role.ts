import { QueryTypes, type QueryInterface } from 'sequelize';

// The running app has its own database role, combtrace_app. It reads and writes rows
// and nothing else: it owns no table, so it cannot ALTER TABLE … DISABLE TRIGGER, drop the
// append-only triggers or change the schema, and it is no superuser, so it cannot SET
// session_replication_role = replica either. On top of the triggers, the privileges themselves
// refuse what the triggers refuse: no UPDATE/DELETE/TRUNCATE on the audit log and the stock
// ledger, no DELETE/TRUNCATE on lots and their containers, readings, lab files and blend parents.
// Migrations, seeders and backups keep running as the owner (lib/db/migrate.ts, lib/ops/backup.sh).
//
// Roles belong to the whole cluster, not to one database: other Combtrace databases in the same
// cluster (tests, e2e, restores) share this role. So `up` creates it only when it is missing, and
// `down` revokes everything in this database and drops the role only when this migration made it
// (the comment below) and no other database still grants it anything; otherwise the role stays.
const ROLE = 'combtrace_app';
const MADE_BY = 'Combtrace app role, created by migration 20261203000100-app-role';
const NO_CHANGE = ['audit_entries', 'stock_entries'];
const NO_DELETE = ['lots', 'lot_containers', 'moisture_readings', 'lab_files', 'lot_parents'];
// umzug's bookkeeping (schema_seeds exists only once the demo seed has run): not the app's business.
const BOOKKEEPING = ['schema_migrations', 'schema_seeds'];

type RoleRow = {
  rolsuper: boolean;
  rolcreatedb: boolean;
  rolcreaterole: boolean;
  rolreplication: boolean;
  rolbypassrls: boolean;
  owner_rights: boolean;
};

async function appRole(q: QueryInterface): Promise<RoleRow | undefined> {
  const rows = await q.sequelize.query<RoleRow>(
    `SELECT rolsuper, rolcreatedb, rolcreaterole, rolreplication, rolbypassrls, pg_has_role(rolname, current_user, 'MEMBER') AS owner_rights
     FROM pg_roles WHERE rolname = :role`,
    { type: QueryTypes.SELECT, replacements: { role: ROLE } },
  );
  return rows[0];
}

async function existingTables(q: QueryInterface, names: string[]): Promise<string[]> {
  const rows = await q.sequelize.query<{ name: string }>(
    `SELECT c.relname AS name FROM pg_class c JOIN pg_namespace n ON n.oid = c.relnamespace
     WHERE n.nspname = 'public' AND c.relkind IN ('r', 'p') AND c.relname IN (:names)`,
    { type: QueryTypes.SELECT, replacements: { names } },
  );
  return rows.map((r) => r.name);
}

export async function up({ context: q }: { context: QueryInterface }) {
  const sql = (text: string) => q.sequelize.query(text);
  // Another database may be creating it at the same moment: losing that race is fine.
  await sql(`DO $$ BEGIN
    IF NOT EXISTS (SELECT 1 FROM pg_roles WHERE rolname = '${ROLE}')
       AND (SELECT rolsuper OR rolcreaterole FROM pg_roles WHERE rolname = current_user) THEN
      CREATE ROLE ${ROLE} LOGIN NOSUPERUSER NOCREATEDB NOCREATEROLE NOREPLICATION NOBYPASSRLS;
      COMMENT ON ROLE ${ROLE} IS '${MADE_BY}';
    END IF;
  EXCEPTION WHEN duplicate_object OR unique_violation THEN NULL;
  END $$`);

  const role = await appRole(q);
  if (!role) {
    // A database you brought yourself, migrated by a role that may not create roles: the app then
    // connects with DATABASE_URL's role (or APP_DATABASE_URL's). The triggers still stand.
    console.warn(
      `${ROLE} does not exist and this user may not create roles; the app will use the role in its URL (DEVELOPERS.md, "Database roles").`,
    );
    return;
  }
  if (
    role.rolsuper ||
    role.rolcreatedb ||
    role.rolcreaterole ||
    role.rolreplication ||
    role.rolbypassrls ||
    role.owner_rights
  ) {
    throw new Error(
      `${ROLE} already exists with more rights than the app may have (superuser, createdb, createrole, replication, bypassrls or the tables' owner's rights); fix or drop that role first.`,
    );
  }

  await sql(`DO $$ BEGIN EXECUTE format('GRANT CONNECT ON DATABASE %I TO ${ROLE}', current_database()); END $$`);
  await sql(`GRANT USAGE ON SCHEMA public TO ${ROLE}`);
  await sql(`GRANT SELECT, INSERT, UPDATE, DELETE ON ALL TABLES IN SCHEMA public TO ${ROLE}`);
  await sql(`GRANT USAGE, SELECT ON ALL SEQUENCES IN SCHEMA public TO ${ROLE}`);
  // Tables and sequences that later migrations create (as this same owner) get the same grants;
  // a later append-only table must revoke explicitly, as below (docs/architecture.md, "Database roles").
  await sql(`ALTER DEFAULT PRIVILEGES IN SCHEMA public GRANT SELECT, INSERT, UPDATE, DELETE ON TABLES TO ${ROLE}`);
  await sql(`ALTER DEFAULT PRIVILEGES IN SCHEMA public GRANT USAGE, SELECT ON SEQUENCES TO ${ROLE}`);

  const bookkeeping = await existingTables(q, BOOKKEEPING);
  if (bookkeeping.length) await sql(`REVOKE ALL ON ${bookkeeping.join(', ')} FROM ${ROLE}`);
  await sql(`REVOKE UPDATE, DELETE, TRUNCATE ON ${NO_CHANGE.join(', ')} FROM ${ROLE}`);
  await sql(`REVOKE DELETE, TRUNCATE ON ${NO_DELETE.join(', ')} FROM ${ROLE}`);
}

export async function down({ context: q }: { context: QueryInterface }) {
  if (!(await appRole(q))) return;
  const sql = (text: string) => q.sequelize.query(text);
  // Plain REVOKEs, not DROP OWNED BY: that would also revoke CONNECT on the other databases.
  await sql(`ALTER DEFAULT PRIVILEGES IN SCHEMA public REVOKE ALL ON TABLES FROM ${ROLE}`);
  await sql(`ALTER DEFAULT PRIVILEGES IN SCHEMA public REVOKE ALL ON SEQUENCES FROM ${ROLE}`);
  await sql(`REVOKE ALL ON ALL TABLES IN SCHEMA public FROM ${ROLE}`);
  await sql(`REVOKE ALL ON ALL SEQUENCES IN SCHEMA public FROM ${ROLE}`);
  await sql(`REVOKE ALL ON SCHEMA public FROM ${ROLE}`);
  await sql(`DO $$ BEGIN EXECUTE format('REVOKE ALL ON DATABASE %I FROM ${ROLE}', current_database()); END $$`);
  // DROP ROLE refuses (2BP01) while any database in the cluster still grants the role something.
  await sql(`DO $$ BEGIN
    IF shobj_description((SELECT oid FROM pg_roles WHERE rolname = '${ROLE}'), 'pg_authid') = '${MADE_BY}' THEN
      DROP ROLE ${ROLE};
    END IF;
  EXCEPTION WHEN dependent_objects_still_exist THEN
    RAISE NOTICE '${ROLE} kept: another database in this cluster still uses it';
  END $$`);
}
