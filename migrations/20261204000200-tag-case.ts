import { DataTypes, type QueryInterface, type Sequelize } from 'sequelize';

// Super tag codes in one case. A put-on typed as "wt-0001" and a pull of "WT-0001" did not meet: the
// super stayed "on the hive" and the pull got a second row with no put-on date. From now on every path
// upper-cases a tag (lib/schemas/fields.ts, lib/data/supers/record.ts); this repairs what is stored.
//
// 1. A ghost pair (an open put-on, and a pull of the same tag in another case on the same colony with
//    no put-on date, pulled on or after the put-on) becomes the one record recordPull would have made:
//    the pull row takes the put-on's date, who put it on and its entry key (so a late retry of the
//    put-on still finds its row), and the open put-on row goes. Its flags are left as they are: they
//    were computed over the wider window, and widening only adds flags; the owner clears one with a reason.
// 2. Every other tag code is upper-cased, in super_tags and super_pulls, except where that would put
//    two open supers on one tag (left for a person to void one of them).
// 3. allow_untagged_supers: whether a super may go on or come off with no tag. New businesses start
//    with tags required; a business already running keeps today's untagged entries until its owner
//    turns the setting off.
export async function up({ context: q }: { context: QueryInterface }) {
  await q.addColumn('business_settings', 'allow_untagged_supers', {
    type: DataTypes.BOOLEAN,
    allowNull: false,
    defaultValue: false,
  });
  await q.sequelize.query(`UPDATE business_settings SET allow_untagged_supers = true`);
  await repairTagCase(q.sequelize);
}

/** Steps 1 and 2 above, in one transaction; safe to run again (a second run finds nothing to do). */
export async function repairTagCase(sequelize: Sequelize): Promise<{ merged: number }> {
  const q = { sequelize };
  return q.sequelize.transaction(async (transaction) => {
    const [pairs] = (await q.sequelize.query(
      `SELECT DISTINCT ON (o.id) o.id AS "onId", p.id AS "pullId", o.put_on_on AS "putOnOn",
              o.put_on_by AS "putOnBy", o.idempotency_key AS "onKey"
         FROM super_pulls o
         JOIN super_pulls p ON p.colony_id = o.colony_id AND upper(p.tag_code) = upper(o.tag_code)
          AND p.tag_code <> o.tag_code AND p.put_on_on IS NULL AND p.pulled_on IS NOT NULL
          AND p.pulled_on >= o.put_on_on AND p.voided_at IS NULL
        WHERE o.pulled_on IS NULL AND o.voided_at IS NULL AND o.put_on_on IS NOT NULL
        ORDER BY o.id, p.pulled_on, p.id`,
      { transaction },
    )) as [{ onId: number; pullId: number; putOnOn: string; putOnBy: number | null; onKey: string | null }[], unknown];
    const merged = new Set<number>();
    for (const pair of pairs) {
      if (merged.has(pair.pullId)) continue;
      merged.add(pair.pullId);
      await q.sequelize.query(`DELETE FROM super_pulls WHERE id = :id`, {
        replacements: { id: pair.onId },
        transaction,
      });
      await q.sequelize.query(
        `UPDATE super_pulls SET put_on_on = :putOnOn, put_on_by = COALESCE(:putOnBy, put_on_by),
                idempotency_key = COALESCE(:onKey, idempotency_key), pull_key = COALESCE(pull_key, idempotency_key)
          WHERE id = :id`,
        { replacements: { ...pair, id: pair.pullId }, transaction },
      );
    }
    await q.sequelize.query(
      `UPDATE super_pulls s SET tag_code = upper(s.tag_code)
        WHERE s.tag_code <> upper(s.tag_code)
          AND NOT (s.pulled_on IS NULL AND s.voided_at IS NULL AND EXISTS (
            SELECT 1 FROM super_pulls x WHERE x.id <> s.id AND upper(x.tag_code) = upper(s.tag_code)
               AND x.pulled_on IS NULL AND x.voided_at IS NULL))`,
      { transaction },
    );
    // A lower-case tag whose upper-case twin exists is the same box printed twice: keep the twin.
    await q.sequelize.query(
      `DELETE FROM super_tags a WHERE a.code <> upper(a.code)
          AND EXISTS (SELECT 1 FROM super_tags b WHERE b.code = upper(a.code))`,
      { transaction },
    );
    await q.sequelize.query(`UPDATE super_tags SET code = upper(code) WHERE code <> upper(code)`, { transaction });
    return { merged: merged.size };
  });
}

// The setting goes. The tag repair is not undone: the original case of a code and the ghost rows are
// not kept anywhere, and upper-case codes are valid under the older code too.
export async function down({ context: q }: { context: QueryInterface }) {
  await q.removeColumn('business_settings', 'allow_untagged_supers');
}
