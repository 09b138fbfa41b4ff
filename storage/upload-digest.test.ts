import { createHash, randomBytes } from 'node:crypto';
import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { Writable } from 'node:stream';
import { describe, expect, it } from 'vitest';
import { emptyChain, etagMd5, parseVerifiedDigest, PartDigestTap, verifiedSha256, type DigestChain } from './upload-digest';

const md5 = (b: Buffer) => createHash('md5').update(b).digest('hex');
const sha256 = (b: Buffer) => createHash('sha256').update(b).digest('hex');
const quoted = (b: Buffer) => `"${md5(b)}"`;

/** Streams `bytes` through a tap in uneven chunks, as a request body arrives. */
async function tapThrough(chain: DigestChain, bytes: Buffer, partSize: number): Promise<PartDigestTap> {
  const tap = new PartDigestTap(chain, partSize);
  const pieces: Buffer[] = [];
  for (let at = 0; at < bytes.length; at += 777) pieces.push(bytes.subarray(at, at + 777));
  const out: Buffer[] = [];
  await pipeline(Readable.from(pieces), tap, new Writable({ write: (c: Buffer, _e, done) => (out.push(c), done()) }));
  expect(Buffer.concat(out).equals(bytes)).toBe(true);
  return tap;
}

describe('the streamed digest chain', () => {
  const partSize = 4096;
  const minPartSize = 3000;

  it('hashes whole parts and leaves a short tail out of the chain until the next write', async () => {
    const file = randomBytes(3 * partSize + 500);
    const size = file.length;
    // First write: two whole parts and 1000 bytes, a tail below the minimum part size.
    const first = (await tapThrough(emptyChain(), file.subarray(0, 2 * partSize + 1000), partSize)).chainAfter(emptyChain(), size, minPartSize);
    expect(first.offset).toBe(2 * partSize);
    expect(first.parts).toEqual([md5(file.subarray(0, partSize)), md5(file.subarray(partSize, 2 * partSize))]);
    // Second write: the stored tail first, then the rest; its last short piece ends the upload, so it is a part.
    const second = (await tapThrough(first, file.subarray(2 * partSize), partSize)).chainAfter(first, size, minPartSize);
    expect(second.offset).toBe(size);
    expect(second.parts).toHaveLength(4);
    const etags = [0, 1, 2].map((i) => quoted(file.subarray(i * partSize, (i + 1) * partSize))).concat(quoted(file.subarray(3 * partSize)));
    expect(verifiedSha256(second, size, etags)).toBe(sha256(file));
  });

  it('counts a short last piece of at least the minimum part size as a part, as the S3 store uploads it', async () => {
    const file = randomBytes(partSize + minPartSize + 10);
    const chain = (await tapThrough(emptyChain(), file.subarray(0, partSize + minPartSize), partSize)).chainAfter(emptyChain(), file.length, minPartSize);
    expect(chain.offset).toBe(partSize + minPartSize);
    expect(chain.parts).toHaveLength(2);
  });

  it('gives no digest when the stored parts are not the hashed ones, or not all of them', async () => {
    const file = randomBytes(2 * partSize);
    const chain = (await tapThrough(emptyChain(), file, partSize)).chainAfter(emptyChain(), file.length, minPartSize);
    const good = [quoted(file.subarray(0, partSize)), quoted(file.subarray(partSize))];
    expect(verifiedSha256(chain, file.length, good)).toBe(sha256(file));
    expect(verifiedSha256(chain, file.length, [good[0], quoted(randomBytes(partSize))])).toBeNull();
    expect(verifiedSha256(chain, file.length, good.slice(0, 1))).toBeNull();
    expect(verifiedSha256(chain, file.length + 1, good)).toBeNull();
    // A server whose part ETags are not MD5s (S3 with KMS keys): no digest, the bytes are read back.
    expect(verifiedSha256(chain, file.length, ['"abc-1"', '"abc-2"'])).toBeNull();
  });

  it('after a failed write keeps only the segments S3 stored, in order', async () => {
    const file = randomBytes(3 * partSize);
    const tap = await tapThrough(emptyChain(), file, partSize);
    const [p1, p2, p3] = [0, 1, 2].map((i) => quoted(file.subarray(i * partSize, (i + 1) * partSize)));
    expect(tap.chainAfter(emptyChain(), file.length + 1, minPartSize, [p1, p2]).parts).toHaveLength(2);
    // Part 2 failed while part 3 went through: the chain stops before the gap.
    expect(tap.chainAfter(emptyChain(), file.length + 1, minPartSize, [p1, p3])).toMatchObject({ offset: partSize, parts: [md5(file.subarray(0, partSize))] });
    expect(tap.chainAfter(emptyChain(), file.length + 1, minPartSize, []).parts).toEqual([]);
  });

  it('leaves the chain it started from as it was, so a failed write cannot spoil it', async () => {
    const start = emptyChain();
    start.sha.update('abc');
    await tapThrough(start, randomBytes(2 * partSize), partSize);
    expect(start.sha.copy().digest('hex')).toBe(sha256(Buffer.from('abc')));
  });

  it('reads only well-formed stored digests', () => {
    expect(parseVerifiedDigest('not json')).toBeNull();
    expect(parseVerifiedDigest(JSON.stringify({ size: -1, sha256: sha256(Buffer.from('abc')) }))).toBeNull();
    const done = { size: 3, sha256: sha256(Buffer.from('abc')) };
    expect(parseVerifiedDigest(JSON.stringify(done))).toEqual(done);
    expect(etagMd5('W/"0123456789ABCDEF0123456789abcdef"')).toBe('0123456789abcdef0123456789abcdef');
  });
});
