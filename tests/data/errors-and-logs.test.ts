import { afterAll, afterEach, describe, expect, it, vi } from 'vitest';
import { DatabaseError } from 'sequelize';
import { closeDb } from '@/lib/db';
import { authenticate } from '@/lib/data/auth/sign-in';
import { authorize } from '@/lib/auth/session';
import { handleRouteError } from '@/lib/http/json';
import { DEMO, signInAs } from '@/tests/support/session';

afterAll(closeDb);
afterEach(() => vi.restoreAllMocks());

/** Everything written to the console while `run` runs, one string per call. */
async function logsOf(run: () => Promise<unknown>): Promise<string[]> {
  const lines: string[] = [];
  const keep = (...args: unknown[]) => {
    lines.push(args.map((a) => (a instanceof Error ? `${a.message}\n${a.stack}` : String(a))).join(' '));
  };
  for (const level of ['log', 'info', 'warn', 'error'] as const) vi.spyOn(console, level).mockImplementation(keep);
  await run().catch(() => undefined);
  return lines;
}

describe('errors and logs (ASVS 16)', () => {
  it('an unexpected failure answers a plain 500 with a reference; the SQL and stack stay in the log under that reference', async () => {
    const sqlError = new DatabaseError(
      Object.assign(new Error('column "secret_col" does not exist'), {
        sql: 'SELECT secret_col FROM users WHERE id = 1',
      }),
    );
    let res: Response | undefined;
    const logged = await logsOf(async () => {
      res = handleRouteError(sqlError);
    });
    expect(res?.status).toBe(500);
    const body = (await res!.json()) as { error: string };
    expect(body.error).toMatch(/^Something went wrong on our side\. Reference [0-9a-f]{8}\.$/);
    expect(JSON.stringify(body)).not.toMatch(/secret_col|SELECT|at .*\.ts/);
    const ref = body.error.match(/Reference ([0-9a-f]{8})/)![1];
    expect(logged.some((l) => l.includes(`[error ${ref}]`) && l.includes('secret_col'))).toBe(true);
  });

  it('sign-in successes, failures and throttling are logged by user id and address, never with the password or e-mail', async () => {
    const secret = 'correct horse of the hive';
    const logged = await logsOf(async () => {
      await authenticate(DEMO.crew, 'demo-crew-pass', '10.20.0.1');
      await authenticate(DEMO.crew, secret, '10.20.0.1');
      await authenticate('nobody-here@nowhere.test', secret, '10.20.0.1');
      for (let i = 0; i < 5; i++) await authenticate(DEMO.keeper2, `${secret} ${i}`, '10.20.0.2');
      await authenticate(DEMO.keeper2, 'demo-keeper-pass', '10.20.0.2');
    });
    expect(logged.filter((l) => l.includes('[auth] sign-in succeeded ip=10.20.0.1 user='))).toHaveLength(1);
    expect(logged.filter((l) => l.includes('[auth] sign-in failed ip=10.20.0.1'))).toHaveLength(2);
    expect(logged.some((l) => l.includes('[auth] sign-in throttled ip=10.20.0.2'))).toBe(true);
    for (const l of logged) {
      expect(l).not.toContain(secret);
      expect(l).not.toContain('demo-crew-pass');
      expect(l).not.toMatch(/@/);
    }
  });

  it('a refused request is logged with who and what was refused', async () => {
    const keeper = await signInAs(DEMO.keeper);
    const logged = await logsOf(() => authorize('settings.manage'));
    expect(logged).toContain(`[auth] refused settings.manage user=${keeper!.id} role=keeper`);
  });
});

describe('the session cookie (ASVS 3.3)', () => {
  it('is HttpOnly and SameSite=Lax always, and Secure with the __Secure- prefix when the app is served over https', async () => {
    const { sessionCookie, authOptions } = await import('@/lib/auth/options');
    expect(sessionCookie('https://shop.example')).toEqual({
      name: '__Secure-next-auth.session-token',
      options: { httpOnly: true, sameSite: 'lax', path: '/', secure: true },
    });
    expect(sessionCookie('http://127.0.0.1:3100')).toEqual({
      name: 'next-auth.session-token',
      options: { httpOnly: true, sameSite: 'lax', path: '/', secure: false },
    });
    expect(authOptions.cookies?.sessionToken?.options.httpOnly).toBe(true);
  });
});
