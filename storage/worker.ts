import 'server-only';
import { config } from '@/lib/config';
import { pollEvery } from '@/lib/jobs/poll';
import { removeStaleUploads } from './cleanup';
import { runClipJobs } from './media-job';
import { clipStore } from './tus-server';

const state = globalThis as unknown as { kerflineClipWorker?: NodeJS.Timeout[] };

/** Media jobs every few seconds, stale-upload cleanup every hour; both read their work from PostgreSQL and disk. */
export function startClipWorker(pollMs = config().CLIP_JOB_POLL_MS): void {
  if (state.kerflineClipWorker) return;
  const sweep = () => removeStaleUploads(clipStore());
  const first = setTimeout(() => void sweep().catch((err: unknown) => console.error('stale upload cleanup', err)), 10_000);
  first.unref();
  state.kerflineClipWorker = [pollEvery(pollMs, 'clip media jobs', () => runClipJobs(clipStore())), pollEvery(3600_000, 'stale upload cleanup', sweep), first];
}
