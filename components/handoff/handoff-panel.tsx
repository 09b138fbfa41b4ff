'use client';

import Link from 'next/link';
import { useState } from 'react';
import { LocalTime } from '@/components/shop-board/dates';
import { Button } from '@/components/ui/button';
import { ApiError } from '@/lib/api/client';
import type { HandoffSummaryDto } from '@/lib/handoffs/schemas';
import { useHandoffs, useLockHandoff } from './use-handoff';

type Props = { slug: string; episodeId: string; initial: HandoffSummaryDto[]; canLock: boolean };

/** On the episode page: "Lock for edit" for the Host, and the list of locked versions. */
export function HandoffPanel({ slug, episodeId, initial, canLock }: Props) {
  const { data: versions } = useHandoffs(slug, episodeId, initial);
  const lock = useLockHandoff(slug, episodeId);
  const [note, setNote] = useState('');
  const base = `/c/${slug}/episodes/${episodeId}/handoff`;
  const error = lock.error instanceof ApiError ? (lock.error.fields.note ?? lock.error.message) : lock.error ? 'Locking failed. Try again.' : null;

  return (
    <section aria-labelledby="handoff-heading" className="rounded-card border border-paper-edge bg-white/50 p-4">
      <h2 id="handoff-heading" className="text-lg font-bold">
        Handoff
      </h2>
      {canLock ? (
        <form
          className="mt-3 flex flex-col gap-2 md:flex-row md:items-end"
          onSubmit={(e) => {
            e.preventDefault();
            lock.mutate(note, { onSuccess: () => setNote('') });
          }}
        >
          <div className="flex-1">
            <label htmlFor="handoff-note" className="mb-1 block text-sm font-bold">
              Note to the editor
            </label>
            <textarea
              id="handoff-note"
              value={note}
              maxLength={2000}
              rows={2}
              onChange={(e) => setNote(e.target.value)}
              className="block w-full rounded-md border border-ink/30 bg-white px-3 py-2 text-base"
              aria-describedby={error ? 'handoff-note-error' : undefined}
            />
          </div>
          <Button type="submit" disabled={lock.isPending}>
            {lock.isPending ? 'Locking…' : 'Lock for edit'}
          </Button>
        </form>
      ) : null}
      {error ? (
        <p id="handoff-note-error" role="alert" className="mt-2 text-sm text-attention-ink">
          {error}
        </p>
      ) : null}
      {lock.isSuccess ? (
        <p role="status" className="mt-2 text-sm">
          Locked <Link href={`${base}/${lock.data.version}`} className="font-bold underline">v{lock.data.version}</Link>; the editors have been e-mailed.
        </p>
      ) : null}
      {versions.length === 0 ? (
        <p className="mt-3 text-sm text-ink-soft">No version is locked yet.{canLock ? ' Lock one when the outline is ready for the editor.' : ''}</p>
      ) : (
        <ol className="mt-3 divide-y divide-paper-edge" aria-label="Locked versions">
          {versions.map((v) => (
            <li key={v.id} className="flex flex-wrap items-center gap-x-4 gap-y-1 py-2 text-sm">
              <Link href={`${base}/${v.version}`} className="inline-flex min-h-touch items-center font-bold underline">
                v{v.version}
              </Link>
              <span>
                <LocalTime iso={v.lockedAt} /> by {v.lockedBy ?? 'someone who left'}
              </span>
              <span className="text-ink-faint">{v.segmentCount} segments</span>
              {v.note ? <span className="basis-full text-ink-soft">“{v.note}”</span> : null}
            </li>
          ))}
        </ol>
      )}
    </section>
  );
}
