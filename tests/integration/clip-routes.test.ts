import fs from 'node:fs';
import { describe, expect, it } from 'vitest';
import os from 'node:os';
import path from 'node:path';
import { Readable } from 'node:stream';
import * as clipFileRoute from '@/app/api/channels/[channel]/clips/[clipId]/file/route';
import * as clipPosterRoute from '@/app/api/channels/[channel]/clips/[clipId]/poster/route';
import * as clipRoute from '@/app/api/channels/[channel]/clips/[clipId]/route';
import * as segmentClipsRoute from '@/app/api/channels/[channel]/segments/[segmentId]/clips/route';
import * as boardRoute from '@/app/api/channels/[channel]/shots/route';
import { db } from '@/db/client';
import { recordClipOnce } from '@/lib/clips/queries';
import { PROBE_UNREADABLE } from '@/lib/clips/probe-note';
import type { ClipDto } from '@/lib/clips/schemas';
import type { BoardShotDto } from '@/lib/shots/schemas';
import { removeStaleUploads } from '@/storage/cleanup';
import { clipStore } from '@/storage/tus-server';
import { call, makeCrew } from './helpers';
import { describeRouteMatrix, type Crew, type RouteCase } from './route-matrix';
import { makeShotEpisode } from './shot-fixtures';

const hex = () => [...crypto.getRandomValues(new Uint8Array(16))].map((b) => b.toString(16).padStart(2, '0')).join('');

/** A clip row as ingest writes it, uploaded by `by` (the shop hand unless named). */
async function makeClip(c: Crew, by = c.shopHand.id) {
  const { build, shopShot } = await makeShotEpisode(c);
  const { clipId } = await recordClipOnce({
    uploadId: hex(),
    segmentId: build.id,
    shotId: shopShot.id,
    uploadedBy: by,
    originalName: 'A001.mp4',
    mimeType: 'video/mp4',
    sizeBytes: 1234,
    sha256: 'a'.repeat(64),
  });
  return { clipId, build, shopShot };
}

/** A clip whose bytes and poster frame are in the store, for the file and poster routes. */
async function makeStoredClip(c: Crew) {
  const { build } = await makeShotEpisode(c);
  const store = clipStore();
  const uploadId = hex();
  const bytes = Buffer.alloc(64, 7);
  await store.tus.create({ id: uploadId, size: 64, offset: 0, metadata: {}, creation_date: new Date().toISOString() } as Parameters<typeof store.tus.create>[0]);
  await store.tus.write(Readable.from([bytes]), uploadId, 0);
  const { clipId } = await recordClipOnce({ uploadId, segmentId: build.id, shotId: null, uploadedBy: c.shopHand.id, originalName: 'A001.mp4', mimeType: 'video/mp4', sizeBytes: 64, sha256: 'd'.repeat(64) });
  const jpeg = path.join(os.tmpdir(), `kerfline-test-poster-${clipId}.jpg`);
  fs.writeFileSync(jpeg, Buffer.from([0xff, 0xd8, 0xff, 0xd9]));
  await store.savePoster(clipId, jpeg);
  fs.rmSync(jpeg, { force: true });
  await db('clips').where({ id: clipId }).update({ has_poster: true });
  return { clipId };
}

