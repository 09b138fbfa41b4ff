import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('cut_settings', (t) => {
    t.uuid('channel_id').primary().references('channels.id').onDelete('CASCADE');
    // Common practice: a full-kerf table-saw blade cuts about 1/8" wide.
    t.double('kerf_in').notNullable().defaultTo(0.125);
    t.double('end_trim_in').notNullable().defaultTo(0);
    t.double('min_offcut_in').notNullable().defaultTo(12);
    t.enu('length_unit', ['in', 'mm'], { useNative: true, enumName: 'length_unit' }).notNullable().defaultTo('in');
    t.timestamps(true, true);
  });
  await knex.raw(`alter table cut_settings
    add constraint cut_settings_kerf_range check (kerf_in between 0 and 1),
    add constraint cut_settings_trim_range check (end_trim_in between 0 and 24),
    add constraint cut_settings_offcut_range check (min_offcut_in between 0 and 240)`);

  await knex.schema.createTable('stock_items', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('channel_id').notNullable().references('channels.id').onDelete('CASCADE');
    t.enu('kind', ['softwood', 'hardwood', 'sheet'], { useNative: true, enumName: 'stock_kind' }).notNullable();
    t.string('name', 120).notNullable();
    t.string('species', 80).notNullable();
    // As the trade writes it: "2x4", "4/4", "3/4".
    t.string('nominal', 20).notNullable();
    t.double('thickness_in').notNullable();
    t.double('width_in');
    t.integer('price_per_bf_cents');
    // Lumber: [{ lengthIn, priceCents? }]; sheets: [{ widthIn, lengthIn, priceCents }].
    t.jsonb('offers').notNullable();
    t.timestamps(true, true);
    t.unique(['channel_id', 'name']);
    t.index(['channel_id']);
  });
  await knex.raw(`alter table stock_items
    add constraint stock_items_width_by_kind check ((kind = 'sheet') = (width_in is null)),
    add constraint stock_items_bf_price_by_kind check ((kind = 'hardwood') = (price_per_bf_cents is not null)),
    add constraint stock_items_offers_array check (jsonb_typeof(offers) = 'array' and jsonb_array_length(offers) between 1 and 12)`);

  await knex.schema.createTable('parts', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('segment_id').notNullable().references('segments.id').onDelete('CASCADE');
    t.uuid('stock_item_id').references('stock_items.id').onDelete('SET NULL');
    t.bigIncrements('seq', { primaryKey: false });
    t.string('name', 80).notNullable();
    t.integer('quantity').notNullable();
    t.double('length_in').notNullable();
    t.double('width_in');
    t.double('thickness_in');
    t.enu('grain', ['length', 'any'], { useNative: true, enumName: 'part_grain' }).notNullable().defaultTo('any');
    t.string('note', 200).notNullable().defaultTo('');
    t.integer('cut_count').notNullable().defaultTo(0);
    t.timestamps(true, true);
    t.index(['segment_id']);
    t.index(['stock_item_id']);
  });
  await knex.raw(`alter table parts
    add constraint parts_quantity_range check (quantity between 1 and 500),
    add constraint parts_length_range check (length_in > 0 and length_in <= 1200),
    add constraint parts_width_range check (width_in is null or (width_in > 0 and width_in <= 1200)),
    add constraint parts_thickness_range check (thickness_in is null or (thickness_in > 0 and thickness_in <= 24)),
    add constraint parts_cut_count_range check (cut_count between 0 and quantity)`);

  await knex.schema.createTable('shopping_ticks', (t) => {
    t.uuid('episode_id').notNullable().references('episodes.id').onDelete('CASCADE');
    t.uuid('stock_item_id').notNullable().references('stock_items.id').onDelete('CASCADE');
    // The size bought, e.g. "96" (inches long) or "48x96" (sheet).
    t.string('size_key', 40).notNullable();
    t.integer('bought').notNullable();
    t.uuid('updated_by').references('users.id').onDelete('SET NULL');
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.primary(['episode_id', 'stock_item_id', 'size_key']);
  });
  await knex.raw('alter table shopping_ticks add constraint shopping_ticks_bought_range check (bought between 0 and 10000)');
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('shopping_ticks');
  await knex.schema.dropTableIfExists('parts');
  await knex.schema.dropTableIfExists('stock_items');
  await knex.schema.dropTableIfExists('cut_settings');
  await knex.raw('drop type if exists part_grain');
  await knex.raw('drop type if exists stock_kind');
  await knex.raw('drop type if exists length_unit');
}
