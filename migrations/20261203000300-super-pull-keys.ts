import { DataTypes, type QueryInterface } from 'sequelize';

// A super can be recorded twice from a phone: once when it goes on, once when it comes off. Each
// record has its own idempotency key. Until now the pull overwrote the put-on's key on the same row,
// so a late retry of the put-on (a phone that lost the first answer) no longer found its row and put
// a second super on the hive. The pull's key now has its own column; idempotency_key stays the key
// of whatever created the row.
export async function up({ context: q }: { context: QueryInterface }) {
  await q.addColumn('super_pulls', 'pull_key', { type: DataTypes.STRING(80), allowNull: true });
  await q.addIndex('super_pulls', ['pull_key'], { unique: true, name: 'super_pulls_pull_key' });
  // Rows already pulled carry the pull's key (the put-on key, if any, was overwritten and is gone).
  await q.sequelize.query(`UPDATE super_pulls SET pull_key = idempotency_key WHERE pulled_on IS NOT NULL`);
}

export async function down({ context: q }: { context: QueryInterface }) {
  await q.sequelize.query(
    `UPDATE super_pulls SET idempotency_key = pull_key WHERE pull_key IS NOT NULL AND pulled_on IS NOT NULL`,
  );
  await q.removeIndex('super_pulls', 'super_pulls_pull_key');
  await q.removeColumn('super_pulls', 'pull_key');
}
