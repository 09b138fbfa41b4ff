import type { Knex } from 'knex';
import { DEMO_CHANNEL, seedDemo } from './seeds/demo';
import { seedDemoEpisode } from './seeds/demo-episode';
import { seedDemoHandoff } from './seeds/demo-handoff';
import { seedDemoShots } from './seeds/demo-shots';
import { seedDemoSponsor } from './seeds/demo-sponsor';
import { seedDemoStock } from './seeds/demo-stock';

type SeedStep = { key: string; run: (trx: Knex.Transaction) => Promise<void> };

// Each step runs once per database, so a restart keeps data as it is, and a database seeded
// before a later step existed still gets that step (unless its demo channel was deleted).
const steps: SeedStep[] = [
  { key: 'demo_seeded', run: seedDemo },
  {
    key: 'demo_episode_seeded',
    run: async (trx) => {
      const channel = await trx('channels').where({ slug: DEMO_CHANNEL.slug }).first('id');
      if (channel) await seedDemoEpisode(trx, channel.id as string);
    },
  },
  {
    key: 'demo_stock_seeded',
    run: async (trx) => {
      const channel = await trx('channels').where({ slug: DEMO_CHANNEL.slug }).first('id');
      if (channel) await seedDemoStock(trx, channel.id as string);
    },
  },
  {
    key: 'demo_shots_seeded',
    run: async (trx) => {
      const channel = await trx('channels').where({ slug: DEMO_CHANNEL.slug }).first('id');
      if (channel) await seedDemoShots(trx, channel.id as string);
    },
  },
  {
    key: 'demo_sponsor_seeded',
    run: async (trx) => {
      const channel = await trx('channels').where({ slug: DEMO_CHANNEL.slug }).first('id');
      if (channel) await seedDemoSponsor(trx, channel.id as string);
    },
  },
  {
    key: 'demo_handoff_seeded',
    run: async (trx) => {
      const channel = await trx('channels').where({ slug: DEMO_CHANNEL.slug }).first('id');
      if (channel) await seedDemoHandoff(trx, channel.id as string);
    },
  },
];

/** Migrates to the latest schema, then runs each demo seed step that has not run on this database. */
export async function setUpDatabase(knex: Knex): Promise<{ migrated: string[]; seeded: boolean }> {
  const [, migrated] = (await knex.migrate.latest()) as [number, string[]];
  const seeded = await knex.transaction(async (trx) => {
    // Serialises two starts racing on a fresh database.
    await trx.raw('select pg_advisory_xact_lock(7302611)');
    let ran = false;
    for (const step of steps) {
      if (await trx('app_meta').where({ key: step.key }).first('key')) continue;
      await step.run(trx);
      await trx('app_meta').insert({ key: step.key, value: JSON.stringify({ at: new Date().toISOString() }) });
      ran = true;
    }
    return ran;
  });
  return { migrated, seeded };
}
