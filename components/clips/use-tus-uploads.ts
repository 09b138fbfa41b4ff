'use client';

import { useQueryClient, type QueryClient } from '@tanstack/react-query';
import { useCallback, useMemo, useSyncExternalStore } from 'react';
import type { DetailedError as TusDetailedError, PreviousUpload, Upload } from 'tus-js-client';
import { UPLOAD_CHUNK_BYTES } from '@/lib/clips/upload-chunk';
import { segmentClipsKey } from './use-clips';

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

type Entry = {
  row: UploadRow;
  key: string;
  file: File;
  target: UploadTarget;
  qc: QueryClient;
  upload: Upload | null;
  /** Whether `upload` is running or paused, so Resume continues it instead of building a new one. */
  started: boolean;
  samples: { t: number; bytes: number }[];
  lastEmit: number;
  /** Bumped by Pause and Cancel, so a start still awaiting its look-ups gives up. */
  generation: number;
};

const MAX_ACTIVE = 2;
const SPEED_WINDOW_MS = 5000;
const EMIT_EVERY_MS = 250;
const RETRY_DELAYS = [0, 1000, 3000, 5000, 10000, 20000, 30000];

// Uploads live outside React, so closing a card's Clips or moving the card to another column does
// not stop them: the panel shows the same rows again when it mounts.
const entries = new Map<string, Entry>();
const snapshots = new Map<string, UploadRow[]>();
const listeners = new Set<() => void>();
const EMPTY: UploadRow[] = [];
let nextId = 1;
let guardsInstalled = false;

const keyOf = (t: UploadTarget) => `${t.slug}/${t.segmentId}/${t.shotId ?? ''}`;
const inFlight = (s: UploadState) => s === 'starting' || s === 'uploading' || s === 'reconnecting';
const sameFile = (a: File, b: File) => a.name === b.name && a.size === b.size && a.lastModified === b.lastModified && a.type === b.type;
const percentOf = (sent: number, total: number) => (total > 0 ? Math.min(99, Math.floor((sent / total) * 100)) : 0);

function publish(key: string) {
  snapshots.set(
    key,
    [...entries.values()].filter((e) => e.key === key).map((e) => e.row),
  );
  for (const l of listeners) l();
}

function patch(e: Entry, changes: Partial<UploadRow>) {
  if (entries.get(e.row.id) !== e) return;
  e.row = { ...e.row, ...changes };
  publish(e.key);
}

