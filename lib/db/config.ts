/** Where the database is: DATABASE_URL wins (managed PostgreSQL in production); else the local cluster. */
export function databaseUrl(): string {
  if (process.env.DATABASE_URL) return process.env.DATABASE_URL;
  const port = process.env.PGPORT ?? '54329';
  const name = process.env.PGDATABASE ?? 'combtrace';
  return `postgres://postgres@127.0.0.1:${port}/${name}`;
}
