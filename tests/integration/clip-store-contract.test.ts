import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { Readable } from 'node:stream';
import type { Upload } from '@tus/server';
import { describe, expect, it } from 'vitest';
import type { ClipStore } from '@/storage/clip-store';
import { DiskClipStore } from '@/storage/disk-store';

// The contract every ClipStore keeps; a new store (S3-compatible, say) is added to this list.
const stores: { name: string; make: () => ClipStore }[] = [
  {
    name: 'disk',
    make: () => {
      const root = fs.mkdtempSync(path.join(os.tmpdir(), 'kerfline-store-'));
      return new DiskClipStore(path.join(root, 'uploads'), path.join(root, 'posters'));
    },
  },
];

const text = async (r: Readable) => {
  const chunks: Buffer[] = [];
  for await (const c of r) chunks.push(c as Buffer);
  return Buffer.concat(chunks);
};

describe.each(stores)('ClipStore contract: $name', ({ make }) => {
  const newUpload = async (store: ClipStore, size: number) => {
    const id = randomBytes(16).toString('hex');
    await store.tus.create({ id, size, offset: 0, metadata: {}, creation_date: new Date().toISOString() } as Upload);
    return id;
  };

  it('stores written bytes and reads them whole or by inclusive range', async () => {
    const store = make();
    const bytes = randomBytes(5000);
    const id = await newUpload(store, bytes.length);
    expect(await store.tus.write(Readable.from([bytes.subarray(0, 3000)]), id, 0)).toBe(3000);
    expect((await store.listUnfinished()).map((u) => u.uploadId)).toEqual([id]);
    expect(await store.listFinished()).toEqual([]);
    await store.tus.write(Readable.from([bytes.subarray(3000)]), id, 3000);
    expect((await store.tus.getUpload(id)).offset).toBe(5000);
    expect(await store.listUnfinished()).toEqual([]);
    expect((await store.listFinished()).map((u) => u.uploadId)).toEqual([id]);
    expect((await text(await store.read(id))).equals(bytes)).toBe(true);
    expect((await text(await store.read(id, { start: 10, end: 19 }))).equals(bytes.subarray(10, 20))).toBe(true);
  });

  it('removes an upload and its bytes, and refuses ids it did not make', async () => {
    const store = make();
    const id = await newUpload(store, 10);
    await store.remove(id);
    await expect(store.read(id)).rejects.toThrow();
    await expect(store.read('../../etc/passwd')).rejects.toThrow(/not an upload id/);
  });

  it('keeps, serves and removes a poster frame', async () => {
    const store = make();
    const clipId = '6f1c1c52-4b8e-4d5e-9a51-6c7a1d2f0e11';
    const jpeg = path.join(os.tmpdir(), `poster-${clipId}.jpg`);
    fs.writeFileSync(jpeg, Buffer.from([0xff, 0xd8, 0xff, 0xd9]));
    expect(await store.readPoster(clipId)).toBeNull();
    await store.savePoster(clipId, jpeg);
    expect((await text((await store.readPoster(clipId))!)).length).toBe(4);
    await store.removePoster(clipId);
    expect(await store.readPoster(clipId)).toBeNull();
  });
});
