import { describe, expect, it } from 'vitest';
import * as episodePlanRoute from '@/app/api/channels/[channel]/episodes/[episodeId]/cut-plan/route';
import * as doneRoute from '@/app/api/channels/[channel]/episodes/[episodeId]/cut-plan/done/route';
import * as pieceRoute from '@/app/api/channels/[channel]/on-hand/[pieceId]/route';
import * as onHandRoute from '@/app/api/channels/[channel]/on-hand/route';
import * as partRoute from '@/app/api/channels/[channel]/parts/[partId]/route';
import * as segmentPlanRoute from '@/app/api/channels/[channel]/segments/[segmentId]/cut-plan/route';
import { db } from '@/db/client';
import type { CutRecordDto } from '@/lib/cut-plans/cut-records';
import type { EpisodePlanDto } from '@/lib/cut-plans/queries';
import { addOnHand } from '@/lib/on-hand/queries';
import type { OnHandPieceDto } from '@/lib/on-hand/schemas';
import { createPart } from '@/lib/parts/queries';
import { createStock } from '@/lib/stock/queries';
import { makeOutlinedEpisode } from './episode-fixtures';
import { call, makeCrew } from './helpers';
import { describeRouteMatrix, type Crew, type RouteCase } from './route-matrix';

const readers = ['host', 'shop_hand', 'editor'] as const;
const keepers = ['host', 'shop_hand'] as const;

const addSpf = (c: Crew) => createStock(c.channel.id, { kind: 'softwood', species: 'SPF', nominal: '2x4', offers: [{ lengthIn: 120, price: 620 }] });
const addPly = (c: Crew) => createStock(c.channel.id, { kind: 'sheet', species: 'Birch plywood', nominal: 0.75, plywood: true, offers: [{ widthIn: 48, lengthIn: 96, price: 6800 }] });
const addPiece = async (c: Crew) => addOnHand(c.channel.id, c.host.id, { stockItemId: (await addSpf(c)).id, lengthIn: 70, widthIn: null, count: 2 });

/** An outlined episode whose level-1 build has 14 legs of 32" on 10 ft 2x4s ($6.20 each). */
async function planned(c: Crew) {
  const { episode, segments } = await makeOutlinedEpisode(c);
  const build = segments.find((s) => s.kind === 'build' && s.level === 1)!;
  const stock = await addSpf(c);
  const part = await createPart(c.channel.id, build.id, { name: 'Leg', quantity: 14, lengthIn: 32, widthIn: null, thicknessIn: null, stockItemId: stock.id, grain: 'any', note: '' });
  return { episode, stock, part };
}

const stockOf = new WeakMap<Crew, string>();

const cases: RouteCase[] = [
  { name: 'GET on hand', fn: onHandRoute.GET, method: 'GET', allowed: [...readers], params: (c) => ({ channel: c.channel.slug }), okStatus: 200 },
  {
    name: 'POST on hand',
    fn: onHandRoute.POST,
    method: 'POST',
    allowed: [...keepers],
    params: async (c) => {
      stockOf.set(c, (await addSpf(c)).id);
      return { channel: c.channel.slug };
    },
    body: (c) => ({ stockItemId: stockOf.get(c), lengthIn: "3' 2\"", count: 2 }),
    badBody: { stockItemId: 'x', lengthIn: '32 3/2', count: 0 },
    okStatus: 201,
  },
  {
    name: 'PATCH on-hand piece',
    fn: pieceRoute.PATCH,
    method: 'PATCH',
    allowed: [...keepers],
    params: async (c) => ({ channel: c.channel.slug, pieceId: (await addPiece(c)).id }),
    body: () => ({ count: 5 }),
    badBody: { count: 1.5 },
    okStatus: 200,
  },
  { name: 'DELETE on-hand piece', fn: pieceRoute.DELETE, method: 'DELETE', allowed: [...keepers], params: async (c) => ({ channel: c.channel.slug, pieceId: (await addPiece(c)).id }), okStatus: 204 },
  {
    name: 'POST cuts done',
    fn: doneRoute.POST,
    method: 'POST',
    allowed: [...keepers],
    params: async (c) => {
      const p = await planned(c);
      stockOf.set(c, p.stock.id);
      return { channel: c.channel.slug, episodeId: p.episode.id };
    },
    body: (c) => ({ stockItemId: stockOf.get(c) ?? '00000000-0000-4000-8000-000000000000' }),
    badBody: { stockItemId: 'x', extra: 1 },
    okStatus: 200,
  },
];

describeRouteMatrix(cases);

const onHandOf = async (c: Crew) => {
  const res = await call(onHandRoute.GET, 'GET', { as: c.editor, params: { channel: c.channel.slug } });
  expect(res.status).toBe(200);
  return res.json.pieces as OnHandPieceDto[];
};
const episodePlan = async (c: Crew, episodeId: string) => {
  const res = await call(episodePlanRoute.GET, 'GET', { as: c.editor, params: { channel: c.channel.slug, episodeId } });
  expect(res.status).toBe(200);
  return res.json as unknown as EpisodePlanDto;
};
const markDone = (c: Crew, episodeId: string, stockItemId: string, as = c.shopHand) => call(doneRoute.POST, 'POST', { as, params: { channel: c.channel.slug, episodeId }, body: { stockItemId } });

