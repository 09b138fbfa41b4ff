import { describe, expect, it } from 'vitest';
import * as boardRoute from '@/app/api/channels/[channel]/episodes/[episodeId]/running-order/route';
import * as episodeRoute from '@/app/api/channels/[channel]/episodes/[episodeId]/route';
import * as segmentsRoute from '@/app/api/channels/[channel]/episodes/[episodeId]/segments/route';
import * as starterRoute from '@/app/api/channels/[channel]/episodes/[episodeId]/starter/route';
import * as episodesRoute from '@/app/api/channels/[channel]/episodes/route';
import * as positionRoute from '@/app/api/channels/[channel]/segments/[segmentId]/position/route';
import * as segmentRoute from '@/app/api/channels/[channel]/segments/[segmentId]/route';
import { db } from '@/db/client';
import type { RunningOrderDto } from '@/lib/segments/schemas';
import { makeEpisode, makeOutlinedEpisode } from './episode-fixtures';
import { addMember, call, makeCrew, makeUser } from './helpers';
import { describeRouteMatrix, type RouteCase } from './route-matrix';

const readers = ['host', 'shop_hand', 'editor'] as const;
const ep = async (c: Parameters<typeof makeEpisode>[0]) => ({ channel: c.channel.slug, episodeId: (await makeEpisode(c)).id });
const seg = async (c: Parameters<typeof makeEpisode>[0]) => {
  const { segments } = await makeOutlinedEpisode(c);
  return { channel: c.channel.slug, segmentId: segments[4]!.id };
};

const cases: RouteCase[] = [
  { name: 'GET episodes', fn: episodesRoute.GET, method: 'GET', allowed: [...readers], params: (c) => ({ channel: c.channel.slug }), okStatus: 200 },
  {
    name: 'POST episode',
    fn: episodesRoute.POST,
    method: 'POST',
    allowed: ['host'],
    params: (c) => ({ channel: c.channel.slug }),
    body: () => ({ title: 'Cherry side table', targetSeconds: '14:30', stage: 'idea' }),
    badBody: { title: '', targetSeconds: '99:99', shootDate: '2027-02-30' },
    okStatus: 201,
  },
  { name: 'GET episode', fn: episodeRoute.GET, method: 'GET', allowed: [...readers], params: ep, okStatus: 200 },
  { name: 'PATCH episode', fn: episodeRoute.PATCH, method: 'PATCH', allowed: ['host'], params: ep, body: () => ({ stage: 'shoot' }), badBody: { stage: 'filming' }, okStatus: 200 },
  { name: 'DELETE episode', fn: episodeRoute.DELETE, method: 'DELETE', allowed: ['host'], params: ep, okStatus: 204 },
  { name: 'POST starter', fn: starterRoute.POST, method: 'POST', allowed: ['host'], params: ep, okStatus: 201 },
  { name: 'GET board', fn: boardRoute.GET, method: 'GET', allowed: [...readers], params: ep, okStatus: 200 },
  {
    name: 'POST segment',
    fn: segmentsRoute.POST,
    method: 'POST',
    allowed: ['host'],
    params: ep,
    body: () => ({ title: 'Glue-up montage', kind: 'interlude' }),
    badBody: { title: 'x', kind: 'outro', level: 2 },
    okStatus: 201,
  },
  { name: 'GET segment', fn: segmentRoute.GET, method: 'GET', allowed: [...readers], params: seg, okStatus: 200 },
  { name: 'PATCH segment', fn: segmentRoute.PATCH, method: 'PATCH', allowed: ['host'], params: seg, body: () => ({ actionSeconds: '1:30' }), badBody: { title: '' }, okStatus: 200 },
  { name: 'DELETE segment', fn: segmentRoute.DELETE, method: 'DELETE', allowed: ['host'], params: seg, okStatus: 204 },
  { name: 'PUT position', fn: positionRoute.PUT, method: 'PUT', allowed: ['host'], params: seg, body: () => ({ afterId: null }), badBody: { afterId: 'third' }, okStatus: 200 },
];

describeRouteMatrix(cases);

async function board(c: Awaited<ReturnType<typeof makeCrew>>, episodeId: string): Promise<RunningOrderDto> {
  const res = await call(boardRoute.GET, 'GET', { as: c.editor, params: { channel: c.channel.slug, episodeId } });
  expect(res.status).toBe(200);
  return res.json as unknown as RunningOrderDto;
}

