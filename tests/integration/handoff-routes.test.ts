import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import * as diffRoute from '@/app/api/channels/[channel]/episodes/[episodeId]/handoffs/diff/route';
import * as exportRoute from '@/app/api/channels/[channel]/episodes/[episodeId]/handoffs/[version]/exports/[format]/route';
import * as versionRoute from '@/app/api/channels/[channel]/episodes/[episodeId]/handoffs/[version]/route';
import * as segmentPackageRoute from '@/app/api/channels/[channel]/episodes/[episodeId]/handoffs/[version]/segments/[segmentId]/package/route';
import * as handoffsRoute from '@/app/api/channels/[channel]/episodes/[episodeId]/handoffs/route';
import { NextRequest } from 'next/server';
import { db } from '@/db/client';
import type { HandoffDiff } from '@/lib/handoffs/diff';
import { checkOtio } from '@/lib/handoffs/otio-check';
import { lockHandoff } from '@/lib/handoffs/queries';
import type { HandoffSummaryDto } from '@/lib/handoffs/schemas';
import { saveScript } from '@/lib/scripts/queries';
import { moveSegment } from '@/lib/segments/queries';
import { changeShotState } from '@/lib/shots/queries';
import { addThreeLevelBuild } from '@/lib/segments/queries';
import { createShot } from '@/lib/shots/queries';
import { hostMember, makeLockedEpisode, storeClip } from './handoff-fixtures';
import { mailAfterEverythingSent, waitForMail } from '../support/mail-catcher';
import { BASE, call, makeCrew, sessionCookie } from './helpers';
import { describeRouteMatrix, type Crew, type RouteCase } from './route-matrix';
import { makeShotEpisode } from './shot-fixtures';

const ch = (c: Crew) => ({ channel: c.channel.slug });
const doc = (text: string) => ({ type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text }] }] });

const cases: RouteCase[] = [
  { name: 'GET handoffs', fn: handoffsRoute.GET, method: 'GET', allowed: ['host', 'editor'], params: async (c) => ({ ...ch(c), episodeId: (await makeShotEpisode(c)).episode.id }), okStatus: 200 },
  {
    name: 'POST handoffs (lock for edit)',
    fn: handoffsRoute.POST,
    method: 'POST',
    allowed: ['host'],
    params: async (c) => ({ ...ch(c), episodeId: (await makeShotEpisode(c)).episode.id }),
    body: () => ({ note: 'Cut it tight' }),
    badBody: { note: 42 },
    okStatus: 201,
  },
  {
    name: 'GET handoff version',
    fn: versionRoute.GET,
    method: 'GET',
    allowed: ['host', 'editor'],
    params: async (c) => ({ ...ch(c), episodeId: (await makeLockedEpisode(c)).episode.id, version: '1' }),
    okStatus: 200,
  },
  {
    name: 'GET handoff diff',
    fn: diffRoute.GET,
    method: 'GET',
    allowed: ['host', 'editor'],
    params: async (c) => ({ ...ch(c), episodeId: (await makeLockedEpisode(c)).episode.id }),
    path: '/api/x?from=1&to=1',
    okStatus: 200,
  },
  {
    name: 'GET handoff export (csv)',
    fn: exportRoute.GET,
    method: 'GET',
    allowed: ['host', 'editor'],
    params: async (c) => ({ ...ch(c), episodeId: (await makeLockedEpisode(c)).episode.id, version: '1', format: 'csv' }),
    okStatus: 200,
  },
  {
    name: 'GET segment package',
    fn: segmentPackageRoute.GET,
    method: 'GET',
    allowed: ['host', 'editor'],
    params: async (c) => {
      const ep = await makeLockedEpisode(c);
      return { ...ch(c), episodeId: ep.episode.id, version: '1', segmentId: ep.build.id };
    },
    okStatus: 200,
  },
];

// call() parses JSON; exports are files, so the matrix above only needs their status. Raw bytes here.
async function fetchRaw(fn: typeof exportRoute.GET, as: Crew['host'], params: Record<string, string>) {
  const req = new NextRequest(new URL('/api/x', BASE), { headers: { cookie: await sessionCookie(as) } });
  const res = await fn(req, { params: Promise.resolve(params) });
  return { res, bytes: Buffer.from(await res.arrayBuffer()) };
}

