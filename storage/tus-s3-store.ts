import { pipeline, Readable } from 'node:stream';
import { pipeline as pipelineDone } from 'node:stream/promises';
import { S3, type Part } from '@aws-sdk/client-s3';
import { S3Store, type MetadataValue } from '@tus/s3-store';
import { ERRORS, Upload } from '@tus/server';
import type { S3Settings } from './config';
import { PartBufferPool, PartSplitter } from './part-splitter';
import { PartStreamer } from './part-streamer';
import { declaredBodyLength } from './patch-length';
import { addDeleteObjectsMd5, addUnsignedPartPayload, s3ClientConfig } from './s3-client';
import { digestKey, emptyChain, parseVerifiedDigest, PartDigestTap, verifiedSha256, type DigestChain } from './upload-digest';
import type { LockMarks } from './upload-lock-queries';

const isNotFound = (err: unknown): boolean => {
  const e = err as { name?: string; $metadata?: { httpStatusCode?: number } };
  return e.name === 'NoSuchKey' || e.name === 'NotFound' || e.$metadata?.httpStatusCode === 404;
};

// What ListParts answers once a multipart upload is completed or aborted (Source: @tus/s3-store 2.0.7 getUpload, the same codes).
const isGoneUpload = (err: unknown): boolean => {
  const e = err as { name?: string; Code?: string };
  return ['NoSuchKey', 'NoSuchUpload'].some((code) => e.name === code || e.Code === code);
};

// Chains of uploads this process is writing. An upload left unfinished for a day is taken up again, if
// ever, with a read-back at its finish; the cap bounds memory (a chain is a few hundred bytes per GiB).
const CHAIN_IDLE_MS = 24 * 3600 * 1000;
const MAX_CHAINS = 10_000;

// Part buffers one PATCH may hold in memory: one filling and the rest on their way to S3 (with 8 MiB parts,
// two at a time; 32 MiB took the app's RSS growth over its 64 MiB goal in bench/upload/s3.ts). Larger parts
// (uploads above about 11 GiB with 1000 parts) are staged in the temp folder by @tus/s3-store, as before.
// The CPU profile of a 512 MiB upload showed the temp files (written, then read again for the part upload)
// costing the app more than the upload's MD5 and SHA-256.
const PART_MEMORY_BYTES = 24 * 1024 * 1024;

// Parts on their way at once when a PATCH's length is known (no tail before it): two in part buffers and
// the one being filled streamed, so three in the memory of two (part-streamer.ts). Measured against the
// buffered 2 + 1 filling in bench/upload/s3.ts (docs/scaling.md): tus/SDK(4) 0.80 against 0.70 (9 runs
// each, interleaved), RSS growth 49 against 61 MiB. Every part streamed (no buffers) was slower (0.69);
// three buffers and a fourth part streamed were no faster (0.79) and back at 57-60 MiB.
const STREAMED_IN_FLIGHT = 3;

// Views of uploads left stamped at release (a few hundred bytes per GiB of parts); the oldest go first.
const MAX_STAMPED = 1000;

/** An upload as this process last saw it in S3 or left it: its parts and the size of its `.part` tail (undefined: none). */
type View = { parts: Part[]; tailSize: number | undefined };
/** One hold of an upload's lock by this process, and the mark it set (upload-lock-queries.ts). */
type Lease = { mark: string };
/** The view good for the requests of the hold `lease`. */
type Seen = View & { lease: Lease };
/** What one write sent: its parts, in any order, and the tail it left. */
type WriteRecord = { parts: Part[]; tailSize: number | undefined };
/** Where one write's pieces go: its first part number, the upload offset it starts at, its part size, what it records. */
type WriteAt = { metadata: MetadataValue; firstPart: number; offset: number; partSize: number; record?: WriteRecord };

/**
 * @tus/s3-store with the Content-MD5 fix on its own client, a way to drop one upload from its cache,
 * the upload's SHA-256 computed while the parts stream out (upload-digest.ts), so finishing a clip
 * does not read the whole object back from S3, and two changes for throughput:
 * - parts are cut in memory and sent while the PATCH goes on (part-splitter.ts) instead of through temp files,
 *   and when the PATCH's length is known one more is streamed as it arrives (part-streamer.ts);
 * - a PATCH asks S3 about the upload at most once (ListParts and the tail's size, under the upload lock),
 *   where @tus/s3-store asks again before writing, and not at all when no other process held the upload's
 *   lock since this one's last PATCH (the lock's marks, upload-lock-queries.ts): what that PATCH sent and
 *   left is then what S3 has. The upload record (`<id>.info`, which does not change once the upload's
 *   length is known) stays cached across requests.
 */
