import { describe, expect, it } from 'vitest';
import * as segmentShotsRoute from '@/app/api/channels/[channel]/segments/[segmentId]/shots/route';
import * as bulkRoute from '@/app/api/channels/[channel]/segments/[segmentId]/shots/bulk/route';
import * as toolsRoute from '@/app/api/channels/[channel]/segments/[segmentId]/tools/route';
import * as reviewRoute from '@/app/api/channels/[channel]/segments/[segmentId]/safety-review/route';
import * as boardRoute from '@/app/api/channels/[channel]/shots/route';
import * as mineRoute from '@/app/api/channels/[channel]/shots/mine/route';
import * as shotRoute from '@/app/api/channels/[channel]/shots/[shotId]/route';
import * as restoreRoute from '@/app/api/channels/[channel]/shots/[shotId]/restore/route';
import * as duplicateRoute from '@/app/api/channels/[channel]/shots/[shotId]/duplicate/route';
import * as positionRoute from '@/app/api/channels/[channel]/shots/[shotId]/position/route';
import * as stateRoute from '@/app/api/channels/[channel]/shots/[shotId]/state/route';
import * as shotMailRoute from '@/app/api/channels/[channel]/shot-mail/route';
import * as boardOfEpisodeRoute from '@/app/api/channels/[channel]/episodes/[episodeId]/running-order/route';
import { db } from '@/db/client';
import { deleteShot } from '@/lib/shots/queries';
import type { BoardShotDto, ShotDto } from '@/lib/shots/schemas';
import { call, makeCrew } from './helpers';
import { describeRouteMatrix, type Crew, type RouteCase } from './route-matrix';
import { makeShotEpisode } from './shot-fixtures';

const all = ['host', 'shop_hand', 'editor'] as const;
const crewHands = ['host', 'shop_hand'] as const;
const ch = (c: Crew) => ({ channel: c.channel.slug });

const cases: RouteCase[] = [
  { name: 'GET segment shots', fn: segmentShotsRoute.GET, method: 'GET', allowed: [...all], params: async (c) => ({ ...ch(c), segmentId: (await makeShotEpisode(c)).build.id }), okStatus: 200 },
  {
    name: 'POST shot',
    fn: segmentShotsRoute.POST,
    method: 'POST',
    allowed: ['host'],
    params: async (c) => ({ ...ch(c), segmentId: (await makeShotEpisode(c)).build.id }),
    body: () => ({ description: 'Plane the seat', framing: 'close_up' }),
    badBody: { description: '', framing: 'dutch', camera: 'drone', dueDate: '2027-02-30' },
    okStatus: 201,
  },
  {
    name: 'POST shots in bulk',
    fn: bulkRoute.POST,
    method: 'POST',
    allowed: ['host'],
    params: async (c) => ({ ...ch(c), segmentId: (await makeShotEpisode(c)).build.id }),
    body: () => ({ text: 'CU: glue squeeze-out\nWide: clamp up' }),
    badBody: { text: 'CU:\n', assigneeId: 'nobody' },
    okStatus: 201,
  },
  {
    name: 'PATCH shot (assigned to the shop hand)',
    fn: shotRoute.PATCH,
    method: 'PATCH',
    allowed: [...crewHands],
    params: async (c) => ({ ...ch(c), shotId: (await makeShotEpisode(c)).shopShot.id }),
    body: () => ({ notes: 'Use the 50 mm lens' }),
    badBody: { description: '   ', dueDate: 'tomorrow' },
    okStatus: 200,
  },
  { name: 'GET shot', fn: shotRoute.GET, method: 'GET', allowed: [...all], params: async (c) => ({ ...ch(c), shotId: (await makeShotEpisode(c)).shopShot.id }), okStatus: 200 },
  { name: 'DELETE shot', fn: shotRoute.DELETE, method: 'DELETE', allowed: ['host'], params: async (c) => ({ ...ch(c), shotId: (await makeShotEpisode(c)).shopShot.id }), okStatus: 204 },
  {
    name: 'POST restore shot',
    fn: restoreRoute.POST,
    method: 'POST',
    allowed: ['host'],
    params: async (c) => {
      const { shopShot } = await makeShotEpisode(c);
      await deleteShot(c.channel.id, shopShot.id);
      return { ...ch(c), shotId: shopShot.id };
    },
    okStatus: 200,
  },
  { name: 'POST duplicate shot', fn: duplicateRoute.POST, method: 'POST', allowed: ['host'], params: async (c) => ({ ...ch(c), shotId: (await makeShotEpisode(c)).shopShot.id }), okStatus: 201 },
  {
    name: 'PUT shot position',
    fn: positionRoute.PUT,
    method: 'PUT',
    allowed: ['host'],
    params: async (c) => ({ ...ch(c), shotId: (await makeShotEpisode(c)).shopShot.id }),
    body: () => ({ afterId: null }),
    badBody: { afterId: 'first' },
    okStatus: 200,
  },
  {
    name: 'PUT shot state',
    fn: stateRoute.PUT,
    method: 'PUT',
    allowed: [...crewHands],
    params: async (c) => ({ ...ch(c), shotId: (await makeShotEpisode(c)).hostShot.id }),
    body: () => ({ state: 'retake', reason: 'Soft focus' }),
    badBody: { state: 'retake', reason: '' },
    okStatus: 200,
  },
  { name: 'GET shop board', fn: boardRoute.GET, method: 'GET', allowed: [...all], params: (c) => ch(c), okStatus: 200 },
  { name: 'GET my shots', fn: mineRoute.GET, method: 'GET', allowed: [...all], params: (c) => ch(c), okStatus: 200 },
  { name: 'GET segment tools', fn: toolsRoute.GET, method: 'GET', allowed: [...all], params: async (c) => ({ ...ch(c), segmentId: (await makeShotEpisode(c)).build.id }), okStatus: 200 },
  {
    name: 'PUT segment tools',
    fn: toolsRoute.PUT,
    method: 'PUT',
    allowed: ['host'],
    params: async (c) => ({ ...ch(c), segmentId: (await makeShotEpisode(c)).build.id }),
    body: () => ({ tools: ['table_saw', 'chisels'] }),
    badBody: { tools: ['lathe', 'other'], otherTool: '' },
    okStatus: 200,
  },
  {
    name: 'PUT safety review',
    fn: reviewRoute.PUT,
    method: 'PUT',
    allowed: ['host'],
    params: async (c) => {
      const { build } = await makeShotEpisode(c);
      await db('segments').where({ id: build.id }).update({ tools: JSON.stringify(['router']) });
      return { ...ch(c), segmentId: build.id };
    },
    body: () => ({ reviewed: true }),
    badBody: { reviewed: 'yes' },
    okStatus: 200,
  },
  { name: 'GET shot mail waiting', fn: shotMailRoute.GET, method: 'GET', allowed: ['host'], params: (c) => ch(c), okStatus: 200 },
];

