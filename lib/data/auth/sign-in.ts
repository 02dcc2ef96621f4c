import 'server-only';
import { Op } from 'sequelize';
import { getDb } from '@/lib/db/index';
import { verifyPassword } from '@/lib/auth/password';
import type { Role } from '@/lib/auth/roles';

/**
 * ASVS 6.1.1 / 6.3.1: limits on failed sign-ins within a window, counted in sign_in_attempts.
 * - one account from one address: 5 failures, then that address waits (the usual guesser);
 * - one address, any accounts: 30 failures (stops spraying many accounts from one address);
 * - one account, any addresses: 20 failures (stops a guesser who spreads over many addresses).
 *   An attacker could use this last one to lock a person out, so it does not apply from an address
 *   where this account signed in successfully in the last 30 days: the owner's usual phone or
 *   laptop keeps working, and the lock-out lasts only as long as the window (15 minutes).
 */
export const SIGN_IN_LIMITS = {
  windowMinutes: 15,
  perAccountAndAddress: 5,
  perAddress: 30,
  perAccount: 20,
  knownAddressDays: 30,
};

export type AuthResult =
  | { status: 'ok'; user: { id: number; email: string; name: string; role: Role; sessionVersion: number } }
  | { status: 'invalid' }
  | { status: 'throttled' };

export async function isThrottled(email: string, ip: string): Promise<boolean> {
  const { SignInAttempt } = getDb().models;
  const L = SIGN_IN_LIMITS;
  const since = new Date(Date.now() - L.windowMinutes * 60_000);
  const failed = { succeeded: false, createdAt: { [Op.gt]: since } };
  const [accountHere, address, account] = await Promise.all([
    SignInAttempt.count({ where: { email, ip, ...failed } }),
    SignInAttempt.count({ where: { ip, ...failed } }),
    SignInAttempt.count({ where: { email, ...failed } }),
  ]);
  if (accountHere >= L.perAccountAndAddress || address >= L.perAddress) return true;
  if (account < L.perAccount) return false;
  const known = await SignInAttempt.count({
    where: {
      email,
      ip,
      succeeded: true,
      createdAt: { [Op.gt]: new Date(Date.now() - L.knownAddressDays * 86_400_000) },
    },
  });
  return known === 0;
}

export async function authenticate(email: string, password: string, ip: string): Promise<AuthResult> {
  const { User, SignInAttempt } = getDb().models;
  const normalised = email.toLowerCase();
  if (await isThrottled(normalised, ip)) {
    console.warn(`[auth] sign-in throttled ip=${ip}`);
    return { status: 'throttled' };
  }
  const user = await User.findOne({ where: { email: normalised } });
  // verifyPassword hashes even for an unknown account: same timing for both (ASVS 6.3.8).
  const ok = await verifyPassword(password, user?.passwordHash ?? null);
  const succeeded = Boolean(ok && user && !user.disabledAt);
  await SignInAttempt.create({ email: normalised, ip, succeeded });
  console.info(`[auth] sign-in ${succeeded ? 'succeeded' : 'failed'} ip=${ip}${user ? ` user=${user.id}` : ''}`);
  if (!succeeded || !user) return { status: 'invalid' };
  return {
    status: 'ok',
    user: { id: user.id, email: user.email, name: user.name, role: user.role, sessionVersion: user.sessionVersion },
  };
}