describe('route matrix', () => {
  // Exports answer files: compare the status only, by wrapping the route so call() sees JSON.
  const jsonless = (fn: typeof exportRoute.GET) => async (req: NextRequest, ctx: { params: Promise<Record<string, string | string[] | undefined>> }) => {
    const res = await fn(req, ctx);
    const type = res.headers.get('content-type') ?? '';
    return type.startsWith('application/json') && !res.headers.get('content-disposition') ? res : Response.json({ ok: true }, { status: res.status });
  };
  describeRouteMatrix(cases.map((tc) => (tc.fn === exportRoute.GET || tc.fn === segmentPackageRoute.GET ? { ...tc, fn: jsonless(tc.fn as typeof exportRoute.GET) } : tc)));
});

describe('lock for edit', () => {
  it('gives concurrent locks distinct version numbers', async () => {
    const c = await makeCrew();
    const { episode } = await makeShotEpisode(c);
    const m = await hostMember(c);
    const locked = await Promise.all([1, 2, 3, 4, 5].map(() => lockHandoff(m, c.host, episode.id, { note: '' })));
    expect(locked.map((h) => h.version).sort()).toEqual([1, 2, 3, 4, 5]);
  });

  it('keeps a locked version byte-identical after the live episode changes', async () => {
    const c = await makeCrew();
    const ep = await makeLockedEpisode(c);
    const params = { ...ch(c), episodeId: ep.episode.id, version: '1', format: 'json' };
    const before = await fetchRaw(exportRoute.GET, c.editor, params);
    expect(before.res.status).toBe(200);
    expect(before.res.headers.get('etag')).toBe(`"${ep.handoff.contentHash}"`);

    const m = await hostMember(c);
    await saveScript(c.channel.id, ep.build.id, doc('A whole new script'), 0);
    await moveSegment(c.channel.id, ep.build.id, null);
    await changeShotState(m, ep.shopShot.id, { state: 'retake', reason: 'Soft focus' });
    await db('episodes').where({ id: ep.episode.id }).update({ title: 'Renamed' });
    await db('clips').where({ id: ep.clip.clipId }).delete();

    const after = await fetchRaw(exportRoute.GET, c.editor, params);
    expect(after.bytes.equals(before.bytes)).toBe(true);
    expect(after.res.headers.get('etag')).toBe(before.res.headers.get('etag'));
    await expect(db('handoffs').where({ id: ep.handoff.id }).update({ note: 'x' })).rejects.toThrow(/cannot change/);
  });

  it('lists versions newest first, and e-mails each Editor once per version with its link', async () => {
    const c = await makeCrew();
    const ep = await makeLockedEpisode(c);
    await lockHandoff(await hostMember(c), c.host, ep.episode.id, { note: 'Second pass' });
    const res = await call(handoffsRoute.GET, 'GET', { as: c.editor, params: { ...ch(c), episodeId: ep.episode.id } });
    const list = (res.json as { handoffs: HandoffSummaryDto[] }).handoffs;
    expect(list.map((h) => [h.version, h.note])).toEqual([
      [2, 'Second pass'],
      [1, 'First assembly'],
    ]);
    await waitForMail(c.editor.email, { atLeast: 2 });
    const mails = await mailAfterEverythingSent(c.editor.email);
    expect(mails).toHaveLength(2);
    expect(mails.map((m) => m.text).join('\n')).toContain(`/c/${c.channel.slug}/episodes/${ep.episode.id}/handoff/2`);
    expect(await mailAfterEverythingSent(c.shopHand.email)).toHaveLength(0);
  });

  it('runs the same number of SQL statements however big the episode is', async () => {
    const count = async (episodeId: string, c: Crew) => {
      let n = 0;
      const onQuery = () => n++;
      db.on('query', onQuery);
      try {
        await lockHandoff(await hostMember(c), c.host, episodeId, { note: '' });
      } finally {
        db.off('query', onQuery);
      }
      return n;
    };
    const c = await makeCrew();
    const small = await makeShotEpisode(c);
    const big = await makeShotEpisode(c);
    const more = await addThreeLevelBuild(c.channel.id, big.episode.id);
    for (const s of more) {
      const shot = await createShot(c.channel.id, s.id, { description: 'Extra', framing: 'wide', camera: 'a_cam', assigneeId: null, dueDate: null, notes: '' });
      await storeClip(s.id, shot.id, c.host.id, 'B.mp4');
    }
    // Statements inside the request only; the mail lookup is one more, both times.
    expect(await count(big.episode.id, c)).toBe(await count(small.episode.id, c));
  });

  it('answers 404 for a version that does not exist and for another channel’s episode', async () => {
    const c = await makeCrew();
    const ep = await makeLockedEpisode(c);
    expect((await call(versionRoute.GET, 'GET', { as: c.host, params: { ...ch(c), episodeId: ep.episode.id, version: '9' } })).status).toBe(404);
    const other = await makeCrew();
    const res = await call(handoffsRoute.POST, 'POST', { as: other.host, params: { ...ch(other), episodeId: ep.episode.id }, body: {} });
    expect(res.status).toBe(404);
  });
});

