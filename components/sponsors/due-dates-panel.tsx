'use client';

import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { ApiError } from '@/lib/api/client';
import { dueDateLabels, type DueDateDto, type DueDateKind } from '@/lib/sponsors/schemas';
import { DueText } from './due-text';
import { useSponsorMutations } from './use-sponsor-mutations';

const actionLabels = { set: 'set to', done: 'done', reopened: 'reopened' } as const;

/** Each due date: move it, mark it done or open again; the history says who did what when. */
export function DueDatesPanel({ channelSlug, deliverableId, dueDates, today }: { channelSlug: string; deliverableId: string; dueDates: DueDateDto[]; today: string }) {
  const m = useSponsorMutations(channelSlug);
  const [error, setError] = useState<string | null>(null);
  const change = (kind: DueDateKind, body: { dueOn?: string | null; done?: boolean }) => {
    setError(null);
    m.updateDueDate.mutate(
      { deliverableId, kind, body },
      { onError: (err) => setError(err instanceof ApiError ? (Object.values(err.fields)[0] ?? err.message) : 'Could not save.') },
    );
  };
  return (
    <div>
      <h4 className="mb-2 text-sm font-bold">Due dates</h4>
      {error ? (
        <p role="alert" className="mb-2 text-sm font-bold text-attention-ink">
          {error}
        </p>
      ) : null}
      <ul className="divide-y divide-paper-edge rounded-md border border-paper-edge bg-white/70">
        {dueDates.map((d) => (
          <li key={d.kind} className="grid gap-2 p-3 sm:grid-cols-[9rem_1fr_auto] sm:items-center">
            <label htmlFor={`${deliverableId}-${d.kind}`} className="text-sm font-bold">
              {dueDateLabels[d.kind]}
              {d.kind === 'payment_due' && !d.overridden && d.dueOn ? <span className="block text-xs font-normal text-ink-faint">from go-live or invoice + terms</span> : null}
            </label>
            <div className="flex flex-wrap items-center gap-2">
              <input
                id={`${deliverableId}-${d.kind}`}
                type="date"
                defaultValue={d.dueOn ?? ''}
                key={d.dueOn ?? ''}
                onBlur={(e) => {
                  const v = e.target.value || null;
                  if (v !== d.dueOn) change(d.kind, { dueOn: v });
                }}
                className="min-h-touch rounded-md border border-ink/30 bg-white px-2 font-mono"
              />
              {d.dueOn ? <DueText dueOn={d.dueOn} today={today} done={d.doneAt !== null} /> : <span className="text-sm text-ink-faint">No date</span>}
              {d.history.length > 0 ? (
                <details className="basis-full text-xs text-ink-soft">
                  <summary className="cursor-pointer">History</summary>
                  <ol className="mt-1 space-y-0.5">
                    {d.history.map((h, i) => (
                      <li key={i}>
                        <span className="font-mono">{h.at.slice(0, 16).replace('T', ' ')}</span> {h.byName ?? 'Someone'} {actionLabels[h.action]}{' '}
                        {h.action === 'set' ? <span className="font-mono">{h.dueOn ?? 'no date'}</span> : null}
                      </li>
                    ))}
                  </ol>
                </details>
              ) : null}
            </div>
            <Button variant={d.doneAt ? 'quiet' : 'secondary'} onClick={() => change(d.kind, { done: d.doneAt === null })} disabled={m.updateDueDate.isPending} aria-label={`${d.doneAt ? 'Reopen' : 'Mark done'}: ${dueDateLabels[d.kind]}`}>
              {d.doneAt ? `Done by ${d.doneByName ?? 'someone'} · Reopen` : 'Mark done'}
            </Button>
          </li>
        ))}
      </ul>
    </div>
  );
}
