import { pipeline, type Readable } from 'node:stream';
import type { Part } from '@aws-sdk/client-s3';
import { S3Store, type MetadataValue } from '@tus/s3-store';
import type { S3Settings } from './config';
import { addDeleteObjectsMd5, s3ClientConfig } from './s3-client';
import { digestKey, emptyChain, parseVerifiedDigest, PartDigestTap, verifiedSha256, type DigestChain } from './upload-digest';

const isNotFound = (err: unknown): boolean => {
  const e = err as { name?: string; $metadata?: { httpStatusCode?: number } };
  return e.name === 'NoSuchKey' || e.name === 'NotFound' || e.$metadata?.httpStatusCode === 404;
};

// Chains of uploads this process is writing. An upload left unfinished for a day is taken up again, if
// ever, with a read-back at its finish; the cap bounds memory (a chain is a few hundred bytes per GiB).
const CHAIN_IDLE_MS = 24 * 3600 * 1000;
const MAX_CHAINS = 10_000;

/**
 * @tus/s3-store with the Content-MD5 fix on its own client, a way to drop one upload from its cache,
 * and the upload's SHA-256 computed while the parts stream out (upload-digest.ts), so finishing a clip
 * does not read the whole object back from S3.
 */
export class TusS3Store extends S3Store {
  private readonly chains = new Map<string, { chain: DigestChain; at: number }>();

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
    this.chains.delete(id);
    await super.remove(id);
    await this.client.deleteObjects({ Bucket: this.bucket, Delete: { Objects: [{ Key: this.partKey(id, true) }, { Key: digestKey(id) }], Quiet: true } });
  }

  /**
   * Every PATCH's bytes (the previous tail first) pass here once, split into parts. The tap hashes them
   * on the way; the chain goes on only when it ends exactly where this write begins: same offset, same
   * number of parts. A PATCH that fails half-way (an aborted or paused browser upload) keeps the chain
   * of the parts S3 did store. An upload whose previous PATCH ran on another process has no chain here,
   * and its finish reads the object back.
   */
  protected override async uploadParts(metadata: MetadataValue, readStream: Readable, currentPartNumber: number, offset: number): Promise<number> {
    const id = metadata.file.id;
    const start = this.chainAt(id, offset, currentPartNumber - 1);
    if (!start) return super.uploadParts(metadata, readStream, currentPartNumber, offset);
    const tap = new PartDigestTap(start, this.calcOptimalPartSize(metadata.file.size));
    let uploaded: number;
    try {
      // pipeline() carries an aborted request's error on to the tap, so the splitter behind it fails as it would have.
      uploaded = await super.uploadParts(metadata, pipeline(readStream, tap, () => {}), currentPartNumber, offset);
    } catch (err) {
      const stored = await this.retrieveParts(id).catch(() => null);
      if (stored) this.keep(id, tap.chainAfter(start, metadata.file.size, this.minPartSize, stored.map((p) => p.ETag)));
      throw err;
    }
    this.keep(id, tap.chainAfter(start, metadata.file.size, this.minPartSize));
    return uploaded;
  }

  /** At the last byte: the SHA-256 counts only when S3's parts are, one for one, the parts the chain hashed. */
  protected override async finishMultipartUpload(metadata: MetadataValue, parts: Part[]): Promise<string | undefined> {
    const id = metadata.file.id;
    const chain = this.chains.get(id)?.chain;
    this.chains.delete(id);
    const size = metadata.file.size;
    const sha256 = chain && size !== undefined ? verifiedSha256(chain, size, parts.map((p) => p.ETag)) : null;
    const location = await super.finishMultipartUpload(metadata, parts);
    if (sha256 && size !== undefined) {
      await this.client.putObject({ Bucket: this.bucket, Key: digestKey(id), Body: JSON.stringify({ size, sha256 }), ContentType: 'application/json' });
    }
    return location;
  }

  /** The SHA-256 recorded for a finished upload of `size` bytes, verified against its parts; null when there is none. */
  async finishedSha256(id: string, size: number): Promise<string | null> {
    try {
      const res = await this.client.getObject({ Bucket: this.bucket, Key: digestKey(id) });
      const digest = parseVerifiedDigest((await res.Body?.transformToString()) ?? '');
      return digest?.size === size ? digest.sha256 : null;
    } catch (err) {
      if (isNotFound(err)) return null;
      throw err;
    }
  }

  /** The chain to extend for a write whose stream starts at `offset` after `partCount` parts; null when there is none to trust. */
  private chainAt(id: string, offset: number, partCount: number): DigestChain | null {
    const held = this.chains.get(id)?.chain;
    this.chains.delete(id);
    if (offset === 0 && partCount === 0) return emptyChain();
    return held && held.offset === offset && held.parts.length === partCount ? held : null;
  }

  private keep(id: string, chain: DigestChain): void {
    const now = Date.now();
    for (const [key, { at }] of this.chains) {
      if (now - at < CHAIN_IDLE_MS && this.chains.size < MAX_CHAINS) break;
      this.chains.delete(key);
    }
    this.chains.set(id, { chain, at: now });
  }
}