export class TusS3Store extends S3Store {
  private readonly chains = new Map<string, { chain: DigestChain; at: number }>();
  /** Uploads whose lock this process holds: a fresh lease per hold. */
  private readonly leases = new Map<string, Lease>();
  private readonly seen = new Map<string, Seen>();
  /** Views this process left at its last release of an upload's lock, under that hold's mark. */
  private readonly stamped = new Map<string, View & { mark: string }>();
  private readonly pool: PartBufferPool;
  /**
   * Sends streamed parts. One attempt: a part's bytes stream from the request and cannot be sent again, so
   * a failure fails the PATCH and the client resends from the offset S3 kept (the SDK would otherwise retry
   * with a body already consumed).
   */
  private readonly streamClient: S3;

  constructor(s: S3Settings) {
    super({
      partSize: s.partSize,
      maxMultipartParts: s.maxParts,
      // No `Expect: 100-continue` on part uploads (the SDK adds it to bodies of 2 MB and more): each part would
      // wait a round trip to S3 before its first byte, and a streamed part holds the browser's bytes meanwhile.
      // A refused request (bad keys, a gone upload) then costs one part's bytes sent in vain.
      // Source: @aws-sdk/middleware-sdk-s3 3.1175 addExpectContinueMiddleware, option expectContinueHeader.
      s3ClientConfig: { ...s3ClientConfig(s), bucket: s.bucket, expectContinueHeader: false },
    });
    addDeleteObjectsMd5(this.client.middlewareStack);
    addUnsignedPartPayload(this.client.middlewareStack);
    this.streamClient = new S3({ ...s3ClientConfig(s), maxAttempts: 1, expectContinueHeader: false });
    addUnsignedPartPayload(this.streamClient.middlewareStack);
    this.pool = new PartBufferPool(this.preferredPartSize, Math.floor(PART_MEMORY_BYTES / this.preferredPartSize));
  }

  forget(id: string): Promise<void> {
    this.seen.delete(id);
    this.stamped.delete(id);
    return this.clearCache(id);
  }

  /**
   * This process now holds the upload's lock. When the mark before this hold is the one this process left
   * at its last release, no other process has held the lock since, and the view it left holds: the PATCH
   * need not ask S3 again (ListParts and the tail's HEAD are most of a PATCH's fixed cost). Otherwise another
   * process may have written the upload, so what we saw of its parts goes; the upload record stays unless
   * its length was still open (creation-defer-length: a later PATCH may set it), since nothing else in it
   * changes.
   */
  async lockTaken(id: string, marks: LockMarks): Promise<void> {
    const lease: Lease = { mark: marks.current };
    this.leases.set(id, lease);
    this.seen.delete(id);
    const left = this.stamped.get(id);
    this.stamped.delete(id);
    if (left && left.mark === marks.previous) {
      this.seen.set(id, { lease, parts: left.parts, tailSize: left.tailSize });
      return;
    }
    const cached = await this.cache.get(id);
    if (cached?.file.size === undefined) await this.clearCache(id);
  }

  /** The upload's tus metadata from its record (cached), or null when there is none. */
  async uploadMetadata(id: string): Promise<Record<string, string | null> | null> {
    try {
      return (await this.getMetadata(id)).file.metadata ?? {};
    } catch {
      return null;
    }
  }

  /** The view this hold ended with is stamped with its mark, for this process's next hold to take up. */
  lockReleased(id: string): void {
    const lease = this.leases.get(id);
    const seen = this.seen.get(id);
    this.leases.delete(id);
    this.seen.delete(id);
    if (!lease || seen?.lease !== lease) return;
    this.stamped.set(id, { mark: lease.mark, parts: seen.parts, tailSize: seen.tailSize });
    if (this.stamped.size > MAX_STAMPED) this.stamped.delete(this.stamped.keys().next().value ?? id);
  }

  /**
   * @tus/s3-store 2.0.7's getUpload (the offset is the parts plus the tail), also remembering what it saw
   * when this process holds the upload's lock from before it looked until after, for the write that follows.
   */
  override async getUpload(id: string): Promise<Upload> {
    const lease = this.leases.get(id);
    const wasCached = Boolean(await this.cache.get(id));
    let metadata: MetadataValue;
    try {
      metadata = await this.getMetadata(id);
    } catch {
      throw ERRORS.FILE_NOT_FOUND;
    }
    const seen = this.seen.get(id);
    if (lease && seen?.lease === lease) return new Upload({ ...metadata.file, offset: viewOffset(seen) });
    let parts: Part[];
    try {
      parts = await this.retrieveParts(id);
    } catch (err) {
      if (!isGoneUpload(err)) throw err;
      // Completed, or removed by another process while its record was cached here: only a fresh read tells.
      if (wasCached) {
        await this.clearCache(id);
        return this.getUpload(id);
      }
      return new Upload({ ...metadata.file, offset: metadata.file.size ?? 0 });
    }
    const tailSize = await this.getIncompletePartSize(id);
    if (lease && this.leases.get(id) === lease) this.seen.set(id, { lease, parts, tailSize });
    return new Upload({ ...metadata.file, offset: viewOffset({ parts, tailSize }) });
  }

