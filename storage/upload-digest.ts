import { createHash, type Hash } from 'node:crypto';
import { Transform, type TransformCallback } from 'node:stream';
import { z } from 'zod';

/**
 * The SHA-256 of an upload, computed while its bytes stream into S3 instead of reading the object back
 * at finish. tus writes an upload as numbered multipart parts, PATCH after PATCH; the short tail of a
 * PATCH waits in `<id>.part` and goes into the next PATCH's first part.
 *
 * The chain covers exactly the bytes of the complete parts, in part order, as they went to S3: for each
 * part its MD5 (what S3 answers as the part's ETag) and, after the last one, the running SHA-256. At
 * finish the part list S3 reports must equal the chain's MD5s one for one; only then is the SHA-256 the
 * hash of the stored object. Anything else (a chain broken by a crash, PATCHes of one upload on
 * different processes, an S3 whose ETags are not MD5s) leaves no verified digest and ingest reads the
 * object back instead.
 *
 * The running SHA-256 is node:crypto's, which cannot be saved and resumed elsewhere, so a chain lives in
 * the memory of the process that writes the upload. A resumable one (hash-wasm 4.13, state saved in S3
 * after every PATCH) was tried first: on this loaded 2-core machine its SHA-256 ran at 18-49 MiB/s against
 * node:crypto's 200-330 MiB/s (SHA extensions), as slow as the upload itself.
 */

const hex32 = /^[0-9a-f]{32}$/;

/** Bytes hashed so far: the complete parts, their MD5s, and the SHA-256 over them. */
export type DigestChain = {
  /** Bytes in the complete parts so far (the tail in `<id>.part` is not in the chain yet). */
  offset: number;
  /** MD5 (hex) of part 1, 2, … in order. */
  parts: string[];
  /** SHA-256 after those bytes; copied, never finished, so the chain can go on. */
  sha: Hash;
};

const doneSchema = z.strictObject({
  size: z.number().int().nonnegative(),
  sha256: z.string().regex(/^[0-9a-f]{64}$/),
});

/** The verified digest of a finished upload, kept beside it as `<id>.sha256`. */
export type VerifiedDigest = z.infer<typeof doneSchema>;

export const digestKey = (uploadId: string): string => `${uploadId}.sha256`;

/** Parses a stored digest; anything unreadable counts as none (the upload is read back). */
export function parseVerifiedDigest(text: string): VerifiedDigest | null {
  try {
    const parsed = doneSchema.safeParse(JSON.parse(text));
    return parsed.success ? parsed.data : null;
  } catch {
    return null;
  }
}

/** The chain of an upload with no complete part yet. */
export const emptyChain = (): DigestChain => ({ offset: 0, parts: [], sha: createHash('sha256') });

/** ETags come quoted (Source: RFC 9110 §8.8.3, entity-tag = DQUOTE etagc DQUOTE); S3 part ETags are the part's MD5 in hex unless encrypted with KMS or SSE-C. */
export const etagMd5 = (etag: string | undefined): string | null => {
  const bare = (etag ?? '').replace(/^W\//, '').replace(/"/g, '').toLowerCase();
  return hex32.test(bare) ? bare : null;
};

/** The final digest when S3's part list (ETags in part order) is exactly the chain's, else null. */
export function verifiedSha256(chain: DigestChain, size: number, partEtags: (string | undefined)[]): string | null {
  if (chain.offset !== size || partEtags.length !== chain.parts.length) return null;
  if (!partEtags.every((etag, i) => etagMd5(etag) === chain.parts[i])) return null;
  return chain.sha.copy().digest('hex');
}

type Segment = { md5: string; bytes: number; sha: Hash };

/**
 * Passes a write's byte stream through unchanged while it hashes: MD5 per part-sized segment (the same
 * split @tus/s3-store's StreamSplitter makes) and a copy of the SHA-256 at every segment end.
 */
export class PartDigestTap extends Transform {
  private readonly segments: Segment[] = [];
  private readonly sha: Hash;
  private md5: Hash = createHash('md5');
  private inSegment = 0;

  /** A tap that goes on from `chain` (which it leaves as it was). */
  constructor(
    chain: DigestChain,
    private readonly partSize: number,
  ) {
    super();
    this.sha = chain.sha.copy();
  }

  override _transform(chunk: Buffer, _enc: BufferEncoding, done: TransformCallback): void {
    let rest = chunk;
    while (rest.length > 0) {
      const take = Math.min(rest.length, this.partSize - this.inSegment);
      const piece = rest.subarray(0, take);
      this.md5.update(piece);
      this.sha.update(piece);
      this.inSegment += take;
      if (this.inSegment === this.partSize) this.closeSegment();
      rest = rest.subarray(take);
    }
    done(null, chunk);
  }

  override _flush(done: TransformCallback): void {
    if (this.inSegment > 0) this.closeSegment();
    done();
  }

  private closeSegment(): void {
    this.segments.push({ md5: this.md5.digest('hex'), bytes: this.inSegment, sha: this.sha.copy() });
    this.md5 = createHash('md5');
    this.inSegment = 0;
  }

  /**
   * The chain after this write, given where it started. Every whole segment became a part; the last,
   * shorter one too when it is at least `minPartSize` or ends the upload, and otherwise it is the new
   * tail, which joins the chain with the next write (Source: @tus/s3-store 2.0.7 uploadParts, the
   * same rule). After a failed write pass the ETags S3 lists: the chain then takes only the segments
   * that are, in order, the parts S3 kept.
   */
  chainAfter(start: DigestChain, size: number | undefined, minPartSize: number, storedEtags?: (string | undefined)[]): DigestChain {
    let { offset, sha } = start;
    const parts = [...start.parts];
    for (const segment of this.segments) {
      const isPart = segment.bytes === this.partSize || segment.bytes >= minPartSize || offset + segment.bytes === size;
      if (!isPart) break;
      if (storedEtags && etagMd5(storedEtags[parts.length]) !== segment.md5) break;
      offset += segment.bytes;
      sha = segment.sha;
      parts.push(segment.md5);
    }
    return { offset, parts, sha };
  }
}
