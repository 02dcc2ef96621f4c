import type { QueryInterface } from 'sequelize';

// The records a food-safety question depends on are append-only in the database
// itself, whatever the app does: the audit log and the stock ledger never change; lots and their
// containers, readings and lab files are corrected by voiding, never deleted.
const NO_CHANGE = ['audit_entries', 'stock_entries'];
const NO_DELETE = ['lots', 'lot_containers', 'moisture_readings', 'lab_files', 'lot_parents'];

export async function up({ context: q }: { context: QueryInterface }) {
  await q.sequelize.query(`CREATE OR REPLACE FUNCTION combtrace_append_only() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      RAISE EXCEPTION '% on % is not allowed: these records are append-only (correct them with a new entry)', TG_OP, TG_TABLE_NAME
        USING ERRCODE = 'insufficient_privilege';
    END $$`);
  for (const t of NO_CHANGE) {
    await q.sequelize.query(
      `CREATE TRIGGER ${t}_append_only BEFORE UPDATE OR DELETE ON ${t} FOR EACH ROW EXECUTE FUNCTION combtrace_append_only()`,
    );
  }
  for (const t of NO_DELETE) {
    await q.sequelize.query(
      `CREATE TRIGGER ${t}_no_delete BEFORE DELETE ON ${t} FOR EACH ROW EXECUTE FUNCTION combtrace_append_only()`,
    );
  }
}

export async function down({ context: q }: { context: QueryInterface }) {
  for (const t of NO_CHANGE) await q.sequelize.query(`DROP TRIGGER IF EXISTS ${t}_append_only ON ${t}`);
  for (const t of NO_DELETE) await q.sequelize.query(`DROP TRIGGER IF EXISTS ${t}_no_delete ON ${t}`);
  await q.sequelize.query(`DROP FUNCTION IF EXISTS combtrace_append_only()`);
}
