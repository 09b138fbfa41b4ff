'use client';

import { useQuery } from '@tanstack/react-query';
import { useId, useState } from 'react';
import { LocalTime } from '@/components/shop-board/dates';
import { Button } from '@/components/ui/button';
import { apiFetch } from '@/lib/api/client';
import { channelApi } from '@/lib/api/paths';
import { queryKeys } from '@/lib/api/query-keys';
import type { EditNoteDto } from '@/lib/edit/schemas';

/**
 * The edit notes left on one clip, across locked versions, read-only: how a Shop hand hears what the
 * editor said about the footage they shot. Loaded when opened, so a list of clips costs no requests.
 */
export function ClipNotes({ slug, clipId, clipName }: { slug: string; clipId: string; clipName: string }) {
  const [open, setOpen] = useState(false);
  const regionId = useId();
  const notes = useQuery({
    queryKey: queryKeys.clipNotes(slug, clipId),
    queryFn: () => apiFetch<{ notes: EditNoteDto[] }>(channelApi(slug, 'clips', clipId, 'notes')).then((r) => r.notes),
    enabled: open,
  });
  return (
    <div>
      <Button variant="secondary" aria-expanded={open} aria-controls={regionId} onClick={() => setOpen((v) => !v)}>
        Edit notes<span className="sr-only"> on {clipName}</span>
      </Button>
      <div id={regionId} hidden={!open} className="mt-2">
        {open ? <NotesBody state={notes} /> : null}
      </div>
    </div>
  );
}

type NotesState = { data: EditNoteDto[] | undefined; isError: boolean; error: Error | null; refetch: () => unknown };

function NotesBody({ state }: { state: NotesState }) {
  if (state.isError) {
    return (
      <p role="alert" className="text-sm text-attention-ink">
        Could not load the notes: {state.error?.message}{' '}
        <Button variant="quiet" onClick={() => void state.refetch()}>
          Try again
        </Button>
      </p>
    );
  }
  if (!state.data) {
    return (
      <p role="status" className="text-sm text-ink-soft">
        Loading notes…
      </p>
    );
  }
  if (state.data.length === 0) return <p className="text-sm text-ink-soft">No edit notes on this clip.</p>;
  return (
    <ol className="grid gap-2" aria-label="Edit notes on this clip">
      {state.data.map((n) => (
        <li key={n.id} className={`rounded-md border p-2 text-sm ${n.resolvedAt ? 'border-paper-edge bg-paper-deep/60' : 'border-ink/30 bg-white'}`}>
          <p className="flex flex-wrap items-baseline gap-x-3">
            <span className="font-mono font-bold">{n.timecode ?? '—'}</span>
            <span className="font-mono text-ink-soft">v{n.version}</span>
            <span className="text-ink-faint">
              {n.author ?? 'someone who left'}, <LocalTime iso={n.createdAt} />
            </span>
            {n.resolvedAt ? <span className="font-bold">Resolved</span> : null}
          </p>
          <p className="mt-1 whitespace-pre-wrap text-base">{n.body}</p>
          {n.replies.length ? (
            <ol className="mt-1 grid gap-1 border-l-2 border-paper-edge pl-3">
              {n.replies.map((r) => (
                <li key={r.id}>
                  <span className="text-ink-faint">{r.author ?? 'someone'}:</span> <span className="whitespace-pre-wrap">{r.body}</span>
                </li>
              ))}
            </ol>
          ) : null}
        </li>
      ))}
    </ol>
  );
}
