import type { Knex } from 'knex';
import { migrationSource } from './db/migrations';
import { config as env } from './lib/config';

// One config for the app, the set-up script and the tests; DATABASE_URL is set by scripts/start.mjs and scripts/test.mjs.
const config: Knex.Config = {
  client: 'pg',
  connection: env().DATABASE_URL,
  pool: { min: 0, max: env().DB_POOL_MAX },
  migrations: { migrationSource, tableName: 'knex_migrations' },
};

export default config;
