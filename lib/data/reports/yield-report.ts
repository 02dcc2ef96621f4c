import 'server-only';
import { todayIn } from '@/lib/domain/local-date';
import { seasonOf } from '@/lib/domain/season';
import { QueryTypes } from 'sequelize';
import type { SessionUser } from '@/lib/auth/session';
import { getDb } from '@/lib/db/index';
import { getSettings } from '@/lib/data/settings/settings';
import {
  listSeasons,
  seasonColonies,
  seasonHistory,
  seasonLots,
  seasonShares,
  superEstimatesFrom,
  type HistoryRow,
} from './yield-sql';
import { buildReport, type SeasonReport } from './build-report';
import { reportScope, type ReportFilter } from './scope';

/** Every colony's line: the top of its parent chain (a colony with no parent is its own line). */
async function lineRoots(): Promise<Map<number, string>> {
  const { sequelize } = getDb();
  const rows = await sequelize.query<{ id: number; line: string }>(
    `WITH RECURSIVE up AS (
       SELECT id, id AS top, parent_colony_id, 0 AS depth FROM colonies
       UNION ALL SELECT up.id, p.id, p.parent_colony_id, up.depth + 1 FROM up JOIN colonies p ON p.id = up.parent_colony_id WHERE up.depth < 30
     )
     SELECT DISTINCT ON (up.id) up.id, c.code AS line FROM up JOIN colonies c ON c.id = up.top ORDER BY up.id, up.depth DESC`,
    { type: QueryTypes.SELECT },
  );
  return new Map(rows.map((r) => [r.id, r.line]));
}

/**
 * The season report for `user` (owner: all; keeper: own colonies only). Returns null when the
 * user may not see the asked-for scope (another keeper's report) — callers answer 404.
 */
export async function getSeasonReport(user: SessionUser, filter: ReportFilter): Promise<SeasonReport | null> {
  const scope = reportScope(user, filter);
  if (!scope) return null;
  const [settings, seasons] = await Promise.all([getSettings(), listSeasons()]);
  const season = scope.season ?? seasons[0] ?? seasonOf(todayIn(settings.timeZone), settings.seasonStartMonth);
  const est = superEstimatesFrom(settings.superEstimates);
  // Independent queries run side by side; the colony list waits only for the shares.
  const sharesP = seasonShares(season, est);
  const basesP = sharesP.then((sh) => seasonColonies(season, [...new Set(sh.map((s) => s.colonyId))], scope));
  const [shares, lots, bases, lines] = await Promise.all([sharesP, seasonLots(season), basesP, lineRoots()]);
  return buildReport({ season, seasons, scope, shares, lots, bases, lines });
}

/** Season-over-season honey per yard, within the user's scope. */
export async function getSeasonHistory(user: SessionUser, filter: ReportFilter): Promise<HistoryRow[] | null> {
  const scope = reportScope(user, filter);
  if (!scope) return null;
  const settings = await getSettings();
  return seasonHistory(superEstimatesFrom(settings.superEstimates), scope);
}
