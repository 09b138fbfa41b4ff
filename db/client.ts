import knex, { type Knex } from 'knex';
import config from '../knexfile';

// One pool per process; kept on globalThis so dev reloads don't open a new pool each time.
const globalForDb = globalThis as unknown as { kerflineDb?: Knex };

export const db: Knex = globalForDb.kerflineDb ?? knex(config);
if (process.env.NODE_ENV !== 'production') globalForDb.kerflineDb = db;
