'use client';

import { useQueryClient } from '@tanstack/react-query';
import { useCallback, useMemo, useSyncExternalStore } from 'react';
import { queryKeys } from '@/lib/api/query-keys';
import { UploadQueue, type UploadTarget } from '@/lib/clips/upload-queue';
import { tusTransport } from './tus-transport';

export type { UploadRow, UploadState, UploadTarget } from '@/lib/clips/upload-queue';

// One queue per page, outside React, so closing a card's Clips or moving the card to another column
// does not stop its uploads: the panel shows the same rows again when it mounts.
const queue = new UploadQueue<File>(tusTransport);
const EMPTY: ReturnType<typeof queue.rows> = [];
let guardsInstalled = false;

function installGuards() {
  if (guardsInstalled || typeof window === 'undefined') return;
  guardsInstalled = true;
  window.addEventListener('beforeunload', (ev) => {
    if (queue.hasUnfinished()) ev.preventDefault();
  });
  // Back on the network after tus gave up: carry on without making anyone press Resume.
  window.addEventListener('online', () => queue.retryFailed());
}

/** The uploads of one segment (and shot): the upload queue over tus-js-client, as React state. */
export function useTusUploads(target: UploadTarget) {
  const qc = useQueryClient();
  const { slug, segmentId, shotId } = target;
  const rows = useSyncExternalStore(
    queue.subscribe,
    () => queue.rows({ slug, segmentId, shotId }),
    () => EMPTY,
  );
  const add = useCallback(
    (files: File[]) => {
      installGuards();
      return queue.add({ slug, segmentId, shotId }, files, () => {
        void qc.invalidateQueries({ queryKey: queryKeys.segmentClips(slug, segmentId) });
        // Shot cards say "Has footage" from their clip count.
        void qc.invalidateQueries({ queryKey: queryKeys.shots(slug) });
      });
    },
    [slug, segmentId, shotId, qc],
  );
  return useMemo(() => ({ rows, add, pause: queue.pause, resume: queue.resume, cancel: queue.cancel, remove: queue.remove }), [rows, add]);
}
