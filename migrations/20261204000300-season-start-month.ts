import type { QueryInterface } from 'sequelize';

// The season is not the calendar year: the owner sets the month it starts (1 = January, the
// calendar year; 7 = July suits much of the southern hemisphere). Reports group by that season and
// the conflict check of a super with no put-on date falls back to its start.
export async function up({ context: q }: { context: QueryInterface }) {
  await q.sequelize.query(
    `ALTER TABLE business_settings ADD COLUMN season_start_month integer NOT NULL DEFAULT 1
       CONSTRAINT business_settings_season_start_month_ck CHECK (season_start_month BETWEEN 1 AND 12)`,
  );
}

export async function down({ context: q }: { context: QueryInterface }) {
  await q.sequelize.query(`ALTER TABLE business_settings DROP COLUMN season_start_month`);
}
