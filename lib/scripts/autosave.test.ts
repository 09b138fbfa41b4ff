import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { ApiError } from '@/lib/api/client';
import {
  autosaveDebounceMs,
  classifySaveError,
  createAutosaver,
  retryDelayMs,
  statusLabel,
  type AutosaveSnapshot,
  type SaveOutcome,
} from './autosave';

type Call = { baseVersion: number; resolve: (o: SaveOutcome) => void; reject: (e: unknown) => void };

function setup(baseVersion = 4) {
  const calls: Call[] = [];
  const changes: AutosaveSnapshot[] = [];
  const saved: SaveOutcome[] = [];
  const autosaver = createAutosaver({
    baseVersion,
    save: (v) =>
      new Promise<SaveOutcome>((resolve, reject) => {
        calls.push({ baseVersion: v, resolve, reject });
      }),
    onChange: (s) => changes.push(s),
    onSaved: (o) => saved.push(o),
  });
  const last = () => {
    const call = calls.at(-1);
    if (!call) throw new Error('no save was made');
    return call;
  };
  return { autosaver, calls, changes, saved, last };
}

const settle = () => vi.advanceTimersByTimeAsync(0);
const networkError = () => new ApiError(0, 'network', 'Could not reach Kerfline.');

beforeEach(() => {
  vi.useFakeTimers();
});
afterEach(() => {
  vi.useRealTimers();
});

describe('retryDelayMs', () => {
  it('doubles from 1 s and stops at 30 s', () => {
    expect([1, 2, 3, 4, 5, 6, 7, 50].map(retryDelayMs)).toEqual([1_000, 2_000, 4_000, 8_000, 16_000, 30_000, 30_000, 30_000]);
  });
});

describe('classifySaveError', () => {
  it('retries what may pass later and keeps refusals and conflicts apart', () => {
    expect(classifySaveError(networkError())).toEqual({ kind: 'retry' });
    expect(classifySaveError(new ApiError(500, 'internal', 'x'))).toEqual({ kind: 'retry' });
    expect(classifySaveError(new ApiError(503, 'unknown', 'x'))).toEqual({ kind: 'retry' });
    expect(classifySaveError(new ApiError(429, 'too_many_requests', 'x'))).toEqual({ kind: 'retry' });
    expect(classifySaveError(new TypeError('bad body'))).toEqual({ kind: 'retry' });
    expect(classifySaveError(new ApiError(409, 'conflict', 'x'))).toEqual({ kind: 'conflict' });
    expect(classifySaveError(new ApiError(400, 'invalid_input', 'Too long.'))).toEqual({ kind: 'rejected', message: 'Too long.' });
    expect(classifySaveError(new ApiError(403, 'forbidden', 'No.'))).toEqual({ kind: 'rejected', message: 'No.' });
    expect(classifySaveError(new ApiError(409, 'other', 'Taken.'))).toEqual({ kind: 'rejected', message: 'Taken.' });
  });
});

describe('statusLabel', () => {
  it('says what the writer needs to know', () => {
    expect(statusLabel({ kind: 'saved' })).toBe('Saved');
    expect(statusLabel({ kind: 'pending' })).toBe('Saving…');
    expect(statusLabel({ kind: 'saving' })).toBe('Saving…');
    expect(statusLabel({ kind: 'retrying', attempt: 2, delayMs: 2_000 })).toBe('Not saved — retrying');
    expect(statusLabel({ kind: 'rejected', message: 'The script is too long.' })).toBe('Not saved: The script is too long.');
    expect(statusLabel({ kind: 'conflict' })).toBe('Not saved');
  });
});

