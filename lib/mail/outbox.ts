import 'server-only';
import { Op, type Transaction } from 'sequelize';
import { getDb } from '@/lib/db';
import type { OutboxAttachment } from '@/models/outbox-message';
import { mailFrom, mailTransport } from './transport';

export type MailInput = {
  to: string;
  subject: string;
  text: string;
  html?: string;
  attachments?: OutboxAttachment[];
  /** Same key, one message: enqueueing twice is harmless. */
  dedupeKey?: string;
};

/** A header value never carries a line break: CR/LF in a name cannot add a header (ASVS 1.3.11). */
export function headerSafe(value: string): string {
  return value.replace(/[\r\n]+/g, ' ').trim();
}

/**
 * Records a message in the caller's transaction (the transactional outbox). It is sent after the
 * commit by `deliverDueMail`, which the app runs right away and then on a timer.
 * Returns false when a message with the same dedupe key already exists.
 */
export async function enqueueMail(mail: MailInput, transaction?: Transaction): Promise<boolean> {
  const { OutboxMessage } = getDb().models;
  const [, created] = await OutboxMessage.findOrCreate({
    where: { dedupeKey: mail.dedupeKey ?? `once-${crypto.randomUUID()}` },
    defaults: {
      toAddress: headerSafe(mail.to),
      subject: headerSafe(mail.subject).slice(0, 250),
      textBody: mail.text,
      htmlBody: mail.html ?? null,
      attachments: mail.attachments ?? [],
    },
    transaction,
  });
  return created;
}

const MAX_ATTEMPTS = 12;

/**
 * Sends what is due. Rows are claimed with FOR UPDATE SKIP LOCKED, so several app instances can
 * run this at once without sending a message twice. Failures back off exponentially (30 s · 2^n, capped at 1 h).
 */
export async function deliverDueMail(limit = 20): Promise<{ sent: number; failed: number }> {
  const { sequelize, models } = getDb();
  let sent = 0;
  let failed = 0;
  for (let i = 0; i < limit; i++) {
    const done = await sequelize.transaction(async (t) => {
      const msg = await models.OutboxMessage.findOne({
        where: { status: 'pending', nextAttemptAt: { [Op.lte]: new Date() } },
        order: [['id', 'ASC']],
        lock: t.LOCK.UPDATE,
        skipLocked: true,
        transaction: t,
      });
      if (!msg) return null;
      try {
        await mailTransport().sendMail({
          from: mailFrom(),
          to: msg.toAddress,
          subject: msg.subject,
          text: msg.textBody,
          html: msg.htmlBody ?? undefined,
          attachments: msg.attachments.map((a) => ({
            filename: a.filename,
            contentType: a.contentType,
            content: Buffer.from(a.base64, 'base64'),
          })),
        });
        await msg.update(
          { status: 'sent', sentAt: new Date(), attempts: msg.attempts + 1, lastError: null },
          { transaction: t },
        );
        return 'sent';
      } catch (err) {
        const attempts = msg.attempts + 1;
        const delayMs = Math.min(3_600_000, 30_000 * 2 ** (attempts - 1));
        await msg.update(
          {
            attempts,
            lastError: err instanceof Error ? err.message.slice(0, 500) : 'send failed',
            status: attempts >= MAX_ATTEMPTS ? 'failed' : 'pending',
            nextAttemptAt: new Date(Date.now() + delayMs),
          },
          { transaction: t },
        );
        return 'failed';
      }
    });
    if (done === null) break;
    if (done === 'sent') sent++;
    else {
      failed++;
      break;
    }
  }
  return { sent, failed };
}

/** Fire-and-forget delivery after a commit; the timer in instrumentation.ts catches anything missed. */
export function kickMail(): void {
  deliverDueMail().catch((err) => console.error('[mail] delivery failed:', err instanceof Error ? err.message : err));
}
