import 'server-only';
import { config } from '@/lib/config';
import { pollEvery } from '@/lib/jobs/poll';
import { removeStaleUploads } from './cleanup';
import { runClipJobs } from './media-job';
import { reconcileFinishedUploads } from './reconcile';
import { runByteRemovals, sweepOrphans } from './removals';
import { clipStore } from './tus-server';

const state = globalThis as unknown as { kerflineClipWorker?: NodeJS.Timeout[] };

/** How long a finished upload's bytes must have been still before the reconciler may act on it. */
const RECONCILE_SETTLED_MS = 60_000;

/**
 * Media jobs and byte removals every few seconds, finished uploads without a clip row at start and every minute,
 * stale-upload cleanup and the orphan sweep every hour; all read their work from PostgreSQL and disk.
 */
export function startClipWorker(pollMs = config().CLIP_JOB_POLL_MS): void {
  if (state.kerflineClipWorker) return;
  const sweep = () => removeStaleUploads(clipStore());
  const first = setTimeout(() => void sweep().catch((err: unknown) => console.error('stale upload cleanup', err)), 10_000);
  first.unref();
  // At start no finish hook of this process can be running, so every finished upload is settled.
  const atStart = setTimeout(() => void reconcileFinishedUploads(clipStore(), 0).catch((err: unknown) => console.error('upload reconciler', err)), 0);
  atStart.unref();
  state.kerflineClipWorker = [
    pollEvery(pollMs, 'clip media jobs', () => runClipJobs(clipStore())),
    pollEvery(config().CLIP_RECONCILE_MS, 'upload reconciler', () => reconcileFinishedUploads(clipStore(), RECONCILE_SETTLED_MS)),
    ...(!config().KERFLINE_BYTE_REMOVALS ? [] : [pollEvery(pollMs, 'clip byte removals', () => runByteRemovals(clipStore()))]),
    pollEvery(3600_000, 'stale upload cleanup', sweep),
    pollEvery(3600_000, 'orphan sweep', () => sweepOrphans(clipStore())),
    first,
    atStart,
  ];
}