describe('episodes', () => {
  it('the three-level starter lays out cold open, three builds, sponsor read and outro', async () => {
    const c = await makeCrew();
    const episode = await makeEpisode(c);
    await call(starterRoute.POST, 'POST', { as: c.host, params: { channel: c.channel.slug, episodeId: episode.id } });
    const b = await board(c, episode.id);
    expect(b.segments.map((s) => [s.kind, s.level])).toEqual([
      ['cold_open', null],
      ['build', 1],
      ['build', 2],
      ['build', 3],
      ['sponsor_read', null],
      ['outro', null],
    ]);
    expect(b.segments[1]?.title).toContain('Starter');
    expect(b.canEdit).toBe(false);
  });

  it('lists with segment counts and the forecast, filtered by stage', async () => {
    const c = await makeCrew();
    const { episode, segments } = await makeOutlinedEpisode(c);
    await db('segments').where({ id: segments[0]!.id }).update({ word_count: 300, action_seconds: 10 });
    await makeEpisode(c, 'Just an idea');
    const all = await call(episodesRoute.GET, 'GET', { as: c.shopHand, params: { channel: c.channel.slug } });
    const listed = (all.json.episodes as { id: string; segmentCount: number; forecastSeconds: number }[]).find((e) => e.id === episode.id);
    // 300 words at the default 150 wpm = 120 s, plus 10 s of action.
    expect(listed).toMatchObject({ segmentCount: 6, forecastSeconds: 130 });
    const ideas = await call(episodesRoute.GET, 'GET', { as: c.host, params: { channel: c.channel.slug }, path: '/api/x?stage=idea' });
    expect(ideas.json.episodes).toEqual([]);
    const bad = await call(episodesRoute.GET, 'GET', { as: c.host, params: { channel: c.channel.slug }, path: '/api/x?stage=filming' });
    expect(bad.status).toBe(400);
  });

  it('refuses a publish date before the shoot date, also when only one of them changes', async () => {
    const c = await makeCrew();
    const params = { channel: c.channel.slug, episodeId: (await makeEpisode(c)).id };
    expect((await call(episodeRoute.PATCH, 'PATCH', { as: c.host, params, body: { shootDate: '2027-03-10', publishDate: '2027-03-01' } })).status).toBe(400);
    expect((await call(episodeRoute.PATCH, 'PATCH', { as: c.host, params, body: { shootDate: '2027-03-10' } })).status).toBe(200);
    const res = await call(episodeRoute.PATCH, 'PATCH', { as: c.host, params, body: { publishDate: '2027-03-01' } });
    expect(res.status).toBe(400);
    expect(res.json.error?.fields?.publishDate).toBeTruthy();
  });

  it('delete removes its segments in one go; archive keeps them', async () => {
    const c = await makeCrew();
    const { episode } = await makeOutlinedEpisode(c);
    const params = { channel: c.channel.slug, episodeId: episode.id };
    const archived = await call(episodeRoute.PATCH, 'PATCH', { as: c.host, params, body: { archived: true } });
    expect(archived.json.episode).toMatchObject({ archived: true });
    expect(await db('segments').where({ episode_id: episode.id }).count<{ count: string }[]>('* as count')).toEqual([{ count: '6' }]);
    expect((await call(episodeRoute.DELETE, 'DELETE', { as: c.host, params })).status).toBe(204);
    expect(await db('segments').where({ episode_id: episode.id }).first()).toBeUndefined();
  });
});

