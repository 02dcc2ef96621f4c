import 'server-only';
import { Op, UniqueConstraintError, type Transaction } from 'sequelize';
import { getDb } from '@/lib/db/index';
import { appUrl } from '@/lib/config/app-url';
import { hashPassword, newToken, sha256 } from '@/lib/auth/password';
import type { Role } from '@/lib/auth/roles';
import { enqueueMail, kickMail } from '@/lib/mail/outbox';
import { passwordMail } from '@/lib/mail/templates';
import { recordAudit } from '@/lib/data/audit';
import { getSettings } from '@/lib/data/settings/settings';

export type UserRow = {
  id: number;
  email: string;
  name: string;
  role: Role;
  disabled: boolean;
  sessionVersion: number;
  createdAt: Date;
};

function toRow(u: {
  id: number;
  email: string;
  name: string;
  role: Role;
  disabledAt: Date | null;
  sessionVersion: number;
  createdAt: Date;
}): UserRow {
  return {
    id: u.id,
    email: u.email,
    name: u.name,
    role: u.role,
    disabled: u.disabledAt !== null,
    sessionVersion: u.sessionVersion,
    createdAt: u.createdAt,
  };
}

export async function getActiveUser(id: number): Promise<UserRow | null> {
  const u = await getDb().models.User.findByPk(id);
  return u && !u.disabledAt ? toRow(u) : null;
}

export async function bumpSessionVersion(userId: number): Promise<void> {
  await getDb().models.User.increment('sessionVersion', { where: { id: userId } });
}

export class EmailTakenError extends Error {
  constructor() {
    super('An account with that e-mail already exists. Sign in, or reset the password.');
  }
}

/** Owner creates a staff account; the staff member gets a link to set a password (valid 72 h). */
export async function createStaff(
  actorUserId: number,
  input: { email: string; name: string; role: Exclude<Role, 'customer'> },
): Promise<UserRow> {
  const { sequelize, models } = getDb();
  const settings = await getSettings();
  try {
    const row = await sequelize.transaction(async (t) => {
      const u = await models.User.create(
        { email: input.email.toLowerCase(), name: input.name, role: input.role, passwordHash: null },
        { transaction: t },
      );
      const { token, tokenHash } = newToken();
      await models.PasswordToken.create(
        { userId: u.id, purpose: 'set', tokenHash, expiresAt: new Date(Date.now() + 72 * 3600_000) },
        { transaction: t },
      );
      await enqueueMail(
        passwordMail({
          kind: 'set',
          to: u.email,
          name: u.name,
          business: settings.businessName,
          link: `${appUrl()}/reset-password?token=${token}`,
        }),
        t,
      );
      await recordAudit(
        {
          actorUserId,
          action: 'user.create',
          entityType: 'user',
          entityId: u.id,
          after: { email: u.email, role: u.role, name: u.name },
        },
        t,
      );
      return toRow(u);
    });
    kickMail();
    return row;
  } catch (err) {
    if (err instanceof UniqueConstraintError) throw new EmailTakenError();
    throw err;
  }
}

/** Every set or reset link of this user that is still open is marked used. */
export async function endOpenPasswordTokens(userId: number, t: Transaction): Promise<void> {
  await getDb().models.PasswordToken.update(
    { usedAt: new Date() },
    { where: { userId, usedAt: null }, transaction: t },
  );
}

/**
 * Sets a password from an e-mailed token; the token works once, ends every other session and every
 * other open link of the account.
 */
export async function resetPassword(token: string, password: string): Promise<'ok' | 'invalid'> {
  const { sequelize, models } = getDb();
  // The token is looked up before any hashing: a made-up token costs one indexed read, not a hash.
  const open = { tokenHash: sha256(token), usedAt: null, expiresAt: { [Op.gt]: new Date() } };
  if (!(await models.PasswordToken.count({ where: open }))) return 'invalid';
  const passwordHash = await hashPassword(password);
  return sequelize.transaction(async (t) => {
    const row = await models.PasswordToken.findOne({
      where: open,
      lock: t.LOCK.UPDATE,
      transaction: t,
    });
    if (!row) return 'invalid';
    await row.update({ usedAt: new Date() }, { transaction: t });
    const user = await models.User.findByPk(row.userId, { transaction: t, lock: t.LOCK.UPDATE });
    if (!user || user.disabledAt) return 'invalid';
    await user.update({ passwordHash, sessionVersion: user.sessionVersion + 1 }, { transaction: t });
    // A password that was just set ends every other open link for the account: an older reset mail
    // (read by someone else, or still in a shared inbox) must not set it again (ASVS 6.4.x).
    await endOpenPasswordTokens(user.id, t);
    await recordAudit(
      { actorUserId: user.id, action: `user.password.${row.purpose}`, entityType: 'user', entityId: user.id },
      t,
    );
    return 'ok';
  });
}

export async function listStaff(): Promise<UserRow[]> {
  const users = await getDb().models.User.findAll({
    where: { role: { [Op.ne]: 'customer' } },
    order: [
      ['role', 'ASC'],
      ['name', 'ASC'],
    ],
  });
  return users.map(toRow);
}

/** Role change or disabling takes effect on the next request: the session version moves on. */
export async function updateStaff(
  actorUserId: number,
  userId: number,
  patch: { role?: Exclude<Role, 'customer'>; disabled?: boolean },
): Promise<UserRow | null> {
  const { sequelize, models } = getDb();
  return sequelize.transaction(async (t) => {
    const u = await models.User.findByPk(userId, { transaction: t, lock: t.LOCK.UPDATE });
    if (!u || u.role === 'customer') return null;
    const before = { role: u.role, disabled: u.disabledAt !== null };
    await u.update(
      {
        role: patch.role ?? u.role,
        disabledAt: patch.disabled === undefined ? u.disabledAt : patch.disabled ? new Date() : null,
        sessionVersion: u.sessionVersion + 1,
      },
      { transaction: t },
    );
    await recordAudit(
      {
        actorUserId,
        action: 'user.update',
        entityType: 'user',
        entityId: u.id,
        before,
        after: { role: u.role, disabled: u.disabledAt !== null },
      },
      t,
    );
    return toRow(u);
  });
}