describe('on-hand pieces', () => {
  it('adds lumber by its length in shop notation, needs a width for sheets only, and refuses another channel’s stock', async () => {
    const c = await makeCrew();
    const other = await makeCrew();
    const spf = await addSpf(c);
    const ply = await addPly(c);
    const post = (body: unknown) => call(onHandRoute.POST, 'POST', { as: c.shopHand, params: { channel: c.channel.slug }, body });
    const board = await post({ stockItemId: spf.id, lengthIn: "5' 10\"" });
    expect(board.status).toBe(201);
    expect(board.json.piece).toMatchObject({ stockName: '2x4 SPF', kind: 'softwood', lengthIn: 70, widthIn: null, count: 1, source: 'hand', episodeId: null });
    expect((await post({ stockItemId: ply.id, lengthIn: '30' })).json.error?.fields?.widthIn).toMatch(/width/);
    expect((await post({ stockItemId: spf.id, lengthIn: '30', widthIn: '3' })).json.error?.fields?.widthIn).toMatch(/leave the width empty/);
    expect((await post({ stockItemId: (await addSpf(other)).id, lengthIn: '30' })).json.error?.fields?.stockItemId).toBeTruthy();
    expect((await post({ stockItemId: spf.id, lengthIn: '41ft' })).status).toBe(400);
    const sheet = await post({ stockItemId: ply.id, lengthIn: '30', widthIn: '610mm', count: 3 });
    expect(sheet.json.piece).toMatchObject({ kind: 'sheet', lengthIn: 30, count: 3 });
    expect((sheet.json.piece as OnHandPieceDto).widthIn).toBeCloseTo(24.0157, 3);
    expect((await onHandOf(c)).map((p) => p.kind)).toEqual(['softwood', 'sheet']);
    // Another channel's piece is not found, for a change as for a removal.
    const id = (board.json.piece as OnHandPieceDto).id;
    expect((await call(pieceRoute.PATCH, 'PATCH', { as: other.host, params: { channel: other.channel.slug, pieceId: id }, body: { count: 3 } })).status).toBe(404);
    expect((await call(pieceRoute.PATCH, 'PATCH', { as: c.host, params: { channel: c.channel.slug, pieceId: id }, body: { count: 3 } })).json.piece).toMatchObject({ count: 3 });
  });

  it('is pulled by the plan instead of buying, and only what is bought is on the shopping list', async () => {
    const c = await makeCrew();
    const { episode, stock } = await planned(c);
    expect((await episodePlan(c, episode.id)).whole.costCents).toBe(3100);
    const piece = (await call(onHandRoute.POST, 'POST', { as: c.host, params: { channel: c.channel.slug }, body: { stockItemId: stock.id, lengthIn: '120' } })).json.piece as OnHandPieceDto;
    const plan = await episodePlan(c, episode.id);
    const group = plan.whole.groups[0]!;
    // A whole 10 ft board on hand holds three legs: four to buy instead of five.
    expect(group.pulled).toEqual([{ onHandId: piece.id, lengthIn: 120, widthIn: null, count: 1 }]);
    expect(group.purchase).toMatchObject([{ sizeKey: '120', count: 4, costCents: 2480 }]);
    expect(plan.whole.costCents).toBe(2480);
    expect(group.boards.filter((b) => b.onHandId === piece.id)).toHaveLength(1);
  });
});