  /**
   * @tus/s3-store 2.0.7's write, without asking S3 again what getUpload just saw under the same lock, and with
   * the tail (under the minimum part size, so at most 5 MiB) read into memory rather than a temp file.
   */
  override async write(src: Readable, id: string, offset: number): Promise<number> {
    const lease = this.leases.get(id);
    const seen = this.seen.get(id);
    // Whatever this write does in S3, the view before it is gone; a write that ends well leaves the next one.
    this.seen.delete(id);
    const known = seen && lease === seen.lease ? seen : null;
    const metadata = await this.getMetadata(id);
    const parts = known?.parts ?? (await this.retrieveParts(id));
    const nextPartNumber = (parts.at(-1)?.PartNumber ?? 0) + 1;
    const tail = known && known.tailSize === undefined ? undefined : await this.readTail(id);
    if (tail) await this.deleteIncompletePart(id);
    const source = tail ? Readable.from(prepend(tail, src)) : src;
    const tailBytes = tail?.length ?? 0;
    // With no tail in front, the body's declared length is the stream's: its parts can be streamed.
    const length = tail ? undefined : declaredBodyLength();
    const record: WriteRecord = { parts: [], tailSize: undefined };
    const uploaded = await this.uploadParts(metadata, source, nextPartNumber, offset - tailBytes, length, record);
    const newOffset = offset + uploaded - tailBytes;
    if (metadata.file.size === newOffset) {
      await this.finishMultipartUpload(metadata, await this.retrieveParts(id));
      await this.completeMetadata(metadata.file);
      await this.clearCache(id);
      return newOffset;
    }
    const byNumber = (a: Part, b: Part) => (a.PartNumber ?? 0) - (b.PartNumber ?? 0);
    const after: View = { parts: [...parts, ...record.parts.sort(byNumber)], tailSize: record.tailSize };
    // Kept only when it adds up to the new offset: parts staged through @tus/s3-store's temp files go unrecorded.
    if (lease && this.leases.get(id) === lease && viewOffset(after) === newOffset) this.seen.set(id, { lease, ...after });
    return newOffset;
  }

