import { randomBytes } from 'node:crypto';
import type { Knex } from 'knex';
import { beforeAll, describe, expect, it } from 'vitest';
import { createScratchDatabase } from '../support/scratch-database';

// A throwaway database, so stepping migrations down and up cannot disturb the other tests.
const scratchDb = createScratchDatabase('kerfline_hw');
let scratch: Knex;
beforeAll(() => {
  scratch = scratchDb();
});

const MIGRATION = '20261222000000_hardwood_board_widths';

describe('hardwood board widths migration (issue 16)', () => {
  it('gives every hardwood offer its item width and renames its ticks, and goes back without loss', async () => {
    await scratch.migrate.latest();
    // Step back to just before this migration: the rack as it was.
    while ((await scratch.migrate.currentVersion()) >= MIGRATION.slice(0, 14)) await scratch.migrate.down();
    const [channel] = await scratch('channels').insert({ slug: `hw-${randomBytes(3).toString('hex')}`, name: 'Hardwood shop' }).returning<{ id: string }[]>('id');
    const channelId = channel?.id ?? '';
    const [episode] = await scratch('episodes').insert({ channel_id: channelId, title: 'Bench' }).returning<{ id: string }[]>('id');
    const offersBefore = [{ lengthIn: 96, priceCents: 0 }, { lengthIn: 120, priceCents: 0 }];
    const [oak] = await scratch('stock_items')
      .insert({ channel_id: channelId, kind: 'hardwood', name: '4/4 Oak, 5 1/2" wide', species: 'Oak', nominal: '4/4', thickness_in: 1, width_in: 5.5, price_per_bf_cents: 900, offers: JSON.stringify(offersBefore) })
      .returning<{ id: string }[]>('id');
    const [spf] = await scratch('stock_items')
      .insert({ channel_id: channelId, kind: 'softwood', name: '2x4 SPF', species: 'SPF', nominal: '2x4', thickness_in: 1.5, width_in: 3.5, offers: JSON.stringify([{ lengthIn: 96, priceCents: 448 }]) })
      .returning<{ id: string }[]>('id');
    const episodeId = episode?.id ?? '';
    await scratch('shopping_board_ticks').insert([
      { episode_id: episodeId, stock_item_id: oak?.id, size_key: '96', board: 1 },
      { episode_id: episodeId, stock_item_id: oak?.id, size_key: '120', board: 2 },
      { episode_id: episodeId, stock_item_id: spf?.id, size_key: '96', board: 1 },
    ]);
    const snapshot = async () => ({
      stock: await scratch('stock_items').where({ channel_id: channelId }).orderBy('name').select('name', 'width_in', 'offers'),
      ticks: await scratch('shopping_board_ticks').where({ episode_id: episodeId }).orderBy(['stock_item_id', 'size_key']).select('stock_item_id', 'size_key', 'board'),
    });
    const before = await snapshot();

    await scratch.migrate.up();
    const after = await snapshot();
    expect(after.stock.find((r) => r.name.startsWith('4/4'))).toEqual({
      name: '4/4 Oak, 5 1/2" wide',
      width_in: 5.5,
      offers: [{ widthIn: 5.5, lengthIn: 96, priceCents: 0 }, { widthIn: 5.5, lengthIn: 120, priceCents: 0 }],
    });
    // Softwood is untouched; oak ticks name width x length, the planner's key for a hardwood board.
    expect(after.stock.find((r) => r.name === '2x4 SPF')).toEqual(before.stock.find((r) => r.name === '2x4 SPF'));
    expect(after.ticks.filter((t) => t.stock_item_id === oak?.id).map((t) => [t.size_key, t.board]).sort()).toEqual([
      ['5.5x120', 2],
      ['5.5x96', 1],
    ]);
    expect(after.ticks.filter((t) => t.stock_item_id === spf?.id).map((t) => t.size_key)).toEqual(['96']);

    await scratch.migrate.down();
    expect(await snapshot()).toEqual(before);
    await scratch.migrate.latest();
  });
});
