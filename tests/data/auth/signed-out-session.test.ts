import { afterAll, describe, expect, it, vi } from 'vitest';
import { encode } from 'next-auth/jwt';
import { closeDb, getDb } from '@/lib/db/index';
import { authOptions, sessionCookie } from '@/lib/auth/options';
import { bumpSessionVersion } from '@/lib/data/staff/users';
import { DEMO } from '@/tests/support/session';

const SECRET = 'db-test-secret-not-for-production-0000000';
afterAll(closeDb);

/**
 * What next-auth's session action answers for this cookie: the same core code that serves
 * GET /api/auth/session (our route passes GET straight to it), with the app's options. The test
 * setup stubs getServerSession, so the real one is taken here; it answers null for an empty session.
 */
async function sessionEndpoint(token: string) {
  const { getServerSession } = await vi.importActual<typeof import('next-auth')>('next-auth');
  const req = { headers: {}, cookies: { [sessionCookie().name]: token } };
  const res = { getHeader() {}, setCookie() {}, setHeader() {} };
  return getServerSession(req as never, res as never, { ...authOptions, secret: SECRET });
}

describe("next-auth's /api/auth/session honours sign-out", () => {
  it('returns the user for a live cookie and nothing once the session version moved on', async () => {
    const u = await getDb().models.User.findOne({ where: { email: DEMO.crew } });
    const token = await encode({
      secret: SECRET,
      token: { name: u!.name, email: u!.email, uid: u!.id, role: u!.role, sv: u!.sessionVersion },
    });
    expect(await sessionEndpoint(token)).toMatchObject({ user: { email: DEMO.crew, role: 'crew' } });
    await bumpSessionVersion(u!.id); // what sign-out does
    const after = await sessionEndpoint(token);
    expect(after).toBeNull();
    expect(JSON.stringify(after)).not.toContain(DEMO.crew);
  });

  it('a disabled account gets nothing either', async () => {
    const u = await getDb().models.User.create({ email: 'gone@hollowmere.test', name: 'Gone', role: 'keeper' });
    const token = await encode({
      secret: SECRET,
      token: { name: u.name, email: u.email, uid: u.id, role: u.role, sv: u.sessionVersion },
    });
    await u.update({ disabledAt: new Date() });
    expect(await sessionEndpoint(token)).toBeNull();
  });
});
