import 'server-only';
import { existingClipIds, existingSegmentIds, takeByteRemovals } from '@/lib/clips/queries';
import type { ClipStore } from './clip-store';

/** Removes the bytes and poster of deleted clips, as queued in byte_removals (issue 12, item 5). */
export function runByteRemovals(store: ClipStore, limit = 50): Promise<number> {
  return takeByteRemovals(limit, async ({ uploadId, clipId }) => {
    await store.remove(uploadId);
    await store.removePoster(clipId);
  });
}

/**
 * Finds bytes that nothing refers to: posters of clips that have no row, and unfinished uploads
 * whose segment was deleted while they were uploading. (Finished uploads without a clip row are the
 * reconciler's: it ingests them, or removes them when their segment is gone.)
 */
export async function sweepOrphans(store: ClipStore): Promise<{ posters: string[]; uploads: string[] }> {
  const posterIds = await store.listPosters();
  const live = await existingClipIds(posterIds);
  const posters = posterIds.filter((id) => !live.has(id));
  for (const id of posters) await store.removePoster(id);

  const unfinished = await store.listUnfinished();
  const targets = new Map<string, string>();
  for (const { uploadId } of unfinished) {
    const upload = await store.tus.getUpload(uploadId).catch(() => null);
    const segmentId = upload?.metadata?.segmentId;
    if (segmentId) targets.set(uploadId, segmentId);
  }
  const segments = await existingSegmentIds([...new Set(targets.values())]);
  const uploads = [...targets].filter(([, segmentId]) => !segments.has(segmentId)).map(([uploadId]) => uploadId);
  for (const id of uploads) await store.remove(id);
  return { posters, uploads };
}
