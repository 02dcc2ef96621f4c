import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createServer } from 'node:net';
import { Op } from 'sequelize';
import { closeDb, getDb } from '@/lib/db';
import { deliverDueMail, enqueueMail, headerSafe } from '@/lib/mail/outbox';
import { startMailFake } from '@/fakes/mail/server';

async function freePort(): Promise<number> {
  return new Promise((resolve) => {
    const s = createServer().listen(0, '127.0.0.1', () => {
      const { port } = s.address() as { port: number };
      s.close(() => resolve(port));
    });
  });
}

let smtpPort = 0;
let webPort = 0;
beforeAll(async () => {
  smtpPort = await freePort();
  webPort = await freePort();
  process.env.SMTP_PORT = String(smtpPort);
});
afterAll(closeDb);

const inbox = async (to: string) =>
  (await (await fetch(`http://127.0.0.1:${webPort}/api/messages?to=${encodeURIComponent(to)}`)).json()) as {
    subject: string;
  }[];

describe('mail outbox', () => {
  it('queues while the mail server is down and delivers each message exactly once when it is back', async () => {
    const { OutboxMessage } = getDb().models;
    const to = `queue-${Date.now()}@example.test`;
    for (const n of [1, 2, 3])
      await enqueueMail({ to, subject: `Queued ${n}`, text: 'hello', dedupeKey: `queue-test-${to}-${n}` });
    // Enqueueing the same key again adds nothing.
    expect(await enqueueMail({ to, subject: 'Queued 1', text: 'hello', dedupeKey: `queue-test-${to}-1` })).toBe(false);

    // Mail queued by other test files is not this test's business: keep it out of the way.
    await OutboxMessage.update(
      { nextAttemptAt: new Date(Date.now() + 86_400_000) },
      { where: { status: 'pending', toAddress: { [Op.ne]: to } } },
    );
    const down = await deliverDueMail();
    expect(down.sent).toBe(0);
    expect(down.failed).toBe(1);
    const failed = await OutboxMessage.findAll({ where: { toAddress: to } });
    expect(failed.every((m) => m.status === 'pending')).toBe(true);
    expect(failed.some((m) => m.attempts === 1 && m.nextAttemptAt > new Date())).toBe(true);

    const fake = await startMailFake({ smtpPort, webPort });
    try {
      // The back-off has passed.
      await OutboxMessage.update({ nextAttemptAt: new Date(Date.now() - 1000) }, { where: { toAddress: to } });
      const up = await deliverDueMail();
      expect(up.sent).toBeGreaterThanOrEqual(3);
      expect(await deliverDueMail()).toEqual({ sent: 0, failed: 0 });
      const got = await inbox(to);
      expect(got.map((m) => m.subject).sort()).toEqual(['Queued 1', 'Queued 2', 'Queued 3']);
    } finally {
      await fake.close();
    }
  });

  it('a CR/LF in a name cannot add a mail header (ASVS 1.3.11)', () => {
    expect(headerSafe('Order for Eve\r\nBcc: victim@example.test')).toBe('Order for Eve Bcc: victim@example.test');
  });
});
