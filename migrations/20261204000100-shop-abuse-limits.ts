import type { QueryInterface } from 'sequelize';

// Checkout limits (docs/architecture.md, "Checkout limits"): each order keeps the client address it
// was started from, so checkouts can be counted per address and per e-mail within a window.
// Refunds keep the key derived from the refund request (order, amount, jars, the form's request key):
// unique, so the same refund asked twice is refused before any money moves.
export async function up({ context: q }: { context: QueryInterface }) {
  await q.sequelize.query(`ALTER TABLE orders ADD COLUMN client_ip VARCHAR(64)`);
  await q.sequelize.query(`CREATE INDEX orders_client_ip_created ON orders (client_ip, created_at)`);
  await q.sequelize.query(`CREATE INDEX orders_email_created ON orders (lower(email), created_at)`);
  await q.sequelize.query(`ALTER TABLE refunds ADD COLUMN request_key VARCHAR(120)`);
  await q.sequelize.query(`CREATE UNIQUE INDEX refunds_request_key ON refunds (request_key)`);
}

export async function down({ context: q }: { context: QueryInterface }) {
  await q.sequelize.query(`DROP INDEX refunds_request_key`);
  await q.sequelize.query(`ALTER TABLE refunds DROP COLUMN request_key`);
  await q.sequelize.query(`DROP INDEX orders_email_created`);
  await q.sequelize.query(`DROP INDEX orders_client_ip_created`);
  await q.sequelize.query(`ALTER TABLE orders DROP COLUMN client_ip`);
}
