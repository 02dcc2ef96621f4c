/**
 * Migrations and seeders with umzug, run by tsx:
 *   tsx lib/db/migrate.ts up | down [--to 0] | seed | reseed | status
 * They run as the database owner (databaseUrl), never as the app's own role.
 */
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { Umzug, SequelizeStorage } from 'umzug';
import type { QueryInterface, Sequelize } from 'sequelize';
import { createDb } from './index';
import { APP_ROLE, databaseUrl } from './config';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');

export function migrator(sequelize: Sequelize) {
  return new Umzug<QueryInterface>({
    migrations: { glob: ['*.ts', { cwd: path.join(root, 'migrations') }] },
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: undefined,
  });
}

export function seeder(sequelize: Sequelize) {
  return new Umzug<QueryInterface>({
    migrations: { glob: ['2*.ts', { cwd: path.join(root, 'seeders') }] },
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_seeds' }),
    logger: undefined,
  });
}

/**
 * schema_seeds appears with the first seed, after the app-role migration, so it got the app role's
 * default row grants; umzug's bookkeeping is not the app's business (docs/architecture.md, "Database roles").
 */
async function keepSeedBookkeepingFromApp(sequelize: Sequelize): Promise<void> {
  await sequelize.query(`DO $$ BEGIN
    IF EXISTS (SELECT 1 FROM pg_roles WHERE rolname = '${APP_ROLE}') AND to_regclass('public.schema_seeds') IS NOT NULL THEN
      REVOKE ALL ON public.schema_seeds FROM ${APP_ROLE};
    END IF;
  END $$`);
}

async function main() {
  const [cmd = 'up', ...rest] = process.argv.slice(2);
  const { sequelize } = createDb(databaseUrl(), 'combtrace-migrate');
  try {
    if (cmd === 'up') {
      const done = await migrator(sequelize).up();
      console.log(`Migrations applied: ${done.length}`);
    } else if (cmd === 'down') {
      const to = rest[0] === '--to' ? 0 : undefined;
      const done = await migrator(sequelize).down(to === 0 ? { to: 0 } : undefined);
      console.log(`Migrations reverted: ${done.length}`);
    } else if (cmd === 'seed') {
      const done = await seeder(sequelize).up();
      await keepSeedBookkeepingFromApp(sequelize);
      console.log(done.length ? `Demo data loaded (${done.length} seeders).` : 'Demo data already loaded.');
    } else if (cmd === 'status') {
      const pending = await migrator(sequelize).pending();
      console.log(`Pending migrations: ${pending.map((m) => m.name).join(', ') || 'none'}`);
    } else {
      throw new Error(`Unknown command ${cmd}`);
    }
  } finally {
    await sequelize.close();
  }
}

if (process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  main().catch((err) => {
    console.error(err instanceof Error ? err.message : err);
    process.exit(1);
  });
}
