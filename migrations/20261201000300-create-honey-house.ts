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
// Records of a lot are corrected, never deleted: a voided row keeps who voided it and why.
const voided = {
  voided_at: { type: DataTypes.DATE, allowNull: true },
  voided_by: by,
  void_reason: { type: DataTypes.TEXT, allowNull: true },
};

export async function up({ context: q }: { context: QueryInterface }) {
  await q.createTable('container_types', {
    id,
    name: { type: DataTypes.STRING(60), allowNull: false, unique: true },
    usual_tare_grams: { type: DataTypes.INTEGER, allowNull: false },
    active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    ...ts,
  });

  // Last sequence used per prefix and year; the row is locked while a lot code is taken (no gaps, no duplicates).
  await q.createTable('lot_sequences', {
    prefix: { type: DataTypes.STRING(6), allowNull: false, primaryKey: true },
    year: { type: DataTypes.INTEGER, allowNull: false, primaryKey: true },
    last_value: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
  });

  await q.createTable('lots', {
    id,
    code: { type: DataTypes.STRING(20), allowNull: false, unique: true },
    floral_source: { type: DataTypes.STRING(80), allowNull: false, defaultValue: '' },
    heather: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    extracted_on: { type: DataTypes.DATEONLY, allowNull: true },
    // gathering | extracted | released | packed_out | held
    stage: { type: DataTypes.STRING(12), allowNull: false, defaultValue: 'gathering' },
    hold_reasons: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
    is_blend: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    // Kept up to date in the same transaction as containers, blends and jarring runs.
    net_grams: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    used_grams: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    cappings_wax_grams: { type: DataTypes.INTEGER, allowNull: true },
    best_before_on: { type: DataTypes.DATEONLY, allowNull: true },
    notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    created_by: by,
    ...ts,
  });
  await q.addIndex('lots', ['stage']);
  await q.addIndex('lots', ['extracted_on']);
  await q.sequelize.query(`ALTER TABLE lots ADD CONSTRAINT lots_grams_ck CHECK (net_grams >= 0 AND used_grams >= 0)`);
  await q.addConstraint('super_pulls', {
    type: 'foreign key',
    fields: ['lot_id'],
    name: 'super_pulls_lot_fk',
    references: { table: 'lots', field: 'id' },
    onDelete: 'SET NULL',
    onUpdate: 'CASCADE',
  });

  await q.createTable('lot_containers', {
    id,
    lot_id: ref('lots'),
    container_type_id: ref('container_types', true),
    label: { type: DataTypes.STRING(40), allowNull: false, defaultValue: '' },
    gross_grams: { type: DataTypes.INTEGER, allowNull: false },
    tare_grams: { type: DataTypes.INTEGER, allowNull: false },
    recorded_by: by,
    ...voided,
    ...ts,
  });
  await q.addIndex('lot_containers', ['lot_id']);
  await q.sequelize.query(
    `ALTER TABLE lot_containers ADD CONSTRAINT lot_containers_ck CHECK (tare_grams >= 0 AND gross_grams > tare_grams)`,
  );

  await q.createTable('moisture_readings', {
    id,
    lot_id: ref('lots'),
    // ri (refractive index) | scale (a honey refractometer's own % water scale)
    method: { type: DataTypes.STRING(8), allowNull: false },
    refractive_index: { type: DataTypes.DECIMAL(6, 4), allowNull: true },
    scale_water_pct: { type: DataTypes.DECIMAL(4, 1), allowNull: true },
    temperature_c: { type: DataTypes.DECIMAL(4, 1), allowNull: true },
    water_pct: { type: DataTypes.DECIMAL(5, 2), allowNull: false },
    taken_on: { type: DataTypes.DATEONLY, allowNull: false },
    recorded_by: by,
    ...voided,
    ...ts,
  });
  await q.addIndex('moisture_readings', ['lot_id']);

  await q.createTable('lab_files', {
    id,
    lot_id: ref('lots'),
    filename: { type: DataTypes.STRING(200), allowNull: false },
    content_type: { type: DataTypes.STRING(60), allowNull: false },
    size_bytes: { type: DataTypes.INTEGER, allowNull: false },
    sha256: { type: DataTypes.STRING(64), allowNull: false },
    data: { type: DataTypes.BLOB, allowNull: false },
    hmf_mg_kg: { type: DataTypes.DECIMAL(6, 1), allowNull: true },
    diastase_schade: { type: DataTypes.DECIMAL(5, 1), allowNull: true },
    insoluble_g100g: { type: DataTypes.DECIMAL(5, 2), allowNull: true },
    uploaded_by: by,
    ...voided,
    ...ts,
  });
  await q.addIndex('lab_files', ['lot_id']);

  // Blends: a child lot made from parts of parent lots.
  await q.createTable('lot_parents', {
    id,
    child_lot_id: ref('lots'),
    parent_lot_id: ref('lots'),
    grams: { type: DataTypes.INTEGER, allowNull: false },
    ...ts,
  });
  await q.addIndex('lot_parents', ['child_lot_id']);
  await q.addIndex('lot_parents', ['parent_lot_id']);
  await q.sequelize.query(
    `ALTER TABLE lot_parents ADD CONSTRAINT lot_parents_ck CHECK (grams > 0 AND child_lot_id <> parent_lot_id)`,
  );
}

export async function down({ context: q }: { context: QueryInterface }) {
  await q.removeConstraint('super_pulls', 'super_pulls_lot_fk');
  for (const t of [
    'lot_parents',
    'lab_files',
    'moisture_readings',
    'lot_containers',
    'lots',
    'lot_sequences',
    'container_types',
  ]) {
    await q.dropTable(t, {});
  }
}
