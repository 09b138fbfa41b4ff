import type { Knex } from 'knex';

/**
 * Upload marks (issue 17): each time a process takes an upload's lock it replaces the upload's mark,
 * under the lock, and learns the one before. A process that finds the mark it left at its own last
 * release knows no other process has held the lock since, so what it saw of the upload in S3 (its parts
 * and its trailing short part) still holds and its PATCH need not ask S3 again. A missing or deleted
 * row only means the next PATCH asks S3, so rows can be removed at any time.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('upload_marks', (t) => {
    // The tus upload id (storage: 32 hex characters); no clip row exists until the upload finishes.
    t.text('upload_id').primary();
    t.uuid('mark').notNullable();
    t.timestamp('marked_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('upload_marks');
}
