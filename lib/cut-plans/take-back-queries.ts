import 'server-only';
import type { Knex } from 'knex';
import { db } from '@/db/client';
import { lockEpisode } from '@/lib/episodes/queries';
import { AppError, conflict } from '@/lib/errors';
import { getCutSettings } from '@/lib/stock/queries';
import { formatLength } from '@/lib/units';
import type { StockPlan } from './build';
import { piecesCutByRecords } from './cut-records';
import { listCutRecords } from './record-queries';
import { pulledRowsSchema, type PulledRow, type TakeBackResult } from './schemas';
import { cutCountsAfterTakeBack, newestRecordIds, offcutsNotAsKept, takeBackSummary, type OffcutNotAsKept } from './take-back';

// The table's check on_hand_pieces_count_range: 1 to 1,000 of a size.
const MAX_ON_HAND_COUNT = 1000;

const notFoundRecord = () => new AppError('not_found', 'Those cuts done were not found: they may have been taken back already.');

type RecordRow = { id: string; stock_item_id: string; plan: StockPlan; pulled_rows: unknown };
type OnHandRow = { id: string; length_in: number; width_in: number | null; count: number; cut_record_id: string | null };

/**
 * "Take back" one cut record of an episode: the undo of "Mark these cuts done" (rules in ./take-back.ts).
 *
 * 1. Only the newest record of its stock item: each record planned from what the ones before it left.
 * 2. Refused while an offcut it kept is not on hand as it kept it.
 * 3. Otherwise, in one transaction: its kept offcuts leave the rack, every piece it pulled goes back
 *    (to its row if the row is still there, else as that row again, with its id and provenance), the
 *    pieces it cut are unticked down to what the remaining records cut, and the record is deleted.
 *
 * Locks in the order markCutsDone takes them (the episode row, then the stock item's on-hand rows), so
 * the two never deadlock; the stock item is held FOR KEY SHARE in between, so deleting the stock item
 * (which cascades to its records and pieces) waits instead of removing the record halfway. Exactly once:
 * a second press waits on the episode lock, then finds no record (404) and changes nothing.
 */
export async function takeBackCutRecord(channelId: string, episodeId: string, recordId: string): Promise<TakeBackResult> {
  // Read before the transaction, as markCutsDone does: inside it every query holds its one connection.
  const { lengthUnit } = await getCutSettings(channelId);
  const fmt = (n: number) => formatLength(n, { unit: lengthUnit });
  return db.transaction(async (trx) => {
    await lockEpisode(trx, channelId, episodeId);
    const record: RecordRow | undefined = await trx('cut_records')
      .where({ id: recordId, channel_id: channelId, episode_id: episodeId })
      .first('id', 'stock_item_id', 'plan', 'pulled_rows');
    if (!record) throw notFoundRecord();
    const stockItemId = record.stock_item_id;
    // Gone here means the stock item (and with it the record) was deleted after the read above.
    const stock = await trx('stock_items').where({ id: stockItemId, channel_id: channelId }).forKeyShare().first('id');
    if (!stock) throw notFoundRecord();
    const onHand: OnHandRow[] = await trx('on_hand_pieces')
      .where({ channel_id: channelId, stock_item_id: stockItemId })
      .orderBy(['created_at', 'id'])
      .forUpdate()
      .select('id', 'length_in', 'width_in', 'count', 'cut_record_id');

    const records = await listCutRecords(channelId, episodeId, trx);
    const plan = record.plan;
    const name = plan.stock.name;
    // Rule 1: a later record was planned from what this one left.
    if (!newestRecordIds(records).has(record.id)) {
      throw conflict(
        `Only the newest cuts done of ${name} can be taken back: each was planned from what the ones before it left, so taking back an older one would leave the later ones wrong. Take back the newer one first.`,
      );
    }
    // Rule 2: the kept offcuts must be on the rack as they were kept, to take them off again.
    const keptRows = onHand.filter((o) => o.cut_record_id === record.id);
    const wrong = offcutsNotAsKept(
      plan,
      keptRows.map((o) => ({ lengthIn: o.length_in, widthIn: o.width_in, count: o.count })),
    );
    if (wrong[0]) throw conflict(`These cuts of ${name} cannot be taken back: ${whyNotAsKept(wrong[0], fmt)} Nothing was changed.`);

    const piecesBack = await putPulledBack(trx, channelId, stockItemId, plan, readPulledRows(record.pulled_rows), onHand, fmt);
    if (keptRows.length > 0) await trx('on_hand_pieces').whereIn('id', keptRows.map((o) => o.id)).delete();
    const piecesUnticked = await untickPieces(
      trx,
      episodeId,
      plan,
      records.filter((r) => r.id !== record.id),
    );
    await trx('cut_records').where({ id: record.id }).delete();
    return { recordId: record.id, piecesBack, offcutsRemoved: takeBackSummary(plan).offcutsRemoved, piecesUnticked };
  });
}

function whyNotAsKept(w: OffcutNotAsKept, fmt: (n: number) => string): string {
  const size = w.widthIn === null ? fmt(w.lengthIn) : `${fmt(w.lengthIn)} × ${fmt(w.widthIn)}`;
  if (w.onHand === 0) return `the ${size} offcut they kept is no longer on hand (a later plan pulled it, or someone removed it).`;
  if (w.kept === 0) return `an offcut of ${size} on hand carries their name, but they kept none of that size; it was changed.`;
  return `the ${size} offcut they kept was changed on hand: ${w.kept} kept, ${w.onHand} on hand now${w.onHand < w.kept ? ' (some were used or removed)' : ''}.`;
}

