import { dropDatabase, migrate, recreateDatabase, startTestCluster } from './pg';

/**
 * Integration tests run against a real PostgreSQL: a throw-away database in the test cluster.
 * Migrations go up, all the way down, and up again (so every `down` is exercised), then the demo seed.
 */
export default async function setup() {
  startTestCluster();
  const name = `combtrace_test_${process.pid}`;
  const url = recreateDatabase(name);
  migrate(url, 'up');
  migrate(url, 'down', '--to', '0');
  migrate(url, 'up');
  migrate(url, 'seed');
  process.env.DATABASE_URL = url;
  // The app under test connects with DATABASE_URL (the owner); tests/data/app-role.test.ts switches to combtrace_app.
  delete process.env.APP_DATABASE_URL;
  process.env.SCRYPT_LOG_N ??= '12';
  process.env.MAIL_TIMER = 'off';
  return () => {
    if (process.env.KEEP_TEST_DB !== '1') dropDatabase(name);
  };
}
