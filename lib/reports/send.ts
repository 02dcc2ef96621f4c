import 'server-only';
import type { SessionUser } from '@/lib/auth/session';
import { getDb } from '@/lib/db';
import { keepersWithColonies } from '@/lib/data/reports/scope';
import { getSettings } from '@/lib/data/settings/settings';
import { NotFoundError } from '@/lib/domain/errors';
import { enqueueMail, kickMail } from '@/lib/mail/outbox';
import { escapeHtml, mailHtml } from '@/lib/mail/templates';
import { formatWeight } from '@/lib/domain/units';
import { safePdfFilename } from '@/lib/pdf/response';
import { recordAudit } from '@/lib/data/audit';
import { keeperReportPdf } from './keeper-pdf';

const seasonReportDedupeKey = (season: number, keeperId: number) => `season-report-${season}-${keeperId}`;

/** The keepers who get a report for the season: those with colonies that had supers or honey in it. */
export async function seasonReportRecipients(season: number) {
  return (await keepersWithColonies(season)).map(({ id, name }) => ({ id, name }));
}

/**
 * Puts one keeper's season report (PDF attached) in the outbox. The dedupe key makes a second
 * send of the same season to the same keeper a no-op: `queued` is false then.
 */
export async function sendKeeperSeasonReport(
  owner: SessionUser,
  season: number,
  keeperId: number,
): Promise<{ queued: boolean; name: string }> {
  const recipients = await keepersWithColonies(season);
  const keeper = recipients.find((k) => k.id === keeperId);
  if (!keeper) throw new NotFoundError('That keeper has no colonies in this season.');
  const { sequelize, models } = getDb();
  const key = seasonReportDedupeKey(season, keeperId);
  // Skip the PDF work when it was already sent.
  if (await models.OutboxMessage.findOne({ where: { dedupeKey: key } })) return { queued: false, name: keeper.name };
  const [pdf, settings] = await Promise.all([keeperReportPdf(owner, keeperId, season, keeper.name), getSettings()]);
  if (!pdf) throw new NotFoundError('There is no such report.');
  const honey = formatWeight(pdf.report.totals.honeyGrams, settings.weightSystem);
  const lead =
    `Here is the yield report of your ${pdf.report.colonies.length} colonies for the ${season} season: ${honey} of honey in all. ` +
    'The PDF lists every colony with its supers, its share of each lot, water content, revenue and rank in its yard.';
  const queued = await sequelize.transaction(async (t) => {
    const created = await enqueueMail(
      {
        to: keeper.email,
        subject: `Your ${season} season yield report from ${settings.businessName}`,
        text: `Hello ${keeper.name},\n\n${lead}\n`,
        html: mailHtml(settings.businessName, `<p>Hello ${escapeHtml(keeper.name)},</p><p>${escapeHtml(lead)}</p>`),
        attachments: [
          {
            filename: safePdfFilename(pdf.filename),
            contentType: 'application/pdf',
            base64: Buffer.from(pdf.bytes).toString('base64'),
          },
        ],
        dedupeKey: key,
      },
      t,
    );
    if (created) {
      await recordAudit(
        {
          actorUserId: owner.id,
          action: 'report.send',
          entityType: 'user',
          entityId: keeperId,
          before: null,
          after: { season },
          reason: null,
        },
        t,
      );
    }
    return created;
  });
  if (queued) kickMail();
  return { queued, name: keeper.name };
}