/** The stored copy of the pulled rows; null for records made before the copy was kept. */
function readPulledRows(raw: unknown): PulledRow[] | null {
  if (raw === null || raw === undefined) return null;
  const parsed = pulledRowsSchema.safeParse(raw);
  // Written only by markCutsDone in the record's own transaction: another shape is a bug, not input.
  if (!parsed.success) throw new Error(`cut_records.pulled_rows of an unexpected shape: ${parsed.error.message}`);
  return parsed.data;
}

/**
 * Every piece the plan pulled goes back on the rack: its count onto its row while the row exists, else the
 * row again with its old id. Provenance comes from the stored copy; a record made before that copy puts
 * its pieces back as added by hand (source 'hand', no episode or record: on_hand_pieces_hand_has_no_plan).
 * An episode, record or person the copy names that no longer exists is left out, as the foreign keys'
 * ON DELETE SET NULL would have done. Returns how many pieces went back.
 */
async function putPulledBack(
  trx: Knex.Transaction,
  channelId: string,
  stockItemId: string,
  plan: StockPlan,
  copies: PulledRow[] | null,
  onHand: OnHandRow[],
  fmt: (n: number) => string,
): Promise<number> {
  const rows = new Map(onHand.map((o) => [o.id, o]));
  const byId = new Map<string, StockPlan['pulled'][number]>();
  for (const p of plan.pulled) {
    const seen = byId.get(p.onHandId);
    byId.set(p.onHandId, seen ? { ...seen, count: seen.count + p.count } : { ...p });
  }
  const missing = [...byId.values()].filter((p) => !rows.has(p.onHandId));
  const copyOf = new Map((copies ?? []).map((c) => [c.id, c]));
  const exists = await existingRefs(trx, channelId, missing.flatMap((p) => (copyOf.get(p.onHandId) ? [copyOf.get(p.onHandId)!] : [])));
  let back = 0;
  for (const p of byId.values()) {
    back += p.count;
    const row = rows.get(p.onHandId);
    if (row) {
      if (row.count + p.count > MAX_ON_HAND_COUNT) {
        throw conflict(`These cuts cannot be taken back: putting ${p.count} back would make more than ${MAX_ON_HAND_COUNT} pieces of ${fmt(p.lengthIn)} on hand. Lower that count first. Nothing was changed.`);
      }
      await trx('on_hand_pieces').where({ id: row.id }).update({ count: row.count + p.count, updated_at: trx.fn.now() });
      continue;
    }
    const copy = copyOf.get(p.onHandId);
    const provenance = copy
      ? {
          source: copy.source,
          episode_id: copy.episodeId && exists.episodes.has(copy.episodeId) ? copy.episodeId : null,
          cut_record_id: copy.cutRecordId && exists.records.has(copy.cutRecordId) ? copy.cutRecordId : null,
          created_by: copy.createdBy && exists.users.has(copy.createdBy) ? copy.createdBy : null,
          created_at: new Date(copy.createdAt),
        }
      : { source: 'hand' as const, episode_id: null, cut_record_id: null, created_by: null };
    await trx('on_hand_pieces').insert({
      id: p.onHandId,
      channel_id: channelId,
      stock_item_id: stockItemId,
      length_in: copy?.lengthIn ?? p.lengthIn,
      width_in: copy ? copy.widthIn : p.widthIn,
      count: p.count,
      ...provenance,
    });
  }
  return back;
}

/** Which of the episodes, cut records and people the copies name still exist (in this channel). */
async function existingRefs(trx: Knex.Transaction, channelId: string, copies: PulledRow[]) {
  const ids = (pick: (c: PulledRow) => string | null) => [...new Set(copies.flatMap((c) => (pick(c) ? [pick(c)!] : [])))];
  // One after another: a transaction's queries share its one connection.
  const episodes = await trx('episodes').where({ channel_id: channelId }).whereIn('id', ids((c) => c.episodeId)).pluck('id');
  const records = await trx('cut_records').where({ channel_id: channelId }).whereIn('id', ids((c) => c.cutRecordId)).pluck('id');
  const users = await trx('users').whereIn('id', ids((c) => c.createdBy)).pluck('id');
  return { episodes: new Set<string>(episodes), records: new Set<string>(records), users: new Set<string>(users) };
}

/** Unticks the pieces the record cut, never below what the remaining records cut. Returns how many. */
async function untickPieces(trx: Knex.Transaction, episodeId: string, plan: StockPlan, remaining: { plan: Pick<StockPlan, 'boards'> }[]): Promise<number> {
  const partIds = [...new Set(plan.boards.flatMap((b) => b.pieces.map((p) => p.partId)))];
  if (partIds.length === 0) return 0;
  // Row locks: each new count is read, computed and written back.
  const parts: { id: string; quantity: number; cut_count: number }[] = await trx('parts')
    .whereIn('id', partIds)
    .whereIn('segment_id', trx('segments').where({ episode_id: episodeId }).select('id'))
    .orderBy('id')
    .forUpdate()
    .select('id', 'quantity', 'cut_count');
  const before = new Map(parts.map((p) => [p.id, p.cut_count]));
  const changes = cutCountsAfterTakeBack(
    parts.map((p) => ({ id: p.id, quantity: p.quantity, cutCount: p.cut_count })),
    plan,
    piecesCutByRecords(remaining),
  );
  let unticked = 0;
  for (const c of changes) {
    await trx('parts').where({ id: c.id }).update({ cut_count: c.cutCount, updated_at: trx.fn.now() });
    // The rule can raise a count someone lowered below what the remaining records cut; that is no untick.
    unticked += Math.max(0, (before.get(c.id) ?? c.cutCount) - c.cutCount);
  }
  return unticked;
}
