/** The role the running app connects as on the local cluster: rows only, no schema (docs/architecture.md, "Database roles"). */
export const APP_ROLE = 'combtrace_app';

function localUrl(user: string): string {
  const port = process.env.PGPORT ?? '54329';
  const name = process.env.PGDATABASE ?? 'combtrace';
  return `postgres://${user}@127.0.0.1:${port}/${name}`;
}

/**
 * The owner's connection, for migrations, seeders and backups: DATABASE_URL wins (managed
 * PostgreSQL in production); else the local cluster as postgres.
 */
export function databaseUrl(): string {
  return process.env.DATABASE_URL || localUrl('postgres');
}

/**
 * The running app's connection: APP_DATABASE_URL wins; else DATABASE_URL exactly as given (your own
 * database, your choice of role); else the local cluster as combtrace_app, which the migration
 * 20261203000100-app-role creates with plain row privileges.
 */
export function appDatabaseUrl(): string {
  return process.env.APP_DATABASE_URL || process.env.DATABASE_URL || localUrl(APP_ROLE);
}
