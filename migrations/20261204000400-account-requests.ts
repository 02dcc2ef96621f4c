import { DataTypes, type QueryInterface } from 'sequelize';

// Requests anyone can make without signing in (a password reset, a sign-up), recorded first and
// worked through after the answer has gone: the answer costs the same whether or not the address has
// an account, and the rows double as the counters of the per-address and per-account limits.
export async function up({ context: q }: { context: QueryInterface }) {
  await q.createTable('account_requests', {
    id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
    kind: { type: DataTypes.STRING(16), allowNull: false },
    email: { type: DataTypes.STRING(254), allowNull: false },
    name: { type: DataTypes.STRING(120), allowNull: true },
    ip: { type: DataTypes.STRING(64), allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    processed_at: { type: DataTypes.DATE, allowNull: true },
  });
  await q.sequelize.query(
    `ALTER TABLE account_requests ADD CONSTRAINT account_requests_kind_ck CHECK (kind IN ('reset', 'sign-up'))`,
  );
  await q.addIndex('account_requests', ['email', 'created_at']);
  await q.addIndex('account_requests', ['ip', 'created_at']);
  await q.sequelize.query(`CREATE INDEX account_requests_waiting ON account_requests (id) WHERE processed_at IS NULL`);
}

export async function down({ context: q }: { context: QueryInterface }) {
  await q.dropTable('account_requests');
}
