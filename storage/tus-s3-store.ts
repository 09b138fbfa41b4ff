import { pipeline, type Readable } from 'node:stream';
import type { Part } from '@aws-sdk/client-s3';
import { S3Store, type MetadataValue } from '@tus/s3-store';
import type { S3Settings } from './config';
import { addDeleteObjectsMd5, s3ClientConfig } from './s3-client';
import { digestKey, emptyChain, parseDigestRecord, PartDigestTap, verifiedSha256, type DigestChain, type DigestRecord } from './upload-digest';

const isNotFound = (err: unknown): boolean => {
  const e = err as { name?: string; $metadata?: { httpStatusCode?: number } };
  return e.name === 'NoSuchKey' || e.name === 'NotFound' || e.$metadata?.httpStatusCode === 404;
};

/**
 * @tus/s3-store with the Content-MD5 fix on its own client, a way to drop one upload from its cache,
 * and the upload's SHA-256 computed while the parts stream out (upload-digest.ts), so finishing a clip
 * does not read the whole object back from S3.
 */
export class TusS3Store extends S3Store {
  /** The chain a write in this process is extending, by upload id (one writer per upload: the upload lock). */
  private readonly writing = new Map<string, DigestChain>();

  constructor(s: S3Settings) {
    super({
      partSize: s.partSize,
      maxMultipartParts: s.maxParts,
      s3ClientConfig: { ...s3ClientConfig(s), bucket: s.bucket },
    });
    addDeleteObjectsMd5(this.client.middlewareStack);
  }

  forget(id: string): Promise<void> {
    return this.clearCache(id);
  }

  // @tus/s3-store 2.0.7 leaves the trailing short part (`<id>.part`) behind when tus DELETE cancels an upload.
  override async remove(id: string): Promise<void> {
    await super.remove(id);
    await this.client.deleteObjects({ Bucket: this.bucket, Delete: { Objects: [{ Key: this.partKey(id, true) }, { Key: digestKey(id) }], Quiet: true } });
  }

  override async write(src: Readable, id: string, offset: number): Promise<number> {
    try {
      return await super.write(src, id, offset);
    } finally {
      this.writing.delete(id);
    }
  }

  /**
   * Every PATCH's bytes (the previous tail first) pass here once, split into parts. The tap hashes them
   * on the way; the chain is carried on only when it ends exactly where this write begins: same offset,
   * same number of parts. A PATCH that fails half-way (an aborted or paused browser upload) keeps the
   * chain of the parts S3 did store. Otherwise (a crash between storing and recording, parts S3 kept
   * out of order) the upload has no chain and its finish reads the object back.
   */
  protected override async uploadParts(metadata: MetadataValue, readStream: Readable, currentPartNumber: number, offset: number): Promise<number> {
    const id = metadata.file.id;
    const start = await this.chainAt(id, offset, currentPartNumber - 1);
    const tap = start ? await PartDigestTap.start(start, this.calcOptimalPartSize(metadata.file.size)) : null;
    if (!start || !tap) return super.uploadParts(metadata, readStream, currentPartNumber, offset);
    // pipeline() carries an aborted request's error on to the tap, so the splitter behind it fails as it would have.
    let uploaded: number;
    try {
      uploaded = await super.uploadParts(metadata, pipeline(readStream, tap, () => {}), currentPartNumber, offset);
    } catch (err) {
      await this.keepStoredPart(id, start, tap, metadata.file.size).catch(() => undefined);
      throw err;
    }
    const chain = tap.chainAfter(start, metadata.file.size, this.minPartSize);
    await this.saveDigest(id, chain);
    this.writing.set(id, chain);
    return uploaded;
  }

  /** After a failed write: the chain through the parts S3 kept, checked against its part list. */
  private async keepStoredPart(id: string, start: DigestChain, tap: PartDigestTap, size: number | undefined): Promise<void> {
    const stored = await this.retrieveParts(id);
    const chain = tap.chainAfter(start, size, this.minPartSize, stored.map((p) => p.ETag));
    if (chain.parts.length > start.parts.length) await this.saveDigest(id, chain);
  }

  /** At the last byte: the SHA-256 counts only when S3's parts are, one for one, the parts the chain hashed. */
  protected override async finishMultipartUpload(metadata: MetadataValue, parts: Part[]): Promise<string | undefined> {
    const id = metadata.file.id;
    const chain = this.writing.get(id);
    const sha256 = chain && metadata.file.size !== undefined ? await verifiedSha256(chain, metadata.file.size, parts.map((p) => p.ETag)) : null;
    const location = await super.finishMultipartUpload(metadata, parts);
    if (sha256 && metadata.file.size !== undefined) await this.saveDigest(id, { kind: 'done', size: metadata.file.size, sha256 });
    else await this.dropDigest(id);
    return location;
  }

  /** The SHA-256 recorded for a finished upload of `size` bytes, verified against its parts; null when there is none. */
  async finishedSha256(id: string, size: number): Promise<string | null> {
    const record = await this.readDigest(id);
    return record?.kind === 'done' && record.size === size ? record.sha256 : null;
  }

  /** The chain to extend for a write whose stream starts at `offset` after `partCount` parts; null when there is none to trust. */
  private async chainAt(id: string, offset: number, partCount: number): Promise<DigestChain | null> {
    if (offset === 0 && partCount === 0) return emptyChain();
    const record = await this.readDigest(id);
    if (record?.kind === 'chain' && record.offset === offset && record.parts.length === partCount) return record;
    // Broken chain: remove it, so no later write can take it up again.
    if (record) await this.dropDigest(id);
    return null;
  }

  private async readDigest(id: string): Promise<DigestRecord | null> {
    try {
      const res = await this.client.getObject({ Bucket: this.bucket, Key: digestKey(id) });
      return parseDigestRecord((await res.Body?.transformToString()) ?? '');
    } catch (err) {
      if (isNotFound(err)) return null;
      throw err;
    }
  }

  private async saveDigest(id: string, record: DigestRecord): Promise<void> {
    await this.client.putObject({ Bucket: this.bucket, Key: digestKey(id), Body: JSON.stringify(record), ContentType: 'application/json' });
  }

  private async dropDigest(id: string): Promise<void> {
    await this.client.deleteObject({ Bucket: this.bucket, Key: digestKey(id) });
  }
}
