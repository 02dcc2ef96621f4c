/**
 * Migrations and seeders with umzug, run by tsx:
 *   tsx lib/db/migrate.ts up | down [--to 0] | seed | reseed | status
 */
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { Umzug, SequelizeStorage } from 'umzug';
import type { QueryInterface, Sequelize } from 'sequelize';
import { getDb, closeDb } from './index';

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

async function main() {
  const [cmd = 'up', ...rest] = process.argv.slice(2);
  const { sequelize } = getDb();
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
      console.log(done.length ? `Demo data loaded (${done.length} seeders).` : 'Demo data already loaded.');
    } else if (cmd === 'status') {
      const pending = await migrator(sequelize).pending();
      console.log(`Pending migrations: ${pending.map((m) => m.name).join(', ') || 'none'}`);
    } else {
      throw new Error(`Unknown command ${cmd}`);
    }
  } finally {
    await closeDb();
  }
}

if (process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  main().catch((err) => {
    console.error(err instanceof Error ? err.message : err);
    process.exit(1);
  });
}
