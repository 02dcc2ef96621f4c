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
  await q.createTable('yards', {
    id,
    name: { type: DataTypes.STRING(80), allowNull: false, unique: true },
    place: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    latitude: { type: DataTypes.DECIMAL(9, 6), allowNull: true },
    longitude: { type: DataTypes.DECIMAL(9, 6), allowNull: true },
    forage_notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    archived_at: { type: DataTypes.DATE, allowNull: true },
    ...ts,
  });
  await q.createTable('yard_keepers', {
    yard_id: { ...ref('yards', false, 'CASCADE'), primaryKey: true },
    user_id: { ...ref('users', false, 'CASCADE'), primaryKey: true },
    created_at: ts.created_at,
  });

  // Owner-editable list; the label of the real product governs, this is only a record of it.
  await q.createTable('treatment_kinds', {
    id,
    name: { type: DataTypes.STRING(80), allowNull: false, unique: true },
    supers_allowed: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    waiting_days: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    ...ts,
  });

  await q.createTable('colonies', {
    id,
    code: { type: DataTypes.STRING(30), allowNull: false, unique: true },
    yard_id: ref('yards'),
    keeper_id: ref('users'),
    // package | nucleus | swarm | purchased | split
    origin: { type: DataTypes.STRING(20), allowNull: false },
    parent_colony_id: ref('colonies', true),
    queen_year: { type: DataTypes.INTEGER, allowNull: true },
    // active | dead_out | combined | sold
    status: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'active' },
    combined_into_id: ref('colonies', true),
    started_on: { type: DataTypes.DATEONLY, allowNull: true },
    notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    ...ts,
  });
  await q.addIndex('colonies', ['yard_id']);
  await q.addIndex('colonies', ['keeper_id']);
  await q.addIndex('colonies', ['parent_colony_id']);

  // Timeline entries that are not supers, feedings or treatments: notes, splits, moves, status changes.
  await q.createTable('colony_events', {
    id,
    colony_id: ref('colonies', false, 'CASCADE'),
    // note | split | move | status
    kind: { type: DataTypes.STRING(20), allowNull: false },
    occurred_on: { type: DataTypes.DATEONLY, allowNull: false },
    details: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
    note: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    recorded_by: by,
    idempotency_key: { type: DataTypes.STRING(80), allowNull: true, unique: true },
    ...ts,
  });
  await q.addIndex('colony_events', ['colony_id', 'occurred_on']);

  await q.createTable('feedings', {
    id,
    colony_id: ref('colonies', false, 'CASCADE'),
    // sugar_syrup | fondant | pollen_substitute | other
    kind: { type: DataTypes.STRING(20), allowNull: false },
    amount: { type: DataTypes.STRING(60), allowNull: false, defaultValue: '' },
    started_on: { type: DataTypes.DATEONLY, allowNull: false },
    ended_on: { type: DataTypes.DATEONLY, allowNull: true },
    note: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    recorded_by: by,
    idempotency_key: { type: DataTypes.STRING(80), allowNull: true, unique: true },
    ...ts,
  });
  await q.addIndex('feedings', ['colony_id', 'started_on']);

  await q.createTable('treatments', {
    id,
    colony_id: ref('colonies', false, 'CASCADE'),
    treatment_kind_id: ref('treatment_kinds'),
    product_name: { type: DataTypes.STRING(120), allowNull: false, defaultValue: '' },
    applied_on: { type: DataTypes.DATEONLY, allowNull: false },
    removed_on: { type: DataTypes.DATEONLY, allowNull: true },
    // Copied from the kind when recorded, so a later edit of the list does not rewrite history.
    supers_allowed: { type: DataTypes.BOOLEAN, allowNull: false },
    waiting_days: { type: DataTypes.INTEGER, allowNull: false },
    note: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    recorded_by: by,
    idempotency_key: { type: DataTypes.STRING(80), allowNull: true, unique: true },
    ...ts,
  });
  await q.addIndex('treatments', ['colony_id', 'applied_on']);

  // A physical super box with its printed tag.
  await q.createTable('super_tags', {
    id,
    code: { type: DataTypes.STRING(30), allowNull: false, unique: true },
    depth: { type: DataTypes.STRING(10), allowNull: false },
    frame_count: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 10 },
    retired_at: { type: DataTypes.DATE, allowNull: true },
    ...ts,
  });

  // A super on a colony: put on …, pulled (weighed full), later its empty weight and its lot.
  await q.createTable('super_pulls', {
    id,
    colony_id: ref('colonies'),
    tag_code: { type: DataTypes.STRING(30), allowNull: true },
    depth: { type: DataTypes.STRING(10), allowNull: false },
    frame_count: { type: DataTypes.INTEGER, allowNull: false },
    put_on_on: { type: DataTypes.DATEONLY, allowNull: true },
    pulled_on: { type: DataTypes.DATEONLY, allowNull: true },
    full_grams: { type: DataTypes.INTEGER, allowNull: true },
    capped_frames: { type: DataTypes.DECIMAL(4, 1), allowNull: true },
    empty_grams: { type: DataTypes.INTEGER, allowNull: true },
    flagged: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    flag_reasons: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
    lot_id: { type: DataTypes.INTEGER, allowNull: true },
    override_reason: { type: DataTypes.TEXT, allowNull: true },
    override_by: by,
    put_on_by: by,
    pulled_by: by,
    idempotency_key: { type: DataTypes.STRING(80), allowNull: true, unique: true },
    note: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    ...ts,
  });
  await q.addIndex('super_pulls', ['colony_id', 'pulled_on']);
  await q.addIndex('super_pulls', ['pulled_on']);
  await q.addIndex('super_pulls', ['lot_id']);
  await q.addIndex('super_pulls', ['tag_code']);
  // A tag is on at most one hive at a time.
  await q.addIndex('super_pulls', ['tag_code'], {
    unique: true,
    where: { pulled_on: null },
    name: 'super_pulls_one_open_per_tag',
  });
  await q.sequelize.query(`ALTER TABLE super_pulls ADD CONSTRAINT super_pulls_weights_ck
    CHECK ((full_grams IS NULL OR full_grams > 0) AND (empty_grams IS NULL OR empty_grams >= 0) AND frame_count BETWEEN 1 AND 12)`);
}

export async function down({ context: q }: { context: QueryInterface }) {
  for (const t of [
    'super_pulls',
    'super_tags',
    'treatments',
    'feedings',
    'colony_events',
    'colonies',
    'treatment_kinds',
    'yard_keepers',
    'yards',
  ]) {
    await q.dropTable(t, {});
  }
}