describe('segments', () => {
  it('changing a Build to another kind drops its level; a level on a non-Build is refused', async () => {
    const c = await makeCrew();
    const { segments } = await makeOutlinedEpisode(c);
    const params = { channel: c.channel.slug, segmentId: segments[2]!.id };
    const res = await call(segmentRoute.PATCH, 'PATCH', { as: c.host, params, body: { kind: 'interlude' } });
    expect(res.json.segment).toMatchObject({ kind: 'interlude', level: null });
    const bad = await call(segmentRoute.PATCH, 'PATCH', { as: c.host, params, body: { level: 2 } });
    expect(bad.status).toBe(400);
    expect(bad.json.error?.fields?.level).toBeTruthy();
  });

  it('moving the sponsor read above build level 2 writes one row and the order sticks', async () => {
    const c = await makeCrew();
    const { episode, segments } = await makeOutlinedEpisode(c);
    const [open, l1, l2, l3, sponsor, outro] = segments;
    const before = await db('segments').where({ episode_id: episode.id }).select('id', 'position', 'updated_at');
    const res = await call(positionRoute.PUT, 'PUT', { as: c.host, params: { channel: c.channel.slug, segmentId: sponsor!.id }, body: { afterId: l1!.id } });
    expect(res.status).toBe(200);
    const after = await db('segments').where({ episode_id: episode.id }).select('id', 'position', 'updated_at');
    const changed = after.filter((a) => before.find((b) => b.id === a.id)?.position !== a.position);
    expect(changed.map((r) => r.id)).toEqual([sponsor!.id]);
    const b = await board(c, episode.id);
    expect(b.segments.map((s) => s.id)).toEqual([open!.id, l1!.id, sponsor!.id, l2!.id, l3!.id, outro!.id]);

    const first = await call(positionRoute.PUT, 'PUT', { as: c.host, params: { channel: c.channel.slug, segmentId: outro!.id }, body: { afterId: null } });
    expect(first.status).toBe(200);
    expect((await board(c, episode.id)).segments[0]?.id).toBe(outro!.id);
  });

  it('refuses to follow a segment of another episode, or itself', async () => {
    const c = await makeCrew();
    const a = await makeOutlinedEpisode(c);
    const b = await makeOutlinedEpisode(c);
    const params = { channel: c.channel.slug, segmentId: a.segments[0]!.id };
    expect((await call(positionRoute.PUT, 'PUT', { as: c.host, params, body: { afterId: b.segments[0]!.id } })).status).toBe(400);
    expect((await call(positionRoute.PUT, 'PUT', { as: c.host, params, body: { afterId: a.segments[0]!.id } })).status).toBe(400);
  });

  it('concurrent moves end in one consistent order: no duplicate keys, no lost segment', async () => {
    const c = await makeCrew();
    const { episode, segments } = await makeOutlinedEpisode(c);
    const ids = segments.map((s) => s.id);
    const cohost = await makeUser('cohost');
    await addMember(c.channel, cohost, 'host');
    // Twenty moves at once, all into the same few gaps, from two "people".
    const moves = Array.from({ length: 20 }, (_, i) => ({
      as: i % 2 ? c.host : cohost,
      segmentId: ids[i % ids.length]!,
      afterId: i % 3 === 0 ? null : ids[(i * 7 + 1) % ids.length]!,
    })).filter((m) => m.afterId !== m.segmentId);
    const results = await Promise.all(
      moves.map((m) => call(positionRoute.PUT, 'PUT', { as: m.as, params: { channel: c.channel.slug, segmentId: m.segmentId }, body: { afterId: m.afterId } })),
    );
    expect(results.every((r) => r.status === 200)).toBe(true);
    const rows: { id: string; position: string }[] = await db('segments').where({ episode_id: episode.id }).select('id', 'position');
    expect(rows).toHaveLength(6);
    expect(new Set(rows.map((r) => r.position)).size).toBe(6);
    expect(new Set(rows.map((r) => r.id))).toEqual(new Set(ids));
  });

  it('the board forecast follows word counts, action time and the channel speaking rate', async () => {
    const c = await makeCrew();
    const { episode, segments } = await makeOutlinedEpisode(c);
    await db('segments').where({ id: segments[1]!.id }).update({ word_count: 300 });
    await call(segmentRoute.PATCH, 'PATCH', { as: c.host, params: { channel: c.channel.slug, segmentId: segments[1]!.id }, body: { actionSeconds: '2:00' } });
    let b = await board(c, episode.id);
    expect(b.forecast.segments[1]).toMatchObject({ startSeconds: 0, spokenSeconds: 120, actionSeconds: 120, totalSeconds: 240 });
    expect(b.forecast.segments[2]).toMatchObject({ startSeconds: 240 });
    expect(b.forecast.totalSeconds).toBe(240);
    await db('channels').where({ id: c.channel.id }).update({ speaking_rate_wpm: 100 });
    b = await board(c, episode.id);
    expect(b.forecast.totalSeconds).toBe(180 + 120);
  });
});
