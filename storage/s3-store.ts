import { createReadStream } from 'node:fs';
import { stat as statFile } from 'node:fs/promises';
import type { Readable } from 'node:stream';
import {
  DeleteObjectCommand,
  DeleteObjectsCommand,
  GetObjectCommand,
  HeadObjectCommand,
  ListMultipartUploadsCommand,
  ListObjectsV2Command,
  ListPartsCommand,
  PutObjectCommand,
  type S3Client,
} from '@aws-sdk/client-s3';
import { Upload as MultipartUpload } from '@aws-sdk/lib-storage';
import { getSignedUrl } from '@aws-sdk/s3-request-presigner';
import { checkClipId, checkUploadId, isClipId, isUploadId, type ClipStore } from './clip-store';
import type { S3Settings } from './config';
import { makeS3Client } from './s3-client';
import { TusS3Store } from './tus-s3-store';
import type { LockMarks } from './upload-lock-queries';
import { digestKey } from './upload-digest';

const notFound = (err: unknown): boolean => {
  const e = err as { name?: string; $metadata?: { httpStatusCode?: number } };
  return e.name === 'NoSuchKey' || e.name === 'NotFound' || e.name === 'NoSuchUpload' || e.$metadata?.httpStatusCode === 404;
};

/**
 * Clips in an S3-compatible bucket. tus writes each upload as a multipart upload under its id (plus
 * `<id>.info`, between PATCHes `<id>.part`, and `<id>.sha256`, its digest so far); posters live under `posters/`. Reads stream from the
 * bucket with ranged GetObject, never through a local copy; ffprobe/ffmpeg get a presigned URL.
 */
export class S3ClipStore implements ClipStore {
  readonly tus: TusS3Store;
  private readonly client: S3Client;
  private readonly bucket: string;

  constructor(private readonly settings: S3Settings) {
    this.tus = new TusS3Store(settings);
    this.client = makeS3Client(settings);
    this.bucket = settings.bucket;
  }

  /** Stores a finished upload's bytes whole (moving clips from disk): a multipart upload within the server's part limit. */
  async putFinished(uploadId: string, body: Readable, size: number): Promise<void> {
    const partSize = Math.max(this.settings.partSize, Math.ceil(size / this.settings.maxParts));
    await new MultipartUpload({ client: this.client, params: { Bucket: this.bucket, Key: checkUploadId(uploadId), Body: body }, partSize, queueSize: 4 }).done();
  }

  private posterKey(clipId: string): string {
    return `posters/${checkClipId(clipId)}.jpg`;
  }

  async read(uploadId: string, range?: { start: number; end: number }): Promise<Readable> {
    const res = await this.client.send(
      new GetObjectCommand({ Bucket: this.bucket, Key: checkUploadId(uploadId), Range: range ? `bytes=${range.start}-${range.end}` : undefined }),
    );
    if (!res.Body) throw new Error(`no body for ${uploadId}`);
    return res.Body as Readable;
  }

  async stat(uploadId: string): Promise<{ size: number; modifiedAt: Date } | null> {
    try {
      const head = await this.client.send(new HeadObjectCommand({ Bucket: this.bucket, Key: checkUploadId(uploadId) }));
      return { size: head.ContentLength ?? 0, modifiedAt: head.LastModified ?? new Date(0) };
    } catch (err) {
      if (notFound(err)) return null;
      throw err;
    }
  }

  async remove(uploadId: string): Promise<void> {
    checkUploadId(uploadId);
    // tus aborts an unfinished multipart upload; a finished one (or a half-removed one) has only objects left.
    await this.tus.remove(uploadId).catch(() => undefined);
    await this.client.send(
      new DeleteObjectsCommand({
        Bucket: this.bucket,
        Delete: { Objects: [uploadId, `${uploadId}.info`, `${uploadId}.part`, digestKey(uploadId)].map((Key) => ({ Key })), Quiet: true },
      }),
    );
    await this.tus.forget(uploadId);
  }

