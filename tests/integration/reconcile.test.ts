import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { Readable } from 'node:stream';
import type { Upload } from '@tus/server';
import { describe, expect, it } from 'vitest';
import { db } from '@/db/client';
import { deleteSegment } from '@/lib/segments/queries';
import { DiskClipStore } from '@/storage/disk-store';
import { reconcileFinishedUploads } from '@/storage/reconcile';
import { makeCrew } from './helpers';
import { makeShotEpisode } from './shot-fixtures';

// Issue 12, item 4, in-process: the crash itself is tested against the built app in uploads.test.ts.

async function finishedUpload(store: DiskClipStore, metadata: Record<string, string>, bytes = randomBytes(2000)) {
  const id = randomBytes(16).toString('hex');
  await store.tus.create({ id, size: bytes.length, offset: 0, metadata, creation_date: new Date().toISOString() } as Upload);
  await store.tus.write(Readable.from([bytes]), id, 0);
  return id;
}

describe('upload reconciler', () => {
  it('ingests a finished upload without a clip row once, however often it runs, and leaves unfinished ones', async () => {
    const root = fs.mkdtempSync(path.join(os.tmpdir(), 'kerfline-reconcile-'));
    const store = new DiskClipStore(path.join(root, 'uploads'), path.join(root, 'posters'));
    const c = await makeCrew();
    const { build } = await makeShotEpisode(c);
    const meta: Record<string, string> = { segmentId: build.id, filename: 'lost.mp4', filetype: 'video/mp4', uploaderId: c.shopHand.id, channelId: c.channel.id };
    const id = await finishedUpload(store, meta);
    const unfinished = randomBytes(16).toString('hex');
    await store.tus.create({ id: unfinished, size: 100, offset: 0, metadata: meta, creation_date: new Date().toISOString() } as Upload);

    // Recent bytes wait for the settling time: a finish hook may still be at work.
    expect((await reconcileFinishedUploads(store, 60_000)).ingested).toEqual([]);
    const runs = await Promise.all([reconcileFinishedUploads(store, 0), reconcileFinishedUploads(store, 0), reconcileFinishedUploads(store, 0)]);
    expect(runs.flatMap((r) => r.ingested)).toEqual([id]);
    const rows = await db('clips').where({ upload_id: id });
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({ segment_id: build.id, original_name: 'lost.mp4' });
    expect(await db('clip_jobs').where({ clip_id: rows[0].id })).toHaveLength(1);
    expect(await db('clips').where({ upload_id: unfinished })).toHaveLength(0);
  });

  it('removes the bytes of a finished upload whose segment was deleted', async () => {
    const root = fs.mkdtempSync(path.join(os.tmpdir(), 'kerfline-reconcile-'));
    const store = new DiskClipStore(path.join(root, 'uploads'), path.join(root, 'posters'));
    const c = await makeCrew();
    const { build } = await makeShotEpisode(c);
    const id = await finishedUpload(store, { segmentId: build.id, filename: 'orphan.mp4', filetype: 'video/mp4', uploaderId: c.shopHand.id, channelId: c.channel.id });
    await deleteSegment(c.channel.id, build.id);
    expect(await reconcileFinishedUploads(store, 0)).toEqual({ ingested: [], removed: [id] });
    expect(fs.existsSync(path.join(root, 'uploads', id))).toBe(false);
  });
});
