import 'server-only';
import type { Knex } from 'knex';
import { db } from '@/db/client';
import { invalidInput, notFound } from '@/lib/errors';
import type { CreatePartInput, PartDto, UpdatePartInput } from './schemas';

type PartRow = {
  id: string;
  segment_id: string;
  stock_item_id: string | null;
  name: string;
  quantity: number;
  length_in: number;
  width_in: number | null;
  thickness_in: number | null;
  grain: PartDto['grain'];
  note: string;
  cut_count: number;
};

const partColumns = ['p.id', 'p.segment_id', 'p.stock_item_id', 'p.name', 'p.quantity', 'p.length_in', 'p.width_in', 'p.thickness_in', 'p.grain', 'p.note', 'p.cut_count'];

const toPartDto = (r: PartRow): PartDto => ({
  id: r.id,
  segmentId: r.segment_id,
  stockItemId: r.stock_item_id,
  name: r.name,
  quantity: r.quantity,
  lengthIn: r.length_in,
  widthIn: r.width_in,
  thicknessIn: r.thickness_in,
  grain: r.grain,
  note: r.note,
  cutCount: r.cut_count,
});

const channelParts = (channelId: string) =>
  db('parts as p').join('segments as s', 's.id', 'p.segment_id').join('episodes as e', 'e.id', 's.episode_id').where('e.channel_id', channelId);

export async function listSegmentParts(channelId: string, segmentId: string): Promise<PartDto[]> {
  await buildSegmentOr404(db, channelId, segmentId, { allowOtherKinds: true });
  const rows: PartRow[] = await channelParts(channelId).where('p.segment_id', segmentId).orderBy('p.seq').select(partColumns);
  return rows.map(toPartDto);
}

/** Parts of every build segment of an episode, in running order, with the segment's level. */
export async function listEpisodeParts(channelId: string, episodeId: string): Promise<(PartDto & { level: number | null })[]> {
  const rows: (PartRow & { level: number | null })[] = await channelParts(channelId)
    .where('s.episode_id', episodeId)
    .orderBy([{ column: 's.position' }, { column: 'p.seq' }])
    .select([...partColumns, 's.level']);
  return rows.map((r) => ({ ...toPartDto(r), level: r.level }));
}

async function buildSegmentOr404(trx: Knex | Knex.Transaction, channelId: string, segmentId: string, opts: { allowOtherKinds?: boolean } = {}) {
  const seg: { kind: string } | undefined = await trx('segments as s')
    .join('episodes as e', 'e.id', 's.episode_id')
    .where({ 's.id': segmentId, 'e.channel_id': channelId })
    .first('s.kind');
  if (!seg) throw notFound('That segment');
  if (!opts.allowOtherKinds && seg.kind !== 'build') throw invalidInput({ segmentId: 'Only a Build segment has a parts list.' }, 'Only a Build segment has a parts list.');
}

async function stockInChannelOr400(trx: Knex | Knex.Transaction, channelId: string, stockItemId: string | null | undefined) {
  if (!stockItemId) return;
  const found = await trx('stock_items').where({ id: stockItemId, channel_id: channelId }).first('id');
  if (!found) throw invalidInput({ stockItemId: 'That stock is not in this channel’s rack.' });
}

export async function createPart(channelId: string, segmentId: string, input: CreatePartInput): Promise<PartDto> {
  return db.transaction(async (trx) => {
    await buildSegmentOr404(trx, channelId, segmentId);
    await stockInChannelOr400(trx, channelId, input.stockItemId);
    const [row] = await trx('parts')
      .insert({
        segment_id: segmentId,
        stock_item_id: input.stockItemId,
        name: input.name,
        quantity: input.quantity,
        length_in: input.lengthIn,
        width_in: input.widthIn,
        thickness_in: input.thicknessIn,
        grain: input.grain,
        note: input.note,
      })
      .returning<PartRow[]>(partColumns.map((c) => c.slice(2)));
    if (!row) throw new Error('insert returned no row');
    return toPartDto(row);
  });
}

export async function updatePart(channelId: string, partId: string, input: UpdatePartInput): Promise<PartDto> {
  return db.transaction(async (trx) => {
    const current: { quantity: number; cut_count: number } | undefined = await channelParts(channelId)
      .transacting(trx)
      .where('p.id', partId)
      .forUpdate('p')
      .first('p.quantity', 'p.cut_count');
    if (!current) throw notFound('That part');
    await stockInChannelOr400(trx, channelId, input.stockItemId);
    const quantity = input.quantity ?? current.quantity;
    const cutCount = input.cutCount ?? Math.min(current.cut_count, quantity);
    if (cutCount > quantity) throw invalidInput({ cutCount: `Only ${quantity} of this part are needed.` });
    const patch: Record<string, unknown> = { cut_count: cutCount, updated_at: trx.fn.now() };
    const map: [keyof UpdatePartInput, string][] = [
      ['name', 'name'],
      ['quantity', 'quantity'],
      ['lengthIn', 'length_in'],
      ['widthIn', 'width_in'],
      ['thicknessIn', 'thickness_in'],
      ['stockItemId', 'stock_item_id'],
      ['grain', 'grain'],
      ['note', 'note'],
    ];
    for (const [key, column] of map) if (input[key] !== undefined) patch[column] = input[key];
    const [row] = await trx('parts').where({ id: partId }).update(patch).returning<PartRow[]>(partColumns.map((c) => c.slice(2)));
    if (!row) throw notFound('That part');
    return toPartDto(row);
  });
}

export async function deletePart(channelId: string, partId: string): Promise<void> {
  const ids = channelParts(channelId).where('p.id', partId).select('p.id');
  const count = await db('parts').whereIn('id', ids).delete();
  if (count === 0) throw notFound('That part');
}
