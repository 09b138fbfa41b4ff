import { PassThrough, Writable, type Readable } from 'node:stream';
import type { PartBufferPool, SendPart } from './part-splitter';
import { SendSlots } from './send-slots';

/**
 * Sends one piece of the split stream: `body` carries exactly `length` bytes starting at `start`.
 * When the piece cannot be completed (the request ended or failed part-way), `signal` aborts the send,
 * so the server never stores it with short bytes.
 */
export type StreamPiece = (body: Readable, start: number, length: number, signal: AbortSignal) => Promise<void>;

/** The request body ended before all the bytes it declared (an aborted or cut-off PATCH). */
export class IncompleteBodyError extends Error {
  constructor(received: number, declared: number) {
    super(`the request body ended after ${received} of its ${declared} bytes`);
    this.name = 'IncompleteBodyError';
  }
}

/** Part buffers the streamer may fill in memory before sending, at most `max` at once. */
export type BufferedSends = { pool: PartBufferPool; max: number; send: SendPart };

type Streamed = { kind: 'stream'; body: PassThrough; length: number; written: number; abort: AbortController };
type Buffered = { kind: 'buffer'; buffer: Buffer; start: number; length: number; written: number };
type Piece = Streamed | Buffered;

/** Resolves on the next 'drain' or 'close' of `body`, whichever comes first. */
const drainedOrClosed = (body: PassThrough) =>
  new Promise<void>((resolve) => {
    const done = () => {
      body.off('drain', done);
      body.off('close', done);
      resolve();
    };
    body.on('drain', done);
    body.on('close', done);
  });

/**
 * Cuts a byte stream of a length known in advance (`total`: the PATCH's Content-Length) into pieces of
 * `partSize` bytes (the last one shorter) and sends them, at most `maxInFlight` at once. A piece goes into
 * a part buffer of `buffered` when one is free (filled as fast as the request brings bytes, then sent
 * whole, as part-splitter.ts does); otherwise it is streamed straight into its send as the bytes arrive,
 * which needs no buffer: so with two buffers and `maxInFlight` 3, three parts travel at once in the
 * memory of two. Without `buffered` every piece is streamed. A streamed piece holds only its stream's
 * own few chunks. Backpressure reaches the request: while a streamed piece cannot take more, or
 * `maxInFlight` sends run, no more bytes are read.
 *
 * A body that ends short of `total` (tus ends the stream cleanly when the client aborts) or fails aborts
 * the piece being filled, so only whole pieces reach the server, and the streamer fails with the reason.
 * A failed send fails the streamer; `settled()` waits for every send it started, then rejects with the
 * first failure.
 */
export class PartStreamer extends Writable {
  private piece: Piece | null = null;
  private start = 0;
  private received = 0;
  private readonly slots: SendSlots;
  /** Part buffers taken: being filled, or on their way. */
  private buffersOut = 0;

  constructor(
    private readonly total: number,
    private readonly partSize: number,
    maxInFlight: number,
    private readonly send: StreamPiece,
    private readonly buffered?: BufferedSends,
  ) {
    super();
    this.slots = new SendSlots(maxInFlight, (error) => this.destroy(error));
  }

  override _write(chunk: Buffer, _encoding: BufferEncoding, done: (error?: Error | null) => void): void {
    this.take(chunk).then(() => done(), done);
  }

  override _final(done: (error?: Error | null) => void): void {
    if (this.received === this.total) return done();
    const short = new IncompleteBodyError(this.received, this.total);
    this.drop(short);
    done(short);
  }

  override _destroy(error: Error | null, done: (error?: Error | null) => void): void {
    this.drop(error ?? new Error('the part stream was destroyed'));
    done(error);
  }

  settled(): Promise<void> {
    return this.slots.settled();
  }

  private async take(chunk: Buffer): Promise<void> {
    if (this.received + chunk.length > this.total) throw new Error(`the request body is longer than the ${this.total} bytes it declared`);
    this.received += chunk.length;
    let rest = chunk;
    while (rest.length > 0) {
      const piece = this.piece ?? (await this.open());
      if (!piece || this.destroyed) return;
      const bytes = rest.subarray(0, piece.length - piece.written);
      rest = rest.subarray(bytes.length);
      if (piece.kind === 'buffer') {
        bytes.copy(piece.buffer, piece.written);
        piece.written += bytes.length;
        if (piece.written === piece.length) this.sendBuffered(piece);
        continue;
      }
      piece.written += bytes.length;
      const more = piece.body.write(bytes);
      if (piece.written === piece.length) {
        piece.body.end();
        this.piece = null;
      } else if (!more) {
        await drainedOrClosed(piece.body);
      }
    }
  }

  /** The next piece once fewer than `maxInFlight` sends run: in a free part buffer, else streamed; null when the streamer failed meanwhile. */
  private async open(): Promise<Piece | null> {
    await this.slots.free();
    if (this.destroyed) return null;
    const length = Math.min(this.partSize, this.total - this.start);
    if (this.buffered && this.buffersOut < this.buffered.max) {
      this.buffersOut += 1;
      this.piece = { kind: 'buffer', buffer: this.buffered.pool.take(), start: this.start, length, written: 0 };
      this.start += length;
      return this.piece;
    }
    const piece: Streamed = {
      kind: 'stream', body: new PassThrough(), length, written: 0, abort: new AbortController() };
    const sent = this.send(piece.body, this.start, length, piece.abort.signal);
    this.start += length;
    // The send stopped reading its body: the body goes too, so a write waiting for it to drain wakes up.
    this.slots.track(sent, () => {}, () => piece.body.destroy());
    this.piece = piece;
    return piece;
  }

  private sendBuffered(piece: Buffered): void {
    const buffered = this.buffered;
    if (!buffered) return;
    this.piece = null;
    const sent = buffered.send(piece.buffer.subarray(0, piece.length), piece.start);
    // A buffer goes back to the pool only after a send that succeeded: a failed one may still be read by a retry in flight.
    this.slots.track(
      sent,
      () => {
        this.buffersOut -= 1;
        buffered.pool.give(piece.buffer);
      },
      () => void (this.buffersOut -= 1),
    );
  }

  /** Drops the piece being filled: a buffered one is never sent, a streamed one's send is aborted, so neither reaches the server short. */
  private drop(reason: Error): void {
    const piece = this.piece;
    this.piece = null;
    if (!piece) return;
    if (piece.kind === 'buffer') {
      this.buffersOut -= 1;
      this.buffered?.pool.give(piece.buffer);
      return;
    }
    piece.abort.abort(reason);
    // No error on the body itself: the send reads it and may not listen for one; the abort carries the reason.
    piece.body.destroy();
  }
}
