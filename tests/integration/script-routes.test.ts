import { describe, expect, it } from 'vitest';
import * as boardRoute from '@/app/api/channels/[channel]/episodes/[episodeId]/running-order/route';
import * as scriptRoute from '@/app/api/channels/[channel]/segments/[segmentId]/script/route';
import { db } from '@/db/client';
import type { RunningOrderDto } from '@/lib/segments/schemas';
import { makeOutlinedEpisode } from './episode-fixtures';
import { call, makeCrew } from './helpers';
import { describeRouteMatrix, type Crew } from './route-matrix';

const doc = (text: string) => ({ type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text }] }] });
const seg = async (c: Crew) => ({ channel: c.channel.slug, segmentId: (await makeOutlinedEpisode(c)).segments[1]!.id });

describeRouteMatrix([
  { name: 'GET script', fn: scriptRoute.GET, method: 'GET', allowed: ['host', 'shop_hand', 'editor'], params: seg, okStatus: 200 },
  {
    name: 'PUT script',
    fn: scriptRoute.PUT,
    method: 'PUT',
    allowed: ['host'],
    params: seg,
    body: () => ({ doc: doc('Square the stock first.'), baseVersion: 0 }),
    badBody: { doc: { type: 'doc', content: [{ type: 'image', attrs: { src: 'http://x/y.png' } }] }, baseVersion: 0 },
    okStatus: 200,
  },
]);

describe('scripts', () => {
  it('stores the doc, derives plain text and word count, and bumps the version', async () => {
    const c = await makeCrew();
    const params = await seg(c);
    const res = await call(scriptRoute.PUT, 'PUT', { as: c.host, params, body: { doc: doc("Don't rush the half-lap: mark, saw, pare."), baseVersion: 0 } });
    expect(res.status).toBe(200);
    expect(res.json.script).toMatchObject({ version: 1, wordCount: 7 });
    const row = await db('segments').where({ id: params.segmentId }).first('script_text', 'word_count');
    expect(row).toEqual({ script_text: "Don't rush the half-lap: mark, saw, pare.", word_count: 7 });
    const read = await call(scriptRoute.GET, 'GET', { as: c.editor, params });
    expect(read.json.script).toMatchObject({ version: 1, doc: doc("Don't rush the half-lap: mark, saw, pare.") });
  });

  it('refuses a stale save with 409 and keeps what was stored', async () => {
    const c = await makeCrew();
    const params = await seg(c);
    await call(scriptRoute.PUT, 'PUT', { as: c.host, params, body: { doc: doc('First writer.'), baseVersion: 0 } });
    const stale = await call(scriptRoute.PUT, 'PUT', { as: c.host, params, body: { doc: doc('Second writer, from version 0.'), baseVersion: 0 } });
    expect(stale.status).toBe(409);
    expect(stale.json.error?.message).toMatch(/someone else changed/i);
    const read = await call(scriptRoute.GET, 'GET', { as: c.host, params });
    expect(read.json.script).toMatchObject({ version: 1, doc: doc('First writer.') });
    const overwrite = await call(scriptRoute.PUT, 'PUT', { as: c.host, params, body: { doc: doc('Second writer, on purpose.'), baseVersion: 1 } });
    expect(overwrite.json.script).toMatchObject({ version: 2 });
  });

  it('two saves from the same version at once: exactly one wins', async () => {
    const c = await makeCrew();
    const params = await seg(c);
    const results = await Promise.all(
      ['a', 'b', 'c', 'd'].map((w) => call(scriptRoute.PUT, 'PUT', { as: c.host, params, body: { doc: doc(`Writer ${w}.`), baseVersion: 0 } })),
    );
    expect(results.map((r) => r.status).sort()).toEqual([200, 409, 409, 409]);
  });

  it('refuses nodes and marks the editor does not make, with a field error, and changes nothing', async () => {
    const c = await makeCrew();
    const params = await seg(c);
    const link = { type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text: 'x', marks: [{ type: 'link', attrs: { href: 'javascript:alert(1)' } }] }] }] };
    const res = await call(scriptRoute.PUT, 'PUT', { as: c.host, params, body: { doc: link, baseVersion: 0 } });
    expect(res.status).toBe(400);
    expect(Object.keys(res.json.error?.fields ?? {}).some((k) => k.startsWith('doc'))).toBe(true);
    const nested = { type: 'doc', content: [{ type: 'listItem', content: [{ type: 'paragraph' }] }] };
    expect((await call(scriptRoute.PUT, 'PUT', { as: c.host, params, body: { doc: nested, baseVersion: 0 } })).status).toBe(400);
    expect((await call(scriptRoute.GET, 'GET', { as: c.host, params })).json.script).toMatchObject({ version: 0, doc: null });
  });

  it('the forecast changes with the words', async () => {
    const c = await makeCrew();
    const { episode, segments } = await makeOutlinedEpisode(c);
    const params = { channel: c.channel.slug, segmentId: segments[1]!.id };
    await call(scriptRoute.PUT, 'PUT', { as: c.host, params, body: { doc: doc('word '.repeat(300).trim()), baseVersion: 0 } });
    const b = (await call(boardRoute.GET, 'GET', { as: c.shopHand, params: { channel: c.channel.slug, episodeId: episode.id } })).json as unknown as RunningOrderDto;
    // 300 words at 150 wpm = 120 s.
    expect(b.forecast.totalSeconds).toBe(120);
    expect(b.segments[1]).toMatchObject({ hasScript: true, wordCount: 300 });
  });
});
