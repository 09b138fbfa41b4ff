import knex, { type Knex } from 'knex';
import pg from 'pg';
import config from '../knexfile';
import { config as env } from '../lib/config';

// A calendar date (shoot date, due date) has no time zone; keep it as the 'YYYY-MM-DD' text PostgreSQL sends.
pg.types.setTypeParser(pg.types.builtins.DATE, (value: string) => value);

// One pool per process; kept on globalThis so dev reloads don't open a new pool each time.
const globalForDb = globalThis as unknown as { kerflineDb?: Knex };

export const db: Knex = globalForDb.kerflineDb ?? knex(config);
if (env().NODE_ENV !== 'production') globalForDb.kerflineDb = db;
