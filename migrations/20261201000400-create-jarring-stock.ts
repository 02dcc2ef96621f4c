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
const by = { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' } };

export async function up({ context: q }: { context: QueryInterface }) {
  await q.createTable('products', {
    id,
    slug: { type: DataTypes.STRING(80), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    description: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    net_grams: { type: DataTypes.INTEGER, allowNull: false },
    // The unit the label declares (g or oz) and the amount in it, e.g. 12 oz.
    declared_unit: { type: DataTypes.STRING(2), allowNull: false, defaultValue: 'g' },
    declared_amount: { type: DataTypes.DECIMAL(8, 2), allowNull: false },
    container_kind: { type: DataTypes.STRING(60), allowNull: false },
    container_grams: { type: DataTypes.INTEGER, allowNull: false },
    price_cents: { type: DataTypes.INTEGER, allowNull: false },
    gtin: { type: DataTypes.STRING(14), allowNull: true, unique: true },
    photo_id: { type: DataTypes.INTEGER, allowNull: true },
    active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    sort_order: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    ...ts,
  });
  await q.sequelize.query(
    `ALTER TABLE products ADD CONSTRAINT products_ck CHECK (net_grams > 0 AND container_grams >= 0 AND price_cents >= 0)`,
  );

  // Uploaded images and other binary files, served by a route handler, never from public/.
  await q.createTable('stored_files', {
    id,
    filename: { type: DataTypes.STRING(200), allowNull: false },
    content_type: { type: DataTypes.STRING(60), allowNull: false },
    size_bytes: { type: DataTypes.INTEGER, allowNull: false },
    sha256: { type: DataTypes.STRING(64), allowNull: false },
    data: { type: DataTypes.BLOB, allowNull: false },
    uploaded_by: by,
    ...ts,
  });
  await q.addConstraint('products', {
    type: 'foreign key',
    fields: ['photo_id'],
    name: 'products_photo_fk',
    references: { table: 'stored_files', field: 'id' },
    onDelete: 'SET NULL',
    onUpdate: 'CASCADE',
  });

  await q.createTable('label_layouts', {
    id,
    name: { type: DataTypes.STRING(60), allowNull: false, unique: true },
    // The LabelLayout of lib/domain/label-layout.ts, in millimetres.
    layout: { type: DataTypes.JSONB, allowNull: false },
    ...ts,
  });

  await q.createTable('jarring_runs', {
    id,
    lot_id: ref('lots'),
    product_id: ref('products'),
    jar_count: { type: DataTypes.INTEGER, allowNull: false },
    run_on: { type: DataTypes.DATEONLY, allowNull: false },
    // Net fill weights of the sampled jars, grams.
    sample_grams: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
    rule_set: { type: DataTypes.STRING(8), allowNull: false },
    fill_pass: { type: DataTypes.BOOLEAN, allowNull: false },
    fill_report: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
    honey_used_grams: { type: DataTypes.INTEGER, allowNull: false },
    // A failing run's jars are not stock until the owner overrides with a reason.
    override_reason: { type: DataTypes.TEXT, allowNull: true },
    override_by: by,
    created_by: by,
    idempotency_key: { type: DataTypes.STRING(80), allowNull: true, unique: true },
    ...ts,
  });
  await q.addIndex('jarring_runs', ['lot_id']);
  await q.sequelize.query(
    `ALTER TABLE jarring_runs ADD CONSTRAINT jarring_runs_ck CHECK (jar_count > 0 AND honey_used_grams > 0)`,
  );

  // On hand and reserved jars per product per lot. The CHECK is the last line against overselling.
  await q.createTable('stock_levels', {
    product_id: { ...ref('products'), primaryKey: true },
    lot_id: { ...ref('lots'), primaryKey: true },
    on_hand: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    reserved: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    best_before_on: { type: DataTypes.DATEONLY, allowNull: false },
    ...ts,
  });
  await q.sequelize.query(
    `ALTER TABLE stock_levels ADD CONSTRAINT stock_levels_ck CHECK (on_hand >= 0 AND reserved >= 0 AND reserved <= on_hand)`,
  );
  await q.addIndex('stock_levels', ['product_id', 'best_before_on']);

  // Every change of on-hand stock, append-only.
  await q.createTable('stock_entries', {
    id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
    product_id: ref('products'),
    lot_id: ref('lots'),
    delta: { type: DataTypes.INTEGER, allowNull: false },
    // jarring | order | breakage | adjustment | return
    kind: { type: DataTypes.STRING(12), allowNull: false },
    reason: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    jarring_run_id: ref('jarring_runs', true),
    order_id: { type: DataTypes.INTEGER, allowNull: true },
    created_by: by,
    created_at: ts.created_at,
  });
  await q.addIndex('stock_entries', ['product_id', 'lot_id']);
  await q.addIndex('stock_entries', ['order_id']);
}

export async function down({ context: q }: { context: QueryInterface }) {
  await q.removeConstraint('products', 'products_photo_fk');
  for (const t of ['stock_entries', 'stock_levels', 'jarring_runs', 'label_layouts', 'stored_files', 'products']) {
    await q.dropTable(t, {});
  }
}
