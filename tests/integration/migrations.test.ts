import { randomBytes } from 'node:crypto';
import knex, { type Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import config from '../../knexfile';
import { setUpDatabase } from '@/db/setup';

// A throwaway database on the same server, so rolling back cannot disturb the other tests.
const name = `kerfline_mig_${randomBytes(4).toString('hex')}`;
const serverUrl = new URL(process.env.DATABASE_URL ?? '');
const admin = knex({ client: 'pg', connection: { connectionString: new URL('/postgres', serverUrl).href }, pool: { min: 0, max: 1 } });
let scratch: Knex;

beforeAll(async () => {
  await admin.raw(`create database ${name}`);
  scratch = knex({ ...config, connection: new URL(`/${name}`, serverUrl).href });
});

afterAll(async () => {
  await scratch.destroy();
  await admin.raw(`drop database if exists ${name}`);
  await admin.destroy();
});

describe('migrations', () => {
  it('go up, all the way down, and up again', async () => {
    await scratch.migrate.latest();
    expect(await scratch.schema.hasTable('invitations')).toBe(true);
    await scratch.migrate.rollback(undefined, true);
    expect(await scratch.schema.hasTable('users')).toBe(false);
    await scratch.migrate.latest();
    expect(await scratch.schema.hasTable('memberships')).toBe(true);
  });

  it('seed the demo channel once: a second set-up keeps data and adds nothing', async () => {
    const first = await setUpDatabase(scratch);
    const users = await scratch('users').count<{ count: string }[]>('* as count');
    await scratch('channels').update({ name: 'Renamed by the host' });
    const second = await setUpDatabase(scratch);
    expect(first.seeded).toBe(true);
    expect(second.seeded).toBe(false);
    expect(await scratch('users').count<{ count: string }[]>('* as count')).toEqual(users);
    expect((await scratch('channels').first('name'))?.name).toBe('Renamed by the host');
  });
});
