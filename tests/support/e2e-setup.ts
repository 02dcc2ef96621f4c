import { execFileSync, spawn, type ChildProcess } from 'node:child_process';
import { existsSync, mkdirSync, openSync } from 'node:fs';
import path from 'node:path';
import { migrate, recreateDatabase, startTestCluster } from './pg';
import { E2E_MAIL_WEB_PORT, E2E_PORT, E2E_SMTP_PORT, E2E_STRIPE_PORT, ROOT } from './test-env';
import { APP_ROLE } from '../../lib/db/config';

const children: ChildProcess[] = [];

function startDetached(name: string, cmd: string, args: string[], env: NodeJS.ProcessEnv): ChildProcess {
  const logDir = path.join(ROOT, 'tests/.artifacts');
  mkdirSync(logDir, { recursive: true });
  const log = openSync(path.join(logDir, `${name}.log`), 'w');
  // Own process group, so teardown stops the whole tree (killing npx leaves next-server behind).
  const child = spawn(cmd, args, { cwd: ROOT, env, detached: true, stdio: ['ignore', log, log] });
  children.push(child);
  return child;
}

async function waitFor(url: string, what: string, timeoutMs = 60_000): Promise<void> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    try {
      const res = await fetch(url);
      if (res.ok) return;
    } catch {
      /* not up yet */
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`${what} did not start; see tests/.artifacts/*.log`);
}

/**
 * Browser tests run against a production build with everything real: PostgreSQL (a fresh
 * database with the demo seed), the Stripe and mail fakes, and `next start`. Migrations and the
 * seed run as the owner; the server connects as the app's own role, as in production, and is
 * never given the owner's URL.
 */
export default async function setup() {
  startTestCluster();
  const dbUrl = recreateDatabase('combtrace_e2e');
  migrate(dbUrl, 'up');
  migrate(dbUrl, 'seed');

  if (process.env.E2E_SKIP_BUILD !== '1' || !existsSync(path.join(ROOT, '.next/BUILD_ID'))) {
    execFileSync('node', ['node_modules/next/dist/bin/next', 'build'], {
      cwd: ROOT,
      stdio: 'inherit',
      env: { ...process.env, NEXT_TELEMETRY_DISABLED: '1' },
    });
  }

  const baseUrl = `http://127.0.0.1:${E2E_PORT}`;
  const appDbUrl = new URL(dbUrl);
  appDbUrl.username = APP_ROLE;
  const env: NodeJS.ProcessEnv = {
    ...process.env,
    NODE_ENV: 'production',
    APP_DATABASE_URL: appDbUrl.toString(),
    NEXTAUTH_URL: baseUrl,
    APP_URL: baseUrl,
    NEXTAUTH_SECRET: 'e2e-secret-not-for-production-000000000000',
    SMTP_PORT: String(E2E_SMTP_PORT),
    FAKE_SMTP_PORT: String(E2E_SMTP_PORT),
    FAKE_MAIL_WEB_PORT: String(E2E_MAIL_WEB_PORT),
    FAKE_STRIPE_PORT: String(E2E_STRIPE_PORT),
    STRIPE_SECRET_KEY: 'sk_test_combtrace_e2e',
    STRIPE_API_HOST: '127.0.0.1',
    STRIPE_API_PORT: String(E2E_STRIPE_PORT),
    STRIPE_API_PROTOCOL: 'http',
    STRIPE_WEBHOOK_URL: `${baseUrl}/api/stripe/webhook`,
    STRIPE_WEBHOOK_SECRET: 'whsec_combtrace_e2e',
    MAIL_TIMER_MS: '1000',
    SCRYPT_LOG_N: '12',
  };
  delete env.NEXT_RUNTIME;
  delete env.DATABASE_URL;
  startDetached('fakes', 'node', ['node_modules/tsx/dist/cli.mjs', 'fakes/run.ts'], env);
  startDetached(
    'app',
    'node',
    ['node_modules/next/dist/bin/next', 'start', '-H', '127.0.0.1', '-p', String(E2E_PORT)],
    env,
  );
  await waitFor(`http://127.0.0.1:${E2E_MAIL_WEB_PORT}/api/messages`, 'The mail fake');
  await waitFor(`${baseUrl}/api/health`, 'The app');

  process.env.E2E_BASE_URL = baseUrl;
  process.env.E2E_MAIL_URL = `http://127.0.0.1:${E2E_MAIL_WEB_PORT}`;
  process.env.E2E_STRIPE_URL = `http://127.0.0.1:${E2E_STRIPE_PORT}`;
  process.env.DATABASE_URL = dbUrl;

  return async () => {
    for (const child of children) {
      try {
        if (child.pid) process.kill(-child.pid, 'SIGTERM');
      } catch {
        /* already gone */
      }
    }
  };
}
