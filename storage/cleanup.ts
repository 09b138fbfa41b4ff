import 'server-only';
import { removeUploadMarks, uploadIdsInUse } from '@/lib/clips/queries';
import type { ClipStore } from './clip-store';
import { staleUploadMs } from './config';

/** Removes unfinished uploads whose bytes have not changed for `olderThanMs`; never a recorded clip's bytes. */
export async function removeStaleUploads(store: ClipStore, olderThanMs = staleUploadMs(), now = Date.now()): Promise<string[]> {
  const stale = (await store.listUnfinished()).filter((u) => now - u.touchedAt.getTime() > olderThanMs);
  const recorded = await uploadIdsInUse(stale.map((s) => s.uploadId));
  // Removed outside the upload lock: a process that last wrote one of these must not trust its view of it (tus-s3-store.ts).
  await removeUploadMarks(stale.filter((s) => !recorded.has(s.uploadId)).map((s) => s.uploadId), new Date(now - olderThanMs));
  const removed: string[] = [];
  for (const { uploadId } of stale) {
    if (recorded.has(uploadId)) continue;
    await store.remove(uploadId);
    removed.push(uploadId);
  }
  return removed;
}
