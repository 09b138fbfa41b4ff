import { randomBytes } from 'node:crypto';
import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { describe, expect, it } from 'vitest';
import { PartBufferPool, PartSplitter } from './part-splitter';

/** `bytes` in uneven pieces, as a request body arrives. */
const pieces = (bytes: Buffer, size = 777) => {
  const out: Buffer[] = [];
  for (let at = 0; at < bytes.length; at += size) out.push(bytes.subarray(at, at + size));
  return out;
};

/** A send that finishes when the test says so, recording a copy of what it got (the splitter reuses its buffers). */
function manualSends() {
  const sent: { start: number; bytes: Buffer; finish: (err?: Error) => void }[] = [];
  const send = (bytes: Buffer, start: number) =>
    new Promise<void>((resolve, reject) => {
      sent.push({ start, bytes: Buffer.from(bytes), finish: (err) => (err ? reject(err) : resolve()) });
    });
  return { sent, send };
}

const tick = () => new Promise((r) => setImmediate(r));

describe('cutting a PATCH body into parts in memory', () => {
  it('sends whole parts in order with their offsets, then the short last part at the end', async () => {
    const bytes = randomBytes(3 * 1000 + 123);
    const got: { start: number; bytes: Buffer }[] = [];
    const splitter = new PartSplitter(new PartBufferPool(1000, 4), 2, async (b, start) => void got.push({ start, bytes: Buffer.from(b) }));
    await pipeline(Readable.from(pieces(bytes)), splitter);
    await splitter.settled();
    expect(got.map((g) => g.start)).toEqual([0, 1000, 2000, 3000]);
    expect(got.map((g) => g.bytes.length)).toEqual([1000, 1000, 1000, 123]);
    expect(Buffer.concat(got.map((g) => g.bytes)).equals(bytes)).toBe(true);
  });

  it('takes no more bytes while the most parts it may send at once are on their way', async () => {
    const bytes = randomBytes(5 * 100);
    const { sent, send } = manualSends();
    const splitter = new PartSplitter(new PartBufferPool(100, 4), 2, send);
    const done = pipeline(Readable.from(pieces(bytes, 10)), splitter);
    for (let i = 0; i < 50 && sent.length < 2; i++) await tick();
    for (let i = 0; i < 20; i++) await tick();
    // Two parts sent, a third filled and waiting: nothing more was read into a fourth.
    expect(sent).toHaveLength(2);
    sent[0]!.finish();
    for (let i = 0; i < 50 && sent.length < 3; i++) await tick();
    expect(sent).toHaveLength(3);
    for (let i = 1; i < 5; i++) {
      for (let t = 0; t < 50 && sent.length <= i; t++) await tick();
      sent[i]!.finish();
    }
    await done;
    await splitter.settled();
    expect(Buffer.concat(sent.map((s) => s.bytes)).equals(bytes)).toBe(true);
  });

  it('drops the unfinished part when the body fails, but lets the parts already sent finish', async () => {
    const bytes = randomBytes(250);
    const got: number[] = [];
    const splitter = new PartSplitter(new PartBufferPool(100, 4), 3, async (_b, start) => void got.push(start));
    const body = Readable.from(
      (async function* () {
        yield* pieces(bytes, 50);
        throw new Error('client went away');
      })(),
    );
    await expect(pipeline(body, splitter)).rejects.toThrow('client went away');
    await splitter.settled();
    expect(got).toEqual([0, 100]);
  });

  it('fails when a part cannot be sent, after the other sends settle', async () => {
    const { sent, send } = manualSends();
    const splitter = new PartSplitter(new PartBufferPool(100, 4), 3, send);
    const done = pipeline(Readable.from(pieces(randomBytes(1000), 10)), splitter);
    for (let i = 0; i < 50 && sent.length < 2; i++) await tick();
    sent[0]!.finish(new Error('S3 said no'));
    await expect(done).rejects.toThrow('S3 said no');
    const settled = splitter.settled();
    for (const s of sent.slice(1)) s.finish();
    await expect(settled).rejects.toThrow('S3 said no');
    // It stopped reading: far fewer than the ten parts of the body were sent.
    expect(sent.length).toBeLessThanOrEqual(4);
  });

  it('keeps a few buffers for the next parts instead of allocating each time', () => {
    const pool = new PartBufferPool(64, 1);
    const a = pool.take();
    pool.give(a);
    pool.give(Buffer.alloc(64));
    expect(pool.take()).toBe(a);
    expect(pool.take()).not.toBe(a);
  });
});
