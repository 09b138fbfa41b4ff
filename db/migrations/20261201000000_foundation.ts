import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.raw('create extension if not exists citext');

  await knex.schema.createTable('users', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.specificType('email', 'citext').notNullable().unique();
    t.string('name', 120).notNullable();
    t.string('password_hash', 100).notNullable();
    t.boolean('email_opt_out').notNullable().defaultTo(false);
    t.timestamps(true, true);
  });

  await knex.schema.createTable('channels', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.string('slug', 80).notNullable().unique();
    t.string('name', 120).notNullable();
    // Common practice for conversational delivery, no published source.
    t.integer('speaking_rate_wpm').notNullable().defaultTo(150);
    t.timestamps(true, true);
  });
  await knex.raw('alter table channels add constraint channels_speaking_rate_range check (speaking_rate_wpm between 60 and 300)');

  await knex.schema.createTable('memberships', (t) => {
    t.uuid('channel_id').notNullable().references('channels.id').onDelete('CASCADE');
    t.uuid('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.enu('role', ['host', 'shop_hand', 'editor'], { useNative: true, enumName: 'crew_role' }).notNullable();
    t.timestamps(true, true);
    t.primary(['channel_id', 'user_id']);
    t.index(['user_id']);
  });

  await knex.schema.createTable('invitations', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('channel_id').notNullable().references('channels.id').onDelete('CASCADE');
    t.specificType('email', 'citext').notNullable();
    t.specificType('role', 'crew_role').notNullable();
    t.string('token_hash', 64).notNullable().unique();
    t.timestamp('expires_at', { useTz: true }).notNullable();
    t.timestamp('accepted_at', { useTz: true });
    t.timestamp('revoked_at', { useTz: true });
    t.timestamp('sent_at', { useTz: true });
    t.uuid('invited_by').references('users.id').onDelete('SET NULL');
    t.uuid('accepted_by').references('users.id').onDelete('SET NULL');
    t.timestamps(true, true);
  });
  // At most one open invitation per address and channel.
  await knex.raw(
    'create unique index invitations_one_open on invitations (channel_id, email) where accepted_at is null and revoked_at is null',
  );

  await knex.schema.createTable('sign_in_failures', (t) => {
    t.bigIncrements('id');
    t.string('throttle_key', 320).notNullable();
    t.timestamp('failed_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['throttle_key', 'failed_at']);
  });

  await knex.schema.createTable('app_meta', (t) => {
    t.string('key', 64).primary();
    t.jsonb('value').notNullable();
    t.timestamps(true, true);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('app_meta');
  await knex.schema.dropTableIfExists('sign_in_failures');
  await knex.schema.dropTableIfExists('invitations');
  await knex.schema.dropTableIfExists('memberships');
  await knex.raw('drop type if exists crew_role');
  await knex.schema.dropTableIfExists('channels');
  await knex.schema.dropTableIfExists('users');
}
