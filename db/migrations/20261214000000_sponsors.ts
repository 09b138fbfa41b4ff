import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('sponsors', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('channel_id').notNullable().references('channels.id').onDelete('CASCADE');
    t.string('name', 120).notNullable();
    // [{ name, email }]: a sponsor has a handful of contacts, never queried one by one.
    t.jsonb('contacts').notNullable().defaultTo('[]');
    t.string('notes', 2000).notNullable().defaultTo('');
    t.timestamps(true, true);
    t.unique(['channel_id', 'name']);
  });

  await knex.schema.createTable('sponsor_deals', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('channel_id').notNullable().references('channels.id').onDelete('CASCADE');
    t.uuid('sponsor_id').notNullable().references('sponsors.id').onDelete('CASCADE');
    t.string('title', 160).notNullable();
    // Integer minor units (cents, pence; yen has none) with an ISO 4217 code, never a float.
    t.bigInteger('fee_minor').notNullable().defaultTo(0);
    t.specificType('currency', 'char(3)').notNullable();
    t.integer('payment_terms_days').notNullable().defaultTo(30);
    t.enu('invoice_state', ['not_sent', 'sent', 'paid'], { useNative: true, enumName: 'invoice_state' }).notNullable().defaultTo('not_sent');
    t.date('invoice_sent_on');
    t.date('paid_on');
    t.string('notes', 2000).notNullable().defaultTo('');
    t.timestamps(true, true);
    t.index(['channel_id']);
    t.index(['sponsor_id']);
  });
  await knex.raw(`alter table sponsor_deals
    add constraint sponsor_deals_fee_range check (fee_minor between 0 and 100000000000),
    add constraint sponsor_deals_terms_range check (payment_terms_days between 0 and 365),
    add constraint sponsor_deals_currency_form check (currency ~ '^[A-Z]{3}$'),
    add constraint sponsor_deals_invoice_dates check (
      (invoice_state = 'not_sent' and invoice_sent_on is null and paid_on is null)
      or (invoice_state = 'sent' and invoice_sent_on is not null and paid_on is null)
      or (invoice_state = 'paid' and invoice_sent_on is not null and paid_on is not null))`);

  await knex.schema.createTable('deliverables', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('deal_id').notNullable().references('sponsor_deals.id').onDelete('CASCADE');
    t.uuid('episode_id').notNullable().references('episodes.id').onDelete('CASCADE');
    t.uuid('segment_id').references('segments.id').onDelete('SET NULL');
    t.enu('kind', ['segment_read', 'dedicated_segment', 'description_link', 'pinned_comment', 'social_post'], {
      useNative: true,
      enumName: 'deliverable_kind',
    }).notNullable();
    t.jsonb('talking_points');
    t.jsonb('must_say').notNullable().defaultTo('[]');
    t.string('disclosure', 500).notNullable().defaultTo('');
    t.string('tracking', 500).notNullable().defaultTo('');
    t.integer('read_min_seconds');
    t.integer('read_max_seconds');
    t.enu('placement_kind', ['starts_before', 'within_percent'], { useNative: true, enumName: 'placement_kind' });
    t.integer('placement_value');
    t.uuid('owner_id').references('users.id').onDelete('SET NULL');
    t.timestamps(true, true);
    t.index(['deal_id']);
    t.index(['episode_id']);
    t.index(['segment_id']);
  });
  await knex.raw(`alter table deliverables
    add constraint deliverables_read_range check (
      (read_min_seconds is null or read_min_seconds between 0 and 36000)
      and (read_max_seconds is null or read_max_seconds between 0 and 36000)
      and (read_min_seconds is null or read_max_seconds is null or read_min_seconds <= read_max_seconds)),
    add constraint deliverables_placement check (
      (placement_kind is null and placement_value is null)
      or (placement_kind = 'starts_before' and placement_value between 0 and 36000)
      or (placement_kind = 'within_percent' and placement_value between 1 and 100))`);

  await knex.schema.createTable('due_dates', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('deliverable_id').notNullable().references('deliverables.id').onDelete('CASCADE');
    t.enu('kind', ['script_due', 'approval_due', 'go_live', 'report_due', 'payment_due'], { useNative: true, enumName: 'due_date_kind' }).notNullable();
    t.date('due_on');
    // Payment due follows go-live or the invoice plus the deal's terms unless someone set it by hand.
    t.boolean('overridden').notNullable().defaultTo(false);
    t.uuid('done_by').references('users.id').onDelete('SET NULL');
    t.timestamp('done_at', { useTz: true });
    // Bumped on every change, so a calendar can say SEQUENCE and a reminder can tell a moved date.
    t.integer('revision').notNullable().defaultTo(0);
    t.unique(['deliverable_id', 'kind']);
    t.index(['due_on']);
  });

  await knex.schema.createTable('due_date_events', (t) => {
    t.bigIncrements('id');
    t.uuid('due_date_id').notNullable().references('due_dates.id').onDelete('CASCADE');
    t.enu('action', ['set', 'done', 'reopened'], { useNative: true, enumName: 'due_date_action' }).notNullable();
    t.date('due_on');
    t.uuid('user_id').references('users.id').onDelete('SET NULL');
    t.timestamp('at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['due_date_id']);
  });

  // A link the Host sends a sponsor contact: only the SHA-256 of its token is stored.
  await knex.schema.createTable('approval_links', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('deliverable_id').notNullable().references('deliverables.id').onDelete('CASCADE');
    t.string('contact_email', 254).notNullable();
    t.string('token_hash', 64).notNullable().unique();
    t.timestamp('expires_at', { useTz: true }).notNullable();
    t.timestamp('revoked_at', { useTz: true });
    t.uuid('created_by').references('users.id').onDelete('SET NULL');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.enu('decision', ['approved', 'changes_requested'], { useNative: true, enumName: 'approval_decision' });
    t.string('comment', 2000);
    // The script version the sponsor saw when deciding: "changed since approval" compares against it.
    t.integer('script_version');
    t.timestamp('decided_at', { useTz: true });
    t.index(['deliverable_id']);
  });
  await knex.schema.alterTable('deliverables', (t) => {
    t.integer('approved_script_version');
    t.timestamp('approved_at', { useTz: true });
  });

  // A person's calendar feed: the URL's secret is stored hashed; a new one replaces (revokes) the old.
  await knex.schema.createTable('calendar_feeds', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.string('token_hash', 64).notNullable().unique();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('revoked_at', { useTz: true });
    t.index(['user_id']);
  });

  // Days before an open due date that a reminder goes out; "once overdue" is always on.
  await knex.schema.alterTable('channels', (t) => {
    t.jsonb('reminder_days').notNullable().defaultTo(JSON.stringify([3, 1]));
  });

  // One row per reminder sent: the unique key is what makes it once per due date, person, threshold and
  // date, however many app processes poll. A moved date is a new key; a done date is never selected.
  await knex.schema.createTable('reminder_sends', (t) => {
    t.bigIncrements('id');
    t.uuid('due_date_id').notNullable().references('due_dates.id').onDelete('CASCADE');
    t.uuid('user_id').notNullable().references('users.id').onDelete('CASCADE');
    // Days before the due date, or -1 for "overdue".
    t.smallint('threshold').notNullable();
    t.date('due_on').notNullable();
    t.timestamp('sent_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(['due_date_id', 'user_id', 'threshold', 'due_on']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('reminder_sends');
  await knex.schema.dropTableIfExists('calendar_feeds');
  await knex.schema.dropTableIfExists('approval_links');
  await knex.schema.alterTable('channels', (t) => {
    t.dropColumn('reminder_days');
  });
  await knex.schema.dropTableIfExists('due_date_events');
  await knex.schema.dropTableIfExists('due_dates');
  await knex.schema.dropTableIfExists('deliverables');
  await knex.schema.dropTableIfExists('sponsor_deals');
  await knex.schema.dropTableIfExists('sponsors');
  for (const type of ['approval_decision', 'due_date_action', 'due_date_kind', 'placement_kind', 'deliverable_kind', 'invoice_state']) {
    await knex.raw(`drop type if exists ${type}`);
  }
}
