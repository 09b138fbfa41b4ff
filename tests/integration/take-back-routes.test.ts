import { describe, expect, it } from 'vitest';
import * as doneRoute from '@/app/api/channels/[channel]/episodes/[episodeId]/cut-plan/done/route';
import * as takeBackRoute from '@/app/api/channels/[channel]/episodes/[episodeId]/cut-plan/done/[recordId]/route';
import * as episodePlanRoute from '@/app/api/channels/[channel]/episodes/[episodeId]/cut-plan/route';
import * as pieceRoute from '@/app/api/channels/[channel]/on-hand/[pieceId]/route';
import * as partRoute from '@/app/api/channels/[channel]/parts/[partId]/route';
import { db } from '@/db/client';
import type { CutRecordDto } from '@/lib/cut-plans/cut-records';
import type { EpisodePlanDto } from '@/lib/cut-plans/queries';
import { markCutsDone } from '@/lib/cut-plans/record-queries';
import { addOnHand } from '@/lib/on-hand/queries';
import { createPart } from '@/lib/parts/queries';
import { createStock } from '@/lib/stock/queries';
import { makeOutlinedEpisode } from './episode-fixtures';
import { call, makeCrew } from './helpers';
import { describeRouteMatrix, type Crew, type RouteCase } from './route-matrix';

const keepers = ['host', 'shop_hand'] as const;

// 10 ft 2x4s at $6.20; the channel keeps offcuts of 12" and more (the default).
const addSpf = (c: Crew) => createStock(c.channel.id, { kind: 'softwood', species: 'SPF', nominal: '2x4', offers: [{ lengthIn: 120, price: 620 }] });

/** A new outlined episode whose level-1 build has `quantity` parts of `lengthIn` on the stock item. */
async function episodeWith(c: Crew, stockItemId: string, quantity: number, lengthIn: number, name = 'Leg') {
  const { episode, segments } = await makeOutlinedEpisode(c);
  const build = segments.find((s) => s.kind === 'build' && s.level === 1)!;
  const part = await createPart(c.channel.id, build.id, { name, quantity, lengthIn, widthIn: null, thicknessIn: null, stockItemId, grain: 'any', note: '' });
  return { episode, part };
}

const markDone = async (c: Crew, episodeId: string, stockItemId: string) => {
  const res = await call(doneRoute.POST, 'POST', { as: c.shopHand, params: { channel: c.channel.slug, episodeId }, body: { stockItemId } });
  expect(res.status).toBe(200);
  return res.json.record as CutRecordDto;
};
const takeBack = (c: Crew, episodeId: string, recordId: string, as = c.shopHand) =>
  call(takeBackRoute.DELETE, 'DELETE', { as, params: { channel: c.channel.slug, episodeId, recordId } });

/** Every on-hand row of the channel with its provenance, as stored (updated_at aside). */
const onHandRows = (c: Crew) =>
  db('on_hand_pieces')
    .where({ channel_id: c.channel.id })
    .orderBy('id')
    .select('id', 'stock_item_id', 'length_in', 'width_in', 'count', 'source', 'episode_id', 'cut_record_id', 'created_by', 'created_at');
const cutCount = async (partId: string) => ((await db('parts').where({ id: partId }).first('cut_count')) as { cut_count: number }).cut_count;
const recordIds = async (episodeId: string) => (await db('cut_records').where({ episode_id: episodeId }).orderBy('done_at').pluck('id')) as string[];
const episodePlan = async (c: Crew, episodeId: string) => {
  const res = await call(episodePlanRoute.GET, 'GET', { as: c.editor, params: { channel: c.channel.slug, episodeId } });
  expect(res.status).toBe(200);
  return res.json as unknown as EpisodePlanDto;
};

const cases: RouteCase[] = [
  {
    name: 'DELETE cuts done (take back)',
    fn: takeBackRoute.DELETE,
    method: 'DELETE',
    allowed: [...keepers],
    params: async (c) => {
      const stock = await addSpf(c);
      const { episode } = await episodeWith(c, stock.id, 3, 32);
      const done = await markCutsDone(c.channel.id, episode.id, c.host.id, stock.id);
      return { channel: c.channel.slug, episodeId: episode.id, recordId: done.record!.id };
    },
    okStatus: 200,
  },
];

