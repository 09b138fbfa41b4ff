import 'server-only';
import { db } from '@/db/client';
import { findEpisode } from '@/lib/episodes/queries';
import { notFound } from '@/lib/errors';
import { listOnHandStock } from '@/lib/on-hand/queries';
import { listEpisodeParts, listSegmentParts } from '@/lib/parts/queries';
import { getCutSettings, listStock } from '@/lib/stock/queries';
import type { CutPlan } from './build';
import { partsLeftToCut, type CutRecordDto } from './cut-records';
import { computePlan } from './plan-pool';
import { listCutRecords, listSegmentCutRecords } from './record-queries';
import type { ShoppingTickDto, ShoppingTickInput } from './schemas';

// One budget per request, shared by every plan in it (the whole episode and each level), kept short
// so a page never waits long; the planner returns its best plan and says if it is proven.
export const EPISODE_BUDGET_MS = 1500;
export const SEGMENT_BUDGET_MS = 1000;

export type EpisodePlanDto = {
  whole: CutPlan;
  levels: { level: number; plan: CutPlan }[];
  ticks: ShoppingTickDto[];
  /** Stock plans already cut ("Mark these cuts done"); `whole` and `levels` plan only what is left. */
  records: CutRecordDto[];
  lengthUnit: 'in' | 'mm';
  minOffcutIn: number;
  kerfIn: number;
};

export async function planEpisode(channelId: string, episodeId: string): Promise<EpisodePlanDto> {
  await findEpisode(channelId, episodeId);
  const [parts, stock, settings, ticks, records, onHand] = await Promise.all([
    listEpisodeParts(channelId, episodeId),
    listStock(channelId),
    getCutSettings(channelId),
    listTicks(episodeId),
    listCutRecords(channelId, episodeId),
    listOnHandStock(channelId),
  ]);
  const { whole, levels } = await computePlan(channelId, { parts: partsLeftToCut(parts, records), stock, settings, onHand, byLevel: true, budgetMs: EPISODE_BUDGET_MS });
  return { whole: withCutCounts(whole, parts), levels: levels.map((l) => ({ ...l, plan: withCutCounts(l.plan, parts) })), ticks, records, lengthUnit: settings.lengthUnit, minOffcutIn: settings.minOffcutIn, kerfIn: settings.kerfIn };
}

/** `allCut`: the segment has parts with stock and cut records have cut every piece of them. */
export async function planSegment(channelId: string, segmentId: string): Promise<{ plan: CutPlan; lengthUnit: 'in' | 'mm'; kerfIn: number; allCut: boolean }> {
  const [parts, stock, settings, records, onHand] = await Promise.all([
    listSegmentParts(channelId, segmentId),
    listStock(channelId),
    getCutSettings(channelId),
    listSegmentCutRecords(channelId, segmentId),
    listOnHandStock(channelId),
  ]);
  const left = partsLeftToCut(parts, records);
  const { whole } = await computePlan(channelId, { parts: left, stock, settings, onHand, byLevel: false, budgetMs: SEGMENT_BUDGET_MS });
  return { plan: withCutCounts(whole, parts), allCut: parts.length > 0 && left.length === 0, lengthUnit: settings.lengthUnit, kerfIn: settings.kerfIn };
}

/** Cut counts of every part, including those a cut record has fully cut (they are not planned again). */
const withCutCounts = (plan: CutPlan, parts: readonly { id: string; cutCount: number }[]): CutPlan => ({
  ...plan,
  cutCounts: Object.fromEntries(parts.map((p) => [p.id, p.cutCount])),
});

async function listTicks(episodeId: string): Promise<ShoppingTickDto[]> {
  const rows: { stock_item_id: string; size_key: string; board: number }[] = await db('shopping_board_ticks')
    .where({ episode_id: episodeId })
    .orderBy(['stock_item_id', 'size_key', 'board'])
    .select('stock_item_id', 'size_key', 'board');
  return rows.map((r) => ({ stockItemId: r.stock_item_id, sizeKey: r.size_key, board: r.board }));
}

/** Ticks or unticks one board: an insert that ignores a tick already there, or a delete; each is one statement. */
export async function setShoppingTick(
  channelId: string,
  episodeId: string,
  userId: string,
  input: ShoppingTickInput,
): Promise<ShoppingTickDto & { bought: boolean }> {
  await findEpisode(channelId, episodeId);
  const stock = await db('stock_items').where({ id: input.stockItemId, channel_id: channelId }).first('id');
  if (!stock) throw notFound('That stock item');
  const key = { episode_id: episodeId, stock_item_id: input.stockItemId, size_key: input.sizeKey, board: input.board };
  if (input.bought) await db('shopping_board_ticks').insert({ ...key, updated_by: userId }).onConflict(['episode_id', 'stock_item_id', 'size_key', 'board']).ignore();
  else await db('shopping_board_ticks').where(key).delete();
  return { stockItemId: input.stockItemId, sizeKey: input.sizeKey, board: input.board, bought: input.bought };
}
