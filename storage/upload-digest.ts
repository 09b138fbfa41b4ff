import { createHash, type Hash } from 'node:crypto';
import { Transform, type TransformCallback } from 'node:stream';
import { createSHA256, type IHasher } from 'hash-wasm';
import { z } from 'zod';

/**
 * The SHA-256 of an upload, computed while its bytes stream into S3 instead of reading the object back
 * at finish. tus writes an upload as numbered multipart parts, PATCH after PATCH, possibly on different
 * processes; the short tail of a PATCH waits in `<id>.part` and goes into the next PATCH's first part.
 *
 * The chain covers exactly the bytes of the complete parts, in part order, as they went to S3: for each
 * part its MD5 (what S3 answers as the part's ETag) and, after the last one, the SHA-256 state
 * (hash-wasm can save and resume it; node:crypto cannot). It lives in `<id>.sha256` next to the upload.
 * At finish the part list S3 reports must equal the chain's MD5s one for one; only then is the SHA-256
 * the hash of the stored object. Anything else (a chain broken by a failed PATCH, an S3 whose ETags are
 * not MD5s, a crash between writes) leaves no verified digest and ingest reads the object back instead.
 */

const hex32 = /^[0-9a-f]{32}$/;

const chainSchema = z.strictObject({
  kind: z.literal('chain'),
  /** Bytes in the complete parts so far (the tail in `<id>.part` is not in the chain yet). */
  offset: z.number().int().nonnegative(),
  /** hash-wasm's saved SHA-256 state after those bytes, base64. */
  state: z.string().min(1),
  /** MD5 (hex) of part 1, 2, … in order. */
  parts: z.array(z.string().regex(hex32)),
});

const doneSchema = z.strictObject({
  kind: z.literal('done'),
  size: z.number().int().nonnegative(),
  sha256: z.string().regex(/^[0-9a-f]{64}$/),
});

const recordSchema = z.discriminatedUnion('kind', [chainSchema, doneSchema]);

export type DigestChain = z.infer<typeof chainSchema>;
export type VerifiedDigest = z.infer<typeof doneSchema>;
export type DigestRecord = z.infer<typeof recordSchema>;

export const digestKey = (uploadId: string): string => `${uploadId}.sha256`;

/** Parses a stored record; anything unreadable counts as no record (the upload falls back to reading back). */
export function parseDigestRecord(text: string): DigestRecord | null {
  try {
    const parsed = recordSchema.safeParse(JSON.parse(text));
    return parsed.success ? parsed.data : null;
  } catch {
    return null;
  }
}

/** ETags come quoted (Source: RFC 9110 §8.8.3, entity-tag = DQUOTE etagc DQUOTE); S3 part ETags are the part's MD5 in hex unless encrypted with KMS or SSE-C. */
export const etagMd5 = (etag: string | undefined): string | null => {
  const bare = (etag ?? '').replace(/^W\//, '').replace(/"/g, '').toLowerCase();
  return hex32.test(bare) ? bare : null;
};

/** The final digest when S3's part list (ETags in part order) is exactly the chain's, else null. */
export async function verifiedSha256(chain: DigestChain, size: number, partEtags: (string | undefined)[]): Promise<string | null> {
  if (chain.offset !== size || partEtags.length !== chain.parts.length) return null;
  if (!partEtags.every((etag, i) => etagMd5(etag) === chain.parts[i])) return null;
  const hasher = await resumeSha256(chain.state);
  return hasher ? hasher.digest('hex') : null;
}

async function resumeSha256(state: string): Promise<IHasher | null> {
  const hasher = await createSHA256();
  try {
    return hasher.load(Buffer.from(state, 'base64'));
  } catch {
    // Saved by an incompatible hash-wasm build (an upgrade mid-upload): no chain.
    return null;
  }
}

type Segment = { md5: string; bytes: number; state: string };

/**
 * Passes a write's byte stream through unchanged while it hashes: MD5 per part-sized segment (the same
 * split @tus/s3-store's StreamSplitter makes) and the SHA-256 state at every segment end.
 */
export class PartDigestTap extends Transform {
  private readonly segments: Segment[] = [];
  private md5: Hash = createHash('md5');
  private inSegment = 0;

  private constructor(
    private readonly sha: IHasher,
    private readonly partSize: number,
  ) {
    super();
  }

  /** A tap that continues `chain` from its SHA-256 state; null when that state cannot be resumed. */
  static async start(chain: DigestChain, partSize: number): Promise<PartDigestTap | null> {
    const sha = await resumeSha256(chain.state);
    return sha ? new PartDigestTap(sha, partSize) : null;
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
    this.segments.push({ md5: this.md5.digest('hex'), bytes: this.inSegment, state: Buffer.from(this.sha.save()).toString('base64') });
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
    let { offset, state } = start;
    const parts = [...start.parts];
    for (const segment of this.segments) {
      const isPart = segment.bytes === this.partSize || segment.bytes >= minPartSize || offset + segment.bytes === size;
      if (!isPart) break;
      if (storedEtags && etagMd5(storedEtags[parts.length]) !== segment.md5) break;
      offset += segment.bytes;
      state = segment.state;
      parts.push(segment.md5);
    }
    return { kind: 'chain', offset, state, parts };
  }
}

/** The chain of an upload with no complete part yet. */
export async function emptyChain(): Promise<DigestChain> {
  const hasher = await createSHA256();
  return { kind: 'chain', offset: 0, state: Buffer.from(hasher.init().save()).toString('base64'), parts: [] };
}
