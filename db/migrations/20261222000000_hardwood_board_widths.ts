import type { Knex } from 'knex';

/**
 * Hardwood boards by width and length (issue 16): a hardwood item used to have one width
 * (`width_in`) and offers of lengths only. Each offer now names its own width, so an item can offer
 * 4", 5 1/2" and 7 1/4" boards. Existing items keep their one width on every offer; `width_in` stays
 * (the widest board on sale). Shopping ticks of hardwood name their size as width x length, the same
 * key the planner gives a board ("6x96"), so ticks made before keep their boards.
 */

// Frozen copy of offerSizeKey's number format (lib/stock/schemas.ts) at the time of this migration.
const key = (n: number) => `${Math.round(n * 10000) / 10000}`;

type Row = { id: string; width_in: number; offers: { lengthIn: number; widthIn?: number; priceCents: number }[] };

export async function up(knex: Knex): Promise<void> {
  const rows: Row[] = await knex('stock_items').where({ kind: 'hardwood' }).select('id', 'width_in', 'offers');
  for (const r of rows) {
    const offers = r.offers.map((o) => ({ widthIn: o.widthIn ?? r.width_in, lengthIn: o.lengthIn, priceCents: o.priceCents }));
    await knex('stock_items').where({ id: r.id }).update({ offers: JSON.stringify(offers) });
    await knex('shopping_board_ticks')
      .where({ stock_item_id: r.id })
      .whereNot('size_key', 'like', '%x%')
      .update({ size_key: knex.raw('? || size_key', [`${key(r.width_in)}x`]) });
  }
}

/** Back to one width per item: the offers of the item's widest board (`width_in`); other widths and their ticks are lost. */
export async function down(knex: Knex): Promise<void> {
  const rows: Row[] = await knex('stock_items').where({ kind: 'hardwood' }).select('id', 'width_in', 'offers');
  for (const r of rows) {
    const prefix = `${key(r.width_in)}x`;
    const same = r.offers.filter((o) => o.widthIn === undefined || key(o.widthIn) === key(r.width_in));
    const offers = (same.length > 0 ? same : r.offers).map((o) => ({ lengthIn: o.lengthIn, priceCents: o.priceCents }));
    await knex('stock_items').where({ id: r.id }).update({ offers: JSON.stringify(offers) });
    await knex('shopping_board_ticks').where({ stock_item_id: r.id }).where('size_key', 'like', '%x%').whereNot('size_key', 'like', `${prefix}%`).delete();
    await knex('shopping_board_ticks')
      .where({ stock_item_id: r.id })
      .where('size_key', 'like', `${prefix}%`)
      .update({ size_key: knex.raw('substr(size_key, ?)', [prefix.length + 1]) });
  }
}
