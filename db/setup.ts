import type { Knex } from 'knex';
import { seedDemo } from './seeds/demo';

const SEEDED_KEY = 'demo_seeded';

/** Migrates to the latest schema; seeds the demo channel once per database, so restarts keep data as it is. */
export async function setUpDatabase(knex: Knex): Promise<{ migrated: string[]; seeded: boolean }> {
  const [, migrated] = (await knex.migrate.latest()) as [number, string[]];
  const seeded = await knex.transaction(async (trx) => {
    // Serialises two starts racing on a fresh database.
    await trx.raw('select pg_advisory_xact_lock(7302611)');
    const done = await trx('app_meta').where({ key: SEEDED_KEY }).first('key');
    if (done) return false;
    await seedDemo(trx);
    await trx('app_meta').insert({ key: SEEDED_KEY, value: JSON.stringify({ at: new Date().toISOString() }) });
    return true;
  });
  return { migrated, seeded };
}
