import { randomUUID } from 'node:crypto';
import type { Lock, Locker, RequestRelease } from '@tus/server';
import type pg from 'pg';
import { tusError } from './tus-errors';

// Keeps upload locks apart from any other advisory lock in the database ('kerf' in ASCII).
/** The connections upload locks are held on (db/lock-pool.ts). */
export type LockPool = pg.Pool;

const NAMESPACE = 0x6b657266;

/**
 * An upload's mark when this process took its lock (`previous`; null when it had none) and the new one
 * it set (`current`). A process that stamps what it knows of the upload with `current` at release and
 * finds that same mark as `previous` at its next lock knows no other process held the lock in between.
 */
export type LockMarks = { previous: string | null; current: string };

// Under the advisory lock, so no other process reads or writes the row between the two statements' views.
const REMARK = `
  with old as (select mark from upload_marks where upload_id = $1)
  insert into upload_marks (upload_id, mark) values ($1, $2)
  on conflict (upload_id) do update set mark = excluded.mark, marked_at = now()
  returning (select mark from old) as previous`;

export type PgLockerOptions = {
  /** How long a request waits for another request on the same upload, in any process (default 30 s, as @tus/server's MemoryLocker). */
  timeoutMs?: number;
  pollMs?: number;
  /** Runs once the lock is held, before the request touches the upload, with the upload's marks. */
  onAcquired?: (uploadId: string, marks: LockMarks) => Promise<void>;
  /** Runs just before the lock is given up, while no other process can have it yet. */
  onReleasing?: (uploadId: string) => void;
};

/**
 * One writer per upload across every app process: a PostgreSQL session-level advisory lock per upload
 * id, held on its own pooled connection for the length of the tus request. `unlock` (the handler's
 * `finally`) releases it; if the process or its connection dies, PostgreSQL releases it with the session.
 * Source: PostgreSQL 15 manual, §9.27.10 Advisory Lock Functions, and §13.3.5 Advisory Locks.
 */
export class PgLocker implements Locker {
  constructor(
    private readonly pool: pg.Pool,
    private readonly options: PgLockerOptions = {},
  ) {}

  newLock(id: string): Lock {
    return new PgLock(id, this.pool, this.options);
  }
}

const sleep = (ms: number, signal: AbortSignal) =>
  new Promise<void>((resolve) => {
    const t = setTimeout(done, ms);
    function done() {
      clearTimeout(t);
      signal.removeEventListener('abort', done);
      resolve();
    }
    signal.addEventListener('abort', done, { once: true });
  });

// tus-js-client retries a 423 with back-off (Source: tus-js-client 4.3 shouldRetry: 409 and 423 are retried).
const busy = () => tusError(423, 'Another request is writing this upload; it is tried again shortly.');

class PgLock implements Lock {
  private client: pg.PoolClient | null = null;

  constructor(
    private readonly id: string,
    private readonly pool: pg.Pool,
    private readonly options: PgLockerOptions,
  ) {}

  // Another process cannot be asked to let go early, so `_requestRelease` goes unused: its request ends on its own or with its connection.
  async lock(signal: AbortSignal, _requestRelease: RequestRelease): Promise<void> {
    const deadline = Date.now() + (this.options.timeoutMs ?? 30_000);
    const client = await this.pool.connect();
    // A connection that breaks while held is dropped at unlock; without a listener its error would end the process.
    const ignore = () => {};
    client.on('error', ignore);
    try {
      for (;;) {
        const { rows } = await client.query<{ ok: boolean }>('select pg_try_advisory_lock($1, hashtext($2)) as ok', [NAMESPACE, this.id]);
        if (rows[0]?.ok) break;
        if (signal.aborted || Date.now() >= deadline) throw busy();
        await sleep(this.options.pollMs ?? 100, signal);
      }
    } catch (err) {
      client.off('error', ignore);
      client.release();
      throw err;
    }
    this.client = client;
    try {
      const current = randomUUID();
      const { rows } = await client.query<{ previous: string | null }>(REMARK, [this.id, current]);
      await this.options.onAcquired?.(this.id, { previous: rows[0]?.previous ?? null, current });
    } catch (err) {
      await this.unlock();
      throw err;
    }
  }

  async unlock(): Promise<void> {
    const client = this.client;
    if (!client) throw new Error('Releasing an upload lock that is not held');
    this.client = null;
    this.options.onReleasing?.(this.id);
    try {
      await client.query('select pg_advisory_unlock($1, hashtext($2))', [NAMESPACE, this.id]);
      client.release();
    } catch (err) {
      // The session is gone or broken: PostgreSQL released its locks with it; the connection is not reused.
      client.release(err instanceof Error ? err : new Error(String(err)));
    }
  }
}
