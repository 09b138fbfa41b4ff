import { describe, expect, it, vi } from 'vitest';
import { MAX_ACTIVE, UploadQueue, type TransportEvents, type TransportUpload, type UploadFile, type UploadTarget, type UploadTransport } from './upload-queue';

const target: UploadTarget = { slug: 'shop', segmentId: 'seg-1', shotId: null };
const file = (name: string, size = 1000): UploadFile => ({ name, size, lastModified: 1, type: 'video/mp4' });

/** A transport the test drives by hand: each created upload waits until the test reports on it. */
class FakeTransport implements UploadTransport<UploadFile> {
  readonly runs = new Map<string, { events: TransportEvents; upload: TransportUpload & { starts: number; aborts: (boolean | undefined)[] } }>();
  created = 0;
  resumeOffset: number | null = null;
  /** Set to hold create() open until the test releases it. */
  gate: Promise<void> | null = null;

  async create(f: UploadFile, _t: UploadTarget, events: TransportEvents) {
    this.created++;
    if (this.gate) await this.gate;
    const offset = this.resumeOffset;
    const upload = {
      starts: 0,
      aborts: [] as (boolean | undefined)[],
      resumePrevious: async () => offset,
      start() {
        upload.starts++;
      },
      async abort(terminate?: boolean) {
        upload.aborts.push(terminate);
      },
    };
    this.runs.set(f.name, { events, upload });
    return upload;
  }

  run(name: string) {
    const r = this.runs.get(name);
    if (!r) throw new Error(`${name} was never created`);
    return r;
  }
}

/** Lets the queue's awaited look-ups (create, resumePrevious) finish. */
const settle = () => new Promise((r) => setTimeout(r, 0));

function setUp() {
  const transport = new FakeTransport();
  let clock = 0;
  const queue = new UploadQueue(transport, () => clock);
  const tick = (ms: number) => (clock += ms);
  const row = (name: string) => {
    const found = queue.rows(target).find((r) => r.name === name);
    if (!found) throw new Error(`no row for ${name}`);
    return found;
  };
  return { transport, queue, tick, row };
}

