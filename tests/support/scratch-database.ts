import { randomBytes } from 'node:crypto';
import knex, { type Knex } from 'knex';
import { afterAll, beforeAll } from 'vitest';
import config from '../../knexfile';

/**
 * A throwaway database on the test server for the calling test file, created before its tests and
 * dropped after them, so stepping migrations down and up cannot disturb the other tests. Returns a
 * getter: the connection exists only once `beforeAll` has run.
 */
export function createScratchDatabase(prefix: string): () => Knex {
  const name = `${prefix}_${randomBytes(4).toString('hex')}`;
  const serverUrl = new URL(process.env.DATABASE_URL ?? '');
  const admin = knex({ client: 'pg', connection: { connectionString: new URL('/postgres', serverUrl).href }, pool: { min: 0, max: 1 } });
  let scratch: Knex | undefined;

  beforeAll(async () => {
    await admin.raw(`create database ${name}`);
    scratch = knex({ ...config, connection: new URL(`/${name}`, serverUrl).href });
  });

  afterAll(async () => {
    await scratch?.destroy();
    await admin.raw(`drop database if exists ${name}`);
    await admin.destroy();
  });

  return () => {
    if (!scratch) throw new Error('The scratch database is set up in beforeAll; use it inside a test.');
    return scratch;
  };
}
