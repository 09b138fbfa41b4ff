'use client';

import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { LocalTime } from '@/components/shop-board/dates';
import { apiFetch } from '@/lib/api/client';
import { shotStateLabels, type ShotState } from '@/lib/shots/catalog';
import { channelApi } from '@/lib/api/paths';
import { queryKeys } from '@/lib/api/query-keys';

type Event = { from: ShotState; to: ShotState; reason: string | null; by: string | null; at: string };

/** Every state change of one shot, who made it and when; read only when opened. */
export function ShotHistory({ channelSlug, shotId, number }: { channelSlug: string; shotId: string; number: number }) {
  const [open, setOpen] = useState(false);
  const history = useQuery({
    queryKey: queryKeys.shotHistory(channelSlug, shotId),
    queryFn: () => apiFetch<{ history: Event[] }>(channelApi(channelSlug, 'shots', shotId)).then((r) => r.history),
    enabled: open,
  });
  return (
    <details className="mt-1 text-xs" onToggle={(e) => setOpen(e.currentTarget.open)}>
      <summary className="cursor-pointer text-ink-soft underline" aria-label={`History of shot ${number}`}>
        History
      </summary>
      {history.isPending ? (
        <p className="text-ink-faint">Loading…</p>
      ) : history.isError ? (
        <p className="text-attention-ink">Could not load the history: {history.error.message}</p>
      ) : history.data.length === 0 ? (
        <p className="text-ink-faint">No state changes yet.</p>
      ) : (
        <ol className="mt-1 space-y-1">
          {history.data.map((e, i) => (
            <li key={`${i}-${e.at}`}>
              {shotStateLabels[e.from]} → <strong>{shotStateLabels[e.to]}</strong> by {e.by ?? 'someone who left'}, <LocalTime iso={e.at} />
              {e.reason ? <span className="block text-attention-ink">{e.reason}</span> : null}
            </li>
          ))}
        </ol>
      )}
    </details>
  );
}