describe('diff', () => {
  it('shows a word-level script change, a moved segment and a shot state between v1 and v2', async () => {
    const c = await makeCrew();
    const ep = await makeLockedEpisode(c);
    const m = await hostMember(c);
    await saveScript(c.channel.id, ep.build.id, doc('Cut both legs square'), 0);
    await moveSegment(c.channel.id, ep.build.id, null);
    await changeShotState(m, ep.shopShot.id, { state: 'captured' });
    await lockHandoff(m, c.host, ep.episode.id, { note: '' });
    const res = await call(diffRoute.GET, 'GET', { as: c.editor, params: { ...ch(c), episodeId: ep.episode.id }, path: '/api/x?from=1&to=2' });
    expect(res.status).toBe(200);
    const d = (res.json as { diff: HandoffDiff }).diff;
    expect(d.scripts[0]?.words.filter((w) => w.change === 'added').map((w) => w.text).join('')).toContain('Cut both legs square');
    // Swapping two neighbours moves one of them relative to the rest.
    expect(d.segmentsMoved).toHaveLength(1);
    expect(d.shotsChanged.map((s) => [s.id, s.toState])).toEqual([[ep.shopShot.id, 'captured']]);
  });

  it('400 with fields for a bad query, 404 for a version that does not exist', async () => {
    const c = await makeCrew();
    const ep = await makeLockedEpisode(c);
    const params = { ...ch(c), episodeId: ep.episode.id };
    const bad = await call(diffRoute.GET, 'GET', { as: c.host, params, path: '/api/x?from=a&to=0' });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.json.error?.fields ?? {})).toEqual(expect.arrayContaining(['from', 'to']));
    expect((await call(diffRoute.GET, 'GET', { as: c.host, params, path: '/api/x?from=1&to=7' })).status).toBe(404);
  });
});

describe('exports', () => {
  it('OTIO passes the required-field checker; EDL, CSV and the ZIP package are whole', async () => {
    const c = await makeCrew();
    const ep = await makeLockedEpisode(c);
    const params = (format: string) => ({ ...ch(c), episodeId: ep.episode.id, version: '1', format });

    const otio = await fetchRaw(exportRoute.GET, c.editor, params('otio'));
    expect(otio.res.headers.get('content-disposition')).toContain('.otio');
    expect(checkOtio(JSON.parse(otio.bytes.toString('utf8')))).toEqual([]);

    const edl = (await fetchRaw(exportRoute.GET, c.editor, params('edl'))).bytes.toString('utf8');
    expect(edl.split('\n')[1]).toBe('FCM: DROP FRAME');

    const csv = (await fetchRaw(exportRoute.GET, c.editor, params('csv'))).bytes.toString('utf8');
    expect(csv).toContain('A001.mp4');

    const zip = await fetchRaw(exportRoute.GET, c.editor, params('zip'));
    expect(zip.res.headers.get('content-type')).toBe('application/zip');
    expect(Number(zip.res.headers.get('content-length'))).toBe(zip.bytes.length);
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'kerfline-it-zip-'));
    try {
      fs.writeFileSync(path.join(dir, 'p.zip'), zip.bytes);
      expect(execFileSync('unzip', ['-t', 'p.zip'], { cwd: dir }).toString()).toContain('No errors detected');
      execFileSync('unzip', ['-q', 'p.zip', '-d', 'x'], { cwd: dir });
      const check = execFileSync('sha256sum', ['-c', 'SHA256SUMS'], { cwd: path.join(dir, 'x') }).toString();
      expect(check).toMatch(/S01 A001\.mp4: OK/);
      expect(check).not.toMatch(/FAILED/);
    } finally {
      fs.rmSync(dir, { recursive: true, force: true });
    }
  });

  it('a per-segment package of a segment not in the version is 404', async () => {
    const c = await makeCrew();
    const ep = await makeLockedEpisode(c);
    const res = await call(segmentPackageRoute.GET, 'GET', { as: c.host, params: { ...ch(c), episodeId: ep.episode.id, version: '1', segmentId: ep.clip.clipId } });
    expect(res.status).toBe(404);
  });
});
