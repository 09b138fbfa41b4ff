import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('shots', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('segment_id').notNullable().references('segments.id').onDelete('CASCADE');
    // Order in the segment's shot list, and the shop hand's own order on the board: both fractional keys.
    t.specificType('position', 'text collate "C"').notNullable();
    t.specificType('board_position', 'text collate "C"').notNullable();
    t.enu('framing', ['wide', 'medium', 'close_up', 'extreme_close_up', 'overhead', 'insert', 'pov'], { useNative: true, enumName: 'shot_framing' })
      .notNullable()
      .defaultTo('medium');
    t.enu('camera', ['a_cam', 'b_cam', 'phone', 'top_cam'], { useNative: true, enumName: 'shot_camera' }).notNullable().defaultTo('a_cam');
    t.string('description', 300).notNullable();
    t.uuid('assignee_id').references('users.id').onDelete('SET NULL');
    t.date('due_date');
    t.string('notes', 1000).notNullable().defaultTo('');
    t.enu('state', ['planned', 'captured', 'retake'], { useNative: true, enumName: 'shot_state' }).notNullable().defaultTo('planned');
    t.string('retake_reason', 300);
    t.uuid('state_changed_by').references('users.id').onDelete('SET NULL');
    t.timestamp('state_changed_at', { useTz: true });
    // Deleting hides a shot; undo brings it back with its id, history and place.
    t.timestamp('deleted_at', { useTz: true });
    t.timestamps(true, true);
    t.unique(['segment_id', 'position']);
    t.index(['assignee_id']);
  });

  await knex.schema.createTable('shot_events', (t) => {
    t.bigIncrements('id');
    t.uuid('shot_id').notNullable().references('shots.id').onDelete('CASCADE');
    t.specificType('from_state', 'shot_state').notNullable();
    t.specificType('to_state', 'shot_state').notNullable();
    t.string('reason', 300);
    t.uuid('user_id').references('users.id').onDelete('SET NULL');
    t.timestamp('at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['shot_id']);
  });

  // What each person has been told they hold; the next assignment e-mail is the difference from now.
  await knex.schema.createTable('shot_notices', (t) => {
    t.uuid('shot_id').notNullable().references('shots.id').onDelete('CASCADE');
    t.uuid('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.date('due_date');
    t.primary(['shot_id', 'user_id']);
  });

  // One open burst per person and channel: the first change opens it, the mail goes when it is due.
  await knex.schema.createTable('shot_mail_bursts', (t) => {
    t.uuid('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.uuid('channel_id').notNullable().references('channels.id').onDelete('CASCADE');
    t.timestamp('due_at', { useTz: true }).notNullable();
    t.primary(['user_id', 'channel_id']);
    t.index(['due_at']);
  });

  await knex.schema.alterTable('segments', (t) => {
    t.jsonb('tools').notNullable().defaultTo('[]');
    t.string('other_tool', 80).notNullable().defaultTo('');
    t.uuid('safety_reviewed_by').references('users.id').onDelete('SET NULL');
    t.timestamp('safety_reviewed_at', { useTz: true });
  });
  await knex.raw(`alter table shots add constraint shots_retake_has_reason check (state <> 'retake' or retake_reason is not null)`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('segments', (t) => {
    t.dropColumn('tools');
    t.dropColumn('other_tool');
    t.dropColumn('safety_reviewed_by');
    t.dropColumn('safety_reviewed_at');
  });
  await knex.schema.dropTableIfExists('shot_mail_bursts');
  await knex.schema.dropTableIfExists('shot_notices');
  await knex.schema.dropTableIfExists('shot_events');
  await knex.schema.dropTableIfExists('shots');
  for (const type of ['shot_state', 'shot_camera', 'shot_framing']) await knex.raw(`drop type if exists ${type}`);
}
