import 'server-only';
import { uploadIdsBeingRemoved, uploadIdsInUse } from '@/lib/clips/queries';
import type { ClipStore } from './clip-store';
import { ingestUpload } from './ingest';
import { isTusError } from './tus-errors';

/**
 * Finished uploads without a clip row: the server died after the last byte and before the finish
 * hook wrote the row (issue 12, item 4). Each is ingested as the hook would have, exactly once:
 * the clip row is keyed by its upload id (insert ... on conflict do nothing). An upload whose
 * segment was deleted meanwhile has nowhere to go, so its bytes are removed.
 *
 * `settledMs`: uploads whose bytes changed more recently may still have their finish hook running
 * in some process; at start-up that is 0 for this process, and the row's key keeps it once anyway.
 */
export async function reconcileFinishedUploads(store: ClipStore, settledMs: number, now = Date.now()): Promise<{ ingested: string[]; removed: string[] }> {
  const finished = (await store.listFinished()).filter((u) => now - u.touchedAt.getTime() >= settledMs);
  const ids = finished.map((u) => u.uploadId);
  // A clip deleted a moment ago leaves its bytes until the removal job runs; they are not a lost clip.
  const [recorded, removing] = await Promise.all([uploadIdsInUse(ids), uploadIdsBeingRemoved(ids)]);
  const ingested: string[] = [];
  const removed: string[] = [];
  for (const { uploadId } of finished) {
    if (recorded.has(uploadId) || removing.has(uploadId)) continue;
    const upload = await store.tus.getUpload(uploadId).catch(() => null);
    if (!upload) continue;
    try {
      const result = await ingestUpload(store, upload);
      if (result.created) ingested.push(uploadId);
    } catch (err) {
      if (!(isTusError(err) && (err.status_code === 404 || err.status_code === 400))) throw err;
      // No segment or no clip details: these bytes can never become a clip.
      await store.remove(uploadId);
      removed.push(uploadId);
    }
  }
  return { ingested, removed };
}
