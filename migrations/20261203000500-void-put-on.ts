import type { QueryInterface } from 'sequelize';

// A super recorded as put on by mistake (still open: put_on_on set, pulled_on NULL) can now be voided
// too, not only a recorded pull. A voided row is still never in a lot, but it no longer has to be pulled.
// A voided put-on is not on the hive: it no longer holds its tag, so the same tag can go on again.
export async function up({ context: q }: { context: QueryInterface }) {
  await q.sequelize.query(`ALTER TABLE super_pulls DROP CONSTRAINT super_pulls_void_state_ck`);
  await q.sequelize.query(
    `ALTER TABLE super_pulls ADD CONSTRAINT super_pulls_void_state_ck CHECK (voided_at IS NULL OR lot_id IS NULL)`,
  );
  await q.sequelize.query(`DROP INDEX super_pulls_one_open_per_tag`);
  await q.sequelize.query(
    `CREATE UNIQUE INDEX super_pulls_one_open_per_tag ON super_pulls (tag_code) WHERE pulled_on IS NULL AND voided_at IS NULL`,
  );
}

// Going back cannot express a voided put-on: rather than invent a pull date or delete a record,
// it stops and says which rows are in the way.
export async function down({ context: q }: { context: QueryInterface }) {
  const [rows] = (await q.sequelize.query(
    `SELECT id FROM super_pulls WHERE voided_at IS NOT NULL AND pulled_on IS NULL ORDER BY id`,
  )) as [{ id: number }[], unknown];
  if (rows.length > 0) {
    throw new Error(
      `Cannot undo 20261203000500-void-put-on: ${rows.length} voided super-on record(s) (super_pulls id ${rows.map((r) => r.id).join(', ')}) have no pull, which the older rules forbid. Keep this migration, or deal with those rows by hand first.`,
    );
  }
  await q.sequelize.query(`DROP INDEX super_pulls_one_open_per_tag`);
  await q.sequelize.query(
    `CREATE UNIQUE INDEX super_pulls_one_open_per_tag ON super_pulls (tag_code) WHERE pulled_on IS NULL`,
  );
  await q.sequelize.query(`ALTER TABLE super_pulls DROP CONSTRAINT super_pulls_void_state_ck`);
  await q.sequelize.query(
    `ALTER TABLE super_pulls ADD CONSTRAINT super_pulls_void_state_ck CHECK (voided_at IS NULL OR (pulled_on IS NOT NULL AND lot_id IS NULL))`,
  );
}
