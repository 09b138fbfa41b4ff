import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { HeadObjectCommand } from '@aws-sdk/client-s3';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/db/client';
import { makeS3Client } from '@/storage/s3-client';
import { makeCrew, sessionCookie } from '../../integration/helpers';
import type { Crew } from '../../integration/route-matrix';
import { makeShotEpisode } from '../../integration/shot-fixtures';
import { makeRandomFile, startTusUpload } from '../tus-client';
import { bucketStore, clipsOf, idOf, makeVideo, ports, s3App, settings, storedSha } from './s3-apps';

// The upload guarantees of tests/integration/uploads.test.ts, with the built app keeping clips in S3 (Swift's s3api).
const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'kerfline-uploads-s3-'));
const SIZE = 40 * 1024 * 1024;
const app = s3App(ports.uploads);
const endpoint = () => `${app.url}/api/uploads`;

let crew: Crew;
let segmentId: string;
let cookie: string;
let file: string;
let sha: string;

beforeAll(async () => {
  await app.start();
  crew = await makeCrew();
  segmentId = (await makeShotEpisode(crew)).build.id;
  cookie = await sessionCookie(crew.shopHand);
  file = path.join(dir, 'big.bin');
  sha = await makeRandomFile(file, SIZE);
});

afterAll(async () => {
  await app.kill();
  fs.rmSync(dir, { recursive: true, force: true });
});

const meta = (filename: string, filetype = 'video/mp4') => ({ segmentId, filename, filetype });

describe('tus uploads into S3', () => {
  it('resumes an upload aborted midway from the offset S3 holds; the stored SHA-256 matches and there is one clip row', async () => {
    let aborted: Promise<void> | null = null;
    const first = startTusUpload(endpoint(), file, {
      cookie,
      metadata: meta('resumed.bin'),
      onProgress: (sent, total) => {
        if (!aborted && sent > total * 0.4) aborted = first.abort();
      },
    });
    await expect.poll(() => aborted !== null, { timeout: 60_000, interval: 50 }).toBe(true);
    await aborted;
    const head = await fetch(first.url!, { method: 'HEAD', headers: { 'Tus-Resumable': '1.0.0', cookie } });
    const offset = Number(head.headers.get('upload-offset'));
    expect(offset).toBeGreaterThan(0);
    expect(offset).toBeLessThan(SIZE);
    expect(await clipsOf(idOf(first.url!))).toHaveLength(0);

    await startTusUpload(endpoint(), file, { cookie, metadata: {}, uploadUrl: first.url! }).done;
    const clips = await clipsOf(idOf(first.url!));
    expect(clips).toHaveLength(1);
    expect(clips[0]).toMatchObject({ sha256: sha, size_bytes: String(SIZE), original_name: 'resumed.bin' });
    expect(await storedSha(idOf(first.url!))).toBe(sha);
  });

  it('finishes an upload when the app process is killed mid-upload and started again', async () => {
    let killed = false;
    let restarting: Promise<void> | null = null;
    const run = startTusUpload(endpoint(), file, {
      cookie,
      metadata: meta('restart.bin'),
      onProgress: (sent, total) => {
        if (!killed && sent > total * 0.3) {
          killed = true;
          restarting = app.kill().then(() => app.start());
        }
      },
    });
    await run.done;
    await restarting;
    expect(killed).toBe(true);
    const clips = await clipsOf(idOf(run.url!));
    expect(clips).toHaveLength(1);
    expect(clips[0]?.sha256).toBe(sha);
    expect(await storedSha(idOf(run.url!))).toBe(sha);
  }, 120_000);

  it('writes one clip row when the finishing PATCH is sent again', async () => {
    const small = path.join(dir, 'small.bin');
    await makeRandomFile(small, 1000);
    const run = startTusUpload(endpoint(), small, { cookie, metadata: meta('small.bin') });
    await run.done;
    const again = await fetch(run.url!, {
      method: 'PATCH',
      headers: { 'Tus-Resumable': '1.0.0', 'Upload-Offset': '1000', 'Content-Type': 'application/offset+octet-stream', cookie, origin: app.url },
      body: new Uint8Array(0),
    });
    expect(again.status).toBeLessThan(500);
    expect(await clipsOf(idOf(run.url!))).toHaveLength(1);
  });

  it('cancels an unfinished upload with tus DELETE and removes what S3 held of it', async () => {
    let aborted: Promise<void> | null = null;
    const run = startTusUpload(endpoint(), file, {
      cookie,
      metadata: meta('cancelled.bin'),
      onProgress: (sent, total) => {
        if (!aborted && sent > total * 0.3) aborted = run.abort();
      },
    });
    await expect.poll(() => aborted !== null, { timeout: 60_000, interval: 50 }).toBe(true);
    await aborted;
    const id = idOf(run.url!);
    expect((await bucketStore().listUnfinished()).map((u) => u.uploadId)).toContain(id);
    // A short tail PATCH leaves S3 a trailing part shorter than a multipart part: `<id>.part`.
    const head = await fetch(run.url!, { method: 'HEAD', headers: { 'Tus-Resumable': '1.0.0', cookie } });
    const tail = await fetch(run.url!, {
      method: 'PATCH',
      headers: { 'Tus-Resumable': '1.0.0', 'Upload-Offset': head.headers.get('upload-offset')!, 'Content-Type': 'application/offset+octet-stream', cookie, origin: app.url },
      body: new Uint8Array(1000),
    });
    expect(tail.status).toBe(204);
    const res = await fetch(run.url!, { method: 'DELETE', headers: { 'Tus-Resumable': '1.0.0', cookie, origin: app.url } });
    expect(res.status).toBe(204);
    expect((await bucketStore().listUnfinished()).map((u) => u.uploadId)).not.toContain(id);
    const s3 = makeS3Client(settings());
    for (const key of [id, `${id}.info`, `${id}.part`]) {
      await expect(s3.send(new HeadObjectCommand({ Bucket: settings().bucket, Key: key })), key).rejects.toMatchObject({ $metadata: { httpStatusCode: 404 } });
    }
    expect((await fetch(run.url!, { method: 'HEAD', headers: { 'Tus-Resumable': '1.0.0', cookie } })).status).toBe(404);
  });
});

