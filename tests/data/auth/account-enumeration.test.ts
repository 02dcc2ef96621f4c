import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { Op } from 'sequelize';
import { closeDb, getDb } from '@/lib/db/index';
import { forgotPasswordAction, signUpAction } from '@/app/(auth)/actions';
import { holdAccountRequests, kickAccountRequests } from '@/lib/data/auth/account-requests';
import { hashingStats } from '@/lib/auth/password';
import { DEMO, headersFromClient, setRequestHeaders, signInAs } from '@/tests/support/session';

process.env.NEXTAUTH_SECRET ??= 'db-test-secret-not-for-production-0000000';
afterAll(closeDb);

let n = 0;
beforeEach(async () => {
  await signInAs(null);
  setRequestHeaders(await headersFromClient(`198.51.100.${++n}`));
});

/** Rows in the tables a request could write to before answering (the request log itself aside). */
async function writes() {
  const { sequelize } = getDb();
  const [[row]] = (await sequelize.query(
    `SELECT (SELECT count(*) FROM users)::int AS users, (SELECT count(*) FROM password_tokens)::int AS tokens,
            (SELECT count(*) FROM outbox_messages)::int AS mail, (SELECT count(*) FROM audit_entries)::int AS audit,
            (SELECT count(*) FROM account_requests)::int AS requests`,
  )) as [Record<string, number>[], unknown];
  return row;
}

const mailTo = (to: string, since: Date) =>
  getDb().models.OutboxMessage.findAll({ where: { toAddress: to, createdAt: { [Op.gte]: since } } });

describe('password reset: a real and an unknown address cost the same', () => {
  it('neither path hashes, and both write exactly one request row before answering', async () => {
    await kickAccountRequests(); // nothing of other tests left waiting
    const results = [];
    const release = holdAccountRequests(); // the mail is written after answering: keep it from racing the counts
    try {
      for (const email of [DEMO.crew, 'ghost-reset@nowhere.test']) {
        const before = await writes();
        const hashes = hashingStats().started;
        results.push(await forgotPasswordAction({ email }));
        expect(hashingStats().started).toBe(hashes);
        expect(await writes()).toEqual({ ...before, requests: before.requests + 1 });
      }
    } finally {
      release();
      await kickAccountRequests();
    }
    expect(results[0]).toEqual(results[1]);
  });

  it('answers in about the same time for a real and an unknown address (median of 7, generous bound)', async () => {
    const median = async (email: string) => {
      const times: number[] = [];
      for (let i = 0; i < 7; i++) {
        setRequestHeaders(await headersFromClient(`198.51.101.${i + (email.startsWith('ghost') ? 100 : 0)}`));
        const t0 = performance.now();
        await forgotPasswordAction({ email: i < 3 ? email : email.replace('@', `+${i}@`) });
        times.push(performance.now() - t0);
      }
      return times.sort((a, b) => a - b)[3];
    };
    const real = await median(DEMO.keeper);
    const unknown = await median('ghost-timing@nowhere.test');
    expect(Math.abs(real - unknown)).toBeLessThan(Math.max(25, 0.5 * Math.max(real, unknown)));
  });

  it('after answering, only the real account gets a reset mail', async () => {
    const since = new Date();
    await getDb().models.User.create({ email: 'real-reset@example.test', name: 'Real', role: 'customer' });
    setRequestHeaders(await headersFromClient('198.51.102.1'));
    await forgotPasswordAction({ email: 'real-reset@example.test' });
    await forgotPasswordAction({ email: 'ghost-mail@nowhere.test' });
    await kickAccountRequests();
    expect((await mailTo('real-reset@example.test', since)).map((m) => m.subject)).toEqual([
      expect.stringMatching(/Reset your password/),
    ]);
    expect(await mailTo('ghost-mail@nowhere.test', since)).toEqual([]);
  });
});

describe('sign-up: a new and an existing address get the same answer', () => {
  it('answers identically, mails the new address a link and the existing owner a notice', async () => {
    const since = new Date();
    const fresh = await signUpAction({ name: 'Wren Ashby', email: 'wren@example.test' });
    setRequestHeaders(await headersFromClient('198.51.102.2'));
    const existing = await signUpAction({ name: 'Someone Else', email: DEMO.owner });
    expect(existing).toEqual(fresh);
    expect(fresh).toEqual({ ok: true });
    await kickAccountRequests();
    const [finish] = await mailTo('wren@example.test', since);
    expect(finish?.subject).toMatch(/Finish creating your account/);
    expect(finish?.textBody).toMatch(/reset-password\?token=/);
    const [notice] = await mailTo(DEMO.owner, since);
    expect(notice?.subject).toMatch(/already have an account/);
    expect(notice?.textBody).not.toMatch(/token=/);
    const owner = await getDb().models.User.findOne({ where: { email: DEMO.owner } });
    expect(owner?.name).not.toBe('Someone Else');
    expect(owner?.role).toBe('owner');
  });

  it('never says "already exists"', async () => {
    const result = await signUpAction({ name: 'Dup', email: DEMO.customer });
    expect(JSON.stringify(result)).not.toMatch(/already/i);
  });
});
