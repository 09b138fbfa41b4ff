'use client';

import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useRouter } from 'next/navigation';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { apiFetch } from '@/lib/api/client';
import { channelApi } from '@/lib/api/paths';
import { queryKeys } from '@/lib/api/query-keys';

export function StarterButton({ channelSlug, episodeId }: { channelSlug: string; episodeId: string }) {
  const router = useRouter();
  const qc = useQueryClient();
  const start = useMutation({
    mutationFn: () => apiFetch(channelApi(channelSlug, 'episodes', episodeId, 'starter'), { method: 'POST' }),
    onSuccess: async () => {
      await qc.invalidateQueries({ queryKey: queryKeys.runningOrder(channelSlug, episodeId) });
      router.refresh();
    },
  });
  return (
    <div className="space-y-2">
      {start.isError ? <Alert tone="attention">{start.error.message}</Alert> : null}
      <Button variant="secondary" disabled={start.isPending} onClick={() => start.mutate()}>
        {start.isPending ? 'Adding…' : 'Start a three-level build'}
      </Button>
      <p className="text-sm text-ink-soft">Adds a cold open, builds at levels 1, 2 and 3, a sponsor read and an outro, for you to rename.</p>
    </div>
  );
}
