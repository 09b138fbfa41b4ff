'use client';

import { useMutation } from '@tanstack/react-query';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { apiFetch } from '@/lib/api/client';
import type { EpisodeDto } from '@/lib/episodes/schemas';
import { channelApi, channelPage } from '@/lib/api/paths';

export function EpisodeDangerZone({ channelSlug, episode, segmentCount }: { channelSlug: string; episode: EpisodeDto; segmentCount: number }) {
  const router = useRouter();
  const [confirming, setConfirming] = useState(false);
  const url = channelApi(channelSlug, 'episodes', episode.id);
  const archive = useMutation({
    mutationFn: () => apiFetch(url, { method: 'PATCH', body: { archived: !episode.archived } }),
    onSuccess: () => router.refresh(),
  });
  const remove = useMutation({
    mutationFn: () => apiFetch(url, { method: 'DELETE' }),
    onSuccess: () => {
      router.push(channelPage(channelSlug, 'episodes'));
      router.refresh();
    },
  });
  const error = archive.error ?? remove.error;

  return (
    <section aria-labelledby="danger-heading" className="mt-10 max-w-2xl rounded-card border border-attention/40 p-5">
      <h2 id="danger-heading" className="text-lg font-bold">
        Archive or delete
      </h2>
      {error ? <Alert tone="attention">{error.message}</Alert> : null}
      <p className="mt-1 text-sm text-ink-soft">Archived episodes leave the list but keep everything. Deleting cannot be undone.</p>
      <div className="mt-4 flex flex-wrap gap-3">
        <Button variant="secondary" disabled={archive.isPending} onClick={() => archive.mutate()}>
          {episode.archived ? 'Bring back from the archive' : 'Archive episode'}
        </Button>
        {confirming ? (
          <>
            <Button variant="danger" disabled={remove.isPending} onClick={() => remove.mutate()}>
              Delete “{episode.title}” and its {segmentCount} segment{segmentCount === 1 ? '' : 's'}
            </Button>
            <Button variant="quiet" onClick={() => setConfirming(false)}>
              Keep it
            </Button>
          </>
        ) : (
          <Button variant="danger" onClick={() => setConfirming(true)}>
            Delete episode…
          </Button>
        )}
      </div>
    </section>
  );
}
