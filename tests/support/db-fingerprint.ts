import { getDb } from '@/lib/db';

/**
 * Row count (and newest updated_at) of every table: two equal fingerprints mean nothing was written.
 * Sign-in attempts, account requests and the migration bookkeeping are left out (throttling writes them by design).
 */
export async function dbFingerprint(): Promise<string> {
  const { sequelize } = getDb();
  const [tables] =
    await sequelize.query(`SELECT c.relname AS t, EXISTS (SELECT 1 FROM information_schema.columns i WHERE i.table_name = c.relname AND i.column_name = 'updated_at') AS u
    FROM pg_class c JOIN pg_namespace n ON n.oid = c.relnamespace WHERE c.relkind = 'r' AND n.nspname = 'public' AND c.relname NOT IN ('sign_in_attempts', 'account_requests', 'schema_migrations', 'schema_seeds') ORDER BY 1`);
  const parts: string[] = [];
  for (const { t, u } of tables as { t: string; u: boolean }[]) {
    const [[row]] = (await sequelize.query(`SELECT count(*) AS n${u ? ', max(updated_at) AS m' : ''} FROM "${t}"`)) as [
      Record<string, unknown>[],
      unknown,
    ];
    parts.push(`${t}:${row.n}:${row.m ?? ''}`);
  }
  return parts.join('|');
}
