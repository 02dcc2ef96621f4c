'use server';
import { guardedAction } from '@/lib/http/server-action';
import { seasonReportRecipients, sendKeeperSeasonReport } from '@/lib/reports/send';
import { sendKeeperInput, sendSeasonInput } from '@/lib/schemas/reports';

/** Who gets a season report: one entry per keeper with colonies that season. */
export const seasonRecipientsAction = guardedAction('reports.send', sendSeasonInput, async (_user, { season }) => ({
  ok: true as const,
  data: await seasonReportRecipients(season),
}));

/** Queues one keeper's report; a second send of the same season to the same keeper is skipped. */
export const sendKeeperReportAction = guardedAction(
  'reports.send',
  sendKeeperInput,
  async (user, { season, keeperId }) => ({
    ok: true as const,
    data: await sendKeeperSeasonReport(user, season, keeperId),
  }),
);
