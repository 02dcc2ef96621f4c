import { getDb } from '@/lib/db/index';

/**
 * A trigger that raises the first time `when` holds for a row inserted into `table`, and never
 * again. The counter is a sequence because nextval survives the rollback the failure causes.
 * `detail`, an SQL expression over NEW, is added to the message ("injected failure (name): detail").
 * Returns the clean-up.
 */
export async function failOnce(
  name: string,
  table: string,
  when: string,
  detail?: string,
): Promise<() => Promise<void>> {
  const { sequelize } = getDb();
  const raise = detail
    ? `RAISE EXCEPTION 'injected failure (${name}): %', ${detail}`
    : `RAISE EXCEPTION 'injected failure (${name})'`;
  await sequelize.query(`CREATE SEQUENCE ${name}_seq`);
  await sequelize.query(`CREATE FUNCTION ${name}() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      IF ${when} THEN
        IF nextval('${name}_seq') = 1 THEN ${raise}; END IF;
      END IF;
      RETURN NEW;
    END $$`);
  await sequelize.query(`CREATE TRIGGER ${name} BEFORE INSERT ON ${table} FOR EACH ROW EXECUTE FUNCTION ${name}()`);
  return async () => {
    await sequelize.query(`DROP TRIGGER IF EXISTS ${name} ON ${table}`);
    await sequelize.query(`DROP FUNCTION IF EXISTS ${name}()`);
    await sequelize.query(`DROP SEQUENCE IF EXISTS ${name}_seq`);
  };
}