describe('createAutosaver', () => {
  it('saves once, after typing has paused for the debounce', async () => {
    const { autosaver, calls, saved, last } = setup();
    expect(autosaver.snapshot()).toEqual({ status: { kind: 'saved' }, unsaved: false });
    autosaver.edit();
    await vi.advanceTimersByTimeAsync(500);
    autosaver.edit();
    await vi.advanceTimersByTimeAsync(autosaveDebounceMs - 1);
    expect(calls).toHaveLength(0);
    expect(autosaver.snapshot()).toEqual({ status: { kind: 'pending' }, unsaved: true });
    await vi.advanceTimersByTimeAsync(1);
    expect(calls).toHaveLength(1);
    expect(last().baseVersion).toBe(4);
    expect(autosaver.snapshot().status).toEqual({ kind: 'saving' });
    last().resolve({ version: 5, wordCount: 12 });
    await settle();
    expect(autosaver.snapshot()).toEqual({ status: { kind: 'saved' }, unsaved: false });
    expect(autosaver.baseVersion()).toBe(5);
    expect(saved).toEqual([{ version: 5, wordCount: 12 }]);
  });

  it('tells the listener only about changes, not every keystroke', async () => {
    const { autosaver, changes } = setup();
    for (let i = 0; i < 20; i++) {
      autosaver.edit();
      await vi.advanceTimersByTimeAsync(100);
    }
    expect(changes).toEqual([{ status: { kind: 'pending' }, unsaved: true }]);
  });

  it('keeps one save in flight and saves edits made during it right after, on the new version', async () => {
    const { autosaver, calls } = setup();
    autosaver.edit();
    await vi.advanceTimersByTimeAsync(autosaveDebounceMs);
    expect(calls).toHaveLength(1);
    autosaver.edit();
    await vi.advanceTimersByTimeAsync(autosaveDebounceMs * 5);
    expect(calls).toHaveLength(1);
    expect(autosaver.snapshot()).toEqual({ status: { kind: 'saving' }, unsaved: true });
    calls[0]?.resolve({ version: 5, wordCount: 1 });
    await settle();
    expect(calls).toHaveLength(2);
    expect(calls[1]?.baseVersion).toBe(5);
    calls[1]?.resolve({ version: 6, wordCount: 2 });
    await settle();
    expect(autosaver.snapshot()).toEqual({ status: { kind: 'saved' }, unsaved: false });
  });

  it('waits for the debounce when the writer is still typing as a save ends', async () => {
    const { autosaver, calls } = setup();
    autosaver.edit();
    await vi.advanceTimersByTimeAsync(autosaveDebounceMs);
    autosaver.edit();
    calls[0]?.resolve({ version: 5, wordCount: 1 });
    await settle();
    expect(calls).toHaveLength(1);
    expect(autosaver.snapshot()).toEqual({ status: { kind: 'pending' }, unsaved: true });
    await vi.advanceTimersByTimeAsync(autosaveDebounceMs);
    expect(calls).toHaveLength(2);
  });

  it('retries network errors and 5xx with backoff, keeping the text unsaved, then recovers', async () => {
    const { autosaver, calls, last } = setup();
    autosaver.edit();
    await vi.advanceTimersByTimeAsync(autosaveDebounceMs);
    last().reject(networkError());
    await settle();
    expect(autosaver.snapshot()).toEqual({ status: { kind: 'retrying', attempt: 1, delayMs: 1_000 }, unsaved: true });
    // An edit while waiting does not jump the queue; the retry sends the newest text.
    autosaver.edit();
    await vi.advanceTimersByTimeAsync(999);
    expect(calls).toHaveLength(1);
    await vi.advanceTimersByTimeAsync(1);
    expect(calls).toHaveLength(2);
    last().reject(new ApiError(502, 'unknown', 'Bad gateway'));
    await settle();
    expect(autosaver.snapshot().status).toEqual({ kind: 'retrying', attempt: 2, delayMs: 2_000 });
    await vi.advanceTimersByTimeAsync(2_000);
    expect(calls).toHaveLength(3);
    last().resolve({ version: 5, wordCount: 3 });
    await settle();
    expect(autosaver.snapshot()).toEqual({ status: { kind: 'saved' }, unsaved: false });
    // The backoff starts over after a success.
    autosaver.edit();
    await vi.advanceTimersByTimeAsync(autosaveDebounceMs);
    last().reject(networkError());
    await settle();
    expect(autosaver.snapshot().status).toEqual({ kind: 'retrying', attempt: 1, delayMs: 1_000 });
  });

  it('backs off to 30 s at most', async () => {
    const { autosaver, calls, last } = setup();
    autosaver.edit();
    await vi.advanceTimersByTimeAsync(autosaveDebounceMs);
    for (let attempt = 1; attempt <= 8; attempt++) {
      last().reject(networkError());
      await settle();
      expect(autosaver.snapshot().status).toEqual({ kind: 'retrying', attempt, delayMs: retryDelayMs(attempt) });
      await vi.advanceTimersByTimeAsync(retryDelayMs(attempt));
      expect(calls).toHaveLength(attempt + 1);
    }
    expect(retryDelayMs(8)).toBe(30_000);
  });

  it('retries at once when flushed (back online)', async () => {
    const { autosaver, calls, last } = setup();
    autosaver.edit();
    await vi.advanceTimersByTimeAsync(autosaveDebounceMs);
    last().reject(networkError());
    await settle();
    autosaver.flush();
    expect(calls).toHaveLength(2);
    expect(autosaver.snapshot().status).toEqual({ kind: 'saving' });
  });

  it('shows a 400 and does not retry until the next edit', async () => {
    const { autosaver, calls, last } = setup();
    autosaver.edit();
    await vi.advanceTimersByTimeAsync(autosaveDebounceMs);
    last().reject(new ApiError(400, 'invalid_input', 'The script is too long.'));
    await settle();
    expect(autosaver.snapshot()).toEqual({ status: { kind: 'rejected', message: 'The script is too long.' }, unsaved: true });
    await vi.advanceTimersByTimeAsync(120_000);
    autosaver.flush();
    expect(calls).toHaveLength(1);
    autosaver.edit();
    expect(autosaver.snapshot().status).toEqual({ kind: 'pending' });
    await vi.advanceTimersByTimeAsync(autosaveDebounceMs);
    expect(calls).toHaveLength(2);
  });

  it('tries again after a 400 when the writer edited during that save', async () => {
    const { autosaver, calls, last } = setup();
    autosaver.edit();
    await vi.advanceTimersByTimeAsync(autosaveDebounceMs);
    autosaver.edit();
    await vi.advanceTimersByTimeAsync(autosaveDebounceMs);
    last().reject(new ApiError(400, 'invalid_input', 'Nope.'));
    await settle();
    expect(calls).toHaveLength(2);
  });

  it('stops on a conflict, keeps the text unsaved, and overwrites on the version given', async () => {
    const { autosaver, calls, last } = setup();
    autosaver.edit();
    await vi.advanceTimersByTimeAsync(autosaveDebounceMs);
    last().reject(new ApiError(409, 'conflict', 'Someone else saved.'));
    await settle();
    expect(autosaver.snapshot()).toEqual({ status: { kind: 'conflict' }, unsaved: true });
    autosaver.edit();
    autosaver.flush();
    await vi.advanceTimersByTimeAsync(60_000);
    expect(calls).toHaveLength(1);
    expect(autosaver.snapshot()).toEqual({ status: { kind: 'conflict' }, unsaved: true });
    autosaver.overwrite(9);
    expect(calls).toHaveLength(2);
    expect(last().baseVersion).toBe(9);
    last().resolve({ version: 10, wordCount: 7 });
    await settle();
    expect(autosaver.snapshot()).toEqual({ status: { kind: 'saved' }, unsaved: false });
    expect(autosaver.baseVersion()).toBe(10);
  });

  it('after reloading their version, nothing is unsaved and the next save builds on it', async () => {
    const { autosaver, last } = setup();
    autosaver.edit();
    await vi.advanceTimersByTimeAsync(autosaveDebounceMs);
    last().reject(new ApiError(409, 'conflict', 'Someone else saved.'));
    await settle();
    autosaver.reloaded(12);
    expect(autosaver.snapshot()).toEqual({ status: { kind: 'saved' }, unsaved: false });
    autosaver.edit();
    await vi.advanceTimersByTimeAsync(autosaveDebounceMs);
    expect(last().baseVersion).toBe(12);
  });

  it('flushes pending edits at once and does nothing when all is saved', async () => {
    const { autosaver, calls } = setup();
    autosaver.flush();
    expect(calls).toHaveLength(0);
    autosaver.edit();
    autosaver.flush();
    expect(calls).toHaveLength(1);
    await vi.advanceTimersByTimeAsync(autosaveDebounceMs * 2);
    expect(calls).toHaveLength(1);
  });

  it('stops its timers when disposed', async () => {
    const { autosaver, calls } = setup();
    autosaver.edit();
    autosaver.dispose();
    await vi.advanceTimersByTimeAsync(60_000);
    expect(calls).toHaveLength(0);
  });
});
