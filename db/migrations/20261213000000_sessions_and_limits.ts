import type { Knex } from 'knex';

// Issue 12, items 9, 10 and 12: session versions and revoked sessions (sign-out ends a session),
// and one table of atomic counters for sign-in throttling and mail rate limits.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('users', (t) => {
    // Carried in every session token; bumping it ends every session of the user ("Sign out everywhere").
    t.integer('session_version').notNullable().defaultTo(0);
  });

  // One row per signed-out session id, kept until the token would have expired anyway.
  await knex.schema.createTable('revoked_sessions', (t) => {
    t.uuid('sid').primary();
    t.uuid('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.timestamp('expires_at', { useTz: true }).notNullable();
    t.index(['expires_at']);
  });

  // One row per key ("email:…", "ip:…", "mail-channel:…"): hits in the current window and the
  // earliest time the next try is allowed. Updated by single INSERT … ON CONFLICT statements.
  await knex.schema.createTable('rate_limits', (t) => {
    t.string('limit_key', 400).primary();
    t.integer('hits').notNullable();
    t.timestamp('window_started_at', { useTz: true }).notNullable();
    t.timestamp('next_allowed_at', { useTz: true }).notNullable();
    t.index(['window_started_at']);
  });

  // Replaced by rate_limits: one row per try could not be counted atomically.
  await knex.schema.dropTableIfExists('sign_in_failures');
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.createTable('sign_in_failures', (t) => {
    t.bigIncrements('id');
    t.string('throttle_key', 320).notNullable();
    t.timestamp('failed_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['throttle_key', 'failed_at']);
  });
  await knex.schema.dropTableIfExists('rate_limits');
  await knex.schema.dropTableIfExists('revoked_sessions');
  await knex.schema.alterTable('users', (t) => {
    t.dropColumn('session_version');
  });
}