describe('mark these cuts done', () => {
  it('uses up the pieces pulled, puts the keep-offcuts on hand, records the cuts, and plans nothing twice', async () => {
    const c = await makeCrew();
    const { episode, stock, part } = await planned(c);
    const piece = (await call(onHandRoute.POST, 'POST', { as: c.host, params: { channel: c.channel.slug }, body: { stockItemId: stock.id, lengthIn: '70' } })).json.piece as OnHandPieceDto;
    const done = await markDone(c, episode.id, stock.id);
    expect(done.status).toBe(200);
    expect(done.json.alreadyDone).toBe(false);
    const record = done.json.record as CutRecordDto;
    expect(record.plan.pulled).toEqual([{ onHandId: piece.id, lengthIn: 70, widthIn: null, count: 1 }]);
    expect(record.doneByName).toBe(c.shopHand.name);
    const kept = record.plan.boards.filter((b) => b.keepOffcut);
    expect(kept.length).toBeGreaterThan(0);
    expect(done.json.keptPieces).toBe(kept.length);

    const onHand = await onHandOf(c);
    expect(onHand.find((p) => p.id === piece.id)).toBeUndefined();
    expect(onHand.every((p) => p.source === 'kept' && p.episodeId === episode.id && p.episodeTitle === episode.title)).toBe(true);
    expect(onHand.reduce((a, p) => a + p.count, 0)).toBe(kept.length);
    expect(onHand.flatMap((p) => Array<number>(p.count).fill(p.lengthIn)).sort()).toEqual(kept.map((b) => b.offcutIn).sort());

    // After the move: the plan has nothing left of this stock to cut, so it cannot pull the offcuts it made.
    let plan = await episodePlan(c, episode.id);
    expect(plan.whole.groups).toEqual([]);
    expect(plan.records.map((r) => r.id)).toEqual([record.id]);
    expect(plan.whole.cutCounts[part.id]).toBe(14);
    const segmentPlan = await call(segmentPlanRoute.GET, 'GET', { as: c.editor, params: { channel: c.channel.slug, segmentId: part.segmentId } });
    expect(segmentPlan.json).toMatchObject({ allCut: true, plan: { groups: [], pieceCount: 0 } });

    // Pressed again: nothing changes.
    const again = await markDone(c, episode.id, stock.id, c.host);
    expect(again.json).toMatchObject({ alreadyDone: true, record: null, keptPieces: 0 });
    expect(await onHandOf(c)).toEqual(onHand);

    // A 20" stretcher added later: only it is planned, from a kept offcut now on hand, at no cost.
    await createPart(c.channel.id, part.segmentId, { name: 'Stretcher', quantity: 1, lengthIn: 20, widthIn: null, thicknessIn: null, stockItemId: stock.id, grain: 'any', note: '' });
    plan = await episodePlan(c, episode.id);
    expect(plan.whole.pieceCount).toBe(1);
    const rest = plan.whole.groups[0]!;
    expect(rest.pulled).toHaveLength(1);
    expect(rest.boards.find((b) => b.onHandId)?.pieces.map((p) => p.name)).toEqual(['Stretcher']);
    expect(plan.whole.costCents).toBe(0);
    // Two more legs: planned again, on a board bought (the offcuts are too short for a leg).
    expect((await call(partRoute.PATCH, 'PATCH', { as: c.host, params: { channel: c.channel.slug, partId: part.id }, body: { quantity: 16 } })).status).toBe(200);
    expect((await episodePlan(c, episode.id)).whole.pieceCount).toBe(3);
  });

  it('puts a sheet remnant on hand with its width, and a later part is cut from it', async () => {
    const c = await makeCrew();
    const { episode, segments } = await makeOutlinedEpisode(c);
    const build = segments.find((s) => s.kind === 'build' && s.level === 1)!;
    const ply = await addPly(c);
    // A 30" x 48" top from a 48" x 96" sheet: 96 - 30 - 1/8" kerf = 65 7/8" of the whole width is left.
    const top = await createPart(c.channel.id, build.id, { name: 'Top', quantity: 1, lengthIn: 30, widthIn: 48, thicknessIn: null, stockItemId: ply.id, grain: 'length', note: '' });
    const done = await markDone(c, episode.id, ply.id);
    expect(done.json.keptPieces).toBe(1);
    const onHand = await onHandOf(c);
    expect(onHand).toMatchObject([{ kind: 'sheet', lengthIn: 65.875, widthIn: 48, count: 1, source: 'kept', episodeId: episode.id }]);
    expect((done.json.record as CutRecordDto).plan.boards[0]).toMatchObject({ offcutIn: 65.875, offcutWidthIn: 48, keepOffcut: true });

    await createPart(c.channel.id, top.segmentId, { name: 'Shelf', quantity: 1, lengthIn: 40, widthIn: 46, thicknessIn: null, stockItemId: ply.id, grain: 'length', note: '' });
    const plan = await episodePlan(c, episode.id);
    expect(plan.whole.groups[0]?.pulled).toEqual([{ onHandId: onHand[0]!.id, lengthIn: 65.875, widthIn: 48, count: 1 }]);
    expect(plan.whole.costCents).toBe(0);
  });

  it('happens exactly once when four people press it at the same moment', async () => {
    const c = await makeCrew();
    const { episode, stock } = await planned(c);
    await addOnHand(c.channel.id, c.host.id, { stockItemId: stock.id, lengthIn: 120, widthIn: null, count: 2 });
    const presses = await Promise.all([c.host, c.shopHand, c.host, c.shopHand].map((who) => markDone(c, episode.id, stock.id, who)));
    expect(presses.map((r) => r.status)).toEqual([200, 200, 200, 200]);
    expect(presses.filter((r) => r.json.alreadyDone === false)).toHaveLength(1);
    const records = await db('cut_records').where({ episode_id: episode.id });
    expect(records).toHaveLength(1);
    const record = presses.find((r) => r.json.alreadyDone === false)!.json.record as CutRecordDto;
    expect(record.plan.pulled.reduce((a, p) => a + p.count, 0)).toBe(2);
    const onHand = await onHandOf(c);
    // Both whole boards used once, and each kept offcut on hand once.
    expect(onHand.filter((p) => p.source === 'hand')).toEqual([]);
    expect(onHand.reduce((a, p) => a + p.count, 0)).toBe(record.plan.boards.filter((b) => b.keepOffcut).length);
  });

  it('refuses stock no part of the episode uses, and stock of another channel', async () => {
    const c = await makeCrew();
    const other = await makeCrew();
    const { episode } = await planned(c);
    expect((await markDone(c, episode.id, (await addPly(c)).id)).status).toBe(409);
    expect((await markDone(c, episode.id, (await addSpf(other)).id)).status).toBe(404);
  });
});
