import type { Knex } from 'knex';

// Issue 12, item 5: deleting an episode or segment left its clip files and posters on disk forever.
// Every removed clip row (deleted itself, or by cascade from its segment or episode) queues the
// removal of its bytes in the same transaction, through a trigger, so no delete path can forget it
// and a crash loses no removal. The clip worker takes the jobs with SKIP LOCKED (storage/removals.ts).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('byte_removals', (t) => {
    t.bigIncrements('id');
    t.string('upload_id', 64).notNullable();
    t.uuid('clip_id').notNullable();
    t.integer('attempts').notNullable().defaultTo(0);
    t.timestamp('run_after', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.string('last_error', 500);
  });
  await knex.raw(`
    create function queue_clip_byte_removal() returns trigger language plpgsql as $$
    begin
      insert into byte_removals (upload_id, clip_id) values (old.upload_id, old.id);
      return old;
    end
    $$
  `);
  await knex.raw('create trigger clips_queue_byte_removal after delete on clips for each row execute function queue_clip_byte_removal()');
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('drop trigger if exists clips_queue_byte_removal on clips');
  await knex.raw('drop function if exists queue_clip_byte_removal()');
  await knex.schema.dropTableIfExists('byte_removals');
}
