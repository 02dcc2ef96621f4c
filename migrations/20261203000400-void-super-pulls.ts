import { DataTypes, type QueryInterface } from 'sequelize';

// A super pull recorded by mistake is voided, never deleted or edited: the row keeps who voided it,
// when and why. The three columns are set together or not at all, and the reason is never blank.
export async function up({ context: q }: { context: QueryInterface }) {
  await q.addColumn('super_pulls', 'voided_at', { type: DataTypes.DATE, allowNull: true });
  await q.addColumn('super_pulls', 'voided_by_user_id', {
    type: DataTypes.INTEGER,
    allowNull: true,
    references: { model: 'users', key: 'id' },
    onDelete: 'RESTRICT',
  });
  await q.addColumn('super_pulls', 'void_reason', { type: DataTypes.TEXT, allowNull: true });
  await q.sequelize.query(`ALTER TABLE super_pulls ADD CONSTRAINT super_pulls_void_ck CHECK (
    (voided_at IS NULL AND voided_by_user_id IS NULL AND void_reason IS NULL)
    OR (voided_at IS NOT NULL AND voided_by_user_id IS NOT NULL AND void_reason IS NOT NULL AND length(btrim(void_reason)) >= 3))`);
  // Only a recorded pull can be voided, and a voided pull is never in a lot (the app refuses both
  // orders: voiding a super in a lot, and putting a voided one in); this holds whatever the app does.
  await q.sequelize.query(
    `ALTER TABLE super_pulls ADD CONSTRAINT super_pulls_void_state_ck CHECK (voided_at IS NULL OR (pulled_on IS NOT NULL AND lot_id IS NULL))`,
  );
  // A void is final: who, when and why cannot be changed or taken back afterwards.
  await q.sequelize.query(`CREATE OR REPLACE FUNCTION combtrace_void_is_final() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      IF OLD.voided_at IS NOT NULL AND (NEW.voided_at IS DISTINCT FROM OLD.voided_at
          OR NEW.voided_by_user_id IS DISTINCT FROM OLD.voided_by_user_id OR NEW.void_reason IS DISTINCT FROM OLD.void_reason) THEN
        RAISE EXCEPTION 'a voided % stays voided (correct it with a new entry)', TG_TABLE_NAME USING ERRCODE = 'insufficient_privilege';
      END IF;
      RETURN NEW;
    END $$`);
  await q.sequelize.query(
    `CREATE TRIGGER super_pulls_void_is_final BEFORE UPDATE ON super_pulls FOR EACH ROW EXECUTE FUNCTION combtrace_void_is_final()`,
  );
}

export async function down({ context: q }: { context: QueryInterface }) {
  await q.sequelize.query(`DROP TRIGGER IF EXISTS super_pulls_void_is_final ON super_pulls`);
  await q.sequelize.query(`DROP FUNCTION IF EXISTS combtrace_void_is_final()`);
  await q.sequelize.query(`ALTER TABLE super_pulls DROP CONSTRAINT IF EXISTS super_pulls_void_state_ck`);
  await q.sequelize.query(`ALTER TABLE super_pulls DROP CONSTRAINT IF EXISTS super_pulls_void_ck`);
  await q.removeColumn('super_pulls', 'void_reason');
  await q.removeColumn('super_pulls', 'voided_by_user_id');
  await q.removeColumn('super_pulls', 'voided_at');
}
