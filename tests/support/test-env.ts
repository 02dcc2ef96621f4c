import path from 'node:path';
import { fileURLToPath } from 'node:url';

/** Ports and folders of the throw-away test services; override with env to run two suites side by side. */
export const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
export const TEST_PGPORT = process.env.TEST_PGPORT ?? '54340';
export const TEST_PGDATA = process.env.TEST_PGDATA ?? path.join(ROOT, '.pg-test/data');
export const E2E_PORT = Number(process.env.E2E_PORT ?? 3199);
export const E2E_STRIPE_PORT = Number(process.env.E2E_STRIPE_PORT ?? 12199);
export const E2E_SMTP_PORT = Number(process.env.E2E_SMTP_PORT ?? 1099);
export const E2E_MAIL_WEB_PORT = Number(process.env.E2E_MAIL_WEB_PORT ?? 1199);

export function testDbUrl(name: string): string {
  return `postgres://postgres@127.0.0.1:${TEST_PGPORT}/${name}`;
}

/** Env for child processes: the test cluster, never the developer's own database. */
export function pgEnv(): NodeJS.ProcessEnv {
  const env: NodeJS.ProcessEnv = { ...process.env, PGPORT: TEST_PGPORT, PGDATA: TEST_PGDATA, PGDATABASE: 'postgres' };
  delete env.DATABASE_URL;
  return env;
}
