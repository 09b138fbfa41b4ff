import { ApiError } from '@/lib/api/client';

// The script editor's autosave, kept free of React and the DOM so its timing can be tested with fake
// timers. Rules: save `debounceMs` after the last edit; one save in flight at a time, and edits made
// during it are saved right after it; network errors, 429 and 5xx retry with backoff and keep the
// text; other refusals wait for the next edit; a 409 conflict stops autosaving until the writer
// chooses their version or ours.

export type SaveStatus =
  | { kind: 'saved' }
  /** Edits are waiting for the debounce or for the save in flight. */
  | { kind: 'pending' }
  | { kind: 'saving' }
  | { kind: 'retrying'; attempt: number; delayMs: number }
  | { kind: 'rejected'; message: string }
  | { kind: 'conflict' };

export type AutosaveSnapshot = {
  status: SaveStatus;
  /** True while the editor holds text the server has not accepted: warn before leaving. */
  unsaved: boolean;
};

export type SaveOutcome = { version: number; wordCount: number };

export const autosaveDebounceMs = 800;
const firstRetryMs = 1_000;
const maxRetryMs = 30_000;

/** 1 s, 2 s, 4 s … capped at 30 s; `attempt` counts failures in a row, from 1. */
export function retryDelayMs(attempt: number): number {
  const exponent = Math.max(0, Math.min(attempt - 1, 15));
  return Math.min(firstRetryMs * 2 ** exponent, maxRetryMs);
}

export type SaveFailure = { kind: 'retry' } | { kind: 'conflict' } | { kind: 'rejected'; message: string };

export function classifySaveError(error: unknown): SaveFailure {
  // Anything that is not the server's answer (a TypeError from a malformed body, say) is treated as
  // transient: retrying keeps the text, giving up could lose it.
  if (!(error instanceof ApiError)) return { kind: 'retry' };
  if (error.status === 0 || error.status === 429 || error.status >= 500) return { kind: 'retry' };
  if (error.status === 409 && error.code === 'conflict') return { kind: 'conflict' };
  return { kind: 'rejected', message: error.message };
}

export function statusLabel(status: SaveStatus): string {
  switch (status.kind) {
    case 'saved':
      return 'Saved';
    case 'pending':
    case 'saving':
      return 'Saving…';
    case 'retrying':
      return 'Not saved — retrying';
    case 'rejected':
      return `Not saved: ${status.message}`;
    case 'conflict':
      return 'Not saved';
  }
}

type Timers = {
  set: (fn: () => void, ms: number) => unknown;
  clear: (handle: unknown) => void;
};

const globalTimers: Timers = {
  set: (fn, ms) => setTimeout(fn, ms),
  clear: (handle) => clearTimeout(handle as ReturnType<typeof setTimeout>),
};

export type AutosaverOptions = {
  baseVersion: number;
  /** Sends the editor's current text over `baseVersion`; read the text when called, not before. */
  save: (baseVersion: number) => Promise<SaveOutcome>;
  onChange: (snapshot: AutosaveSnapshot) => void;
  onSaved?: (outcome: SaveOutcome) => void;
  debounceMs?: number;
  timers?: Timers;
};

export type Autosaver = {
  /** The text changed. */
  edit(): void;
  /** Save pending edits now (leaving the page, back online); does nothing in a conflict. */
  flush(): void;
  /** The editor now shows the server's text at `version`: nothing is unsaved any more. */
  reloaded(version: number): void;
  /** Save our text over the server's `version`, leaving a conflict. */
  overwrite(version: number): void;
  snapshot(): AutosaveSnapshot;
  baseVersion(): number;
  /** Stop the timers; a save in flight still finishes. */
  dispose(): void;
};

