import { randomBytes } from 'node:crypto';
import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { describe, expect, it } from 'vitest';
import { PartBufferPool } from './part-splitter';
import { IncompleteBodyError, PartStreamer } from './part-streamer';

/** `bytes` in uneven pieces, as a request body arrives. */
const pieces = (bytes: Buffer, size = 777) => {
  const out: Buffer[] = [];
  for (let at = 0; at < bytes.length; at += size) out.push(bytes.subarray(at, at + size));
  return out;
};

type Sent = { start: number; length: number; bytes: Buffer; whole: Promise<void>; aborted: boolean; finish: (err?: Error) => void };

/**
 * A send that reads its body as a server would and answers when the test says so (or at once with
 * `autoFinish`); an aborted send rejects, as the SDK does.
 */
function streamedSends(autoFinish = false) {
  const sent: Sent[] = [];
  const send = (body: Readable, start: number, length: number, signal: AbortSignal) =>
    new Promise<void>((resolve, reject) => {
      const chunks: Buffer[] = [];
      let answer: (() => void) | null = null;
      const entry: Sent = {
        start,
        length,
        bytes: Buffer.alloc(0),
        aborted: false,
        whole: new Promise<void>((r) => (answer = r)),
        finish: (err) => (err ? reject(err) : resolve()),
      };
      sent.push(entry);
      signal.addEventListener('abort', () => {
        entry.aborted = true;
        reject(signal.reason instanceof Error ? signal.reason : new Error('aborted'));
      });
      body.on('data', (c: Buffer) => chunks.push(c));
      body.on('error', () => {});
      body.on('end', () => {
        entry.bytes = Buffer.concat(chunks);
        answer?.();
        if (autoFinish) resolve();
      });
    });
  return { sent, send };
}

const tick = () => new Promise((r) => setImmediate(r));
const until = async (ok: () => boolean) => {
  for (let i = 0; i < 200 && !ok(); i++) await tick();
};

