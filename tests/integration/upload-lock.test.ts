import { randomBytes } from 'node:crypto';
import pg from 'pg';
import { afterAll, describe, expect, it } from 'vitest';
import { removeUploadMarks } from '@/lib/clips/queries';
import { PgLocker, type LockMarks } from '@/storage/upload-lock-queries';

// Two pools stand for two app processes: each holds its own PostgreSQL sessions.
const pools = [0, 1].map(() => new pg.Pool({ connectionString: process.env.DATABASE_URL, max: 4 }));
const [one, two] = pools.map((pool) => new PgLocker(pool, { timeoutMs: 600, pollMs: 50 })) as [PgLocker, PgLocker];
const never = () => new AbortController().signal;
const noop = async () => {};
const id = () => randomBytes(16).toString('hex');

afterAll(async () => {
  await Promise.all(pools.map((p) => p.end()));
});

describe('PostgreSQL upload locks', () => {
  it('keeps a second process out until the first unlocks, then lets it in', async () => {
    const upload = id();
    const held = one.newLock(upload);
    await held.lock(never(), noop);
    await expect(two.newLock(upload).lock(never(), noop)).rejects.toMatchObject({ status_code: 423 });
    // Another upload is not held up.
    const other = two.newLock(id());
    await other.lock(never(), noop);
    await other.unlock();
    const waiting = two.newLock(upload);
    const acquired = waiting.lock(never(), noop);
    await new Promise((r) => setTimeout(r, 150));
    await held.unlock();
    await expect(acquired).resolves.toBeUndefined();
    await waiting.unlock();
  });

  it('excludes a second request of the same process too', async () => {
    const upload = id();
    const first = one.newLock(upload);
    await first.lock(never(), noop);
    await expect(one.newLock(upload).lock(never(), noop)).rejects.toMatchObject({ status_code: 423 });
    await first.unlock();
  });

  it('stops waiting as soon as the request is aborted', async () => {
    const upload = id();
    const held = one.newLock(upload);
    await held.lock(never(), noop);
    const abort = new AbortController();
    const started = Date.now();
    const waiting = two.newLock(upload).lock(abort.signal, noop);
    setTimeout(() => abort.abort(), 50);
    await expect(waiting).rejects.toMatchObject({ status_code: 423 });
    // Unaborted, it would wait as long as the lock is held (for ever here); this only tells the two apart.
    expect(Date.now() - started).toBeLessThan(5_000);
    await held.unlock();
  });

  it('is released when the holder’s connection dies, as when its process is killed', async () => {
    const upload = id();
    const dying = new pg.Pool({ connectionString: process.env.DATABASE_URL, max: 1 });
    const pids: number[] = [];
    dying.on('connect', (client) => {
      void client.query<{ pid: number }>('select pg_backend_pid() as pid').then((r) => pids.push(r.rows[0]!.pid));
    });
    const held = new PgLocker(dying).newLock(upload);
    await held.lock(never(), noop);
    await expect(two.newLock(upload).lock(never(), noop)).rejects.toMatchObject({ status_code: 423 });
    await expect.poll(() => pids.length).toBe(1);
    await pools[0]!.query('select pg_terminate_backend($1)', [pids[0]]);
    const next = two.newLock(upload);
    await expect(next.lock(never(), noop)).resolves.toBeUndefined();
    await next.unlock();
    // Unlocking on a dead connection is not an error: the session took the lock with it.
    await expect(held.unlock()).resolves.toBeUndefined();
    await dying.end().catch(() => {});
  });

  it('runs onAcquired once the lock is held, and refuses to unlock twice', async () => {
    const seen: string[] = [];
    const upload = id();
    const lock = new PgLocker(pools[0]!, { onAcquired: async (u) => void seen.push(u) }).newLock(upload);
    await lock.lock(never(), noop);
    expect(seen).toEqual([upload]);
    await lock.unlock();
    await expect(lock.unlock()).rejects.toThrow(/not held/);
  });

  it('gives each hold a new mark and the one before it, whichever process held the lock last', async () => {
    const upload = id();
    const marks: LockMarks[] = [];
    const record = async (_u: string, m: LockMarks) => void marks.push(m);
    const [a, b] = pools.map((pool) => new PgLocker(pool, { onAcquired: record })) as [PgLocker, PgLocker];
    for (const locker of [a, a, b, a]) {
      const lock = locker.newLock(upload);
      await lock.lock(never(), noop);
      await lock.unlock();
    }
    expect(marks[0]?.previous).toBeNull();
    // Each hold learns the mark the hold before it set, so a process that finds its own last mark knows no other process came between.
    marks.slice(1).forEach((m, i) => expect(m.previous).toBe(marks[i]?.current));
    expect(new Set(marks.map((m) => m.current)).size).toBe(4);
  });

  it('forgets the marks of removed uploads and of uploads not locked since a time, so their next hold starts afresh', async () => {
    const [removed, idle, busy] = [id(), id(), id()];
    const marks = new Map<string, LockMarks>();
    const locker = new PgLocker(pools[0]!, { onAcquired: async (u, m) => void marks.set(u, m) });
    const take = async (u: string) => {
      const lock = locker.newLock(u);
      await lock.lock(never(), noop);
      await lock.unlock();
    };
    for (const u of [removed, idle, busy]) await take(u);
    // The idle upload's lock was last taken an hour ago; the cut-off is a minute ago.
    await pools[0]!.query("update upload_marks set marked_at = now() - interval '1 hour' where upload_id = $1", [idle]);
    await removeUploadMarks([removed], new Date(Date.now() - 60_000));
    for (const u of [removed, idle, busy]) await take(u);
    expect(marks.get(removed)?.previous).toBeNull();
    expect(marks.get(idle)?.previous).toBeNull();
    expect(marks.get(busy)?.previous).not.toBeNull();
  });
});