export function createAutosaver(options: AutosaverOptions): Autosaver {
  const timers = options.timers ?? globalTimers;
  const debounceMs = options.debounceMs ?? autosaveDebounceMs;
  let baseVersion = options.baseVersion;
  let status: SaveStatus = { kind: 'saved' };
  // Edits are numbered; the server has accepted every edit up to savedSeq.
  let editSeq = 0;
  let savedSeq = 0;
  let inFlight = false;
  // The debounce (or a retry) came due while a save was in flight: save again as soon as it ends.
  let queued = false;
  let failures = 0;
  // Bumped when the writer resolves a conflict, so an answer to an older request is ignored.
  let epoch = 0;
  let debounceTimer: unknown = null;
  let retryTimer: unknown = null;
  let disposed = false;

  const snapshot = (): AutosaveSnapshot => ({ status, unsaved: editSeq !== savedSeq || status.kind === 'conflict' });
  // Tell the listener only what changed: a keystroke while "Saving…" is no news.
  let lastNotified = '';
  const notify = () => {
    const next = snapshot();
    const key = JSON.stringify(next);
    if (key === lastNotified) return;
    lastNotified = key;
    options.onChange(next);
  };
  const setStatus = (next: SaveStatus) => {
    status = next;
    notify();
  };
  const clearTimers = () => {
    if (debounceTimer !== null) timers.clear(debounceTimer);
    if (retryTimer !== null) timers.clear(retryTimer);
    debounceTimer = null;
    retryTimer = null;
  };

  function start(): void {
    if (status.kind === 'conflict') return;
    if (inFlight) {
      queued = true;
      return;
    }
    clearTimers();
    queued = false;
    inFlight = true;
    const seq = editSeq;
    const requestEpoch = epoch;
    setStatus({ kind: 'saving' });
    options.save(baseVersion).then(
      (outcome) => {
        if (requestEpoch !== epoch) return;
        inFlight = false;
        failures = 0;
        baseVersion = outcome.version;
        savedSeq = Math.max(savedSeq, seq);
        options.onSaved?.(outcome);
        if (editSeq === savedSeq) setStatus({ kind: 'saved' });
        else if (queued || debounceTimer === null) start();
        else setStatus({ kind: 'pending' });
      },
      (error: unknown) => {
        if (requestEpoch !== epoch) return;
        inFlight = false;
        const failure = classifySaveError(error);
        if (failure.kind === 'conflict') {
          clearTimers();
          queued = false;
          setStatus({ kind: 'conflict' });
        } else if (failure.kind === 'retry') {
          failures += 1;
          clearTimers();
          queued = false;
          const delayMs = retryDelayMs(failures);
          if (!disposed) retryTimer = timers.set(start, delayMs);
          setStatus({ kind: 'retrying', attempt: failures, delayMs });
        } else {
          failures = 0;
          // Edits made after this request was sent are the "next edit": they may have fixed it.
          if (queued && editSeq !== seq) start();
          else {
            queued = false;
            if (editSeq === seq) clearTimers();
            setStatus({ kind: 'rejected', message: failure.message });
          }
        }
      },
    );
  }

  return {
    edit() {
      editSeq += 1;
      if (status.kind === 'conflict' || disposed) {
        notify();
        return;
      }
      // A retry is already scheduled and will send the newest text; do not hammer a failing server.
      if (retryTimer !== null) {
        notify();
        return;
      }
      if (debounceTimer !== null) timers.clear(debounceTimer);
      debounceTimer = timers.set(() => {
        debounceTimer = null;
        start();
      }, debounceMs);
      if (status.kind === 'saving') notify();
      else setStatus({ kind: 'pending' });
    },
    flush() {
      if (status.kind === 'conflict' || editSeq === savedSeq) return;
      // After a refusal the same text would be refused again; the next edit tries anew.
      if (status.kind === 'rejected' && debounceTimer === null) return;
      start();
    },
    reloaded(version) {
      epoch += 1;
      clearTimers();
      inFlight = false;
      queued = false;
      failures = 0;
      baseVersion = version;
      savedSeq = editSeq;
      setStatus({ kind: 'saved' });
    },
    overwrite(version) {
      epoch += 1;
      clearTimers();
      inFlight = false;
      queued = false;
      failures = 0;
      baseVersion = version;
      status = { kind: 'pending' };
      start();
    },
    snapshot,
    baseVersion: () => baseVersion,
    dispose() {
      disposed = true;
      clearTimers();
    },
  };
}
