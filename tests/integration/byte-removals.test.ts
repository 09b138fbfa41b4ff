import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { Readable } from 'node:stream';
import type { Upload } from '@tus/server';
import { describe, expect, it } from 'vitest';
import * as episodeRoute from '@/app/api/channels/[channel]/episodes/[episodeId]/route';
import * as segmentRoute from '@/app/api/channels/[channel]/segments/[segmentId]/route';
import { db } from '@/db/client';
import { DiskClipStore } from '@/storage/disk-store';
import { ingestUpload } from '@/storage/ingest';
import { runByteRemovals, sweepOrphans } from '@/storage/removals';
import { call, makeCrew } from './helpers';
import type { Crew } from './route-matrix';
import { makeShotEpisode } from './shot-fixtures';

// Issue 12, item 5: deleting an episode or segment left clip files and posters on disk forever.

function tempStore() {
  const root = fs.mkdtempSync(path.join(os.tmpdir(), 'kerfline-removals-'));
  const store = new DiskClipStore(path.join(root, 'uploads'), path.join(root, 'posters'));
  return { store, upload: (id: string) => path.join(root, 'uploads', id), poster: (clipId: string) => path.join(root, 'posters', `${clipId}.jpg`) };
}

async function storedUpload(store: DiskClipStore, c: Crew, segmentId: string, finish = true) {
  const id = randomBytes(16).toString('hex');
  const meta: Record<string, string> = { segmentId, filename: 'take.mp4', filetype: 'video/mp4', uploaderId: c.shopHand.id, channelId: c.channel.id };
  await store.tus.create({ id, size: 1000, offset: 0, metadata: meta, creation_date: new Date().toISOString() } as unknown as Upload);
  await store.tus.write(Readable.from([randomBytes(finish ? 1000 : 400)]), id, 0);
  return id;
}

/** A clip with its bytes and a poster in `store`. */
async function storedClip(t: ReturnType<typeof tempStore>, c: Crew, segmentId: string) {
  const uploadId = await storedUpload(t.store, c, segmentId);
  const { clipId } = await ingestUpload(t.store, await t.store.tus.getUpload(uploadId));
  const jpeg = path.join(os.tmpdir(), `poster-${clipId}.jpg`);
  fs.writeFileSync(jpeg, Buffer.from([0xff, 0xd8, 0xff, 0xd9]));
  await t.store.savePoster(clipId, jpeg);
  return { uploadId, clipId };
}

const queued = (uploadId: string) => db('byte_removals').where({ upload_id: uploadId });

describe('deleting rows removes their bytes, through the job queue', () => {
  it('queues and removes the clip files and posters of a deleted episode and of a deleted segment', async () => {
    const t = tempStore();
    const c = await makeCrew();
    const first = await makeShotEpisode(c);
    const second = await makeShotEpisode(c);
    const ofEpisode = await storedClip(t, c, first.build.id);
    const ofSegment = await storedClip(t, c, second.build.id);
    const kept = await storedClip(t, c, second.segments.find((s) => s.id !== second.build.id)!.id);

    expect((await call(episodeRoute.DELETE, 'DELETE', { as: c.host, params: { channel: c.channel.slug, episodeId: first.episode.id } })).status).toBe(204);
    expect((await call(segmentRoute.DELETE, 'DELETE', { as: c.host, params: { channel: c.channel.slug, segmentId: second.build.id } })).status).toBe(204);
    // Queued in the deleting transaction: durable before any file is touched.
    expect(await queued(ofEpisode.uploadId)).toHaveLength(1);
    expect(await queued(ofSegment.uploadId)).toHaveLength(1);
    expect(fs.existsSync(t.upload(ofEpisode.uploadId))).toBe(true);

    await runByteRemovals(t.store, 1000);
    for (const gone of [ofEpisode, ofSegment]) {
      expect(fs.existsSync(t.upload(gone.uploadId))).toBe(false);
      expect(fs.existsSync(t.poster(gone.clipId))).toBe(false);
      expect(await queued(gone.uploadId)).toHaveLength(0);
    }
    expect(fs.existsSync(t.upload(kept.uploadId))).toBe(true);
    expect(fs.existsSync(t.poster(kept.clipId))).toBe(true);
  });

  it('sweeps orphans: an unfinished upload whose segment was deleted, and a poster without a clip', async () => {
    const t = tempStore();
    const c = await makeCrew();
    const { build, segments } = await makeShotEpisode(c);
    const other = segments.find((s) => s.id !== build.id)!;
    const midway = await storedUpload(t.store, c, build.id, false);
    const live = await storedUpload(t.store, c, other.id, false);
    const kept = await storedClip(t, c, other.id);
    const orphanPoster = '0f1c1c52-4b8e-4d5e-9a51-6c7a1d2f0e11';
    fs.copyFileSync(t.poster(kept.clipId), t.poster(orphanPoster));
    expect((await call(segmentRoute.DELETE, 'DELETE', { as: c.host, params: { channel: c.channel.slug, segmentId: build.id } })).status).toBe(204);

    expect(await sweepOrphans(t.store)).toEqual({ posters: [orphanPoster], uploads: [midway] });
    expect(fs.existsSync(t.upload(midway))).toBe(false);
    expect(fs.existsSync(t.upload(live))).toBe(true);
    expect(fs.existsSync(t.poster(kept.clipId))).toBe(true);
  });
});