describe('UploadQueue', () => {
  it(`runs at most ${MAX_ACTIVE} uploads at once and starts the next when one finishes`, async () => {
    const { transport, queue, row } = setUp();
    const onDone = vi.fn();
    const { added } = queue.add(target, [file('a'), file('b'), file('c')], onDone);
    expect(added).toEqual(['a', 'b', 'c']);
    await settle();
    expect(row('a').state).toBe('starting');
    expect(row('b').state).toBe('starting');
    expect(row('c').state).toBe('waiting');
    expect(transport.run('a').upload.starts).toBe(1);

    transport.run('a').events.succeeded();
    await settle();
    expect(row('a')).toMatchObject({ state: 'done', percent: 100, sent: 1000 });
    expect(onDone).toHaveBeenCalledTimes(1);
    expect(row('c').state).toBe('starting');
  });

  it('skips a file already queued for the same place, but takes it for another shot', async () => {
    const { queue } = setUp();
    queue.add(target, [file('a')], () => {});
    expect(queue.add(target, [file('a')], () => {})).toEqual({ added: [], skipped: ['a'] });
    expect(queue.add({ ...target, shotId: 'shot-1' }, [file('a')], () => {})).toEqual({ added: ['a'], skipped: [] });
    expect(queue.rows(target)).toHaveLength(1);
  });

  it('reports progress as whole percent held at 99, with speed once half a second has passed, at most every 250 ms', async () => {
    const { transport, queue, tick, row } = setUp();
    queue.add(target, [file('a', 10_000)], () => {});
    await settle();
    const { events } = transport.run('a');
    events.progress(0, 10_000);
    expect(row('a')).toMatchObject({ state: 'uploading', percent: 0, bytesPerSecond: null });
    tick(100);
    events.progress(500, 10_000);
    expect(row('a').sent).toBe(0); // within 250 ms of the last update
    tick(900);
    events.progress(9_999, 10_000);
    expect(row('a')).toMatchObject({ sent: 9_999, percent: 99 });
    expect(row('a').bytesPerSecond).toBeCloseTo(9_999, 0);
    expect(row('a').secondsLeft).toBeCloseTo(1 / 9_999, 5);
  });

  it('marks a dropped connection retryable and lets Resume start a fresh upload; a refusal stays failed', async () => {
    const { transport, queue, row } = setUp();
    queue.add(target, [file('a'), file('b')], () => {});
    await settle();
    expect(transport.run('a').events.shouldRetry(502)).toBe(true);
    expect(row('a').state).toBe('reconnecting');
    transport.run('a').events.failed('Could not reach Kerfline.', 0);
    transport.run('b').events.failed('Upload video, audio or still images.', 415);
    expect(row('a')).toMatchObject({ state: 'failed', retryable: true, error: 'Could not reach Kerfline.' });
    expect(row('b')).toMatchObject({ state: 'failed', retryable: false });
    expect(transport.run('b').events.shouldRetry(415)).toBe(false);

    queue.resume(row('b').id);
    expect(row('b').state).toBe('failed');
    const before = transport.created;
    queue.resume(row('a').id);
    await settle();
    expect(transport.created).toBe(before + 1);
    expect(row('a')).toMatchObject({ state: 'starting', error: null });
  });

  it('pauses by aborting and resumes the same upload without building a new one', async () => {
    const { transport, queue, row } = setUp();
    queue.add(target, [file('a')], () => {});
    await settle();
    const { upload } = transport.run('a');
    queue.pause(row('a').id);
    expect(row('a').state).toBe('paused');
    expect(upload.aborts).toEqual([undefined]);
    queue.resume(row('a').id);
    await settle();
    expect(transport.created).toBe(1);
    expect(upload.starts).toBe(2);
    expect(row('a').state).toBe('starting');
  });

  it('a pause while the upload is still being set up keeps it from starting', async () => {
    const { transport, queue, row } = setUp();
    let release = () => {};
    transport.gate = new Promise<void>((r) => (release = r));
    queue.add(target, [file('a')], () => {});
    queue.pause(row('a').id);
    release();
    await settle();
    expect(transport.run('a').upload.starts).toBe(0);
    expect(row('a').state).toBe('paused');
  });

  it('cancel removes the row and asks the server to drop the partial bytes; remove clears finished rows only', async () => {
    const { transport, queue, row } = setUp();
    queue.add(target, [file('a'), file('b')], () => {});
    await settle();
    queue.cancel(row('a').id);
    expect(transport.run('a').upload.aborts).toEqual([true]);
    expect(queue.rows(target).map((r) => r.name)).toEqual(['b']);
    queue.remove(row('b').id);
    expect(queue.rows(target)).toHaveLength(1);
    transport.run('b').events.succeeded();
    queue.remove(row('b').id);
    expect(queue.rows(target)).toHaveLength(0);
  });

  it('continues an earlier unfinished upload from the offset the server holds', async () => {
    const { transport, queue, row } = setUp();
    transport.resumeOffset = 400;
    queue.add(target, [file('a', 1000)], () => {});
    await settle();
    expect(row('a')).toMatchObject({ sent: 400, percent: 40, resumedFromPercent: 40 });
  });

  it('gives a failed file picked again a new row, and says when nothing is left to lose on leaving', async () => {
    const { transport, queue, row } = setUp();
    queue.add(target, [file('a')], () => {});
    await settle();
    expect(queue.hasUnfinished()).toBe(true);
    transport.run('a').events.failed('refused', 403);
    expect(queue.hasUnfinished()).toBe(false);
    const oldId = row('a').id;
    expect(queue.add(target, [file('a')], () => {}).added).toEqual(['a']);
    expect(queue.rows(target)).toHaveLength(1);
    expect(row('a').id).not.toBe(oldId);
  });

  it('puts retryable failures back in line when the network returns', async () => {
    const { transport, queue, row } = setUp();
    queue.add(target, [file('a')], () => {});
    await settle();
    transport.run('a').events.failed('offline', 0);
    queue.retryFailed();
    await settle();
    expect(row('a').state).toBe('starting');
  });

  it('tells subscribers about every change and keeps the same rows array until one happens', async () => {
    const { queue } = setUp();
    const listener = vi.fn();
    const stop = queue.subscribe(listener);
    queue.add(target, [file('a')], () => {});
    expect(listener).toHaveBeenCalled();
    const rows = queue.rows(target);
    expect(queue.rows(target)).toBe(rows);
    stop();
    listener.mockClear();
    queue.pause(rows[0]!.id);
    expect(listener).not.toHaveBeenCalled();
    expect(queue.rows(target)).not.toBe(rows);
  });
});
