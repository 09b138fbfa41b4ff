import { createHash, randomBytes, randomUUID } from 'node:crypto';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { Readable } from 'node:stream';
import { Upload } from '@tus/server';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { S3Settings } from '@/storage/config';
import { sha256Of } from '@/storage/ingest';
import { withDeclaredBodyLength } from '@/storage/patch-length';
import { IncompleteBodyError } from '@/storage/part-streamer';
import { S3ClipStore } from '@/storage/s3-store';
import { newTestBucket } from './s3-bucket';

// What the S3 tus store may remember between the steps of a PATCH (storage/tus-s3-store.ts): the parts it saw
// under the upload lock, and the upload record, against the real Swift server `npm test` starts. Requests
// pass a counting proxy so the test sees how many the store makes.

const MiB = 1024 * 1024;
const sha256 = (b: Buffer) => createHash('sha256').update(b).digest('hex');

let settings: S3Settings;
let proxied: S3Settings;
let proxy: http.Server;
const requests: string[] = [];

beforeAll(async () => {
  settings = await newTestBucket('lease');
  const to = new URL(settings.endpoint ?? '');
  proxy = http.createServer((req, res) => {
    const q = new URL(req.url ?? '/', 'http://x').searchParams;
    // Source: Amazon S3 API Reference, the operations' request syntax (partNumber + uploadId: UploadPart; uploadId alone on GET: ListParts).
    requests.push(q.has('partNumber') ? 'UploadPart' : req.method === 'GET' && q.has('uploadId') ? 'ListParts' : `${req.method} ${req.url?.split('?')[0]?.split('.').pop()}`);
    const up = http.request({ host: to.hostname, port: to.port, method: req.method, path: req.url, headers: req.headers }, (r) => {
      res.writeHead(r.statusCode ?? 502, r.headers);
      r.pipe(res);
    });
    up.on('error', () => res.destroy());
    req.pipe(up);
  });
  await new Promise<void>((resolve) => proxy.listen(0, '127.0.0.1', resolve));
  proxied = { ...settings, endpoint: `http://127.0.0.1:${(proxy.address() as AddressInfo).port}` };
});

afterAll(async () => {
  proxy.closeAllConnections();
  await new Promise((resolve) => proxy.close(resolve));
});

// Upload marks as PostgreSQL keeps them (storage/upload-lock-queries.ts): each hold of an upload's lock sets a new mark and learns the one before.
const marks = new Map<string, string>();

async function hold(store: S3ClipStore, id: string): Promise<void> {
  const current = randomUUID();
  const previous = marks.get(id) ?? null;
  marks.set(id, current);
  await store.uploadLocked(id, { previous, current });
}

async function newUpload(store: S3ClipStore, size: number): Promise<string> {
  const id = randomBytes(16).toString('hex');
  await store.tus.create(new Upload({ id, size, offset: 0, metadata: { uploaderId: 'u1' }, creation_date: new Date().toISOString() }));
  return id;
}

/**
 * One PATCH as @tus/server runs it: lock, look, write, unlock. With `declared`, the PATCH says its
 * Content-Length (end - start), as tus-js-client's do, and only the first `declared.arrives` bytes come.
 */
async function patch(store: S3ClipStore, id: string, bytes: Buffer, start: number, end: number, declared?: { arrives: number }): Promise<number> {
  await hold(store, id);
  try {
    const { offset } = await store.tus.getUpload(id);
    expect(offset).toBe(start);
    const body = Readable.from([bytes.subarray(start, start + (declared?.arrives ?? end - start))]);
    if (!declared) return await store.tus.write(body, id, offset);
    const headers = new Headers({ 'content-length': String(end - start) });
    return await withDeclaredBodyLength({ headers }, () => store.tus.write(body, id, offset));
  } finally {
    store.uploadUnlocked(id);
  }
}

