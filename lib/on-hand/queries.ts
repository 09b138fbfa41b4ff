import 'server-only';
import type { Knex } from 'knex';
import { db } from '@/db/client';
import { invalidInput, notFound } from '@/lib/errors';
import type { CreateOnHandInput, OnHandPieceDto, OnHandStock, UpdateOnHandInput } from './schemas';

type OnHandRow = {
  id: string;
  stock_item_id: string;
  stock_name: string;
  kind: OnHandPieceDto['kind'];
  length_in: number;
  width_in: number | null;
  count: number;
  source: OnHandPieceDto['source'];
  episode_id: string | null;
  episode_title: string | null;
  created_at: Date;
};

const columns = ['o.id', 'o.stock_item_id', 's.name as stock_name', 's.kind', 'o.length_in', 'o.width_in', 'o.count', 'o.source', 'o.episode_id', 'e.title as episode_title', 'o.created_at'];

const toDto = (r: OnHandRow): OnHandPieceDto => ({
  id: r.id,
  stockItemId: r.stock_item_id,
  stockName: r.stock_name,
  kind: r.kind,
  lengthIn: r.length_in,
  widthIn: r.width_in,
  count: r.count,
  source: r.source,
  episodeId: r.episode_id,
  episodeTitle: r.episode_title,
  addedAt: r.created_at.toISOString(),
});

const pieces = (trx: Knex | Knex.Transaction, channelId: string) =>
  trx('on_hand_pieces as o').join('stock_items as s', 's.id', 'o.stock_item_id').leftJoin('episodes as e', 'e.id', 'o.episode_id').where('o.channel_id', channelId);

const kindOrder = db.raw("array_position(array['softwood','hardwood','sheet']::stock_kind[], s.kind)");

/** The rack's on-hand pieces: by stock kind and name, longest first. */
export async function listOnHand(channelId: string): Promise<OnHandPieceDto[]> {
  const rows: OnHandRow[] = await pieces(db, channelId)
    .orderBy([{ column: kindOrder }, { column: 's.name' }, { column: 'o.length_in', order: 'desc' }, { column: 'o.width_in', order: 'desc' }, { column: 'o.created_at' }])
    .select(columns);
  return rows.map(toDto);
}

/** What the planner is offered: every piece on hand, as plain numbers. */
export async function listOnHandStock(channelId: string, trx: Knex | Knex.Transaction = db): Promise<OnHandStock[]> {
  const rows: { id: string; stock_item_id: string; length_in: number; width_in: number | null; count: number }[] = await trx('on_hand_pieces')
    .where({ channel_id: channelId })
    .orderBy(['stock_item_id', 'created_at', 'id'])
    .select('id', 'stock_item_id', 'length_in', 'width_in', 'count');
  return rows.map((r) => ({ id: r.id, stockItemId: r.stock_item_id, lengthIn: r.length_in, widthIn: r.width_in, count: r.count }));
}

async function findPiece(trx: Knex | Knex.Transaction, channelId: string, id: string): Promise<OnHandPieceDto> {
  const row: OnHandRow | undefined = await pieces(trx, channelId).where('o.id', id).first(columns);
  if (!row) throw notFound('That piece');
  return toDto(row);
}

export async function addOnHand(channelId: string, userId: string, input: CreateOnHandInput): Promise<OnHandPieceDto> {
  const stock: { kind: OnHandPieceDto['kind'] } | undefined = await db('stock_items').where({ id: input.stockItemId, channel_id: channelId }).first('kind');
  // Another channel's stock item is an unknown choice here, as in the parts list: a field error, not 404.
  if (!stock) throw invalidInput({ stockItemId: 'Choose stock from the rack.' });
  if (stock.kind === 'sheet' && input.widthIn === null) throw invalidInput({ widthIn: 'Enter the width of the sheet piece.' });
  if (stock.kind !== 'sheet' && input.widthIn !== null) throw invalidInput({ widthIn: 'Lumber on hand takes the width of its stock; leave the width empty.' });
  const [row] = await db('on_hand_pieces')
    .insert({ channel_id: channelId, stock_item_id: input.stockItemId, length_in: input.lengthIn, width_in: input.widthIn, count: input.count, source: 'hand', created_by: userId })
    .returning<{ id: string }[]>(['id']);
  if (!row) throw new Error('insert returned no row');
  return findPiece(db, channelId, row.id);
}

/** One UPDATE: two people changing the count at once each set a whole number, neither half-applies. */
export async function updateOnHand(channelId: string, id: string, input: UpdateOnHandInput): Promise<OnHandPieceDto> {
  const count = await db('on_hand_pieces').where({ id, channel_id: channelId }).update({ count: input.count, updated_at: db.fn.now() });
  if (count === 0) throw notFound('That piece');
  return findPiece(db, channelId, id);
}

export async function removeOnHand(channelId: string, id: string): Promise<void> {
  const count = await db('on_hand_pieces').where({ id, channel_id: channelId }).delete();
  if (count === 0) throw notFound('That piece');
}
