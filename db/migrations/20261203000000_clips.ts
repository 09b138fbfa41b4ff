import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('clips', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    // The tus upload id: the server makes it, and it names the stored bytes. Unique, so a retried finish writes no second row.
    t.string('upload_id', 64).notNullable().unique();
    t.uuid('segment_id').notNullable().references('segments.id').onDelete('CASCADE');
    t.uuid('shot_id').references('shots.id').onDelete('SET NULL');
    t.uuid('uploaded_by').references('users.id').onDelete('SET NULL');
    t.string('original_name', 255).notNullable();
    t.string('mime_type', 127).notNullable();
    t.bigInteger('size_bytes').notNullable();
    t.specificType('sha256', 'char(64)').notNullable();
    t.enu('probe_state', ['pending', 'done', 'failed', 'unavailable'], { useNative: true, enumName: 'clip_probe_state' }).notNullable().defaultTo('pending');
    t.string('probe_note', 300);
    t.double('duration_seconds');
    t.integer('width');
    t.integer('height');
    t.double('frame_rate');
    t.string('codec', 60);
    t.boolean('has_poster').notNullable().defaultTo(false);
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['segment_id']);
    t.index(['shot_id']);
  });
  await knex.raw('alter table clips add constraint clips_size_positive check (size_bytes >= 0)');

  // Media jobs live in PostgreSQL so a restart loses none; a job whose worker died is taken again after a while.
  await knex.schema.createTable('clip_jobs', (t) => {
    t.bigIncrements('id');
    t.uuid('clip_id').notNullable().references('clips.id').onDelete('CASCADE');
    t.string('kind', 20).notNullable().defaultTo('probe');
    t.integer('attempts').notNullable().defaultTo(0);
    t.timestamp('run_after', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('locked_at', { useTz: true });
    t.string('last_error', 500);
    t.unique(['clip_id', 'kind']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('clip_jobs');
  await knex.schema.dropTableIfExists('clips');
  await knex.raw('drop type if exists clip_probe_state');
}