describe('streaming a PATCH body of known length into parts', () => {
  it('streams whole parts in order with their offsets and lengths, then the short last part', async () => {
    const bytes = randomBytes(3 * 1000 + 123);
    const { sent, send } = streamedSends(true);
    const streamer = new PartStreamer(bytes.length, 1000, 2, send);
    await pipeline(Readable.from(pieces(bytes)), streamer);
    await streamer.settled();
    expect(sent.map((s) => [s.start, s.length])).toEqual([
      [0, 1000],
      [1000, 1000],
      [2000, 1000],
      [3000, 123],
    ]);
    expect(Buffer.concat(sent.map((s) => s.bytes)).equals(bytes)).toBe(true);
  });

  it('starts a part before its bytes are all in, and no more parts than it may have on their way', async () => {
    const bytes = randomBytes(5 * 100);
    const { sent, send } = streamedSends();
    const streamer = new PartStreamer(bytes.length, 100, 2, send);
    const body = new Readable({ read() {} });
    const done = pipeline(body, streamer);
    body.push(bytes.subarray(0, 50));
    await until(() => sent.length === 1);
    // Half of part 1 has arrived and its send is already running: nothing waits for the whole part.
    expect(sent).toHaveLength(1);
    for (let at = 50; at < bytes.length; at += 50) body.push(bytes.subarray(at, at + 50));
    body.push(null);
    await until(() => sent.length === 2);
    for (let i = 0; i < 20; i++) await tick();
    // Two parts out and unanswered: the third has not started, so the request is held back.
    expect(sent).toHaveLength(2);
    await sent[0]!.whole;
    sent[0]!.finish();
    await until(() => sent.length === 3);
    expect(sent).toHaveLength(3);
    for (let i = 1; i < 5; i++) {
      await until(() => sent.length > i);
      await sent[i]!.whole;
      sent[i]!.finish();
    }
    await done;
    await streamer.settled();
    expect(Buffer.concat(sent.map((s) => s.bytes)).equals(bytes)).toBe(true);
  });

  it('aborts the part being filled when the body ends short, and lets whole parts already out finish', async () => {
    const bytes = randomBytes(250);
    const { sent, send } = streamedSends(true);
    const streamer = new PartStreamer(400, 100, 4, send);
    // An aborted PATCH: tus ends the body cleanly after 250 of the 400 bytes it declared.
    await expect(pipeline(Readable.from(pieces(bytes, 30)), streamer)).rejects.toBeInstanceOf(IncompleteBodyError);
    await expect(streamer.settled()).rejects.toBeInstanceOf(IncompleteBodyError);
    expect(sent.map((s) => [s.start, s.aborted])).toEqual([
      [0, false],
      [100, false],
      [200, true],
    ]);
    expect(Buffer.concat(sent.slice(0, 2).map((s) => s.bytes)).equals(bytes.subarray(0, 200))).toBe(true);
  });

  it('aborts the part being filled when the body fails', async () => {
    const { sent, send } = streamedSends(true);
    const streamer = new PartStreamer(400, 100, 4, send);
    const failing = Readable.from(
      (async function* () {
        yield randomBytes(150);
        throw new Error('socket hang up');
      })(),
    );
    await expect(pipeline(failing, streamer)).rejects.toThrow('socket hang up');
    await expect(streamer.settled()).rejects.toThrow();
    expect(sent.map((s) => s.aborted)).toEqual([false, true]);
  });

  it('fails, without waiting for ever, when a send fails while its body is being filled', async () => {
    const { sent, send } = streamedSends();
    const streamer = new PartStreamer(1000, 1000, 2, send);
    const body = new Readable({ read() {} });
    const done = pipeline(body, streamer);
    body.push(randomBytes(100));
    await until(() => sent.length === 1);
    sent[0]!.finish(new Error('S3 said 500'));
    // The request keeps sending; the streamer must fail rather than wait for a body nobody reads.
    for (let i = 0; i < 20; i++) body.push(randomBytes(100));
    await expect(done).rejects.toThrow('S3 said 500');
    await expect(streamer.settled()).rejects.toThrow('S3 said 500');
  });

  it('refuses more bytes than the body declared', async () => {
    const { send } = streamedSends(true);
    const streamer = new PartStreamer(100, 100, 2, send);
    await expect(pipeline(Readable.from([randomBytes(120)]), streamer)).rejects.toThrow('longer than the 100 bytes');
  });

  it('fills free part buffers and streams the part when none is free: three on their way in the memory of two', async () => {
    const bytes = randomBytes(6 * 100 + 40);
    const streamed = streamedSends();
    const inMemory: { start: number; bytes: Buffer; finish: () => void }[] = [];
    const buffered = (b: Buffer, start: number) => new Promise<void>((resolve) => inMemory.push({ start, bytes: Buffer.from(b), finish: resolve }));
    const pool = new PartBufferPool(100, 2);
    const streamer = new PartStreamer(bytes.length, 100, 3, streamed.send, { pool, max: 2, send: buffered });
    const done = pipeline(Readable.from(pieces(bytes, 30)), streamer);
    await until(() => streamed.sent.length === 1);
    for (let i = 0; i < 20; i++) await tick();
    // Parts 1 and 2 in the two buffers and sent whole; part 3 streams while they are on their way; part 4 waits.
    expect(inMemory.map((p) => p.start)).toEqual([0, 100]);
    expect(streamed.sent.map((p) => p.start)).toEqual([200]);
    inMemory[0]!.finish();
    await until(() => inMemory.length === 3);
    // A buffer came back: part 4 fills it.
    expect(inMemory.map((p) => p.start)).toEqual([0, 100, 300]);
    // Answer every send whose bytes are all in (answering twice is harmless) until the body is through, then the rest.
    let through = false;
    void done.then(() => (through = true));
    for (let i = 0; i < 500 && !through; i++) {
      for (const p of inMemory) p.finish();
      for (const p of streamed.sent) if (p.bytes.length === p.length) p.finish();
      await tick();
    }
    await done;
    for (const p of inMemory) p.finish();
    for (const p of streamed.sent) {
      await p.whole;
      p.finish();
    }
    await streamer.settled();
    const all = [...inMemory.map((p) => ({ start: p.start, bytes: p.bytes })), ...streamed.sent.map((p) => ({ start: p.start, bytes: p.bytes }))].sort((x, y) => x.start - y.start);
    expect(all.map((p) => p.start)).toEqual([0, 100, 200, 300, 400, 500, 600]);
    expect(Buffer.concat(all.map((p) => p.bytes)).equals(bytes)).toBe(true);
  });

  it('never sends a part buffer that the body left unfilled', async () => {
    const bytes = randomBytes(150);
    const { sent, send } = streamedSends(true);
    const inMemory: number[] = [];
    const streamer = new PartStreamer(400, 100, 3, send, { pool: new PartBufferPool(100, 2), max: 2, send: async (b, start) => void inMemory.push(start, b.length) });
    await expect(pipeline(Readable.from(pieces(bytes, 30)), streamer)).rejects.toBeInstanceOf(IncompleteBodyError);
    // The one send made succeeded; the failure is the body's (the store throws it).
    await streamer.settled();
    // Part 1 went whole; part 2 had 50 of its 100 bytes in a buffer and was dropped, not sent short.
    expect(inMemory).toEqual([0, 100]);
    expect(sent).toHaveLength(0);
  });
});
