import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { getDb, closeDb } from '@/lib/db/index';
import { signUpAction, resetPasswordAction, forgotPasswordAction } from '@/app/(auth)/actions';
import { createStaffAction, updateStaffAction } from '@/app/(back-office)/admin/staff/actions';
import { saveSettingsAction } from '@/app/(back-office)/admin/settings/actions';
import { currentUser } from '@/lib/auth/session';
import { authenticate } from '@/lib/data/auth/sign-in';
import { kickAccountRequests } from '@/lib/data/auth/account-requests';
import { DEMO, signInAs, replaySession, currentTestSession, setRequestHeaders } from '@/tests/support/session';

afterAll(closeDb);
beforeEach(() => setRequestHeaders({}));

const count = (table: string) =>
  getDb()
    .sequelize.query(`SELECT count(*)::int AS n FROM ${table}`, { plain: true })
    .then((r) => (r as { n: number }).n);

describe('sign-up', () => {
  it('creates a customer, never another role, even when the body asks for one', async () => {
    await signInAs(null);
    const result = await signUpAction({
      name: 'Nell Arden',
      email: 'Nell@Example.test',
      role: 'owner',
    } as never);
    expect(result).toEqual({ ok: true });
    await kickAccountRequests();
    const u = await getDb().models.User.findOne({ where: { email: 'nell@example.test' } });
    expect(u?.role).toBe('customer');
    expect(u?.passwordHash).toBeNull(); // chosen through the mailed link
  });

  it('refuses a malformed sign-up with readable messages and writes nothing', async () => {
    const before = await count('users');
    const result = await signUpAction({ name: '', email: 'not-an-email' });
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.fieldErrors?.email).toMatch(/valid e-mail/);
    expect(result.fieldErrors?.name).toBeTruthy();
    await kickAccountRequests();
    expect(await count('users')).toBe(before);
  });

  it('refuses a cross-site request', async () => {
    setRequestHeaders({ origin: 'https://evil.example', host: '127.0.0.1:3100' });
    await expect(signUpAction({ name: 'X', email: 'x@example.test' })).rejects.toThrow(/another site/);
  });
});

describe('sign-in', () => {
  it('accepts the right password and refuses a wrong one with the same generic answer', async () => {
    expect((await authenticate(DEMO.crew, 'demo-crew-pass', '10.0.0.1')).status).toBe('ok');
    expect((await authenticate(DEMO.crew, 'wrong password', '10.0.0.1')).status).toBe('invalid');
    expect((await authenticate('nobody@nowhere.test', 'wrong password', '10.0.0.1')).status).toBe('invalid');
  });

  it('throttles one account from one address after five failures, but not from elsewhere (ASVS 6.3.1)', async () => {
    for (let i = 0; i < 5; i++) await authenticate(DEMO.keeper2, 'bad guess ' + i, '10.9.9.9');
    expect((await authenticate(DEMO.keeper2, 'demo-keeper-pass', '10.9.9.9')).status).toBe('throttled');
    expect((await authenticate(DEMO.keeper2, 'demo-keeper-pass', '10.1.1.1')).status).toBe('ok');
  });
});

describe('roles are checked in the action itself', () => {
  it('refuses settings to a keeper and to anonymous, allows the owner', async () => {
    const input = {
      businessName: 'Changed',
      address: '',
      region: '',
      contactEmail: '',
      story: '',
      publicLotNote: '',
      timeZone: 'UTC',
      currency: 'usd',
      weightSystem: 'metric',
      gs1CompanyPrefix: '',
      lotCodePrefix: 'HH',
      moistureLimitPct: 20,
      moistureLimitHeatherPct: 23,
      moistureGradeAPct: 18.6,
      bestBeforeMonths: 24,
      seasonStartMonth: 1,
      expectedLossPct: 2,
      fillRuleSet: 'oiml',
      labelDeclaration: 'metric',
      barcodeKind: 'gs1-128',
    } as const;
    await signInAs(DEMO.keeper);
    expect(await saveSettingsAction(input)).toMatchObject({ ok: false, message: /not allowed/ });
    await signInAs(null);
    expect(await saveSettingsAction(input)).toMatchObject({ ok: false, message: /sign in/i });
    const s = await getDb().models.BusinessSetting.findByPk(1);
    expect(s?.businessName).toBe('Hollowmere Apiaries');
    await signInAs(DEMO.owner);
    expect(await saveSettingsAction({ ...input, businessName: 'Hollowmere Apiaries', story: 'New story' })).toEqual({
      ok: true,
    });
    const audit = await getDb().models.AuditEntry.findOne({
      where: { action: 'settings.update' },
      order: [['id', 'DESC']],
    });
    expect(audit?.after).toMatchObject({ story: 'New story' });
  });

  it('lets only the owner create staff, and queues the set-password mail in the same transaction', async () => {
    await signInAs(DEMO.crew);
    expect(await createStaffAction({ name: 'Sly', email: 'sly@hollowmere.test', role: 'owner' })).toMatchObject({
      ok: false,
    });
    await signInAs(DEMO.owner);
    expect(await createStaffAction({ name: 'Bea Tarrant', email: 'bea@hollowmere.test', role: 'crew' })).toEqual({
      ok: true,
    });
    const mail = await getDb().models.OutboxMessage.findOne({ where: { toAddress: 'bea@hollowmere.test' } });
    expect(mail?.subject).toMatch(/Set your password/);
    expect(mail?.textBody).toMatch(/reset-password\?token=/);
  });
});

describe('sessions end at once (ASVS 7.4.2, 8.3.2)', () => {
  it('a role change or disabling invalidates a replayed session on the next request', async () => {
    await signInAs(DEMO.owner);
    const bea = await getDb().models.User.findOne({ where: { email: 'bea@hollowmere.test' } });
    expect(bea).not.toBeNull();
    await signInAs('bea@hollowmere.test');
    const old = currentTestSession();
    expect((await currentUser())?.role).toBe('crew');
    await signInAs(DEMO.owner);
    expect(await updateStaffAction({ userId: bea!.id, role: 'keeper' })).toEqual({ ok: true });
    replaySession(old);
    expect(await currentUser()).toBeNull();
  });

  it('forgot-password answers the same for known and unknown e-mails (ASVS 6.3.8)', async () => {
    await signInAs(null);
    const known = await forgotPasswordAction({ email: DEMO.customer });
    const unknown = await forgotPasswordAction({ email: 'ghost@nowhere.test' });
    expect(known).toEqual(unknown);
    expect(await resetPasswordAction({ token: 'x'.repeat(40), password: 'brand new phrase' })).toMatchObject({
      ok: false,
      message: /expired/,
    });
  });
});

describe('links in password e-mails', () => {
  it('a reset link has no double slash when APP_URL ends with /', async () => {
    const saved = process.env.APP_URL;
    process.env.APP_URL = 'https://honey.example/';
    try {
      await signInAs(null);
      expect(await forgotPasswordAction({ email: DEMO.owner })).toEqual({ ok: true });
      await kickAccountRequests();
    } finally {
      if (saved === undefined) delete process.env.APP_URL;
      else process.env.APP_URL = saved;
    }
    const mail = await getDb().models.OutboxMessage.findOne({
      where: { toAddress: DEMO.owner },
      order: [['id', 'DESC']],
    });
    expect(mail?.textBody).toContain('https://honey.example/reset-password?token=');
    expect(mail?.textBody).not.toMatch(/example\/\/reset-password/);
  });
});
