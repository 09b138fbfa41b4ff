import pg from 'pg';
import { config } from '../lib/config';

// Each tus request in flight holds one of these connections while it has its upload locked
// (storage/upload-lock-queries.ts), so they are a pool of their own, apart from Knex's.
const state = globalThis as unknown as { kerflineLockPool?: pg.Pool };

export function lockPool(): pg.Pool {
  state.kerflineLockPool ??= new pg.Pool({
    connectionString: config().DATABASE_URL,
    max: config().UPLOAD_LOCK_POOL_MAX,
    idleTimeoutMillis: 30_000,
  });
  return state.kerflineLockPool;
}