const ch = (c: Crew) => ({ channel: c.channel.slug });
const cases: RouteCase[] = [
  { name: 'GET segment clips', fn: segmentClipsRoute.GET, method: 'GET', allowed: ['host', 'shop_hand', 'editor'], params: async (c) => ({ ...ch(c), segmentId: (await makeClip(c)).build.id }), okStatus: 200 },
  { name: 'GET clip', fn: clipRoute.GET, method: 'GET', allowed: ['host', 'shop_hand', 'editor'], params: async (c) => ({ ...ch(c), clipId: (await makeClip(c)).clipId }), okStatus: 200 },
  { name: 'GET clip file', fn: clipFileRoute.GET, method: 'GET', allowed: ['host', 'shop_hand', 'editor'], params: async (c) => ({ ...ch(c), clipId: (await makeStoredClip(c)).clipId }), okStatus: 200 },
  { name: 'GET clip poster', fn: clipPosterRoute.GET, method: 'GET', allowed: ['host', 'shop_hand', 'editor'], params: async (c) => ({ ...ch(c), clipId: (await makeStoredClip(c)).clipId }), okStatus: 200 },
  {
    name: 'PATCH clip (tie to a shot, the shop hand’s own)',
    fn: clipRoute.PATCH,
    method: 'PATCH',
    allowed: ['host', 'shop_hand'],
    params: async (c) => ({ ...ch(c), clipId: (await makeClip(c)).clipId }),
    body: () => ({ shotId: null }),
    badBody: { shotId: 'not-a-shot', extra: 1 },
    okStatus: 200,
  },
  { name: 'DELETE clip (the shop hand’s own)', fn: clipRoute.DELETE, method: 'DELETE', allowed: ['host', 'shop_hand'], params: async (c) => ({ ...ch(c), clipId: (await makeClip(c)).clipId }), okStatus: 204 },
];
describeRouteMatrix(cases);

describe('clips', () => {
  it('lists a segment’s clips with their details, and marks the shot as having footage', async () => {
    const c = await makeCrew();
    const { build, clipId } = await makeClip(c);
    const res = await call(segmentClipsRoute.GET, 'GET', { as: c.editor, params: { ...ch(c), segmentId: build.id } });
    const clips = (res.json as { clips: ClipDto[] }).clips;
    expect(clips).toEqual([expect.objectContaining({ id: clipId, originalName: 'A001.mp4', sizeBytes: 1234, probeState: 'pending', uploaderName: c.shopHand.name })]);
    expect(clips[0]).not.toHaveProperty('uploadId');
    const board = (await call(boardRoute.GET, 'GET', { as: c.editor, params: ch(c) })).json as { shots: BoardShotDto[] };
    expect(board.shots.find((s) => s.clipCount > 0)).toBeTruthy();
  });

  it('writes one row per upload however often the finish is recorded', async () => {
    const c = await makeCrew();
    const { build } = await makeShotEpisode(c);
    const clip = { uploadId: hex(), segmentId: build.id, shotId: null, uploadedBy: c.host.id, originalName: 'x', mimeType: 'video/mp4', sizeBytes: 1, sha256: 'b'.repeat(64) };
    const [a, b] = await Promise.all([recordClipOnce(clip), recordClipOnce(clip)]);
    expect(a.clipId).toBe(b.clipId);
    expect([a.created, b.created].sort()).toEqual([false, true]);
    expect(await db('clip_jobs').where({ clip_id: a.clipId })).toHaveLength(1);
  });

  it('lets a shop hand delete only their own uploads; a host deletes any', async () => {
    const c = await makeCrew();
    const { clipId } = await makeClip(c, c.host.id);
    expect((await call(clipRoute.DELETE, 'DELETE', { as: c.shopHand, params: { ...ch(c), clipId } })).status).toBe(403);
    expect((await call(clipRoute.DELETE, 'DELETE', { as: c.editor, params: { ...ch(c), clipId } })).status).toBe(403);
    expect(await db('clips').where({ id: clipId })).toHaveLength(1);
    expect((await call(clipRoute.DELETE, 'DELETE', { as: c.host, params: { ...ch(c), clipId } })).status).toBe(204);
    expect(await db('clips').where({ id: clipId })).toHaveLength(0);
  });
});