describe('the S3 tus store between the steps of a PATCH', () => {
  it('asks S3 about the upload once per PATCH: its parts and its tail, then sends the parts', async () => {
    const store = new S3ClipStore(proxied);
    const bytes = randomBytes(24 * MiB);
    const id = await newUpload(store, bytes.length);
    await patch(store, id, bytes, 0, 8 * MiB);
    // Another process held the lock in between (a HEAD, say): it may have written, so the PATCH looks.
    marks.set(id, randomUUID());
    requests.length = 0;
    await patch(store, id, bytes, 8 * MiB, 16 * MiB);
    expect(requests).toEqual(['ListParts', 'HEAD part', 'UploadPart']);
  });

  it('does not ask S3 again when no other process held the lock since its own last PATCH', async () => {
    const store = new S3ClipStore(proxied);
    const bytes = randomBytes(21 * MiB + 9);
    const id = await newUpload(store, bytes.length);
    // 3 MiB: a tail only; then 8 MiB across the tail (part 1, a 3 MiB tail again); then the rest.
    await patch(store, id, bytes, 0, 3 * MiB);
    requests.length = 0;
    await patch(store, id, bytes, 3 * MiB, 11 * MiB, { arrives: 8 * MiB });
    expect(requests).toEqual(['GET part', 'DELETE part', 'UploadPart', 'PUT part']);
    await hold(store, id);
    expect((await store.tus.getUpload(id)).offset).toBe(11 * MiB);
    store.uploadUnlocked(id);
    requests.length = 0;
    expect(await patch(store, id, bytes, 11 * MiB, bytes.length, { arrives: bytes.length - 11 * MiB })).toBe(bytes.length);
    expect(requests.filter((r) => r === 'ListParts' || r === 'HEAD part')).toHaveLength(1);
    expect(await store.verifiedSha256(id, bytes.length)).toBe(sha256(bytes));
    expect(await sha256Of(await store.read(id))).toBe(sha256(bytes));
  });

  it('looks again after another process held the lock, and the bytes stay whole', async () => {
    const [a, b] = [new S3ClipStore(settings), new S3ClipStore(settings)];
    const bytes = randomBytes(21 * MiB + 7);
    const id = await newUpload(a, bytes.length);
    // A leaves a 1 MiB tail, B writes across it, A takes up B's tail and finishes.
    await patch(a, id, bytes, 0, 9 * MiB);
    await patch(b, id, bytes, 9 * MiB, 19 * MiB);
    expect(await patch(a, id, bytes, 19 * MiB, bytes.length)).toBe(bytes.length);
    expect(await sha256Of(await a.read(id))).toBe(sha256(bytes));
    // B's PATCH broke A's digest chain: the hash comes from reading back, never from a stale chain.
    expect(await a.verifiedSha256(id, bytes.length)).toBeNull();
  });

  it('does not take an upload removed by another process for a finished one, though its record was cached', async () => {
    const [a, b] = [new S3ClipStore(settings), new S3ClipStore(settings)];
    const bytes = randomBytes(6 * MiB);
    const id = await newUpload(a, bytes.length);
    await patch(a, id, bytes, 0, 2 * MiB);
    expect(await a.uploadMetadata(id)).toMatchObject({ uploaderId: 'u1' });
    // Removed outside the lock, as the stale-upload sweep does (storage/cleanup.ts): it drops the upload's mark first.
    marks.delete(id);
    await b.remove(id);
    await hold(a, id);
    await expect(a.tus.getUpload(id)).rejects.toMatchObject({ status_code: 404 });
    a.uploadUnlocked(id);
    expect(await b.uploadMetadata(id)).toBeNull();
  });

  it('finishes an upload whose last PATCH carries the tail and a short last part, with its hash on the way in', async () => {
    const store = new S3ClipStore(proxied);
    const bytes = randomBytes(19 * MiB + 3);
    const id = await newUpload(store, bytes.length);
    await patch(store, id, bytes, 0, 3 * MiB);
    await patch(store, id, bytes, 3 * MiB, 11 * MiB);
    expect(await patch(store, id, bytes, 11 * MiB, bytes.length)).toBe(bytes.length);
    expect(await store.verifiedSha256(id, bytes.length)).toBe(sha256(bytes));
    expect(await sha256Of(await store.read(id))).toBe(sha256(bytes));
    // A finished upload reads as finished, also on a process that never saw it.
    await hold(store, id);
    expect((await store.tus.getUpload(id)).offset).toBe(bytes.length);
    store.uploadUnlocked(id);
    expect((await new S3ClipStore(settings).tus.getUpload(id)).offset).toBe(bytes.length);
  });

  it('streams the parts of a PATCH whose length it declares, and hashes them on the way in', async () => {
    const store = new S3ClipStore(proxied);
    const bytes = randomBytes(21 * MiB + 5);
    const id = await newUpload(store, bytes.length);
    requests.length = 0;
    await patch(store, id, bytes, 0, 16 * MiB, { arrives: 16 * MiB });
    expect(requests.filter((r) => r === 'UploadPart')).toHaveLength(2);
    expect(await patch(store, id, bytes, 16 * MiB, bytes.length, { arrives: bytes.length - 16 * MiB })).toBe(bytes.length);
    expect(await store.verifiedSha256(id, bytes.length)).toBe(sha256(bytes));
    expect(await sha256Of(await store.read(id))).toBe(sha256(bytes));
  });

  it('keeps only whole parts when a streamed PATCH ends short, and the upload resumes from what S3 kept', async () => {
    const store = new S3ClipStore(settings);
    const bytes = randomBytes(20 * MiB);
    const id = await newUpload(store, bytes.length);
    // An aborted PATCH: 13 MiB of the 20 it declared arrive. Part 1 is whole; part 2 must not reach S3 with 5 MiB.
    await expect(patch(store, id, bytes, 0, 20 * MiB, { arrives: 13 * MiB })).rejects.toBeInstanceOf(IncompleteBodyError);
    await hold(store, id);
    expect((await store.tus.getUpload(id)).offset).toBe(8 * MiB);
    store.uploadUnlocked(id);
    expect(await patch(store, id, bytes, 8 * MiB, bytes.length, { arrives: 12 * MiB })).toBe(bytes.length);
    // The chain kept the part S3 stored, so the hash still came on the way in, and it is right.
    expect(await store.verifiedSha256(id, bytes.length)).toBe(sha256(bytes));
    expect(await sha256Of(await store.read(id))).toBe(sha256(bytes));
  });
});
