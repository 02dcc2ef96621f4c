import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { Op } from 'sequelize';
import { closeDb, getDb } from '@/lib/db/index';
import { forgotPasswordAction, resetPasswordAction, signUpAction } from '@/app/(auth)/actions';
import { ACCOUNT_REQUEST_LIMITS, kickAccountRequests } from '@/lib/data/auth/account-requests';
import { hashingStats, hashPassword, PasswordHashingBusyError } from '@/lib/auth/password';
import { DEMO, headersFromClient, setRequestHeaders, signInAs } from '@/tests/support/session';

process.env.NEXTAUTH_SECRET ??= 'db-test-secret-not-for-production-0000000';
afterAll(closeDb);
beforeEach(() => signInAs(null));

const resetMails = (to: string, since: Date) =>
  getDb().models.OutboxMessage.count({
    where: { toAddress: to, subject: { [Op.like]: 'Reset your password%' }, createdAt: { [Op.gte]: since } },
  });

describe('anonymous requests cannot flood a mailbox or the password hasher', () => {
  it('sends at most one reset mail per account within a few minutes, whoever asks', async () => {
    const since = new Date();
    for (const ip of ['192.0.2.11', '192.0.2.12', '192.0.2.13']) {
      setRequestHeaders(await headersFromClient(ip));
      expect(await forgotPasswordAction({ email: DEMO.keeper2 })).toEqual({ ok: true });
      await kickAccountRequests();
    }
    expect(await resetMails(DEMO.keeper2, since)).toBe(1);
  });

  it(`refuses the ${ACCOUNT_REQUEST_LIMITS.reset.perAddress + 1}th reset request from one address within the window`, async () => {
    setRequestHeaders(await headersFromClient('192.0.2.20'));
    for (let i = 0; i < ACCOUNT_REQUEST_LIMITS.reset.perAddress; i++) {
      expect(await forgotPasswordAction({ email: `spray${i}@nowhere.test` })).toEqual({ ok: true });
    }
    expect(await forgotPasswordAction({ email: 'spray-last@nowhere.test' })).toMatchObject({
      ok: false,
      message: /Too many requests/,
    });
    // Another address is not held up.
    setRequestHeaders(await headersFromClient('192.0.2.21'));
    expect(await forgotPasswordAction({ email: 'spray-last@nowhere.test' })).toEqual({ ok: true });
  });

  it('refuses more reset requests for one account than its limit, from any mix of addresses', async () => {
    for (let i = 0; i < ACCOUNT_REQUEST_LIMITS.reset.perAccount; i++) {
      setRequestHeaders(await headersFromClient(`192.0.2.${30 + i}`));
      expect(await forgotPasswordAction({ email: 'one-target@nowhere.test' })).toEqual({ ok: true });
    }
    setRequestHeaders(await headersFromClient('192.0.2.39'));
    expect(await forgotPasswordAction({ email: 'one-target@nowhere.test' })).toMatchObject({ ok: false });
  });

  it('limits sign-ups per address too', async () => {
    setRequestHeaders(await headersFromClient('192.0.2.40'));
    for (let i = 0; i < ACCOUNT_REQUEST_LIMITS['sign-up'].perAddress; i++) {
      expect(await signUpAction({ name: 'Bulk', email: `bulk${i}@example.test` })).toEqual({ ok: true });
    }
    expect(await signUpAction({ name: 'Bulk', email: 'bulk-last@example.test' })).toMatchObject({ ok: false });
    await kickAccountRequests();
  });

  it('a made-up reset token is refused without hashing the password', async () => {
    const before = hashingStats().started;
    for (let i = 0; i < 5; i++) {
      expect(
        await resetPasswordAction({ token: `made-up-token-${i}-${'x'.repeat(30)}`, password: 'long enough phrase' }),
      ).toMatchObject({ ok: false });
    }
    expect(hashingStats().started).toBe(before);
  });

  it('16 and more concurrent hashes run at most two at a time; past the queue they are refused, not piled up', async () => {
    const results = await Promise.allSettled(Array.from({ length: 40 }, (_, i) => hashPassword(`flood ${i}`)));
    expect(hashingStats().peak).toBeLessThanOrEqual(2);
    const refused = results.filter((r) => r.status === 'rejected');
    expect(refused.length).toBeGreaterThan(0);
    for (const r of refused) expect((r as PromiseRejectedResult).reason).toBeInstanceOf(PasswordHashingBusyError);
    expect(results.filter((r) => r.status === 'fulfilled').length).toBeGreaterThanOrEqual(16);
    // The queue drains: a hash after the flood works.
    await expect(hashPassword('after the flood')).resolves.toMatch(/^scrypt\$/);
  });
});
