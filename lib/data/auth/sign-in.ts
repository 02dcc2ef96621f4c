import 'server-only';
import { Op } from 'sequelize';
import { getDb } from '@/lib/db/index';
import { verifyPassword } from '@/lib/auth/password';
import type { Role } from '@/lib/auth/roles';

// ASVS 6.1.1 / 6.3.1: limits on failed sign-ins within a window. The account limit keys on the
// e-mail *and* the address, so an attacker elsewhere cannot lock the real user out; the address
// limit stops one address from spraying many accounts.
const THROTTLE = { windowMinutes: 15, perAccountAndAddress: 5, perAddress: 30 };

export type AuthResult =
  | { status: 'ok'; user: { id: number; email: string; name: string; role: Role; sessionVersion: number } }
  | { status: 'invalid' }
  | { status: 'throttled' };

export async function isThrottled(email: string, ip: string): Promise<boolean> {
  const { SignInAttempt } = getDb().models;
  const since = new Date(Date.now() - THROTTLE.windowMinutes * 60_000);
  const [account, address] = await Promise.all([
    SignInAttempt.count({ where: { email, ip, succeeded: false, createdAt: { [Op.gt]: since } } }),
    SignInAttempt.count({ where: { ip, succeeded: false, createdAt: { [Op.gt]: since } } }),
  ]);
  return account >= THROTTLE.perAccountAndAddress || address >= THROTTLE.perAddress;
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