describe('clip files from S3', () => {
  let clipId: string;
  let bytes: Buffer;
  const fileUrl = () => `${app.url}/api/channels/${crew.channel.slug}/clips/${clipId}/file`;

  beforeAll(async () => {
    const video = path.join(dir, 'take.mov');
    makeVideo(video, 2);
    bytes = fs.readFileSync(video);
    const run = startTusUpload(endpoint(), video, { cookie, metadata: meta('Glue up – take 3.mov', 'video/quicktime') });
    await run.done;
    clipId = (await clipsOf(idOf(run.url!)))[0]!.id as string;
  });

  // ffprobe and ffmpeg share two busy cores with Swift and the app: minutes, not seconds, under load.
  it('reads media details through a presigned URL and keeps the poster in the bucket', { timeout: 180_000 }, async () => {
    await expect
      .poll(async () => (await db('clips').where({ id: clipId }).first('probe_state')).probe_state, { timeout: 120_000, interval: 300 })
      .toBe('done');
    const clip = await db('clips').where({ id: clipId }).first();
    expect(clip).toMatchObject({ width: 1280, height: 720, codec: 'mjpeg', has_poster: true });
    expect(clip.duration_seconds).toBeCloseTo(2, 1);
    expect(await bucketStore().readPoster(clipId)).not.toBeNull();
    const poster = await fetch(`${app.url}/api/channels/${crew.channel.slug}/clips/${clipId}/poster`, { headers: { cookie: await sessionCookie(crew.editor) } });
    expect(poster.status).toBe(200);
    expect(Buffer.from(await poster.arrayBuffer()).subarray(0, 2).equals(Buffer.from([0xff, 0xd8]))).toBe(true);
  });

  it('streams byte ranges and the whole download from S3', async () => {
    const editor = await sessionCookie(crew.editor);
    const part = await fetch(fileUrl(), { headers: { cookie: editor, range: 'bytes=100-1099' } });
    expect(part.status).toBe(206);
    expect(part.headers.get('content-range')).toBe(`bytes 100-1099/${bytes.length}`);
    expect(Buffer.from(await part.arrayBuffer()).equals(bytes.subarray(100, 1100))).toBe(true);
    const tail = await fetch(fileUrl(), { headers: { cookie: editor, range: 'bytes=-10' } });
    expect(Buffer.from(await tail.arrayBuffer()).equals(bytes.subarray(bytes.length - 10))).toBe(true);
    const whole = await fetch(`${fileUrl()}?download=1`, { headers: { cookie: editor } });
    expect(whole.status).toBe(200);
    expect(Buffer.from(await whole.arrayBuffer()).equals(bytes)).toBe(true);
  });

  it('removes the clip’s bytes and poster from the bucket when the clip is deleted', async () => {
    const uploadId = (await db('clips').where({ id: clipId }).first('upload_id')).upload_id as string;
    const res = await fetch(`${app.url}/api/channels/${crew.channel.slug}/clips/${clipId}`, { method: 'DELETE', headers: { cookie: await sessionCookie(crew.host), origin: app.url } });
    expect(res.status).toBe(204);
    await expect.poll(async () => bucketStore().stat(uploadId), { timeout: 10_000 }).toBeNull();
    expect(await bucketStore().readPoster(clipId)).toBeNull();
  });
});
