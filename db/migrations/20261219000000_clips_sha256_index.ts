import type { Knex } from 'knex';

// Issue 15: every clip list looks up earlier clips with the same SHA-256, so that lookup needs an index.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('clips', (t) => {
    t.index(['sha256', 'created_at'], 'clips_sha256_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('clips', (t) => {
    t.dropIndex(['sha256', 'created_at'], 'clips_sha256_index');
  });
}