describeRouteMatrix(cases);

const as = async <T>(res: Promise<{ status: number; json: unknown }>, status: number): Promise<T> => {
  const r = await res;
  expect(r.status, JSON.stringify(r.json)).toBe(status);
  return r.json as T;
};

describe('shot list', () => {
  it('adds pasted shots in order with guessed framing and camera, numbered after the existing ones', async () => {
    const c = await makeCrew();
    const { build } = await makeShotEpisode(c);
    const { shots } = await as<{ shots: ShotDto[] }>(
      call(bulkRoute.POST, 'POST', { as: c.host, params: { ...ch(c), segmentId: build.id }, body: { text: 'CU: glue squeeze-out\n- Overhead / Top cam: layout\nClamp up', assigneeId: c.shopHand.id } }),
      201,
    );
    expect(shots.map((s) => [s.number, s.framing, s.camera, s.description, s.assigneeId])).toEqual([
      [3, 'close_up', 'a_cam', 'glue squeeze-out', c.shopHand.id],
      [4, 'overhead', 'top_cam', 'layout', c.shopHand.id],
      [5, 'medium', 'a_cam', 'Clamp up', c.shopHand.id],
    ]);
  });

  it('refuses the whole paste when one line is wrong, naming the line', async () => {
    const c = await makeCrew();
    const { build } = await makeShotEpisode(c);
    const res = await call(bulkRoute.POST, 'POST', { as: c.host, params: { ...ch(c), segmentId: build.id }, body: { text: 'fine\nCU:' } });
    expect(res.status).toBe(400);
    expect(res.json.error?.fields?.text).toMatch(/Line 2/);
    const list = await as<{ shots: ShotDto[] }>(call(segmentShotsRoute.GET, 'GET', { as: c.host, params: { ...ch(c), segmentId: build.id } }), 200);
    expect(list.shots).toHaveLength(2);
  });

  it('refuses an editor or someone outside the crew as assignee', async () => {
    const c = await makeCrew();
    const { build } = await makeShotEpisode(c);
    const other = await makeCrew();
    for (const assigneeId of [c.editor.id, other.host.id]) {
      const res = await call(segmentShotsRoute.POST, 'POST', { as: c.host, params: { ...ch(c), segmentId: build.id }, body: { description: 'x', assigneeId } });
      expect(res.status).toBe(400);
      expect(res.json.error?.fields?.assigneeId).toMatch(/Host or Shop hand/);
    }
  });

  it('duplicates right after the original, reorders, and deletes with undo', async () => {
    const c = await makeCrew();
    const { build, shopShot, hostShot } = await makeShotEpisode(c);
    const params = (shotId: string) => ({ ...ch(c), shotId });
    const copy = (await as<{ shot: ShotDto }>(call(duplicateRoute.POST, 'POST', { as: c.host, params: params(shopShot.id) }), 201)).shot;
    const order = async () => (await as<{ shots: ShotDto[] }>(call(segmentShotsRoute.GET, 'GET', { as: c.editor, params: { ...ch(c), segmentId: build.id } }), 200)).shots.map((s) => s.id);
    expect(await order()).toEqual([shopShot.id, copy.id, hostShot.id]);
    await as(call(positionRoute.PUT, 'PUT', { as: c.host, params: params(shopShot.id), body: { afterId: hostShot.id } }), 200);
    expect(await order()).toEqual([copy.id, hostShot.id, shopShot.id]);
    await as(call(shotRoute.DELETE, 'DELETE', { as: c.host, params: params(hostShot.id) }), 204);
    expect(await order()).toEqual([copy.id, shopShot.id]);
    const restored = (await as<{ shot: ShotDto }>(call(restoreRoute.POST, 'POST', { as: c.host, params: params(hostShot.id) }), 200)).shot;
    expect(restored.number).toBe(2);
    expect(await order()).toEqual([copy.id, hostShot.id, shopShot.id]);
    expect((await call(restoreRoute.POST, 'POST', { as: c.host, params: params(hostShot.id) })).status).toBe(404);
  });

  it('lets a shop hand edit only their own shots, and never reassign them', async () => {
    const c = await makeCrew();
    const { shopShot, hostShot } = await makeShotEpisode(c);
    const own = await call(shotRoute.PATCH, 'PATCH', { as: c.shopHand, params: { ...ch(c), shotId: shopShot.id }, body: { description: 'Crosscut legs, stop block' } });
    expect(own.status).toBe(200);
    const others = await call(shotRoute.PATCH, 'PATCH', { as: c.shopHand, params: { ...ch(c), shotId: hostShot.id }, body: { notes: 'mine now' } });
    expect(others.status).toBe(403);
    const handOn = await call(shotRoute.PATCH, 'PATCH', { as: c.shopHand, params: { ...ch(c), shotId: shopShot.id }, body: { assigneeId: c.host.id } });
    expect(handOn.status).toBe(403);
    const row = await db('shots').where({ id: hostShot.id }).first('notes', 'assignee_id');
    expect(row).toEqual({ notes: '', assignee_id: c.host.id });
  });
});

