import 'server-only';
import type { Knex } from 'knex';
import { db } from '@/db/client';
import { lockEpisode } from '@/lib/episodes/queries';
import { conflict, notFound } from '@/lib/errors';
import { listEpisodeParts } from '@/lib/parts/queries';
import { getCutSettings, listStock } from '@/lib/stock/queries';
import type { StockPlan } from './build';
import { keptOffcuts, partsLeftToCut, piecesCutByRecords, type CutRecordDto } from './cut-records';
import { computePlan } from './plan-pool';
import type { PulledRow } from './schemas';

// One stock item's plan, the size of a segment's: the same budget.
const RECORD_BUDGET_MS = 1000;

type RecordRow = { id: string; stock_item_id: string; done_at: Date; done_by_name: string | null; plan: StockPlan };

const toDto = (r: RecordRow): CutRecordDto => ({ id: r.id, stockItemId: r.stock_item_id, doneAt: r.done_at.toISOString(), doneByName: r.done_by_name, plan: r.plan });

/** An episode's cut records, oldest first. */
export async function listCutRecords(channelId: string, episodeId: string, trx: Knex | Knex.Transaction = db): Promise<CutRecordDto[]> {
  const rows: RecordRow[] = await trx('cut_records as r')
    .leftJoin('users as u', 'u.id', 'r.done_by')
    .where({ 'r.channel_id': channelId, 'r.episode_id': episodeId })
    .orderBy([{ column: 'r.done_at' }, { column: 'r.id' }])
    .select('r.id', 'r.stock_item_id', 'r.done_at', 'u.name as done_by_name', 'r.plan');
  return rows.map(toDto);
}

/** The cut records of the episode a segment belongs to (a segment's plan leaves out what they cut). */
export async function listSegmentCutRecords(channelId: string, segmentId: string): Promise<CutRecordDto[]> {
  const seg: { episode_id: string } | undefined = await db('segments').where({ id: segmentId }).first('episode_id');
  return seg ? listCutRecords(channelId, seg.episode_id) : [];
}

type LockedOnHandRow = {
  id: string;
  length_in: number;
  width_in: number | null;
  count: number;
  source: PulledRow['source'];
  episode_id: string | null;
  cut_record_id: string | null;
  created_by: string | null;
  created_at: Date;
};

const toPulledRow = (o: LockedOnHandRow): PulledRow => ({
  id: o.id,
  lengthIn: o.length_in,
  widthIn: o.width_in,
  count: o.count,
  source: o.source,
  episodeId: o.episode_id,
  cutRecordId: o.cut_record_id,
  createdBy: o.created_by,
  createdAt: o.created_at.toISOString(),
});

export type MarkCutsDoneResult = { record: CutRecordDto | null; alreadyDone: boolean; keptPieces: number };

/**
 * "Mark these cuts done" for one stock item of an episode's plan: plans what is left to cut of that
 * stock from the rack as it is now, records that plan, uses up the on-hand pieces it pulls and puts
 * its keep-offcuts on hand, all in one transaction.
 *
 * Exactly once: the episode's row lock makes a second press wait for the first; it then finds nothing
 * left to cut and changes nothing. The on-hand rows of the stock item are locked before planning, so
 * another episode's cuts or an edit cannot take a piece this plan pulls.
 */
export async function markCutsDone(channelId: string, episodeId: string, userId: string, stockItemId: string): Promise<MarkCutsDoneResult> {
  // Read before the transaction: inside it, every query goes through its one connection, so presses
  // waiting on the episode lock can never hold the whole pool while the first one needs another.
  const [stock, allParts, settings] = await Promise.all([
    listStock(channelId).then((all) => all.find((s) => s.id === stockItemId)),
    listEpisodeParts(channelId, episodeId),
    getCutSettings(channelId),
  ]);
  return db.transaction(async (trx) => {
    await lockEpisode(trx, channelId, episodeId);
    if (!stock) throw notFound('That stock item');
    // Read after the lock: a press that waited sees the record the first one committed.
    const records = await listCutRecords(channelId, episodeId, trx);
    const parts = allParts.filter((p) => p.stockItemId === stockItemId);
    const left = partsLeftToCut(
      parts,
      records.filter((r) => r.stockItemId === stockItemId),
    );
    if (parts.length === 0) throw conflict('No part of this episode is cut from that stock.');
    // Pressed twice, or by two people at once: the first press cut everything; this one changes nothing.
    if (left.length === 0) return { record: null, alreadyDone: true, keptPieces: 0 };
    const onHand: LockedOnHandRow[] = await trx('on_hand_pieces')
      .where({ channel_id: channelId, stock_item_id: stockItemId })
      .orderBy(['created_at', 'id'])
      .forUpdate()
      .select('id', 'length_in', 'width_in', 'count', 'source', 'episode_id', 'cut_record_id', 'created_by', 'created_at');
    const { whole } = await computePlan(channelId, {
      parts: left,
      stock: [stock],
      settings,
      onHand: onHand.map((o) => ({ id: o.id, stockItemId, lengthIn: o.length_in, widthIn: o.width_in, count: o.count })),
      byLevel: false,
      budgetMs: RECORD_BUDGET_MS,
    });
    const plan = whole.groups[0];
    if (!plan || plan.boards.length === 0) throw conflict('None of these parts can be cut from this stock; see the plan for why.');

    const counts = new Map(onHand.map((o) => [o.id, o.count]));
    for (const pull of plan.pulled) {
      const has = counts.get(pull.onHandId) ?? 0;
      // The planner had exactly these locked counts; more would be a planner bug, never a race.
      if (has < pull.count) throw new Error(`plan pulled ${pull.count} of on-hand piece ${pull.onHandId}, ${has} on hand`);
      if (has === pull.count) await trx('on_hand_pieces').where({ id: pull.onHandId }).delete();
      else await trx('on_hand_pieces').where({ id: pull.onHandId }).update({ count: has - pull.count, updated_at: trx.fn.now() });
    }
    // The pulled rows as locked, so "Take back" can put a used-up row back with its own id and provenance.
    const pulledIds = new Set(plan.pulled.map((p) => p.onHandId));
    const pulledRows: PulledRow[] = onHand.filter((o) => pulledIds.has(o.id)).map(toPulledRow);
    const [row] = await trx('cut_records')
      .insert({ channel_id: channelId, episode_id: episodeId, stock_item_id: stockItemId, plan: JSON.stringify(plan), pulled_rows: JSON.stringify(pulledRows), done_by: userId })
      .returning<{ id: string }[]>(['id']);
    if (!row) throw new Error('insert returned no row');
    const kept = keptOffcuts(plan);
    if (kept.length > 0) {
      await trx('on_hand_pieces').insert(
        kept.map((k) => ({ channel_id: channelId, stock_item_id: stockItemId, length_in: k.lengthIn, width_in: k.widthIn, count: k.count, source: 'kept', episode_id: episodeId, cut_record_id: row.id, created_by: userId })),
      );
    }
    // The cut list tick-off agrees: every piece a record cut counts as cut.
    const cut = piecesCutByRecords([...records, { plan }]);
    for (const [partId, n] of cut) {
      await trx('parts').where({ id: partId }).update({ cut_count: trx.raw('least(quantity, greatest(cut_count, ?))', [n]), updated_at: trx.fn.now() });
    }
    const [record] = (await listCutRecords(channelId, episodeId, trx)).filter((r) => r.id === row.id);
    return { record: record ?? null, alreadyDone: false, keptPieces: kept.reduce((a, k) => a + k.count, 0) };
  });
}
