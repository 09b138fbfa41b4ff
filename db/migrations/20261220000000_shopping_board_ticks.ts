import type { Knex } from 'knex';

/**
 * Shopping ticks per board (issue 16): one row per board or sheet bought, numbered within its size on
 * the episode's plan, instead of one count per size line. Each tick is its own row, so two people
 * ticking different boards at once never overwrite each other, and ticking twice changes nothing.
 * Counts already recorded become boards 1..bought.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('shopping_board_ticks', (t) => {
    t.uuid('episode_id').notNullable().references('episodes.id').onDelete('CASCADE');
    t.uuid('stock_item_id').notNullable().references('stock_items.id').onDelete('CASCADE');
    // The size bought, e.g. "96" (inches long) or "48x96" (sheet), as before.
    t.string('size_key', 40).notNullable();
    t.integer('board').notNullable();
    t.uuid('updated_by').references('users.id').onDelete('SET NULL');
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.primary(['episode_id', 'stock_item_id', 'size_key', 'board']);
  });
  await knex.raw('alter table shopping_board_ticks add constraint shopping_board_ticks_board_range check (board between 1 and 10000)');
  await knex.raw(`
    insert into shopping_board_ticks (episode_id, stock_item_id, size_key, board, updated_by, updated_at)
    select episode_id, stock_item_id, size_key, n, updated_by, updated_at
    from shopping_ticks, generate_series(1, bought) as n`);
  await knex.schema.dropTable('shopping_ticks');
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.createTable('shopping_ticks', (t) => {
    t.uuid('episode_id').notNullable().references('episodes.id').onDelete('CASCADE');
    t.uuid('stock_item_id').notNullable().references('stock_items.id').onDelete('CASCADE');
    t.string('size_key', 40).notNullable();
    t.integer('bought').notNullable();
    t.uuid('updated_by').references('users.id').onDelete('SET NULL');
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.primary(['episode_id', 'stock_item_id', 'size_key']);
  });
  await knex.raw('alter table shopping_ticks add constraint shopping_ticks_bought_range check (bought between 0 and 10000)');
  // A count keeps how many were ticked; which board numbers is lost.
  await knex.raw(`
    insert into shopping_ticks (episode_id, stock_item_id, size_key, bought, updated_at)
    select episode_id, stock_item_id, size_key, count(*)::int, max(updated_at)
    from shopping_board_ticks group by episode_id, stock_item_id, size_key`);
  await knex.schema.dropTable('shopping_board_ticks');
}
