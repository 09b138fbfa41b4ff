import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('episodes', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('channel_id').notNullable().references('channels.id').onDelete('CASCADE');
    t.string('title', 160).notNullable();
    t.string('premise', 280).notNullable().defaultTo('');
    t.enu('stage', ['idea', 'outline', 'shoot', 'edit', 'published'], { useNative: true, enumName: 'episode_stage' }).notNullable().defaultTo('idea');
    t.integer('target_seconds');
    t.date('shoot_date');
    t.date('publish_date');
    t.jsonb('level_labels').notNullable().defaultTo(JSON.stringify(['Starter', 'Intermediate', 'Advanced']));
    t.timestamp('archived_at', { useTz: true });
    t.timestamps(true, true);
    t.index(['channel_id']);
  });
  await knex.raw('alter table episodes add constraint episodes_target_range check (target_seconds between 0 and 36000)');

  await knex.schema.createTable('segments', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('episode_id').notNullable().references('episodes.id').onDelete('CASCADE');
    // Fractional ordering keys compare byte by byte, whatever the database locale.
    t.specificType('position', 'text collate "C"').notNullable();
    t.enu('kind', ['cold_open', 'build', 'sponsor_read', 'interlude', 'outro'], { useNative: true, enumName: 'segment_kind' }).notNullable();
    t.smallint('level');
    t.string('title', 160).notNullable();
    t.jsonb('script');
    t.text('script_text').notNullable().defaultTo('');
    t.integer('word_count').notNullable().defaultTo(0);
    t.integer('script_version').notNullable().defaultTo(0);
    t.integer('action_seconds').notNullable().defaultTo(0);
    t.timestamps(true, true);
    t.unique(['episode_id', 'position']);
  });
  await knex.raw(`alter table segments
    add constraint segments_level_only_on_build check (level is null or (kind = 'build' and level between 1 and 3)),
    add constraint segments_action_range check (action_seconds between 0 and 36000),
    add constraint segments_word_count_positive check (word_count >= 0)`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('segments');
  await knex.schema.dropTableIfExists('episodes');
  await knex.raw('drop type if exists segment_kind');
  await knex.raw('drop type if exists episode_stage');
}