  async listUnfinished(): Promise<{ uploadId: string; touchedAt: Date }[]> {
    const out: { uploadId: string; touchedAt: Date }[] = [];
    let KeyMarker: string | undefined;
    let UploadIdMarker: string | undefined;
    do {
      const page = await this.client.send(new ListMultipartUploadsCommand({ Bucket: this.bucket, KeyMarker, UploadIdMarker }));
      for (const u of page.Uploads ?? []) {
        if (!u.Key || !u.UploadId || !isUploadId(u.Key)) continue;
        out.push({ uploadId: u.Key, touchedAt: await this.lastTouched(u.Key, u.UploadId, u.Initiated) });
      }
      ({ NextKeyMarker: KeyMarker, NextUploadIdMarker: UploadIdMarker } = page);
      if (!page.IsTruncated) break;
    } while (KeyMarker);
    return out;
  }

  /** Finished uploads are whole objects named by their upload id (tus completes the multipart upload at the last byte). */
  async listFinished(): Promise<{ uploadId: string; touchedAt: Date }[]> {
    const out: { uploadId: string; touchedAt: Date }[] = [];
    for await (const o of this.listObjects()) {
      if (o.Key && isUploadId(o.Key)) out.push({ uploadId: o.Key, touchedAt: o.LastModified ?? new Date(0) });
    }
    return out;
  }

  async listPosters(): Promise<string[]> {
    const out: string[] = [];
    for await (const o of this.listObjects('posters/')) {
      const clipId = o.Key?.slice('posters/'.length).replace(/\.jpg$/, '');
      if (clipId && isClipId(clipId)) out.push(clipId);
    }
    return out;
  }

  private async *listObjects(Prefix?: string): AsyncGenerator<{ Key?: string; LastModified?: Date }> {
    let ContinuationToken: string | undefined;
    do {
      const page = await this.client.send(new ListObjectsV2Command({ Bucket: this.bucket, Prefix, ContinuationToken }));
      yield* page.Contents ?? [];
      ContinuationToken = page.IsTruncated ? page.NextContinuationToken : undefined;
    } while (ContinuationToken);
  }

  /** The latest of: the upload began, a part arrived, the trailing short part changed. */
  private async lastTouched(key: string, uploadId: string, initiated: Date | undefined): Promise<Date> {
    let latest = initiated?.getTime() ?? 0;
    const parts = await this.client.send(new ListPartsCommand({ Bucket: this.bucket, Key: key, UploadId: uploadId })).catch(() => null);
    for (const p of parts?.Parts ?? []) latest = Math.max(latest, p.LastModified?.getTime() ?? 0);
    const tail = await this.client.send(new HeadObjectCommand({ Bucket: this.bucket, Key: `${key}.part` })).catch(() => null);
    latest = Math.max(latest, tail?.LastModified?.getTime() ?? 0);
    return new Date(latest);
  }

  async mediaSource(uploadId: string, ttlSeconds = 15 * 60): Promise<string> {
    return getSignedUrl(this.client, new GetObjectCommand({ Bucket: this.bucket, Key: checkUploadId(uploadId) }), { expiresIn: ttlSeconds });
  }

  forget(uploadId: string): Promise<void> {
    return this.tus.forget(uploadId);
  }

  uploadLocked(uploadId: string, marks: LockMarks): Promise<void> {
    return this.tus.lockTaken(uploadId, marks);
  }

  uploadUnlocked(uploadId: string): void {
    this.tus.lockReleased(uploadId);
  }

  /** From the upload record alone (cached): the policy check before the lock needs no parts or offset. */
  async uploadMetadata(uploadId: string): Promise<Record<string, string | null> | null> {
    return this.tus.uploadMetadata(checkUploadId(uploadId));
  }

  verifiedSha256(uploadId: string, size: number): Promise<string | null> {
    return this.tus.finishedSha256(checkUploadId(uploadId), size);
  }

  async savePoster(clipId: string, jpegPath: string): Promise<void> {
    const { size } = await statFile(jpegPath);
    await this.client.send(
      new PutObjectCommand({ Bucket: this.bucket, Key: this.posterKey(clipId), Body: createReadStream(jpegPath), ContentLength: size, ContentType: 'image/jpeg' }),
    );
  }

  async readPoster(clipId: string): Promise<Readable | null> {
    try {
      const res = await this.client.send(new GetObjectCommand({ Bucket: this.bucket, Key: this.posterKey(clipId) }));
      return (res.Body as Readable | undefined) ?? null;
    } catch (err) {
      if (notFound(err)) return null;
      throw err;
    }
  }

  async removePoster(clipId: string): Promise<void> {
    await this.client.send(new DeleteObjectCommand({ Bucket: this.bucket, Key: this.posterKey(clipId) }));
  }
}
