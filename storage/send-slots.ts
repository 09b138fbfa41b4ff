const noop = () => {};

/**
 * The part sends of one PATCH, at most `max` at once (part-splitter.ts and part-streamer.ts). `free()`
 * waits for a slot, which is how backpressure reaches the request; the first failed send goes to
 * `fail` (the caller destroys its stream); `settled()` waits for every send, then rejects with the first
 * failure.
 */
export class SendSlots {
  private readonly running = new Set<Promise<void>>();
  private readonly sends: Promise<void>[] = [];

  constructor(
    private readonly max: number,
    private readonly fail: (error: Error) => void,
  ) {}

  async free(): Promise<void> {
    while (this.running.size >= this.max) await Promise.race(this.running);
  }

  /** Holds a slot until `sent` settles; `onDone` or `onFailed` runs first. */
  track(sent: Promise<void>, onDone: () => void, onFailed: () => void = noop): void {
    this.sends.push(sent);
    const slot: Promise<void> = sent
      .then(onDone, (err: unknown) => {
        onFailed();
        this.fail(err instanceof Error ? err : new Error(String(err)));
      })
      .then(() => void this.running.delete(slot), noop);
    this.running.add(slot);
  }

  async settled(): Promise<void> {
    await Promise.allSettled(this.sends);
    await Promise.all(this.sends);
  }
}