describeRouteMatrix(cases);

describe('take back cuts done', () => {
  it('puts a partly pulled board back on its row, removes the kept offcut, unticks the pieces and deletes the record', async () => {
    const c = await makeCrew();
    const stock = await addSpf(c);
    await addOnHand(c.channel.id, c.host.id, { stockItemId: stock.id, lengthIn: 120, widthIn: null, count: 5 });
    const { episode, part } = await episodeWith(c, stock.id, 3, 32);
    const before = await onHandRows(c);
    const record = await markDone(c, episode.id, stock.id);
    // Three 32" legs from one 10 ft board on hand: 120 - 3 x 32 - 3 x 1/8" kerf leaves 23 5/8", kept.
    expect(record.plan.pulled).toEqual([{ onHandId: before[0]!.id, lengthIn: 120, widthIn: null, count: 1 }]);
    expect(await cutCount(part.id)).toBe(3);
    const marked = await onHandRows(c);
    expect(marked.find((r) => r.id === before[0]!.id)?.count).toBe(4);
    expect(marked.filter((r) => r.cut_record_id === record.id)).toMatchObject([{ length_in: 23.625, count: 1, source: 'kept', episode_id: episode.id }]);

    const res = await takeBack(c, episode.id, record.id);
    expect(res.status).toBe(200);
    expect(res.json).toEqual({ recordId: record.id, piecesBack: 1, offcutsRemoved: 1, piecesUnticked: 3 });
    // The rack is as it was before the cuts were marked done: same rows, counts and provenance.
    expect(await onHandRows(c)).toEqual(before);
    expect(await cutCount(part.id)).toBe(0);
    expect(await recordIds(episode.id)).toEqual([]);
    const plan = await episodePlan(c, episode.id);
    expect(plan.records).toEqual([]);
    expect(plan.whole.pieceCount).toBe(3);
    expect(plan.whole.groups[0]?.pulled).toEqual([{ onHandId: before[0]!.id, lengthIn: 120, widthIn: null, count: 1 }]);
    // And the cuts can be marked done again.
    expect((await markDone(c, episode.id, stock.id)).plan.pulled).toHaveLength(1);
  });

  it('puts a used-up kept offcut back with its own id and provenance, after which the record that kept it can be taken back', async () => {
    const c = await makeCrew();
    const stock = await addSpf(c);
    const first = await episodeWith(c, stock.id, 3, 32);
    const kept = await markDone(c, first.episode.id, stock.id);
    const afterFirst = await onHandRows(c);
    expect(afterFirst).toMatchObject([{ length_in: 23.625, count: 1, source: 'kept', episode_id: first.episode.id, cut_record_id: kept.id, created_by: c.shopHand.id }]);

    // Another episode's 20" rail is cut from that offcut, which is used up (its row deleted).
    const second = await episodeWith(c, stock.id, 1, 20, 'Rail');
    const pulling = await markDone(c, second.episode.id, stock.id);
    expect(pulling.plan.pulled).toEqual([{ onHandId: afterFirst[0]!.id, lengthIn: 23.625, widthIn: null, count: 1 }]);
    expect(await onHandRows(c)).toEqual([]);

    // Rule 2: the first record's offcut is no longer on hand, so it cannot be taken back; nothing changes.
    const refused = await takeBack(c, first.episode.id, kept.id);
    expect(refused.status).toBe(409);
    expect(refused.json.error?.message).toMatch(/the 23 5\/8" offcut they kept is no longer on hand \(a later plan pulled it, or someone removed it\)/);
    expect(await recordIds(first.episode.id)).toEqual([kept.id]);
    expect(await cutCount(first.part.id)).toBe(3);

    expect((await takeBack(c, second.episode.id, pulling.id)).json).toEqual({ recordId: pulling.id, piecesBack: 1, offcutsRemoved: 0, piecesUnticked: 1 });
    expect(await onHandRows(c)).toEqual(afterFirst);
    expect(await cutCount(second.part.id)).toBe(0);

    expect((await takeBack(c, first.episode.id, kept.id, c.host)).json).toEqual({ recordId: kept.id, piecesBack: 0, offcutsRemoved: 1, piecesUnticked: 3 });
    expect(await onHandRows(c)).toEqual([]);
    expect(await cutCount(first.part.id)).toBe(0);
  });

  it('re-inserts a pulled row as added by hand for a record made before pulled rows were copied', async () => {
    const c = await makeCrew();
    const stock = await addSpf(c);
    const piece = await addOnHand(c.channel.id, c.host.id, { stockItemId: stock.id, lengthIn: 70, widthIn: null, count: 1 });
    const { episode } = await episodeWith(c, stock.id, 2, 32);
    const record = await markDone(c, episode.id, stock.id);
    expect(record.plan.pulled).toEqual([{ onHandId: piece.id, lengthIn: 70, widthIn: null, count: 1 }]);
    await db('cut_records').where({ id: record.id }).update({ pulled_rows: null });
    expect((await takeBack(c, episode.id, record.id)).status).toBe(200);
    expect(await onHandRows(c)).toMatchObject([{ id: piece.id, length_in: 70, width_in: null, count: 1, source: 'hand', episode_id: null, cut_record_id: null, created_by: null }]);
  });

  it('takes back only the newest record of a stock item, and lowers the cut count to what the older one cut', async () => {
    const c = await makeCrew();
    const stock = await addSpf(c);
    const ply = await createStock(c.channel.id, { kind: 'sheet', species: 'Birch plywood', nominal: 0.75, plywood: true, offers: [{ widthIn: 48, lengthIn: 96, price: 6800 }] });
    const { episode, part } = await episodeWith(c, stock.id, 3, 32);
    const older = await markDone(c, episode.id, stock.id);
    // Three more legs later: planned from what the first record left, recorded as a second record.
    expect((await call(partRoute.PATCH, 'PATCH', { as: c.host, params: { channel: c.channel.slug, partId: part.id }, body: { quantity: 6 } })).status).toBe(200);
    const newer = await markDone(c, episode.id, stock.id);
    await createPart(c.channel.id, part.segmentId, { name: 'Top', quantity: 1, lengthIn: 30, widthIn: 20, thicknessIn: null, stockItemId: ply.id, grain: 'length', note: '' });
    const sheet = await markDone(c, episode.id, ply.id);
    expect(await cutCount(part.id)).toBe(6);
    const rows = await onHandRows(c);

    const refused = await takeBack(c, episode.id, older.id);
    expect(refused.status).toBe(409);
    expect(refused.json.error?.message).toBe(
      'Only the newest cuts done of 2x4 SPF can be taken back: each was planned from what the ones before it left, so taking back an older one would leave the later ones wrong. Take back the newer one first.',
    );
    expect(await onHandRows(c)).toEqual(rows);
    expect(await recordIds(episode.id)).toEqual([older.id, newer.id, sheet.id]);

    // The newest of each stock item can go, in any order between items.
    expect((await takeBack(c, episode.id, newer.id)).json).toMatchObject({ piecesUnticked: 3 });
    expect(await cutCount(part.id)).toBe(3);
    expect((await episodePlan(c, episode.id)).whole.cutCounts[part.id]).toBe(3);
    expect((await takeBack(c, episode.id, older.id)).status).toBe(200);
    expect(await cutCount(part.id)).toBe(0);
    expect(await recordIds(episode.id)).toEqual([sheet.id]);
    expect((await takeBack(c, episode.id, sheet.id)).status).toBe(200);
    expect(await onHandRows(c)).toEqual([]);
  });

  it('is refused while a kept offcut was changed or removed on hand, and nothing changes', async () => {
    const c = await makeCrew();
    const stock = await addSpf(c);
    const { episode, part } = await episodeWith(c, stock.id, 3, 32);
    const record = await markDone(c, episode.id, stock.id);
    const [offcut] = await onHandRows(c);
    const patch = (count: number) => call(pieceRoute.PATCH, 'PATCH', { as: c.host, params: { channel: c.channel.slug, pieceId: offcut!.id }, body: { count } });
    expect((await patch(2)).status).toBe(200);
    const changed = await onHandRows(c);
    const refused = await takeBack(c, episode.id, record.id);
    expect(refused.status).toBe(409);
    expect(refused.json.error?.message).toBe('These cuts of 2x4 SPF cannot be taken back: the 23 5/8" offcut they kept was changed on hand: 1 kept, 2 on hand now. Nothing was changed.');
    expect(await onHandRows(c)).toEqual(changed);
    expect(await cutCount(part.id)).toBe(3);

    expect((await call(pieceRoute.DELETE, 'DELETE', { as: c.host, params: { channel: c.channel.slug, pieceId: offcut!.id } })).status).toBe(204);
    expect((await takeBack(c, episode.id, record.id)).json.error?.message).toMatch(/no longer on hand/);
    expect(await recordIds(episode.id)).toEqual([record.id]);
  });

  it('happens exactly once when two people press it at the same moment', async () => {
    const c = await makeCrew();
    const stock = await addSpf(c);
    await addOnHand(c.channel.id, c.host.id, { stockItemId: stock.id, lengthIn: 120, widthIn: null, count: 2 });
    const { episode, part } = await episodeWith(c, stock.id, 6, 32);
    const before = await onHandRows(c);
    const record = await markDone(c, episode.id, stock.id);
    expect(record.plan.pulled.reduce((a, p) => a + p.count, 0)).toBe(2);
    const presses = await Promise.all([takeBack(c, episode.id, record.id, c.host), takeBack(c, episode.id, record.id, c.shopHand)]);
    expect(presses.map((r) => r.status).sort()).toEqual([200, 404]);
    expect(presses.find((r) => r.status === 404)?.json.error?.message).toBe('Those cuts done were not found: they may have been taken back already.');
    // Both boards back once (count 2, not 4), both offcuts gone, the legs unticked once.
    expect(await onHandRows(c)).toEqual(before);
    expect(await cutCount(part.id)).toBe(0);
  });

  it('racing another episode’s cuts that would pull its kept offcut: one of the two has it, never both', async () => {
    const c = await makeCrew();
    const stock = await addSpf(c);
    const first = await episodeWith(c, stock.id, 3, 32);
    const kept = await markDone(c, first.episode.id, stock.id);
    const second = await episodeWith(c, stock.id, 1, 20, 'Rail');
    const [back, done] = await Promise.all([
      takeBack(c, first.episode.id, kept.id),
      call(doneRoute.POST, 'POST', { as: c.host, params: { channel: c.channel.slug, episodeId: second.episode.id }, body: { stockItemId: stock.id } }),
    ]);
    expect(done.status).toBe(200);
    const pulled = (done.json.record as CutRecordDto).plan.pulled;
    if (back.status === 200) {
      // Taken back first: the offcut left the rack, so the rail's board is bought.
      expect(pulled).toEqual([]);
      expect(await recordIds(first.episode.id)).toEqual([]);
    } else {
      // The rail's cuts pulled the offcut first: the take-back is refused and changes nothing.
      expect(back.status).toBe(409);
      expect(pulled).toHaveLength(1);
      expect(await recordIds(first.episode.id)).toEqual([kept.id]);
      expect(await cutCount(first.part.id)).toBe(3);
    }
    expect((await onHandRows(c)).filter((r) => r.cut_record_id === kept.id)).toEqual([]);
  });

  it('is 404 for an unknown record, a record of another episode, another channel’s record, and a malformed id', async () => {
    const c = await makeCrew();
    const other = await makeCrew();
    const stock = await addSpf(c);
    const { episode } = await episodeWith(c, stock.id, 3, 32);
    const { episode: sibling } = await episodeWith(c, stock.id, 1, 20);
    const record = await markDone(c, episode.id, stock.id);
    expect((await takeBack(c, episode.id, '00000000-0000-4000-8000-000000000000')).status).toBe(404);
    expect((await takeBack(c, sibling.id, record.id)).status).toBe(404);
    expect((await takeBack(c, episode.id, 'not-a-uuid')).status).toBe(404);
    const theirs = await call(takeBackRoute.DELETE, 'DELETE', { as: other.host, params: { channel: other.channel.slug, episodeId: episode.id, recordId: record.id } });
    expect(theirs.status).toBe(404);
    expect(await recordIds(episode.id)).toEqual([record.id]);
  });
});
