import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('episodes', (t) => {
    // lib/timecode frameRateIds; edit notes and the EDL count frames at this rate.
    t.string('frame_rate', 10).notNullable().defaultTo('29.97df');
    t.enu('edit_stage', ['assembly', 'rough_cut', 'fine_cut', 'picture_lock'], { useNative: true, enumName: 'edit_stage' });
  });
  await knex.raw(`alter table episodes add constraint episodes_frame_rate_known
    check (frame_rate in ('23.976','24','25','29.97df','29.97ndf','30','50','59.94df','59.94ndf','60'))`);

  // A locked version: the snapshot text exactly as served, and its SHA-256. Never updated.
  await knex.schema.createTable('handoffs', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('episode_id').notNullable().references('episodes.id').onDelete('CASCADE');
    t.integer('version').notNullable();
    t.text('content').notNullable();
    t.specificType('content_hash', 'char(64)').notNullable();
    t.string('note', 2000).notNullable().defaultTo('');
    t.uuid('locked_by').references('users.id').onDelete('SET NULL');
    t.timestamp('locked_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(['episode_id', 'version']);
  });
  await knex.raw(`create function handoffs_immutable() returns trigger language plpgsql as $$
    begin raise exception 'a locked handoff version cannot change' using errcode = 'P0001'; end $$`);
  await knex.raw(`create trigger handoffs_no_update before update on handoffs for each row execute function handoffs_immutable()`);

  // The version each person last opened, for the "changed since" banner.
  await knex.schema.createTable('handoff_reads', (t) => {
    t.uuid('episode_id').notNullable().references('episodes.id').onDelete('CASCADE');
    t.uuid('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.integer('version').notNullable();
    t.timestamp('read_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.primary(['episode_id', 'user_id']);
  });

  await knex.schema.createTable('edit_stage_events', (t) => {
    t.bigIncrements('id');
    t.uuid('episode_id').notNullable().references('episodes.id').onDelete('CASCADE');
    t.specificType('from_stage', 'edit_stage');
    t.specificType('to_stage', 'edit_stage').notNullable();
    t.uuid('user_id').references('users.id').onDelete('SET NULL');
    t.timestamp('at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['episode_id']);
  });

  // A thread is a note without parent_id; replies point at it. Pinned to a frame of a version's
  // segment (segment_id as in the snapshot) or of a clip; the frame counts at frame_rate.
  await knex.schema.createTable('edit_notes', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('handoff_id').notNullable().references('handoffs.id').onDelete('CASCADE');
    t.uuid('parent_id').references('edit_notes.id').onDelete('CASCADE');
    t.uuid('segment_id');
    t.uuid('clip_id').references('clips.id').onDelete('SET NULL');
    t.integer('frame');
    t.string('frame_rate', 10);
    t.string('body', 4000).notNullable();
    t.uuid('author_id').references('users.id').onDelete('SET NULL');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('resolved_at', { useTz: true });
    t.uuid('resolved_by').references('users.id').onDelete('SET NULL');
    t.index(['handoff_id']);
    t.index(['parent_id']);
    t.index(['clip_id']);
  });
  await knex.raw(`alter table edit_notes add constraint edit_notes_frame_positive check (frame is null or frame >= 0)`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('edit_notes');
  await knex.schema.dropTableIfExists('edit_stage_events');
  await knex.schema.dropTableIfExists('handoff_reads');
  await knex.schema.dropTableIfExists('handoffs');
  await knex.raw('drop function if exists handoffs_immutable()');
  await knex.raw('alter table episodes drop constraint if exists episodes_frame_rate_known');
  await knex.schema.alterTable('episodes', (t) => {
    t.dropColumn('frame_rate');
    t.dropColumn('edit_stage');
  });
  await knex.raw('drop type if exists edit_stage');
}
