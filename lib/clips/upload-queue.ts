// The clip upload queue without React or tus: which file is waiting, running, paused, failed or done,
// how many run at once, progress and speed. The transport (tus-js-client in the browser, a fake in the
// unit tests) moves the bytes; components/clips/use-tus-uploads.ts connects the two to React.

export type UploadState = 'waiting' | 'starting' | 'uploading' | 'paused' | 'reconnecting' | 'done' | 'failed';

export type UploadRow = {
  id: string;
  name: string;
  size: number;
  state: UploadState;
  sent: number;
  /** Whole percent; 100 only once the server has recorded the clip. */
  percent: number;
  bytesPerSecond: number | null;
  secondsLeft: number | null;
  /** Set when an earlier, unfinished upload of the same file was continued. */
  resumedFromPercent: number | null;
  error: string | null;
  /** A dropped connection, which Resume may get past; a refusal (415, 403, 413) is not. */
  retryable: boolean;
};

export type UploadTarget = { slug: string; segmentId: string; shotId: string | null };

/** What the queue needs to know of a picked file (a browser File has all of it). */
export type UploadFile = { name: string; size: number; lastModified: number; type: string };

/** What the transport reports back while it moves one file. */
export type TransportEvents = {
  progress(sent: number, total: number): void;
  /** The connection dropped with this HTTP status (0: no answer); true lets the transport retry. */
  shouldRetry(status: number): boolean;
  failed(message: string, status: number): void;
  succeeded(): void;
};

/** One file's upload as the transport runs it. */
export interface TransportUpload {
  /** Continues an unfinished earlier upload of the same file, if the server has one: its byte offset, or null. */
  resumePrevious(): Promise<number | null>;
  start(): void;
  /** Stops sending; `terminate` also asks the server to drop the partial bytes. */
  abort(terminate?: boolean): Promise<void>;
}

export interface UploadTransport<F extends UploadFile> {
  create(file: F, target: UploadTarget, events: TransportEvents): Promise<TransportUpload>;
}

type Entry<F extends UploadFile> = {
  row: UploadRow;
  key: string;
  file: F;
  target: UploadTarget;
  onDone: () => void;
  upload: TransportUpload | null;
  /** Whether `upload` is running or paused, so Resume continues it instead of building a new one. */
  started: boolean;
  samples: { t: number; bytes: number }[];
  lastEmit: number;
  /** Bumped by Pause and Cancel, so a start still awaiting its look-ups gives up. */
  generation: number;
};

export const MAX_ACTIVE = 2;
const SPEED_WINDOW_MS = 5000;
const EMIT_EVERY_MS = 250;
const EMPTY: UploadRow[] = [];

export const targetKey = (t: UploadTarget) => `${t.slug}/${t.segmentId}/${t.shotId ?? ''}`;
const inFlight = (s: UploadState) => s === 'starting' || s === 'uploading' || s === 'reconnecting';
const sameFile = (a: UploadFile, b: UploadFile) => a.name === b.name && a.size === b.size && a.lastModified === b.lastModified && a.type === b.type;
/** Whole percent, held at 99 until the server has recorded the clip. */
export const percentOf = (sent: number, total: number) => (total > 0 ? Math.min(99, Math.floor((sent / total) * 100)) : 0);
/** No answer, a server error, or a tus offset conflict / lock: worth another try. Source: tus 1.0.0 §3.2 (409 offset mismatch), §3.3 (423). */
export const retryableStatus = (status: number) => status === 0 || status >= 500 || status === 409 || status === 423;

function messageOf(err: unknown): string {
  return err instanceof Error ? err.message : 'The upload stopped for an unknown reason.';
}

export class UploadQueue<F extends UploadFile> {
  private readonly entries = new Map<string, Entry<F>>();
  private readonly snapshots = new Map<string, UploadRow[]>();
  private readonly listeners = new Set<() => void>();
  private nextId = 1;

  constructor(
    private readonly transport: UploadTransport<F>,
    private readonly now: () => number = () => performance.now(),
  ) {}

  /** For useSyncExternalStore: the same array until something of this target changes. */
  rows(target: UploadTarget): UploadRow[] {
    return this.snapshots.get(targetKey(target)) ?? EMPTY;
  }

  subscribe = (listener: () => void): (() => void) => {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  };

  /** True while a file is waiting or moving: leaving the page would stop it. */
  hasUnfinished(): boolean {
    return [...this.entries.values()].some((e) => inFlight(e.row.state) || e.row.state === 'waiting');
  }

  /** Queues files for a target; a file already waiting or moving there is skipped, a failed one starts over. */
  add(target: UploadTarget, files: readonly F[], onDone: () => void): { added: string[]; skipped: string[] } {
    const key = targetKey(target);
    const added: string[] = [];
    const skipped: string[] = [];
    for (const file of files) {
      const existing = [...this.entries.values()].find((e) => e.key === key && sameFile(e.file, file));
      if (existing && existing.row.state !== 'failed' && existing.row.state !== 'done') {
        skipped.push(file.name);
        continue;
      }
      // Picking a failed file again replaces its row, and resumes it from where the server has it.
      if (existing) this.entries.delete(existing.row.id);
      const id = `upload-${this.nextId++}`;
      const row: UploadRow = {
        id,
        name: file.name,
        size: file.size,
        state: 'waiting',
        sent: 0,
        percent: 0,
        bytesPerSecond: null,
        secondsLeft: null,
        resumedFromPercent: null,
        error: null,
        retryable: false,
      };
      this.entries.set(id, { row, key, file, target, onDone, upload: null, started: false, samples: [], lastEmit: 0, generation: 0 });
      added.push(file.name);
    }
    this.publish(key);
    this.pump();
    return { added, skipped };
  }

