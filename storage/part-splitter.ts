import { Writable } from 'node:stream';
import { SendSlots } from './send-slots';

/** Sends one part: its bytes and where it starts in the split stream. */
export type SendPart = (bytes: Buffer, start: number) => Promise<void>;

/** Part buffers of one size, kept for the next part instead of handed back to the allocator each time. */
export class PartBufferPool {
  private readonly free: Buffer[] = [];

  constructor(
    readonly partSize: number,
    private readonly keep: number,
  ) {}

  take(): Buffer {
    return this.free.pop() ?? Buffer.allocUnsafe(this.partSize);
  }

  give(buffer: Buffer): void {
    if (this.free.length < this.keep) this.free.push(buffer);
  }
}

/**
 * Cuts a byte stream into parts of `pool.partSize` bytes held in memory and hands each to `send` as soon
 * as it is whole, at most `maxInFlight` sends at once. While that many run it takes no more bytes, so
 * the request behind it waits (backpressure) and memory stays at (maxInFlight + 1) part buffers.
 * The end of the stream sends the last, shorter part; an error drops it unsent, as @tus/utils 0.7's
 * StreamSplitter (which stages each part in a temp file) drops its unfinished chunk. A failed send
 * fails the splitter; `settled()` waits for every send it started, then rejects with the first failure.
 */
export class PartSplitter extends Writable {
  private part: Buffer | null = null;
  private filled = 0;
  private start = 0;
  private readonly slots: SendSlots;

  constructor(
    private readonly pool: PartBufferPool,
    maxInFlight: number,
    private readonly send: SendPart,
  ) {
    super();
    this.slots = new SendSlots(maxInFlight, (error) => this.destroy(error));
  }

  override _write(chunk: Buffer, _encoding: BufferEncoding, done: (error?: Error | null) => void): void {
    this.take(chunk).then(() => done(), done);
  }

  override _final(done: (error?: Error | null) => void): void {
    (this.filled > 0 ? this.seal() : Promise.resolve()).then(() => done(), done);
  }

  override _destroy(error: Error | null, done: (error?: Error | null) => void): void {
    // The unfinished part is not sent; its buffer may go back since nothing else holds it.
    if (this.part) this.pool.give(this.part);
    this.part = null;
    done(error);
  }

  settled(): Promise<void> {
    return this.slots.settled();
  }

  private async take(chunk: Buffer): Promise<void> {
    let rest = chunk;
    while (rest.length > 0 && !this.destroyed) {
      this.part ??= this.pool.take();
      const copied = rest.copy(this.part, this.filled);
      this.filled += copied;
      rest = rest.subarray(copied);
      if (this.filled === this.pool.partSize) await this.seal();
    }
  }

  private async seal(): Promise<void> {
    await this.slots.free();
    if (this.destroyed || !this.part) return;
    const buffer = this.part;
    const bytes = buffer.subarray(0, this.filled);
    const start = this.start;
    this.start += this.filled;
    this.part = null;
    this.filled = 0;
    // A buffer goes back to the pool only after a send that succeeded: a failed one may still be read by a retry in flight.
    this.slots.track(this.send(bytes, start), () => this.pool.give(buffer));
  }
}
