import { createHash, randomBytes } from 'node:crypto';
import { Readable } from 'node:stream';
import { GetObjectCommand, PutObjectCommand } from '@aws-sdk/client-s3';
import type { Upload } from '@tus/server';
import { beforeAll, describe, expect, it } from 'vitest';
import type { S3Settings } from '@/storage/config';
import { sha256Of } from '@/storage/ingest';
import { makeS3Client } from '@/storage/s3-client';
import { S3ClipStore } from '@/storage/s3-store';
import { digestKey } from '@/storage/upload-digest';
import { newTestBucket } from './s3-bucket';

// The SHA-256 an S3 upload gets while its bytes stream in (storage/upload-digest.ts), against the real
// Swift server `npm test` starts: it must always be the hash of the stored object, or there is none and
// ingest reads the object back.

const MiB = 1024 * 1024;
const sha256 = (b: Buffer) => createHash('sha256').update(b).digest('hex');

let settings: S3Settings;
beforeAll(async () => {
  settings = await newTestBucket('digest');
});

async function newUpload(store: S3ClipStore, size: number): Promise<string> {
  const id = randomBytes(16).toString('hex');
  await store.tus.create({ id, size, offset: 0, metadata: {}, creation_date: new Date().toISOString() } as Upload);
  return id;
}

/** A PATCH body that breaks after `failAfter` bytes, once `stored()` holds, as an aborted browser request does. */
function breakingBody(bytes: Buffer, failAfter: number, stored: () => Promise<void>): Readable {
  return Readable.from(
    (async function* () {
      for (let at = 0; at < failAfter; at += MiB) yield bytes.subarray(at, Math.min(at + MiB, failAfter));
      await stored();
      throw new Error('client went away');
    })(),
  );
}

describe('the SHA-256 computed while uploading to S3', () => {
  it('follows an upload across PATCHes and short tails, and is the stored object’s hash', async () => {
    // 8 MiB parts: each PATCH below leaves a tail or a short part for the next.
    const store = new S3ClipStore(settings);
    const bytes = randomBytes(27 * MiB + 123);
    const id = await newUpload(store, bytes.length);
    for (const [start, end] of [[0, 3 * MiB], [3 * MiB, 11 * MiB], [11 * MiB, 20 * MiB], [20 * MiB, bytes.length]] as const) {
      await store.forget(id);
      expect(await store.tus.write(Readable.from([bytes.subarray(start, end)]), id, start)).toBe(end);
    }
    expect(await store.verifiedSha256(id, bytes.length)).toBe(sha256(bytes));
    // Any process can read it: it is kept beside the upload.
    expect(await new S3ClipStore(settings).verifiedSha256(id, bytes.length)).toBe(sha256(bytes));
    expect(await sha256Of(await store.read(id))).toBe(sha256(bytes));
    expect(await store.verifiedSha256(id, bytes.length + 1)).toBeNull();
  });

  it('gives no hash when a PATCH of the upload ran on another process, and the bytes read back are right', async () => {
    const [a, b] = [new S3ClipStore(settings), new S3ClipStore(settings)];
    const bytes = randomBytes(20 * MiB);
    const id = await newUpload(a, bytes.length);
    for (const [store, start, end] of [[a, 0, 9 * MiB], [b, 9 * MiB, 17 * MiB], [a, 17 * MiB, bytes.length]] as const) {
      await store.forget(id);
      await store.tus.write(Readable.from([bytes.subarray(start, end)]), id, start);
    }
    expect(await a.verifiedSha256(id, bytes.length)).toBeNull();
    expect(await sha256Of(await a.read(id))).toBe(sha256(bytes));
  });

  it('keeps the parts an aborted PATCH stored in the chain, so a resumed upload still gets its hash', async () => {
    const [store, observer] = [new S3ClipStore(settings), new S3ClipStore(settings)];
    const bytes = randomBytes(20 * MiB);
    const id = await newUpload(store, bytes.length);
    // The request breaks 2 MiB into the second part, after S3 has the first.
    const firstPartStored = async () => {
      await expect.poll(async () => (await observer.forget(id), await observer.tus.getUpload(id)).offset, { timeout: 30_000, interval: 100 }).toBe(8 * MiB);
    };
    // The store fails the write (its own error may stand in for the body's), keeping the whole part it stored.
    await expect(store.tus.write(breakingBody(bytes, 10 * MiB, firstPartStored), id, 0)).rejects.toBeInstanceOf(Error);
    await store.forget(id);
    const { offset } = await store.tus.getUpload(id);
    expect(offset).toBe(8 * MiB);
    expect(await store.tus.write(Readable.from([bytes.subarray(offset)]), id, offset)).toBe(bytes.length);
    expect(await store.verifiedSha256(id, bytes.length)).toBe(sha256(bytes));
  });

  it('ignores a stored digest that is not well-formed', async () => {
    const store = new S3ClipStore(settings);
    const client = makeS3Client(settings);
    const bytes = randomBytes(6 * MiB);
    const id = await newUpload(store, bytes.length);
    await store.tus.write(Readable.from([bytes]), id, 0);
    expect(await store.verifiedSha256(id, bytes.length)).toBe(sha256(bytes));
    await client.send(new PutObjectCommand({ Bucket: settings.bucket, Key: digestKey(id), Body: '{"size": 1}' }));
    expect(await store.verifiedSha256(id, bytes.length)).toBeNull();
    client.destroy();
  });

  it('removes the digest with the upload', async () => {
    const store = new S3ClipStore(settings);
    const client = makeS3Client(settings);
    const exists = (id: string) =>
      client.send(new GetObjectCommand({ Bucket: settings.bucket, Key: digestKey(id) })).then(
        () => true,
        () => false,
      );
    const done = await newUpload(store, 6 * MiB);
    await store.tus.write(Readable.from([randomBytes(6 * MiB)]), done, 0);
    expect(await exists(done)).toBe(true);
    await store.remove(done);
    expect(await exists(done)).toBe(false);
    client.destroy();
  });
});
