import { afterAll, describe, expect, it } from 'vitest';
import { closeDb, getDb } from '@/lib/db/index';
import { resetPasswordAction } from '@/app/(auth)/actions';
import { newToken } from '@/lib/auth/password';
import { setRequestHeaders, signInAs } from '@/tests/support/session';

afterAll(closeDb);

async function openLink(userId: number, purpose: 'set' | 'reset') {
  const { token, tokenHash } = newToken();
  await getDb().models.PasswordToken.create({ userId, purpose, tokenHash, expiresAt: new Date(Date.now() + 3600_000) });
  return token;
}

describe('older reset links stop working once a password is set', () => {
  it('using the newest reset link ends the older reset and set links of that account', async () => {
    setRequestHeaders({});
    await signInAs(null);
    const u = await getDb().models.User.create({ email: 'links@example.test', name: 'Links', role: 'customer' });
    const set = await openLink(u.id, 'set');
    const older = await openLink(u.id, 'reset');
    const newer = await openLink(u.id, 'reset');
    expect(await resetPasswordAction({ token: newer, password: 'the newest phrase' })).toEqual({ ok: true });
    expect(await resetPasswordAction({ token: older, password: 'an older phrase here' })).toMatchObject({
      ok: false,
      message: /expired or was already used/,
    });
    expect(await resetPasswordAction({ token: set, password: 'an older phrase here' })).toMatchObject({ ok: false });
    const open = await getDb().models.PasswordToken.count({ where: { userId: u.id, usedAt: null } });
    expect(open).toBe(0);
  });

  it("one account's reset leaves another account's links open", async () => {
    const a = await getDb().models.User.create({ email: 'links-a@example.test', name: 'A', role: 'customer' });
    const b = await getDb().models.User.create({ email: 'links-b@example.test', name: 'B', role: 'customer' });
    const ta = await openLink(a.id, 'reset');
    const tb = await openLink(b.id, 'reset');
    expect(await resetPasswordAction({ token: ta, password: 'phrase for a one' })).toEqual({ ok: true });
    expect(await resetPasswordAction({ token: tb, password: 'phrase for b two' })).toEqual({ ok: true });
  });
});