  // @tus/s3-store 2.0.7 leaves the trailing short part (`<id>.part`) behind when tus DELETE cancels an upload.
  override async remove(id: string): Promise<void> {
    this.chains.delete(id);
    this.seen.delete(id);
    this.stamped.delete(id);
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
  protected override async uploadParts(metadata: MetadataValue, readStream: Readable, currentPartNumber: number, offset: number, length?: number, record?: WriteRecord): Promise<number> {
    const id = metadata.file.id;
    const partSize = this.calcOptimalPartSize(metadata.file.size);
    const start = this.chainAt(id, offset, currentPartNumber - 1);
    if (!start) return this.sendParts(metadata, readStream, currentPartNumber, offset, partSize, length, record);
    const tap = new PartDigestTap(start, partSize);
    let uploaded: number;
    try {
      // pipeline() carries an aborted request's error on to the tap, so the splitter behind it fails as it would have.
      uploaded = await this.sendParts(metadata, pipeline(readStream, tap, () => {}), currentPartNumber, offset, partSize, length, record);
    } catch (err) {
      const stored = await this.retrieveParts(id).catch(() => null);
      if (stored) this.keep(id, tap.chainAfter(start, metadata.file.size, this.minPartSize, stored.map((p) => p.ETag)));
      throw err;
    }
    this.keep(id, tap.chainAfter(start, metadata.file.size, this.minPartSize));
    return uploaded;
  }

  /**
   * The parts of one write, cut in memory and sent up to the memory budget at once; the same rule as
   * @tus/s3-store 2.0.7 uploadParts for which piece becomes a part (at least the minimum part size, or the
   * upload's last) and which the tail. Parts too large for the budget go through its temp files.
   */
  private async sendParts(metadata: MetadataValue, stream: Readable, firstPart: number, offset: number, partSize: number, length?: number, record?: WriteRecord): Promise<number> {
    const size = metadata.file.size;
    if (length !== undefined && (size === undefined || offset + length <= size)) return this.streamParts(metadata, stream, firstPart, offset, partSize, length, record);
    const inFlight = Math.floor(PART_MEMORY_BYTES / partSize) - 1;
    if (inFlight < 1) return super.uploadParts(metadata, stream, firstPart, offset);
    const pool = partSize === this.pool.partSize ? this.pool : new PartBufferPool(partSize, inFlight + 1);
    const at: WriteAt = { metadata, firstPart, offset, partSize, record };
    let uploaded = 0;
    const splitter = new PartSplitter(pool, inFlight, async (bytes, start) => {
      await this.sendHeld(at, bytes, start);
      uploaded += bytes.length;
    });
    let failure: unknown = null;
    await pipelineDone(stream, splitter).catch((err: unknown) => {
      failure = err;
    });
    // Every part already started finishes (or fails) before the write answers, as in @tus/s3-store.
    await splitter.settled();
    if (failure) throw failure;
    return uploaded;
  }

  /**
   * The parts of one write of `length` bytes (part-streamer.ts): in the two part buffers while they are
   * free, otherwise streamed into their UploadPart as the request's bytes arrive, three on their way at
   * once; the same rule as sendParts for which piece becomes a part and which the tail. A body that ends
   * short drops the part it was filling (a streamed one's UploadPart is aborted), so S3 keeps only whole
   * parts and the upload's offset is the sum of what it kept; the write then fails as a cut-off request does.
   */
  private async streamParts(metadata: MetadataValue, stream: Readable, firstPart: number, offset: number, partSize: number, length: number, record?: WriteRecord): Promise<number> {
    const { id } = metadata.file;
    const at: WriteAt = { metadata, firstPart, offset, partSize, record };
    let uploaded = 0;
    const streamed = async (body: Readable, start: number, bytes: number, abortSignal: AbortSignal) => {
      if (this.isPart(at, start, bytes)) {
        const UploadId = metadata['upload-id'];
        const PartNumber = firstPart + start / partSize;
        const { ETag } = await this.streamClient.uploadPart({ Bucket: this.bucket, Key: id, UploadId, PartNumber, Body: body, ContentLength: bytes }, { abortSignal });
        record?.parts.push({ PartNumber, ETag, Size: bytes });
      } else {
        const Tagging = this.useCompleteTag('false');
        await this.streamClient.putObject({ Bucket: this.bucket, Key: this.partKey(id, true), Body: body, ContentLength: bytes, Tagging }, { abortSignal });
        if (record) record.tailSize = bytes;
      }
      uploaded += bytes;
    };
    const buffered = async (bytes: Buffer, start: number) => {
      await this.sendHeld(at, bytes, start);
      uploaded += bytes.length;
    };
    // Parts larger than the pool's (uploads above about 11 GiB) are all streamed.
    const buffers = partSize === this.pool.partSize ? { pool: this.pool, max: STREAMED_IN_FLIGHT - 1, send: buffered } : undefined;
    const streamer = new PartStreamer(length, partSize, STREAMED_IN_FLIGHT, streamed, buffers);
    let failure: unknown = null;
    await pipelineDone(stream, streamer).catch((err: unknown) => {
      failure = err;
    });
    await streamer.settled().catch((err: unknown) => {
      failure ??= err;
    });
    if (failure) throw failure;
    return uploaded;
  }

  /**
   * Whether the piece of `bytes` at `start` of a write becomes a part: at least the minimum part size, or the
   * upload's last bytes; otherwise it is the new tail (Source: @tus/s3-store 2.0.7 uploadParts, the same rule).
   */
  private isPart(at: WriteAt, start: number, bytes: number): boolean {
    return bytes >= this.minPartSize || at.offset + start + bytes === at.metadata.file.size;
  }

  /** Sends a piece held in memory as its part, or as the upload's tail, and records what it sent. */
  private async sendHeld(at: WriteAt, bytes: Buffer, start: number): Promise<void> {
    const { metadata, firstPart, partSize, record } = at;
    if (this.isPart(at, start, bytes.length)) {
      const PartNumber = firstPart + start / partSize;
      const ETag = await this.uploadPart(metadata, bytes, PartNumber);
      record?.parts.push({ PartNumber, ETag, Size: bytes.length });
    } else {
      await this.client.putObject({ Bucket: this.bucket, Key: this.partKey(metadata.file.id, true), Body: bytes, Tagging: this.useCompleteTag('false') });
      if (record) record.tailSize = bytes.length;
    }
  }

  /** The tail a previous PATCH left (`<id>.part`), or undefined. */
  private async readTail(id: string): Promise<Buffer | undefined> {
    const body = await this.getIncompletePart(id);
    if (!body) return undefined;
    const chunks: Buffer[] = [];
    for await (const chunk of body) chunks.push(chunk as Buffer);
    return Buffer.concat(chunks);
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

async function* prepend(head: Buffer, rest: Readable): AsyncGenerator<Buffer> {
  yield head;
  for await (const chunk of rest) yield chunk as Buffer;
}

/** The upload's offset by a view: its parts and its tail. */
function viewOffset(view: View): number {
  return view.parts.reduce((sum, p) => sum + (p.Size ?? 0), 0) + (view.tailSize ?? 0);
}