function subscribe(listener: () => void) {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

function pump() {
  let active = [...entries.values()].filter((e) => inFlight(e.row.state)).length;
  for (const e of entries.values()) {
    if (active >= MAX_ACTIVE) break;
    if (e.row.state !== 'waiting') continue;
    active++;
    void begin(e);
  }
}

function installGuards() {
  if (guardsInstalled || typeof window === 'undefined') return;
  guardsInstalled = true;
  window.addEventListener('beforeunload', (ev) => {
    if ([...entries.values()].some((e) => inFlight(e.row.state) || e.row.state === 'waiting')) ev.preventDefault();
  });
  // Back on the network after tus gave up: carry on without making anyone press Resume.
  window.addEventListener('online', () => {
    for (const e of entries.values()) if (e.row.state === 'failed' && e.row.retryable) patch(e, { state: 'waiting', error: null });
    pump();
  });
}

const statusOf = (err: TusDetailedError | Error) => ('originalResponse' in err ? (err.originalResponse?.getStatus() ?? 0) : 0);
const retryableStatus = (status: number) => status === 0 || status >= 500 || status === 409 || status === 423;

function messageOf(err: unknown): string {
  if (!(err instanceof Error)) return 'The upload stopped for an unknown reason.';
  if (!('originalRequest' in err)) return err.message;
  const res = (err as TusDetailedError).originalResponse;
  const status = res?.getStatus() ?? 0;
  if (!res || status === 0) return 'Could not reach Kerfline. Check the connection, then press Resume.';
  const body = res.getBody()?.trim() ?? '';
  // The server's tus errors are one line of plain text; anything else (a proxy's HTML page) is not for reading.
  if (body && !body.startsWith('<')) return body.slice(0, 300);
  if (status === 413) return 'The file is larger than this server accepts.';
  return `The server refused the upload (${status}).`;
}

async function serverOffset(url: string): Promise<number | null> {
  try {
    const res = await fetch(url, { method: 'HEAD', headers: { 'Tus-Resumable': '1.0.0' }, credentials: 'same-origin', cache: 'no-store' });
    const offset = Number(res.headers.get('Upload-Offset'));
    return res.ok && Number.isFinite(offset) ? offset : null;
  } catch {
    return null;
  }
}

/** The newest unfinished upload of this file for the same segment and shot, not one meant for another place. */
function previousFor(previous: PreviousUpload[], t: UploadTarget): PreviousUpload | undefined {
  return previous
    .filter((p) => p.uploadUrl && p.metadata.segmentId === t.segmentId && (p.metadata.shotId ?? null) === t.shotId)
    .sort((a, b) => b.creationTime.localeCompare(a.creationTime))[0];
}

function onProgress(e: Entry, sent: number, total: number) {
  const now = performance.now();
  e.samples.push({ t: now, bytes: sent });
  while (e.samples.length > 2 && now - (e.samples[0]?.t ?? now) > SPEED_WINDOW_MS) e.samples.shift();
  if (e.row.state === 'uploading' && now - e.lastEmit < EMIT_EVERY_MS && sent < total) return;
  e.lastEmit = now;
  const first = e.samples[0];
  const seconds = first ? (now - first.t) / 1000 : 0;
  const speed = first && seconds >= 0.5 ? (sent - first.bytes) / seconds : null;
  patch(e, {
    state: 'uploading',
    sent,
    percent: percentOf(sent, total),
    bytesPerSecond: speed,
    secondsLeft: speed && speed > 0 ? (total - sent) / speed : null,
  });
}

async function begin(e: Entry) {
  const generation = ++e.generation;
  const gone = () => e.generation !== generation || entries.get(e.row.id) !== e;
  e.samples = [];
  patch(e, { state: 'starting', error: null, retryable: false, bytesPerSecond: null, secondsLeft: null });
  if (e.upload && e.started) {
    e.upload.start();
    return;
  }
  try {
    // Loaded here so the server never evaluates it: it belongs to the browser.
    const tus = await import('tus-js-client');
    if (gone()) return;
    const { segmentId, shotId, slug } = e.target;
    const upload = new tus.Upload(e.file, {
      endpoint: new URL('/api/uploads', location.origin).href,
      chunkSize: UPLOAD_CHUNK_BYTES,
      retryDelays: RETRY_DELAYS,
      // The disk store cannot concatenate partial uploads.
      parallelUploads: 1,
      metadata: { segmentId, ...(shotId ? { shotId } : {}), filename: e.file.name, filetype: e.file.type || 'application/octet-stream' },
      storeFingerprintForResuming: true,
      removeFingerprintOnSuccess: true,
      onProgress: (sent, total) => onProgress(e, sent, total),
      onShouldRetry: (err) => {
        const retry = retryableStatus(statusOf(err));
        if (retry) {
          e.samples = [];
          patch(e, { state: 'reconnecting', bytesPerSecond: null, secondsLeft: null });
        }
        return retry;
      },
      onError: (err) => {
        // Kept so Cancel can still terminate what reached the server; Resume builds a fresh upload.
        e.started = false;
        patch(e, { state: 'failed', error: messageOf(err), retryable: retryableStatus(statusOf(err)), bytesPerSecond: null, secondsLeft: null });
        pump();
      },
      onSuccess: () => {
        patch(e, { state: 'done', sent: e.row.size, percent: 100, bytesPerSecond: null, secondsLeft: null });
        void e.qc.invalidateQueries({ queryKey: segmentClipsKey(slug, segmentId) });
        // Shot cards say "Has footage" from their clip count.
        void e.qc.invalidateQueries({ queryKey: ['shots', slug] });
        pump();
      },
    });
    e.upload = upload;
    const previous = previousFor(await upload.findPreviousUploads(), e.target);
    if (gone()) return;
    if (previous?.uploadUrl) {
      const offset = await serverOffset(previous.uploadUrl);
      if (gone()) return;
      if (offset !== null) {
        const percent = percentOf(offset, e.row.size);
        patch(e, { sent: offset, percent, resumedFromPercent: percent });
      }
      upload.resumeFromPreviousUpload(previous);
    }
    upload.start();
    e.started = true;
  } catch (err) {
    if (gone()) return;
    e.upload = null;
    patch(e, { state: 'failed', error: messageOf(err), retryable: false });
    pump();
  }
}

function addFiles(target: UploadTarget, qc: QueryClient, files: File[]): { added: string[]; skipped: string[] } {
  installGuards();
  const key = keyOf(target);
  const added: string[] = [];
  const skipped: string[] = [];
  for (const file of files) {
    const existing = [...entries.values()].find((e) => e.key === key && sameFile(e.file, file));
    if (existing && existing.row.state !== 'failed' && existing.row.state !== 'done') {
      skipped.push(file.name);
      continue;
    }
    // Picking a failed file again replaces its row, and resumes it from where the server has it.
    if (existing) entries.delete(existing.row.id);
    const id = `upload-${nextId++}`;
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
    entries.set(id, { row, key, file, target, qc, upload: null, started: false, samples: [], lastEmit: 0, generation: 0 });
    added.push(file.name);
  }
  publish(key);
  pump();
  return { added, skipped };
}

function pause(id: string) {
  const e = entries.get(id);
  if (!e || !(inFlight(e.row.state) || e.row.state === 'waiting')) return;
  e.generation++;
  if (e.upload && !e.started) e.upload = null;
  void e.upload?.abort();
  patch(e, { state: 'paused', bytesPerSecond: null, secondsLeft: null });
  pump();
}

function resume(id: string) {
  const e = entries.get(id);
  if (!e || !(e.row.state === 'paused' || (e.row.state === 'failed' && e.row.retryable))) return;
  patch(e, { state: 'waiting', error: null });
  pump();
}

function cancel(id: string) {
  const e = entries.get(id);
  if (!e || e.row.state === 'done') return;
  e.generation++;
  entries.delete(id);
  publish(e.key);
  // Terminating frees the partial bytes now; if it fails, the server's cleanup removes them within a week.
  void e.upload?.abort(true).catch(() => undefined);
  pump();
}

function remove(id: string) {
  const e = entries.get(id);
  if (!e || !(e.row.state === 'done' || e.row.state === 'failed')) return;
  entries.delete(id);
  publish(e.key);
}

/** The uploads of one segment (and shot): tus-js-client behind a small state machine per file. */
export function useTusUploads(target: UploadTarget) {
  const qc = useQueryClient();
  const key = keyOf(target);
  const rows = useSyncExternalStore(
    subscribe,
    () => snapshots.get(key) ?? EMPTY,
    () => EMPTY,
  );
  const { slug, segmentId, shotId } = target;
  const add = useCallback((files: File[]) => addFiles({ slug, segmentId, shotId }, qc, files), [slug, segmentId, shotId, qc]);
  return useMemo(() => ({ rows, add, pause, resume, cancel, remove }), [rows, add]);
}
