import type { Knex } from 'knex';

/**
 * On-hand stock (issue 16): boards and offcuts a channel already has, used by the planner before
 * anything is bought, at no cost; and the cut records that say what an episode's plan cut, from which
 * on-hand pieces, and which offcuts it kept.
 *
 * A cut record is the explicit "done" state: a plan computed later plans only what its records have
 * not cut yet, so an offcut kept by a record is never offered back to the cuts that made it.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('cut_records', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('channel_id').notNullable().references('channels.id').onDelete('CASCADE');
    // The record belongs to its episode's plan: deleting the episode deletes what it says was cut.
    t.uuid('episode_id').notNullable().references('episodes.id').onDelete('CASCADE');
    // A record without its stock item could not be shown or subtracted; it goes with the item.
    t.uuid('stock_item_id').notNullable().references('stock_items.id').onDelete('CASCADE');
    // The stock plan as cut: boards with their pieces, which came from the rack and which were bought.
    t.jsonb('plan').notNullable();
    t.uuid('done_by').references('users.id').onDelete('SET NULL');
    t.timestamp('done_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['episode_id', 'stock_item_id']);
  });
  await knex.raw(`alter table cut_records
    add constraint cut_records_plan_object check (jsonb_typeof(plan) = 'object' and jsonb_typeof(plan->'boards') = 'array')`);

  await knex.schema.createTable('on_hand_pieces', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('channel_id').notNullable().references('channels.id').onDelete('CASCADE');
    // A piece is planned as its stock item (species, thickness, width); without the item it is unusable.
    t.uuid('stock_item_id').notNullable().references('stock_items.id').onDelete('CASCADE');
    t.double('length_in').notNullable();
    // Sheets: the piece's width. Lumber: null, the stock item's width.
    t.double('width_in');
    t.integer('count').notNullable();
    t.enu('source', ['hand', 'kept'], { useNative: true, enumName: 'on_hand_source' }).notNullable();
    // Kept offcuts: the plan that kept them. The piece outlives its episode (it is still in the shop).
    t.uuid('episode_id').references('episodes.id').onDelete('SET NULL');
    t.uuid('cut_record_id').references('cut_records.id').onDelete('SET NULL');
    t.uuid('created_by').references('users.id').onDelete('SET NULL');
    t.timestamps(true, true);
    t.index(['channel_id', 'stock_item_id']);
  });
  await knex.raw(`alter table on_hand_pieces
    add constraint on_hand_pieces_length_range check (length_in > 0 and length_in <= 480),
    add constraint on_hand_pieces_width_range check (width_in is null or (width_in > 0 and width_in <= 120)),
    add constraint on_hand_pieces_count_range check (count between 1 and 1000),
    add constraint on_hand_pieces_hand_has_no_plan check (source = 'kept' or (episode_id is null and cut_record_id is null))`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('on_hand_pieces');
  await knex.schema.dropTableIfExists('cut_records');
  await knex.raw('drop type if exists on_hand_source');
}
