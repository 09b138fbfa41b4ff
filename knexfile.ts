import type { Knex } from 'knex';
import { migrationSource } from './db/migrations';

// One config for the app, the set-up script and the tests; DATABASE_URL is set by scripts/start.mjs and scripts/test.mjs.
const config: Knex.Config = {
  client: 'pg',
  connection: process.env.DATABASE_URL ?? 'postgres://postgres@127.0.0.1:54329/kerfline',
  pool: { min: 0, max: Number(process.env.DB_POOL_MAX ?? 10) },
  migrations: { migrationSource, tableName: 'knex_migrations' },
};

export default config;