describe('shot state and the shop board', () => {
  it('records who changed the state and when, and keeps the retake reason', async () => {
    const c = await makeCrew();
    const { shopShot } = await makeShotEpisode(c);
    const params = { ...ch(c), shotId: shopShot.id };
    const retake = (await as<{ shot: BoardShotDto }>(call(stateRoute.PUT, 'PUT', { as: c.shopHand, params, body: { state: 'retake', reason: 'Blade guard hid the cut' } }), 200)).shot;
    expect(retake).toMatchObject({ state: 'retake', retakeReason: 'Blade guard hid the cut', stateChangedBy: c.shopHand.name });
    expect(retake.stateChangedAt).not.toBeNull();
    await as(call(stateRoute.PUT, 'PUT', { as: c.host, params, body: { state: 'captured' } }), 200);
    const { shot, history } = await as<{ shot: BoardShotDto; history: { from: string; to: string; reason: string | null; by: string }[] }>(
      call(shotRoute.GET, 'GET', { as: c.editor, params }),
      200,
    );
    expect(shot.retakeReason).toBeNull();
    expect(history).toEqual([
      expect.objectContaining({ from: 'planned', to: 'retake', reason: 'Blade guard hid the cut', by: c.shopHand.name }),
      expect.objectContaining({ from: 'retake', to: 'captured', reason: null, by: c.host.name }),
    ]);
  });

  it('holds Captured on a power-tool segment until a Host ticks Safety reviewed, and a new tool list asks again', async () => {
    const c = await makeCrew();
    const { build, shopShot } = await makeShotEpisode(c);
    const seg = { ...ch(c), segmentId: build.id };
    await as(call(toolsRoute.PUT, 'PUT', { as: c.host, params: seg, body: { tools: ['table_saw', 'chisels'] } }), 200);
    const board = await as<{ shots: BoardShotDto[]; pendingSafety: { segmentId: string }[] }>(call(boardRoute.GET, 'GET', { as: c.shopHand, params: ch(c) }), 200);
    expect(board.pendingSafety.map((p) => p.segmentId)).toEqual([build.id]);
    expect(board.shots.every((s) => s.safetyPending)).toBe(true);
    const held = await call(stateRoute.PUT, 'PUT', { as: c.shopHand, params: { ...ch(c), shotId: shopShot.id }, body: { state: 'captured' } });
    expect(held.status).toBe(409);
    expect(held.json.error?.message).toMatch(/safety review/);
    // Retake needs no review: nothing is cut for a note.
    expect((await call(stateRoute.PUT, 'PUT', { as: c.shopHand, params: { ...ch(c), shotId: shopShot.id }, body: { state: 'retake', reason: 'x' } })).status).toBe(200);
    expect((await call(reviewRoute.PUT, 'PUT', { as: c.shopHand, params: seg, body: { reviewed: true } })).status).toBe(403);
    const reviewed = await as<{ safety: { reviewedBy: string } }>(call(reviewRoute.PUT, 'PUT', { as: c.host, params: seg, body: { reviewed: true } }), 200);
    expect(reviewed.safety.reviewedBy).toBe(c.host.name);
    expect((await call(stateRoute.PUT, 'PUT', { as: c.shopHand, params: { ...ch(c), shotId: shopShot.id }, body: { state: 'captured' } })).status).toBe(200);
    const changed = await as<{ safety: { reviewedAt: string | null } }>(call(toolsRoute.PUT, 'PUT', { as: c.host, params: seg, body: { tools: ['table_saw', 'router'] } }), 200);
    expect(changed.safety.reviewedAt).toBeNull();
  });

  it('refuses a review for a segment without power tools', async () => {
    const c = await makeCrew();
    const { build } = await makeShotEpisode(c);
    await as(call(toolsRoute.PUT, 'PUT', { as: c.host, params: { ...ch(c), segmentId: build.id }, body: { tools: ['chisels'] } }), 200);
    const res = await call(reviewRoute.PUT, 'PUT', { as: c.host, params: { ...ch(c), segmentId: build.id }, body: { reviewed: true } });
    expect(res.status).toBe(400);
    expect(res.json.error?.fields?.reviewed).toMatch(/no power tools/);
  });

  it('places a dropped card after the card above it, filters the board, and counts progress on the episode board', async () => {
    const c = await makeCrew();
    const { episode, shopShot, hostShot } = await makeShotEpisode(c);
    await as(call(stateRoute.PUT, 'PUT', { as: c.host, params: { ...ch(c), shotId: shopShot.id }, body: { state: 'planned', afterId: hostShot.id } }), 200);
    const path = (q: string) => `/api/test?${q}`;
    const board = await as<{ shots: BoardShotDto[] }>(call(boardRoute.GET, 'GET', { as: c.editor, params: ch(c), path: path(`episodeId=${episode.id}`) }), 200);
    expect(board.shots.map((s) => s.id)).toEqual([hostShot.id, shopShot.id]);
    const mine = await as<{ shots: BoardShotDto[] }>(call(boardRoute.GET, 'GET', { as: c.editor, params: ch(c), path: path(`assigneeId=${c.shopHand.id}&camera=a_cam`) }), 200);
    expect(mine.shots.map((s) => s.id)).toEqual([shopShot.id]);
    expect((await call(boardRoute.GET, 'GET', { as: c.editor, params: ch(c), path: path('camera=drone') })).status).toBe(400);
    await as(call(stateRoute.PUT, 'PUT', { as: c.host, params: { ...ch(c), shotId: shopShot.id }, body: { state: 'captured', afterId: null } }), 200);
    await as(call(stateRoute.PUT, 'PUT', { as: c.host, params: { ...ch(c), shotId: hostShot.id }, body: { state: 'retake', reason: 'Noise' } }), 200);
    const running = await as<{ shotProgress: Record<string, { total: number; captured: number; retake: number }> }>(
      call(boardOfEpisodeRoute.GET, 'GET', { as: c.editor, params: { ...ch(c), episodeId: episode.id } }),
      200,
    );
    expect(Object.values(running.shotProgress)).toEqual([{ total: 2, captured: 1, retake: 1 }]);
  });

  it('lists my shots across episodes by date', async () => {
    const c = await makeCrew();
    await makeShotEpisode(c);
    await makeShotEpisode(c);
    const { shots } = await as<{ shots: BoardShotDto[] }>(call(mineRoute.GET, 'GET', { as: c.shopHand, params: ch(c) }), 200);
    expect(shots).toHaveLength(2);
    expect(shots.every((s) => s.assigneeId === c.shopHand.id && s.dueDate === '2027-01-16')).toBe(true);
  });
});
