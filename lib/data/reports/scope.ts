import 'server-only';
import { QueryTypes } from 'sequelize';
import type { SessionUser } from '@/lib/auth/session';
import { getDb } from '@/lib/db/index';
import { getSettings } from '@/lib/data/settings/settings';
import { seasonBounds } from '@/lib/domain/season';
import { LOT_SEASON_SQL } from './yield-ctes';

/** Who a season report covers and who may see it. */

export type ReportFilter = { season?: number; yardId?: number; keeperId?: number };

/** The report scope a user may see: a keeper only their own colonies; null when they ask for another's. */
export function reportScope(user: SessionUser, filter: ReportFilter): ReportFilter | null {
  if (user.role === 'owner') return filter;
  if (user.role !== 'keeper') return null;
  if (filter.keeperId !== undefined && filter.keeperId !== user.id) return null;
  return { ...filter, keeperId: user.id };
}

/** The keeper a report is about, or null when the id is no keeper's. */
export async function reportKeeper(keeperId: number): Promise<{ id: number; name: string } | null> {
  const keeper = await getDb().models.User.findByPk(keeperId, { attributes: ['id', 'name', 'role'] });
  return keeper && keeper.role === 'keeper' ? { id: keeper.id, name: keeper.name } : null;
}

/** Keepers with at least one colony that gave honey or had a super pulled in the season. */
export async function keepersWithColonies(season: number): Promise<{ id: number; name: string; email: string }[]> {
  const { sequelize } = getDb();
  const m = (await getSettings()).seasonStartMonth;
  return sequelize.query<{ id: number; name: string; email: string }>(
    `SELECT DISTINCT u.id, u.name, u.email FROM users u JOIN colonies c ON c.keeper_id = u.id
     WHERE u.role = 'keeper' AND u.disabled_at IS NULL AND (
       EXISTS (SELECT 1 FROM super_pulls sp WHERE sp.colony_id = c.id AND sp.pulled_on >= :from AND sp.pulled_on < :to AND sp.voided_at IS NULL)
       OR EXISTS (SELECT 1 FROM super_pulls sp JOIN lots l ON l.id = sp.lot_id WHERE sp.colony_id = c.id
                  AND ${LOT_SEASON_SQL('l', m)} = :season))
     ORDER BY u.name`,
    { type: QueryTypes.SELECT, replacements: { season, ...seasonBounds(season, m) } },
  );
}

/** Choices for the report's filters, within the user's scope. */
export async function reportFilterChoices(
  user: SessionUser,
): Promise<{ yards: { id: number; name: string }[]; keepers: { id: number; name: string }[] }> {
  const { sequelize } = getDb();
  const own = user.role === 'owner' ? null : user.id;
  const [yards, keepers] = await Promise.all([
    sequelize.query<{ id: number; name: string }>(
      `SELECT y.id, y.name FROM yards y WHERE :own::int IS NULL OR EXISTS (SELECT 1 FROM colonies c WHERE c.yard_id = y.id AND c.keeper_id = :own) ORDER BY y.name`,
      { type: QueryTypes.SELECT, replacements: { own } },
    ),
    own === null
      ? sequelize.query<{ id: number; name: string }>(
          `SELECT id, name FROM users WHERE role = 'keeper' ORDER BY name`,
          { type: QueryTypes.SELECT },
        )
      : Promise.resolve([]),
  ]);
  return { yards, keepers };
}
