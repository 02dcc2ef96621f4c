import { execFileSync } from 'node:child_process';
import path from 'node:path';
import { ROOT, pgEnv, testDbUrl, TEST_PGPORT } from './test-env';

export function startTestCluster(): void {
  execFileSync('bash', [path.join(ROOT, 'lib/db/pg.sh'), 'start'], { env: pgEnv(), stdio: 'inherit' });
}

function psql(sql: string): void {
  execFileSync('psql', ['-h', '127.0.0.1', '-p', TEST_PGPORT, '-U', 'postgres', '-d', 'postgres', '-qc', sql], {
    stdio: 'inherit',
  });
}

export function recreateDatabase(name: string): string {
  psql(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`);
  psql(`CREATE DATABASE "${name}"`);
  return testDbUrl(name);
}

export function dropDatabase(name: string): void {
  psql(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`);
}

/** Runs lib/db/migrate.ts against the given database (up, down --to 0, seed). */
export function migrate(url: string, ...args: string[]): void {
  execFileSync('npx', ['tsx', path.join(ROOT, 'lib/db/migrate.ts'), ...args], {
    cwd: ROOT,
    env: { ...process.env, DATABASE_URL: url, SCRYPT_LOG_N: process.env.SCRYPT_LOG_N ?? '12' },
    stdio: 'inherit',
  });
}
