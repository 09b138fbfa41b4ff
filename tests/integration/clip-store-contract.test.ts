import { execFile } from 'node:child_process';
import { createHash, randomBytes } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { Readable } from 'node:stream';
import { promisify } from 'node:util';
import type { Upload } from '@tus/server';
import { describe, expect, it } from 'vitest';
import type { ClipStore } from '@/storage/clip-store';
import { DiskClipStore } from '@/storage/disk-store';
import { S3ClipStore } from '@/storage/s3-store';
import { newTestBucket } from './s3-bucket';

// The contract every ClipStore keeps: disk, and S3 against the real Swift server `npm test` starts.
const stores: { name: string; make: () => Promise<ClipStore> }[] = [
  {
    name: 'disk',
    make: async () => {
      const root = fs.mkdtempSync(path.join(os.tmpdir(), 'kerfline-store-'));
      return new DiskClipStore(path.join(root, 'uploads'), path.join(root, 'posters'));
    },
  },
  { name: 's3', make: async () => new S3ClipStore(await newTestBucket('contract')) },
];

const bytesOf = async (r: Readable) => {
  const chunks: Buffer[] = [];
  for await (const c of r) chunks.push(c as Buffer);
  return Buffer.concat(chunks);
};

const MiB = 1024 * 1024;

describe.each(stores)('ClipStore contract: $name', ({ make }) => {
  const newUpload = async (store: ClipStore, size: number) => {
    const id = randomBytes(16).toString('hex');
    await store.tus.create({ id, size, offset: 0, metadata: {}, creation_date: new Date().toISOString() } as Upload);
    return id;
  };

  it('stores written bytes and reads them whole or by inclusive range', async () => {
    const store = await make();
    const bytes = randomBytes(5000);
    const id = await newUpload(store, bytes.length);
    expect(await store.tus.write(Readable.from([bytes.subarray(0, 3000)]), id, 0)).toBe(3000);
    expect((await store.listUnfinished()).map((u) => u.uploadId)).toEqual([id]);
    expect(await store.listFinished()).toEqual([]);
    await store.forget(id);
    expect((await store.tus.getUpload(id)).offset).toBe(3000);
    await store.tus.write(Readable.from([bytes.subarray(3000)]), id, 3000);
    expect((await store.tus.getUpload(id)).offset).toBe(5000);
    expect(await store.listUnfinished()).toEqual([]);
    expect((await store.listFinished()).map((u) => u.uploadId)).toEqual([id]);
    expect((await bytesOf(await store.read(id))).equals(bytes)).toBe(true);
    expect((await bytesOf(await store.read(id, { start: 10, end: 19 }))).equals(bytes.subarray(10, 20))).toBe(true);
    expect(await store.stat(id)).toMatchObject({ size: 5000 });
  });

  it('joins pieces written across requests into whole parts, and reads ranges across part boundaries', async () => {
    const store = await make();
    // 8 MiB parts: the first PATCH ends mid-part, as a paused browser upload does.
    const bytes = randomBytes(13 * MiB);
    const id = await newUpload(store, bytes.length);
    for (const [start, end] of [
      [0, 3 * MiB],
      [3 * MiB, 11 * MiB],
      [11 * MiB, 13 * MiB],
    ] as const) {
      await store.forget(id);
      expect(await store.tus.write(Readable.from([bytes.subarray(start, end)]), id, start)).toBe(end);
    }
    const from = 8 * MiB - 100;
    expect((await bytesOf(await store.read(id, { start: from, end: from + 199 }))).equals(bytes.subarray(from, from + 200))).toBe(true);
    expect((await bytesOf(await store.read(id))).equals(bytes)).toBe(true);
  });

  it('hashes a finished upload as stored, or leaves the hash to reading the bytes back', async () => {
    const store = await make();
    const bytes = randomBytes(9 * MiB);
    const id = await newUpload(store, bytes.length);
    await store.tus.write(Readable.from([bytes.subarray(0, 4 * MiB)]), id, 0);
    await store.forget(id);
    await store.tus.write(Readable.from([bytes.subarray(4 * MiB)]), id, 4 * MiB);
    const sha = createHash('sha256').update(bytes).digest('hex');
    expect([null, sha]).toContain(await store.verifiedSha256(id, bytes.length));
    expect(createHash('sha256').update(await bytesOf(await store.read(id))).digest('hex')).toBe(sha);
  });

  it('gives ffprobe a source it can open', async () => {
    const store = await make();
    const video = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'kerfline-probe-')), 'v.mp4');
    await promisify(execFile)('ffmpeg', ['-v', 'error', '-y', '-f', 'lavfi', '-i', 'testsrc=duration=1:size=160x120:rate=10', '-pix_fmt', 'yuv420p', '-c:v', 'libx264', video]);
    const bytes = fs.readFileSync(video);
    const id = await newUpload(store, bytes.length);
    await store.tus.write(Readable.from([bytes]), id, 0);
    const source = await store.mediaSource(id, 60);
    const { stdout } = await promisify(execFile)('ffprobe', ['-v', 'error', '-print_format', 'json', '-show_streams', source]);
    expect(JSON.parse(stdout).streams[0]).toMatchObject({ width: 160, height: 120 });
  });

  it('removes finished and unfinished uploads and their bytes, tolerates removing twice, and refuses ids it did not make', async () => {
    const store = await make();
    const open = await newUpload(store, 10);
    await store.tus.write(Readable.from([Buffer.alloc(4, 1)]), open, 0);
    const done = await newUpload(store, 10);
    await store.tus.write(Readable.from([Buffer.alloc(10, 2)]), done, 0);
    await store.remove(open);
    await store.remove(done);
    await store.remove(done);
    await expect(store.read(done)).rejects.toThrow();
    await expect(store.tus.getUpload(open)).rejects.toBeTruthy();
    expect(await store.stat(done)).toBeNull();
    expect(await store.listUnfinished()).toEqual([]);
    await expect(store.read('../../etc/passwd')).rejects.toThrow(/not an upload id/);
    await expect(store.remove('../x')).rejects.toThrow(/not an upload id/);
  });

  it('keeps, serves and removes a poster frame', async () => {
    const store = await make();
    const clipId = '6f1c1c52-4b8e-4d5e-9a51-6c7a1d2f0e11';
    const jpeg = path.join(os.tmpdir(), `poster-${clipId}.jpg`);
    fs.writeFileSync(jpeg, Buffer.from([0xff, 0xd8, 0xff, 0xd9]));
    expect(await store.readPoster(clipId)).toBeNull();
    await store.savePoster(clipId, jpeg);
    expect((await bytesOf((await store.readPoster(clipId))!)).length).toBe(4);
    expect(await store.listPosters()).toContain(clipId);
    await store.removePoster(clipId);
    expect(await store.readPoster(clipId)).toBeNull();
    expect(await store.listPosters()).not.toContain(clipId);
    await expect(store.savePoster('../x', jpeg)).rejects.toThrow(/not a clip id/);
  });
});
