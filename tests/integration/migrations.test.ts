import type { Knex } from 'knex';
import { beforeAll, describe, expect, it } from 'vitest';
import { createScratchDatabase } from '../support/scratch-database';
import { setUpDatabase } from '@/db/setup';

// A throwaway database, so stepping migrations down and up cannot disturb the other tests.
const scratchDb = createScratchDatabase('kerfline_mig');
let scratch: Knex;
beforeAll(() => {
  scratch = scratchDb();
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
