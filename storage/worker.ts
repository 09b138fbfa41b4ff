import 'server-only';
import { removeStaleUploads } from './cleanup';
import { runClipJobs } from './media-job';
import { clipStore } from './tus-server';

const state = globalThis as unknown as { kerflineClipWorker?: NodeJS.Timeout[] };

/** Media jobs every few seconds, stale-upload cleanup every hour; both read their work from PostgreSQL and disk. */
export function startClipWorker(pollMs = Number(process.env.CLIP_JOB_POLL_MS ?? 2000)): void {
  if (state.kerflineClipWorker) return;
  let busy = false;
  const jobs = setInterval(() => {
    if (busy) return;
    busy = true;
    runClipJobs(clipStore())
      .catch((err: unknown) => console.error('clip media jobs', err))
      .finally(() => {
        busy = false;
      });
  }, pollMs);
  const sweep = () => void removeStaleUploads(clipStore()).catch((err: unknown) => console.error('stale upload cleanup', err));
  const cleanup = setInterval(sweep, 3600_000);
  setTimeout(sweep, 10_000).unref();
  jobs.unref();
  cleanup.unref();
  state.kerflineClipWorker = [jobs, cleanup];
}
