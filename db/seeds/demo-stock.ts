import type { Knex } from 'knex';
import { stockRow } from '../../lib/stock/describe';
import type { CreateStockInput } from '../../lib/stock/schemas';

// Invented demo rack: prices are made up but in a realistic range for a home-centre and a hardwood dealer.
const rack: CreateStockInput[] = [
  { kind: 'softwood', species: 'SPF', nominal: '2x4', offers: [{ lengthIn: 96, price: 448 }, { lengthIn: 120, price: 628 }, { lengthIn: 144, price: 798 }] },
  { kind: 'softwood', species: 'Pine', nominal: '1x4', offers: [{ lengthIn: 72, price: 612 }, { lengthIn: 96, price: 798 }] },
  { kind: 'hardwood', species: 'Ash', nominal: '8/4', pricePerBoardFoot: 640, offers: [{ widthIn: 5, lengthIn: 72 }, { widthIn: 5, lengthIn: 96 }] },
  { kind: 'hardwood', species: 'Ash', nominal: '4/4', pricePerBoardFoot: 590, offers: [{ widthIn: 6, lengthIn: 96 }, { widthIn: 6, lengthIn: 120 }] },
  { kind: 'hardwood', species: 'White oak', nominal: '8/4', pricePerBoardFoot: 980, offers: [{ widthIn: 6, lengthIn: 72 }, { widthIn: 6, lengthIn: 96 }] },
  // Issue 16: a dealer's rack of several widths; the planner chooses which width and length to buy.
  {
    kind: 'hardwood',
    species: 'White oak',
    nominal: '4/4',
    pricePerBoardFoot: 875,
    offers: [
      { widthIn: 4, lengthIn: 72 },
      { widthIn: 4, lengthIn: 96 },
      { widthIn: 5.5, lengthIn: 96 },
      { widthIn: 7.25, lengthIn: 96 },
      { widthIn: 7.25, lengthIn: 120 },
    ],
  },
  { kind: 'sheet', species: 'Birch plywood', nominal: 0.75, plywood: true, offers: [{ widthIn: 24, lengthIn: 48, price: 2450 }, { widthIn: 48, lengthIn: 96, price: 7200 }] },
];

type DemoPart = { stock: string; name: string; quantity: number; lengthIn: number; widthIn?: number; thicknessIn?: number; grain?: 'length'; note?: string };

// Invented cut lists for the three stools of the demo episode.
const partsByLevel: Record<number, DemoPart[]> = {
  1: [
    { stock: '2x4 SPF', name: 'Leg', quantity: 4, lengthIn: 23.25 },
    { stock: '2x4 SPF', name: 'Apron', quantity: 4, lengthIn: 11 },
    { stock: '2x4 SPF', name: 'Stretcher', quantity: 2, lengthIn: 11 },
    { stock: '3/4" Birch plywood', name: 'Seat', quantity: 1, lengthIn: 14, widthIn: 14, grain: 'length', note: 'Face grain front to back' },
  ],
  2: [
    { stock: '8/4 Ash, 5" wide', name: 'Leg', quantity: 4, lengthIn: 23.25, widthIn: 1.5, thicknessIn: 1.5 },
    { stock: '4/4 Ash, 6" wide', name: 'Apron', quantity: 4, lengthIn: 12, widthIn: 3, thicknessIn: 0.75 },
    { stock: '4/4 Ash, 6" wide', name: 'Seat board', quantity: 3, lengthIn: 15, widthIn: 5, thicknessIn: 0.875, note: 'Alternate the growth rings' },
  ],
  3: [
    { stock: '8/4 White oak, 6" wide', name: 'Leg', quantity: 4, lengthIn: 24, widthIn: 1.75, thicknessIn: 1.75, note: 'Rift grain on all four faces' },
    { stock: '4/4 White oak, 4" to 7 1/4" wide', name: 'Stretcher', quantity: 4, lengthIn: 15, widthIn: 2.5, thicknessIn: 0.875, note: 'Tenons run through: add 1/8" each end for flush trimming' },
    { stock: '8/4 White oak, 6" wide', name: 'Seat board', quantity: 2, lengthIn: 16, widthIn: 5.5, thicknessIn: 1.5 },
  ],
};

// Invented pieces already in the demo shop (issue 16), so the demo plan pulls some from the rack and buys the rest.
const onHand: { stock: string; lengthIn: number; widthIn?: number; count: number }[] = [
  { stock: '2x4 SPF', lengthIn: 60, count: 1 },
  { stock: '3/4" Birch plywood', lengthIn: 30, widthIn: 20, count: 1 },
];

export async function seedDemoStock(trx: Knex.Transaction, channelId: string): Promise<void> {
  const ids = new Map<string, string>();
  for (const item of rack) {
    const [row] = await trx('stock_items')
      .insert({ channel_id: channelId, ...stockRow(item) })
      .returning<{ id: string; name: string }[]>(['id', 'name']);
    if (row) ids.set(row.name, row.id);
  }
  await trx('cut_settings').insert({ channel_id: channelId }).onConflict('channel_id').ignore();
  for (const piece of onHand) {
    const stockId = ids.get(piece.stock);
    if (!stockId) throw new Error(`demo piece names unknown stock ${piece.stock}`);
    await trx('on_hand_pieces').insert({ channel_id: channelId, stock_item_id: stockId, length_in: piece.lengthIn, width_in: piece.widthIn ?? null, count: piece.count, source: 'hand' });
  }
  const builds: { id: string; level: number }[] = await trx('segments as s')
    .join('episodes as e', 'e.id', 's.episode_id')
    .where({ 'e.channel_id': channelId, 'e.title': 'One Stool, Three Ways', 's.kind': 'build' })
    .select('s.id', 's.level');
  for (const seg of builds) {
    const parts = partsByLevel[seg.level] ?? [];
    for (const p of parts) {
      const stockId = ids.get(p.stock);
      if (!stockId) throw new Error(`demo part ${p.name} names unknown stock ${p.stock}`);
      await trx('parts').insert({
        segment_id: seg.id,
        stock_item_id: stockId,
        name: p.name,
        quantity: p.quantity,
        length_in: p.lengthIn,
        width_in: p.widthIn ?? null,
        thickness_in: p.thicknessIn ?? null,
        grain: p.grain ?? 'any',
        note: p.note ?? '',
      });
    }
  }
}
