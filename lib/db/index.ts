import { DataTypes, Sequelize } from 'sequelize';
import pg from 'pg';
import { appDatabaseUrl } from './config';
import { initModels, type Models } from '@/models';

// Return BIGINT counts/sums as numbers: our sums are grams and cents, far below 2^53.
pg.types.setTypeParser(20, (v) => Number(v));
// NUMERIC as numbers too (water %, refractive index): precision we store fits a double. Sequelize
// parses DECIMAL itself (to strings), ahead of pg's parser, so its parser is replaced as well.
pg.types.setTypeParser(1700, (v) => Number(v));
(DataTypes as unknown as { postgres: { DECIMAL: { parse: (v: string) => number } } }).postgres.DECIMAL.parse = (v) =>
  Number(v);
// DATE columns stay 'YYYY-MM-DD' strings: a calendar day has no time zone.
pg.types.setTypeParser(1082, (v) => v);

export type Db = { sequelize: Sequelize; models: Models };

/**
 * A Sequelize instance with the models on the given connection. The app uses getDb(); migrate.ts
 * makes its own on the owner's connection, closes it itself, and names itself in pg_stat_activity.
 */
export function createDb(url: string, applicationName = 'combtrace'): Db {
  const sequelize = new Sequelize(url, {
    dialect: 'postgres',
    dialectModule: pg,
    dialectOptions: { application_name: applicationName },
    logging: process.env.DB_LOG === '1' ? console.log : false,
    pool: { max: Number(process.env.DB_POOL_MAX ?? 10), min: 0, idle: 10_000 },
    define: { underscored: true },
  });
  return { sequelize, models: initModels(sequelize) };
}

const holder = globalThis as unknown as { __combtraceDb?: Db };

/**
 * The one Sequelize instance with its models, connected as the app's own role (appDatabaseUrl).
 * Instance and models are cached together on globalThis: Next bundles route handlers and server
 * components separately, and a model class initialised in one bundle is not initialised in the
 * other ("TypeError: Cannot convert undefined or null to object" when only the instance was cached).
 */
export function getDb(): Db {
  holder.__combtraceDb ??= createDb(appDatabaseUrl());
  return holder.__combtraceDb;
}

export async function closeDb(): Promise<void> {
  if (holder.__combtraceDb) {
    await holder.__combtraceDb.sequelize.close();
    holder.__combtraceDb = undefined;
  }
}