describe('stale uploads', () => {
  it('removes unfinished uploads untouched for longer than the limit, with their files, and keeps the rest', async () => {
    const store = clipStore();
    const fresh = await store.tus.create({ id: hex(), size: 100, offset: 0, metadata: {}, creation_date: new Date().toISOString() } as Parameters<typeof store.tus.create>[0]);
    const old = await store.tus.create({ id: hex(), size: 100, offset: 0, metadata: {}, creation_date: new Date().toISOString() } as Parameters<typeof store.tus.create>[0]);
    const oldPath = await store.mediaSource(old.id);
    const past = new Date(Date.now() - 8 * 24 * 3600 * 1000);
    fs.utimesSync(oldPath, past, past);
    fs.utimesSync(`${oldPath}.json`, past, past);
    const removed = await removeStaleUploads(store, 7 * 24 * 3600 * 1000);
    expect(removed).toContain(old.id);
    expect(removed).not.toContain(fresh.id);
    expect(fs.existsSync(oldPath)).toBe(false);
    expect(fs.existsSync(await store.mediaSource(fresh.id))).toBe(true);
    await store.remove(fresh.id);
  });
});

describe('media jobs', () => {
  it('marks a clip ffprobe cannot read as failed with a note, instead of failing the upload', async () => {
    const { Readable } = await import('node:stream');
    const { processClipJob } = await import('@/storage/media-job');
    const c = await makeCrew();
    const { build } = await makeShotEpisode(c);
    const store = clipStore();
    const uploadId = hex();
    await store.tus.create({ id: uploadId, size: 64, offset: 0, metadata: {}, creation_date: new Date().toISOString() } as Parameters<typeof store.tus.create>[0]);
    await store.tus.write(Readable.from([Buffer.alloc(64, 7)]), uploadId, 0);
    const { clipId } = await recordClipOnce({ uploadId, segmentId: build.id, shotId: null, uploadedBy: c.host.id, originalName: 'noise.mp4', mimeType: 'video/mp4', sizeBytes: 64, sha256: 'c'.repeat(64) });
    const job = await db('clip_jobs').where({ clip_id: clipId }).first('id', 'attempts');
    await processClipJob(store, { id: String(job.id), clipId, uploadId, mimeType: 'video/mp4', attempts: 1 });
    const clip = await db('clips').where({ id: clipId }).first('probe_state', 'probe_note', 'has_poster');
    expect(clip).toMatchObject({ probe_state: 'failed', has_poster: false });
    // Plain words for people, not ffprobe's own output (issue 12 item 16).
    expect(clip.probe_note).toBe(PROBE_UNREADABLE);
    expect(clip.probe_note).not.toMatch(/ffprobe|@ 0x|\[|Invalid data/);
    expect(clip.probe_note).not.toContain(await store.mediaSource(uploadId));
    expect(await db('clip_jobs').where({ clip_id: clipId })).toHaveLength(0);
  });
});

describe('filing a clip after the upload (issue 15)', () => {
  const patch = (c: Crew, as: Crew['host'], clipId: string, body: unknown) => call(clipRoute.PATCH, 'PATCH', { as, params: { ...ch(c), clipId }, body });

  it('the uploader ties their clip to another shot of the segment, then unties it', async () => {
    const c = await makeCrew();
    const { clipId, hostShot } = await makeClipWithShots(c);
    const tied = await patch(c, c.shopHand, clipId, { shotId: hostShot.id });
    expect(tied.status).toBe(200);
    expect((tied.json as { clip: ClipDto }).clip).toMatchObject({ id: clipId, shotId: hostShot.id });
    expect(await db('clips').where({ id: clipId }).first('shot_id')).toEqual({ shot_id: hostShot.id });
    const untied = await patch(c, c.shopHand, clipId, { shotId: null });
    expect((untied.json as { clip: ClipDto }).clip.shotId).toBeNull();
  });

  it('the Host moves any clip to another segment: it leaves its shot unless one of the new segment is named', async () => {
    const c = await makeCrew();
    const { clipId, segments, build } = await makeClipWithShots(c);
    const other = segments.find((s) => s.id !== build.id)!;
    const moved = await patch(c, c.host, clipId, { segmentId: other.id });
    expect(moved.status).toBe(200);
    expect((moved.json as { clip: ClipDto }).clip).toMatchObject({ segmentId: other.id, shotId: null });
    const list = await call(segmentClipsRoute.GET, 'GET', { as: c.editor, params: { ...ch(c), segmentId: other.id } });
    expect((list.json as { clips: ClipDto[] }).clips.map((x) => x.id)).toEqual([clipId]);
  });

  it('refuses a shop hand filing someone else’s clip, and an Editor', async () => {
    const c = await makeCrew();
    const { clipId, hostShot } = await makeClipWithShots(c, c.host.id);
    const res = await patch(c, c.shopHand, clipId, { shotId: hostShot.id });
    expect(res.status).toBe(403);
    expect(res.json.error?.message).toMatch(/Host or whoever uploaded/);
    expect((await patch(c, c.editor, clipId, { shotId: null })).status).toBe(403);
    expect(await db('clips').where({ id: clipId }).first('shot_id')).not.toEqual({ shot_id: hostShot.id });
  });

  it('400 naming the field for a shot of another segment or a segment of another channel, and changes nothing', async () => {
    const c = await makeCrew();
    const { clipId, shopShot } = await makeClipWithShots(c);
    const elsewhere = await makeShotEpisode(c);
    const wrongShot = await patch(c, c.host, clipId, { shotId: elsewhere.shopShot.id });
    expect(wrongShot.status).toBe(400);
    expect(wrongShot.json.error?.fields).toHaveProperty('shotId');
    const outsider = await makeCrew();
    const foreign = await makeShotEpisode(outsider);
    const wrongSegment = await patch(c, c.host, clipId, { segmentId: foreign.build.id });
    expect(wrongSegment.status).toBe(400);
    expect(wrongSegment.json.error?.fields).toHaveProperty('segmentId');
    const empty = await patch(c, c.host, clipId, {});
    expect(empty.status).toBe(400);
    expect(await db('clips').where({ id: clipId }).first('shot_id')).toEqual({ shot_id: shopShot.id });
  });
});

describe('the same bytes twice in a channel (issue 15)', () => {
  it('the later clip links the earlier one; another channel’s copy is not linked', async () => {
    const c = await makeCrew();
    const { build } = await makeShotEpisode(c);
    const sha256 = hex() + hex();
    const record = (segmentId: string, name: string, uploadedBy: string) =>
      recordClipOnce({ uploadId: hex(), segmentId, shotId: null, uploadedBy, originalName: name, mimeType: 'video/mp4', sizeBytes: 99, sha256 });
    const first = await record(build.id, 'A001.mp4', c.shopHand.id);
    const second = await record(build.id, 'A001 copy.mp4', c.host.id);
    const outsider = await makeCrew();
    const foreign = await makeShotEpisode(outsider);
    const third = await record(foreign.build.id, 'A001.mp4', outsider.host.id);
    const res = await call(segmentClipsRoute.GET, 'GET', { as: c.editor, params: { ...ch(c), segmentId: build.id } });
    const clips = (res.json as { clips: ClipDto[] }).clips;
    expect(clips.find((x) => x.id === first.clipId)?.duplicateOf).toBeNull();
    expect(clips.find((x) => x.id === second.clipId)?.duplicateOf).toEqual({
      clipId: first.clipId,
      segmentId: build.id,
      episodeId: expect.any(String),
      segmentTitle: build.title,
      originalName: 'A001.mp4',
    });
    const theirs = await call(clipRoute.GET, 'GET', { as: outsider.editor, params: { channel: outsider.channel.slug, clipId: third.clipId } });
    expect((theirs.json as { clip: ClipDto }).clip.duplicateOf).toBeNull();
  });
});

/** A clip on the build's shop-hand shot, with the other shot and segments to file it under. */
async function makeClipWithShots(c: Crew, by = c.shopHand.id) {
  const shots = await makeShotEpisode(c);
  const { clipId } = await recordClipOnce({
    uploadId: hex(),
    segmentId: shots.build.id,
    shotId: shots.shopShot.id,
    uploadedBy: by,
    originalName: 'B002.mov',
    mimeType: 'video/quicktime',
    sizeBytes: 10,
    sha256: hex() + hex(),
  });
  return { clipId, ...shots };
}
