import { execFile } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { Readable } from 'node:stream';
import { promisify } from 'node:util';
import type { Upload } from '@tus/server';
import { describe, expect, it } from 'vitest';
import { recordClipOnce } from '@/lib/clips/queries';
import { DiskClipStore } from '@/storage/disk-store';
import { sha256Of } from '@/storage/ingest';
import { moveClipsToS3 } from '@/storage/move-to-s3';
import { S3ClipStore } from '@/storage/s3-store';
import { db } from '@/db/client';
import { makeCrew } from '../../integration/helpers';
import { newTestBucket, s3AppEnv } from '../../integration/s3-bucket';
import { makeShotEpisode } from '../../integration/shot-fixtures';

async function diskClip(store: DiskClipStore, segmentId: string, uploaderId: string, bytes: Buffer) {
  const uploadId = randomBytes(16).toString('hex');
  await store.tus.create({ id: uploadId, size: bytes.length, offset: 0, metadata: {}, creation_date: new Date().toISOString() } as Upload);
  await store.tus.write(Readable.from([bytes]), uploadId, 0);
  const sha256 = await sha256Of(Readable.from([bytes]));
  const { clipId } = await recordClipOnce({ uploadId, segmentId, shotId: null, uploadedBy: uploaderId, originalName: 'a.mp4', mimeType: 'video/mp4', sizeBytes: bytes.length, sha256 });
  return { uploadId, clipId, sha256 };
}

describe('moving clips from disk to S3', () => {
  it('copies bytes and posters, checks every copy’s SHA-256, skips what is there on a second run, and reports bytes that changed on disk', async () => {
    const root = fs.mkdtempSync(path.join(os.tmpdir(), 'kerfline-move-'));
    const disk = new DiskClipStore(path.join(root, 'uploads'), path.join(root, 'posters'));
    const bucket = await newTestBucket('move');
    const s3 = new S3ClipStore(bucket);
    const crew = await makeCrew();
    const { build } = await makeShotEpisode(crew);
    const big = await diskClip(disk, build.id, crew.host.id, randomBytes(9 * 1024 * 1024 + 17));
    const small = await diskClip(disk, build.id, crew.host.id, randomBytes(3000));
    const poster = path.join(root, 'p.jpg');
    fs.writeFileSync(poster, Buffer.from([0xff, 0xd8, 0xff, 0xd9]));
    await disk.savePoster(small.clipId, poster);
    await db('clips').where({ id: small.clipId }).update({ has_poster: true });

    const first = await moveClipsToS3(disk, s3, { channelId: crew.channel.id });
    expect(first.map((r) => r.outcome)).toEqual(['copied', 'copied']);
    expect(await sha256Of(await s3.read(big.uploadId))).toBe(big.sha256);
    expect(await sha256Of(await s3.read(small.uploadId))).toBe(small.sha256);
    expect(await s3.readPoster(small.clipId)).not.toBeNull();

    // The disk copy of one clip changes; it is already in the bucket, so nothing is copied again.
    fs.writeFileSync(await disk.mediaSource(small.uploadId), randomBytes(3000));
    const second = await moveClipsToS3(disk, s3, { channelId: crew.channel.id });
    expect(second.map((r) => r.outcome)).toEqual(['already there', 'already there']);

    // A clip not yet in the bucket whose disk bytes no longer match is reported and not copied.
    const third = await diskClip(disk, build.id, crew.host.id, randomBytes(500));
    fs.writeFileSync(await disk.mediaSource(third.uploadId), randomBytes(500));
    const rerun = await moveClipsToS3(disk, s3, { channelId: crew.channel.id, removeSource: true });
    expect(rerun.find((r) => r.uploadId === third.uploadId)?.outcome).toBe('source differs');
    expect(await s3.stat(third.uploadId)).toBeNull();
    // With removeSource, local bytes go only for clips whose copy checked out.
    expect(await disk.stat(big.uploadId)).toBeNull();
    expect(await disk.stat(third.uploadId)).not.toBeNull();
    fs.rmSync(root, { recursive: true, force: true });
  });

  it('runs as a script and exits 1 when a clip is missing on disk', async () => {
    const root = fs.mkdtempSync(path.join(os.tmpdir(), 'kerfline-move-cli-'));
    const crew = await makeCrew();
    const { build } = await makeShotEpisode(crew);
    const disk = new DiskClipStore(path.join(root, 'uploads'), path.join(root, 'posters'));
    const kept = await diskClip(disk, build.id, crew.host.id, randomBytes(2000));
    const lost = await diskClip(disk, build.id, crew.host.id, randomBytes(2000));
    await disk.remove(lost.uploadId);
    const bucket = await newTestBucket('move-cli');
    const run = promisify(execFile)(process.execPath, ['--conditions=react-server', '--import', 'tsx', 'scripts/move-clips-to-s3.ts', '--channel', crew.channel.id], {
      env: { ...process.env, ...s3AppEnv(bucket), UPLOAD_DIR: path.join(root, 'uploads'), POSTER_DIR: path.join(root, 'posters') },
    });
    const failure = (await run.catch((e: unknown) => e)) as { code?: number; stdout?: string; stderr?: string };
    expect(failure.code).toBe(1);
    expect(failure.stdout).toMatch(/2 clip\(s\): 1 copied, 1 missing/);
    expect(failure.stderr).toContain(lost.uploadId);
    expect(await sha256Of(await new S3ClipStore(bucket).read(kept.uploadId))).toBe(kept.sha256);
    fs.rmSync(root, { recursive: true, force: true });
  });
});
