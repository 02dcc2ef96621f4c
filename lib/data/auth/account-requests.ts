import 'server-only';
import { Op, type Transaction } from 'sequelize';
import { getDb } from '@/lib/db/index';
import { appUrl } from '@/lib/config/app-url';
import { newToken } from '@/lib/auth/password';
import { enqueueMail, kickMail } from '@/lib/mail/outbox';
import { accountExistsMail, finishSignUpMail, passwordMail } from '@/lib/mail/templates';
import { recordAudit } from '@/lib/data/audit';
import { getSettings } from '@/lib/data/settings/settings';
import type { AccountRequest, AccountRequestKind } from '@/models/account-request';

/**
 * Password resets and sign-ups, which anyone may ask for without signing in.
 *
 * The request itself only checks the limits and records a row, the same work whether or not the
 * address has an account, and the person gets the same answer either way (ASVS 6.3.8: no account
 * enumeration by message or by timing). Nothing is hashed on that path. Looking the address up and
 * writing the mail happen afterwards (`kickAccountRequests`, and the timer in instrumentation.ts).
 *
 * Limits (docs/architecture.md, "Sign-in and account limits"): per address and per e-mail within a
 * window, counted from the same rows; and at most one reset or notice mail per account every few minutes.
 */
export const ACCOUNT_REQUEST_LIMITS = {
  reset: { windowMinutes: 15, perAddress: 10, perAccount: 3 },
  'sign-up': { windowMinutes: 60, perAddress: 10, perAccount: 3 },
  /** At most one reset link or "you already have an account" notice per account in this time. */
  mailEveryMinutes: 5,
  /** Rows are kept this long, then deleted (they only feed the limits above). */
  keepHours: 24,
  /** A sign-up link works this long. */
  signUpLinkHours: 24,
} as const;

export type RequestAnswer = 'accepted' | 'throttled';

/** Records a reset or sign-up request, or says it is over a limit. Same work for any address. */
export async function recordAccountRequest(
  kind: AccountRequestKind,
  input: { email: string; ip: string; name?: string },
): Promise<RequestAnswer> {
  const { AccountRequest } = getDb().models;
  const limits = ACCOUNT_REQUEST_LIMITS[kind];
  const email = input.email.toLowerCase();
  const since = { [Op.gt]: new Date(Date.now() - limits.windowMinutes * 60_000) };
  const [fromAddress, forAccount] = await Promise.all([
    AccountRequest.count({ where: { kind, ip: input.ip, createdAt: since } }),
    AccountRequest.count({ where: { kind, email, createdAt: since } }),
  ]);
  if (fromAddress >= limits.perAddress || forAccount >= limits.perAccount) {
    console.warn(`[auth] ${kind} request throttled ip=${input.ip}`);
    return 'throttled';
  }
  await AccountRequest.create({ kind, email, ip: input.ip, name: input.name ?? null });
  return 'accepted';
}

async function recentMailFor(userId: number, t: Transaction): Promise<boolean> {
  const since = new Date(Date.now() - ACCOUNT_REQUEST_LIMITS.mailEveryMinutes * 60_000);
  const n = await getDb().models.PasswordToken.count({
    where: { userId, createdAt: { [Op.gt]: since } },
    transaction: t,
  });
  return n > 0;
}

async function processReset(row: AccountRequest, business: string, t: Transaction): Promise<boolean> {
  const { models } = getDb();
  const user = await models.User.findOne({ where: { email: row.email }, transaction: t, lock: t.LOCK.UPDATE });
  if (!user || user.disabledAt || (await recentMailFor(user.id, t))) return false;
  const { token, tokenHash } = newToken();
  await models.PasswordToken.create(
    { userId: user.id, purpose: 'reset', tokenHash, expiresAt: new Date(Date.now() + 3600_000) },
    { transaction: t },
  );
  await enqueueMail(
    passwordMail({
      kind: 'reset',
      to: user.email,
      name: user.name,
      business,
      link: `${appUrl()}/reset-password?token=${token}`,
    }),
    t,
  );
  return true;
}