  pause = (id: string): void => {
    const e = this.entries.get(id);
    if (!e || !(inFlight(e.row.state) || e.row.state === 'waiting')) return;
    e.generation++;
    if (e.upload && !e.started) e.upload = null;
    void e.upload?.abort();
    this.patch(e, { state: 'paused', bytesPerSecond: null, secondsLeft: null });
    this.pump();
  };

  resume = (id: string): void => {
    const e = this.entries.get(id);
    if (!e || !(e.row.state === 'paused' || (e.row.state === 'failed' && e.row.retryable))) return;
    this.patch(e, { state: 'waiting', error: null });
    this.pump();
  };

  cancel = (id: string): void => {
    const e = this.entries.get(id);
    if (!e || e.row.state === 'done') return;
    e.generation++;
    this.entries.delete(id);
    this.publish(e.key);
    // Terminating frees the partial bytes now; if it fails, the server's cleanup removes them within a week.
    void e.upload?.abort(true).catch(() => undefined);
    this.pump();
  };

  remove = (id: string): void => {
    const e = this.entries.get(id);
    if (!e || !(e.row.state === 'done' || e.row.state === 'failed')) return;
    this.entries.delete(id);
    this.publish(e.key);
  };

  /** Back on the network: failed uploads that may get through go back in line. */
  retryFailed(): void {
    for (const e of this.entries.values()) if (e.row.state === 'failed' && e.row.retryable) this.patch(e, { state: 'waiting', error: null });
    this.pump();
  }

  private publish(key: string) {
    this.snapshots.set(
      key,
      [...this.entries.values()].filter((e) => e.key === key).map((e) => e.row),
    );
    for (const l of this.listeners) l();
  }

  private patch(e: Entry<F>, changes: Partial<UploadRow>) {
    if (this.entries.get(e.row.id) !== e) return;
    e.row = { ...e.row, ...changes };
    this.publish(e.key);
  }

  private pump() {
    let active = [...this.entries.values()].filter((e) => inFlight(e.row.state)).length;
    for (const e of this.entries.values()) {
      if (active >= MAX_ACTIVE) break;
      if (e.row.state !== 'waiting') continue;
      active++;
      void this.begin(e);
    }
  }

  private onProgress(e: Entry<F>, sent: number, total: number) {
    const now = this.now();
    e.samples.push({ t: now, bytes: sent });
    while (e.samples.length > 2 && now - (e.samples[0]?.t ?? now) > SPEED_WINDOW_MS) e.samples.shift();
    if (e.row.state === 'uploading' && now - e.lastEmit < EMIT_EVERY_MS && sent < total) return;
    e.lastEmit = now;
    const first = e.samples[0];
    const seconds = first ? (now - first.t) / 1000 : 0;
    const speed = first && seconds >= 0.5 ? (sent - first.bytes) / seconds : null;
    this.patch(e, {
      state: 'uploading',
      sent,
      percent: percentOf(sent, total),
      bytesPerSecond: speed,
      secondsLeft: speed && speed > 0 ? (total - sent) / speed : null,
    });
  }

  private events(e: Entry<F>): TransportEvents {
    return {
      progress: (sent, total) => this.onProgress(e, sent, total),
      shouldRetry: (status) => {
        const retry = retryableStatus(status);
        if (retry) {
          e.samples = [];
          this.patch(e, { state: 'reconnecting', bytesPerSecond: null, secondsLeft: null });
        }
        return retry;
      },
      failed: (message, status) => {
        // Kept so Cancel can still terminate what reached the server; Resume builds a fresh upload.
        e.started = false;
        this.patch(e, { state: 'failed', error: message, retryable: retryableStatus(status), bytesPerSecond: null, secondsLeft: null });
        this.pump();
      },
      succeeded: () => {
        this.patch(e, { state: 'done', sent: e.row.size, percent: 100, bytesPerSecond: null, secondsLeft: null });
        e.onDone();
        this.pump();
      },
    };
  }

  private async begin(e: Entry<F>) {
    const generation = ++e.generation;
    const gone = () => e.generation !== generation || this.entries.get(e.row.id) !== e;
    e.samples = [];
    this.patch(e, { state: 'starting', error: null, retryable: false, bytesPerSecond: null, secondsLeft: null });
    if (e.upload && e.started) {
      e.upload.start();
      return;
    }
    try {
      const upload = await this.transport.create(e.file, e.target, this.events(e));
      if (gone()) return;
      e.upload = upload;
      const offset = await upload.resumePrevious();
      if (gone()) return;
      if (offset !== null) {
        const percent = percentOf(offset, e.row.size);
        this.patch(e, { sent: offset, percent, resumedFromPercent: percent });
      }
      upload.start();
      e.started = true;
    } catch (err) {
      if (gone()) return;
      e.upload = null;
      this.patch(e, { state: 'failed', error: messageOf(err), retryable: false });
      this.pump();
    }
  }
}
