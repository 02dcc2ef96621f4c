import { DataTypes, type QueryInterface } from 'sequelize';

const id = { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true };
const timestamps = {
  created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
};

export async function up({ context: q }: { context: QueryInterface }) {
  await q.createTable('users', {
    id,
    email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    role: { type: DataTypes.ENUM('owner', 'keeper', 'crew', 'customer'), allowNull: false },
    password_hash: { type: DataTypes.STRING(200), allowNull: true },
    phone: { type: DataTypes.STRING(40), allowNull: true },
    disabled_at: { type: DataTypes.DATE, allowNull: true },
    // Bumped on sign-out, disabling and role change: older session tokens stop working at once.
    session_version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    weight_unit: { type: DataTypes.ENUM('metric', 'us'), allowNull: true },
    ...timestamps,
  });

  await q.createTable('password_tokens', {
    id,
    user_id: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'users', key: 'id' },
      onDelete: 'CASCADE',
    },
    purpose: { type: DataTypes.ENUM('set', 'reset'), allowNull: false },
    token_hash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    used_at: { type: DataTypes.DATE, allowNull: true },
    ...timestamps,
  });

  // One row (id = 1): the business's own settings, used on labels, in limits and in the shop.
  await q.createTable('business_settings', {
    id: { type: DataTypes.INTEGER, primaryKey: true },
    business_name: { type: DataTypes.STRING(120), allowNull: false },
    address: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    region: { type: DataTypes.STRING(120), allowNull: false, defaultValue: '' },
    contact_email: { type: DataTypes.STRING(254), allowNull: false, defaultValue: '' },
    story: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    public_lot_note: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    time_zone: { type: DataTypes.STRING(64), allowNull: false, defaultValue: 'UTC' },
    currency: { type: DataTypes.STRING(3), allowNull: false, defaultValue: 'usd' },
    weight_system: { type: DataTypes.ENUM('metric', 'us'), allowNull: false, defaultValue: 'metric' },
    gs1_company_prefix: { type: DataTypes.STRING(12), allowNull: false, defaultValue: '' },
    lot_code_prefix: { type: DataTypes.STRING(6), allowNull: false, defaultValue: 'HH' },
    moisture_limit_pct: { type: DataTypes.DECIMAL(4, 1), allowNull: false, defaultValue: 20 },
    moisture_limit_heather_pct: { type: DataTypes.DECIMAL(4, 1), allowNull: false, defaultValue: 23 },
    moisture_grade_a_pct: { type: DataTypes.DECIMAL(4, 1), allowNull: false, defaultValue: 18.6 },
    hmf_max_mg_kg: { type: DataTypes.DECIMAL(6, 1), allowNull: false, defaultValue: 40 },
    diastase_min_schade: { type: DataTypes.DECIMAL(5, 1), allowNull: false, defaultValue: 8 },
    insoluble_max_g100g: { type: DataTypes.DECIMAL(5, 2), allowNull: false, defaultValue: 0.1 },
    best_before_months: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 24 },
    expected_loss_pct: { type: DataTypes.DECIMAL(4, 1), allowNull: false, defaultValue: 2 },
    fill_rule_set: { type: DataTypes.ENUM('oiml', 'nist'), allowNull: false, defaultValue: 'oiml' },
    label_declaration: { type: DataTypes.ENUM('us-dual', 'metric'), allowNull: false, defaultValue: 'metric' },
    barcode_kind: { type: DataTypes.ENUM('gs1-128', 'gs1datamatrix'), allowNull: false, defaultValue: 'gs1-128' },
    // [{ upToGrams, cents }], smallest band first.
    shipping_bands: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
    // Estimated extracted honey per full box by depth: { deep: { gramsPerBox, framesPerBox }, … } (common practice).
    super_estimates: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
    ...timestamps,
  });

  await q.createTable('audit_entries', {
    id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
    actor_user_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' } },
    action: { type: DataTypes.STRING(60), allowNull: false },
    entity_type: { type: DataTypes.STRING(40), allowNull: false },
    entity_id: { type: DataTypes.STRING(40), allowNull: false },
    before: { type: DataTypes.JSONB, allowNull: true },
    after: { type: DataTypes.JSONB, allowNull: true },
    reason: { type: DataTypes.TEXT, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  });
  await q.addIndex('audit_entries', ['entity_type', 'entity_id', 'id']);

  // Transactional outbox: a message is written in the same transaction as the change behind it.
  await q.createTable('outbox_messages', {
    id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
    dedupe_key: { type: DataTypes.STRING(200), allowNull: true, unique: true },
    to_address: { type: DataTypes.STRING(254), allowNull: false },
    subject: { type: DataTypes.STRING(250), allowNull: false },
    text_body: { type: DataTypes.TEXT, allowNull: false },
    html_body: { type: DataTypes.TEXT, allowNull: true },
    // [{ filename, contentType, base64 }]
    attachments: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
    status: { type: DataTypes.ENUM('pending', 'sent', 'failed'), allowNull: false, defaultValue: 'pending' },
    attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    last_error: { type: DataTypes.TEXT, allowNull: true },
    next_attempt_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    sent_at: { type: DataTypes.DATE, allowNull: true },
    ...timestamps,
  });
  await q.addIndex('outbox_messages', ['status', 'next_attempt_at']);

  await q.createTable('sign_in_attempts', {
    id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
    email: { type: DataTypes.STRING(254), allowNull: false },
    ip: { type: DataTypes.STRING(64), allowNull: false },
    succeeded: { type: DataTypes.BOOLEAN, allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  });
  await q.addIndex('sign_in_attempts', ['email', 'created_at']);
  await q.addIndex('sign_in_attempts', ['ip', 'created_at']);
}

export async function down({ context: q }: { context: QueryInterface }) {
  for (const t of [
    'sign_in_attempts',
    'outbox_messages',
    'audit_entries',
    'business_settings',
    'password_tokens',
    'users',
  ]) {
    await q.dropTable(t, {});
  }
  for (const e of [
    'enum_users_role',
    'enum_users_weight_unit',
    'enum_password_tokens_purpose',
    'enum_business_settings_weight_system',
    'enum_business_settings_fill_rule_set',
    'enum_business_settings_label_declaration',
    'enum_business_settings_barcode_kind',
    'enum_outbox_messages_status',
  ]) {
    await q.sequelize.query(`DROP TYPE IF EXISTS "${e}"`);
  }
}