async function processSignUp(row: AccountRequest, business: string, t: Transaction): Promise<boolean> {
  const { models } = getDb();
  const existing = await models.User.findOne({ where: { email: row.email }, transaction: t, lock: t.LOCK.UPDATE });
  if (existing) {
    if (existing.disabledAt) return false;
    // The owner of the address hears about it, at most once per few minutes.
    const slot = Math.floor(Date.now() / (ACCOUNT_REQUEST_LIMITS.mailEveryMinutes * 60_000));
    return enqueueMail(
      {
        ...accountExistsMail({
          to: existing.email,
          name: existing.name,
          business,
          signInLink: `${appUrl()}/sign-in`,
          resetLink: `${appUrl()}/forgot-password`,
        }),
        dedupeKey: `account-exists-${existing.id}-${slot}`,
      },
      t,
    );
  }
  // A customer account without a password: it can be used once its owner has chosen one through the
  // link, which only the owner of the mailbox receives.
  const user = await models.User.create(
    { email: row.email, name: row.name ?? row.email, role: 'customer', passwordHash: null },
    { transaction: t },
  );
  const { token, tokenHash } = newToken();
  await models.PasswordToken.create(
    {
      userId: user.id,
      purpose: 'set',
      tokenHash,
      expiresAt: new Date(Date.now() + ACCOUNT_REQUEST_LIMITS.signUpLinkHours * 3600_000),
    },
    { transaction: t },
  );
  await enqueueMail(
    finishSignUpMail({ to: user.email, name: user.name, business, link: `${appUrl()}/reset-password?token=${token}` }),
    t,
  );
  await recordAudit(
    {
      actorUserId: user.id,
      action: 'user.signup',
      entityType: 'user',
      entityId: user.id,
      after: { email: user.email, role: user.role },
    },
    t,
  );
  return true;
}

/**
 * Works through waiting requests, oldest first. Each row is claimed with FOR UPDATE SKIP LOCKED and
 * handled in its own transaction with its mail (the outbox), so several app instances can run this
 * at once. Rows past `keepHours` are deleted at the end.
 */
export async function processAccountRequests(limit = 50): Promise<{ processed: number; mailed: number }> {
  const { sequelize, models } = getDb();
  const business = (await getSettings()).businessName;
  let processed = 0;
  let mailed = 0;
  for (let i = 0; i < limit; i++) {
    const done = await sequelize.transaction(async (t) => {
      const row = await models.AccountRequest.findOne({
        where: { processedAt: null },
        order: [['id', 'ASC']],
        lock: t.LOCK.UPDATE,
        skipLocked: true,
        transaction: t,
      });
      if (!row) return null;
      const sent = row.kind === 'reset' ? await processReset(row, business, t) : await processSignUp(row, business, t);
      await row.update({ processedAt: new Date() }, { transaction: t });
      return sent;
    });
    if (done === null) break;
    processed++;
    if (done) mailed++;
  }
  await models.AccountRequest.destroy({
    where: { createdAt: { [Op.lt]: new Date(Date.now() - ACCOUNT_REQUEST_LIMITS.keepHours * 3600_000) } },
  });
  if (mailed > 0) kickMail();
  return { processed, mailed };
}

let running: Promise<void> = Promise.resolve();

/**
 * Holds the after-answer work until the returned function is called, so a test can see what an
 * answer wrote by itself (the work would otherwise race the test's read).
 */
export function holdAccountRequests(): () => void {
  let release = () => {};
  const held = new Promise<void>((resolve) => (release = resolve));
  running = running.then(() => held);
  return release;
}

/**
 * After answering: work through the waiting requests in this process, one run after another. The
 * returned promise settles when this run is done (tests await it; actions do not).
 */
export function kickAccountRequests(): Promise<void> {
  running = running
    .then(() => processAccountRequests())
    .then(
      () => undefined,
      (err) => console.error('[auth] account requests:', err instanceof Error ? err.message : err),
    );
  return running;
}
