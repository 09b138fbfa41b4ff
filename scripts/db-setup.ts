// Run by scripts/start.mjs and scripts/test.mjs under tsx, with DATABASE_URL set.
import knex from 'knex';
import config from '../knexfile';
import { setUpDatabase } from '../db/setup';

async function main(): Promise<void> {
  const db = knex(config);
  try {
    const { migrated, seeded } = await setUpDatabase(db);
    console.log(`Database ready: ${migrated.length} migration(s) applied${seeded ? ', demo channel seeded' : ''}.`);
  } catch (err) {
    console.error('Database set-up failed:', err);
    process.exitCode = 1;
  } finally {
    await db.destroy();
  }
}

void main();
