import { DataTypes, type QueryInterface } from 'sequelize';

const id = { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true };
const ts = {
  created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
};
const ref = (model: string, allowNull = false, onDelete = 'RESTRICT') => ({
  type: DataTypes.INTEGER,
  allowNull,
  references: { model, key: 'id' },
  onDelete,
});

export async function up({ context: q }: { context: QueryInterface }) {
  await q.createTable('orders', {
    id,
    // Shown to customers and staff, e.g. "C-10042".
    number: { type: DataTypes.STRING(20), allowNull: false, unique: true },
    customer_id: ref('users', true),
    email: { type: DataTypes.STRING(254), allowNull: false },
    name: { type: DataTypes.STRING(120), allowNull: false, defaultValue: '' },
    phone: { type: DataTypes.STRING(40), allowNull: false, defaultValue: '' },
    // awaiting_payment | paid | packed | shipped | picked_up | cancelled | expired | refunded
    status: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'awaiting_payment' },
    // pickup | ship
    fulfilment: { type: DataTypes.STRING(8), allowNull: false },
    shipping_address: { type: DataTypes.JSONB, allowNull: true },
    subtotal_cents: { type: DataTypes.INTEGER, allowNull: false },
    shipping_cents: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    total_cents: { type: DataTypes.INTEGER, allowNull: false },
    refunded_cents: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    currency: { type: DataTypes.STRING(3), allowNull: false },
    stripe_session_id: { type: DataTypes.STRING(120), allowNull: true, unique: true },
    payment_intent_id: { type: DataTypes.STRING(120), allowNull: true },
    reserved_until: { type: DataTypes.DATE, allowNull: true },
    paid_at: { type: DataTypes.DATE, allowNull: true },
    packed_at: { type: DataTypes.DATE, allowNull: true },
    shipped_at: { type: DataTypes.DATE, allowNull: true },
    picked_up_at: { type: DataTypes.DATE, allowNull: true },
    tracking: { type: DataTypes.STRING(200), allowNull: true },
    ...ts,
  });
  await q.addIndex('orders', ['customer_id', 'created_at']);
  await q.addIndex('orders', ['status', 'created_at']);
  await q.sequelize.query(
    `ALTER TABLE orders ADD CONSTRAINT orders_ck CHECK (subtotal_cents >= 0 AND shipping_cents >= 0 AND refunded_cents >= 0 AND refunded_cents <= total_cents)`,
  );
  await q.sequelize.query(`CREATE SEQUENCE order_number_seq START 10001`);

  await q.createTable('order_lines', {
    id,
    order_id: ref('orders', false, 'CASCADE'),
    product_id: ref('products'),
    // What the customer saw when ordering; prices are always ours, never the browser's.
    product_name: { type: DataTypes.STRING(120), allowNull: false },
    quantity: { type: DataTypes.INTEGER, allowNull: false },
    unit_price_cents: { type: DataTypes.INTEGER, allowNull: false },
    ...ts,
  });
  await q.addIndex('order_lines', ['order_id']);
  await q.sequelize.query(
    `ALTER TABLE order_lines ADD CONSTRAINT order_lines_ck CHECK (quantity > 0 AND unit_price_cents >= 0)`,
  );

  // Which lot's jars fill a line: made when stock is reserved (oldest best-before first), final once paid.
  await q.createTable('order_allocations', {
    id,
    order_line_id: ref('order_lines', false, 'CASCADE'),
    lot_id: ref('lots'),
    quantity: { type: DataTypes.INTEGER, allowNull: false },
    // reserved | sold | released | returned | written_off
    state: { type: DataTypes.STRING(12), allowNull: false, defaultValue: 'reserved' },
    ...ts,
  });
  await q.addIndex('order_allocations', ['order_line_id']);
  await q.addIndex('order_allocations', ['lot_id', 'state']);

  // Each Stripe event id is processed once.
  await q.createTable('stripe_events', {
    id: { type: DataTypes.STRING(120), primaryKey: true },
    type: { type: DataTypes.STRING(80), allowNull: false },
    received_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  });

  await q.createTable('refunds', {
    id,
    order_id: ref('orders'),
    stripe_refund_id: { type: DataTypes.STRING(120), allowNull: true, unique: true },
    amount_cents: { type: DataTypes.INTEGER, allowNull: false },
    restock: { type: DataTypes.BOOLEAN, allowNull: false },
    reason: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    created_by: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' } },
    ...ts,
  });
}

export async function down({ context: q }: { context: QueryInterface }) {
  for (const t of ['refunds', 'stripe_events', 'order_allocations', 'order_lines', 'orders']) await q.dropTable(t, {});
  await q.sequelize.query(`DROP SEQUENCE IF EXISTS order_number_seq`);
}
