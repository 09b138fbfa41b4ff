'use client';

import { useId, useRef, useState } from 'react';
import { EmptyState } from '@/components/ui/empty-state';
import type { SponsorWithDealsDto } from '@/lib/sponsors/schemas';
import { SponsorEditForm } from './sponsor-edit-form';
import { useSponsorMutations } from './use-sponsor-mutations';

/** The channel's sponsors: who to write to, notes, and an editor for each; a sponsor without deals may go. */
export function SponsorList({ channelSlug, sponsors }: { channelSlug: string; sponsors: SponsorWithDealsDto[] }) {
  return (
    <section aria-labelledby="sponsor-list-heading" className="mt-8">
      <h2 id="sponsor-list-heading" className="mb-3 text-lg font-bold">
        Sponsors and contacts
      </h2>
      {sponsors.length === 0 ? (
        <EmptyState title="No sponsors yet">A sponsor is added with its first deal, below.</EmptyState>
      ) : (
        <ul className="max-w-3xl space-y-3">
          {sponsors.map((s) => (
            <SponsorItem key={s.id} channelSlug={channelSlug} sponsor={s} />
          ))}
        </ul>
      )}
    </section>
  );
}

function SponsorItem({ channelSlug, sponsor }: { channelSlug: string; sponsor: SponsorWithDealsDto }) {
  const m = useSponsorMutations(channelSlug);
  const [editing, setEditing] = useState(false);
  const formId = useId();
  const toggleRef = useRef<HTMLButtonElement>(null);
  const close = () => {
    setEditing(false);
    // The form that held focus is gone; hand focus back to the button that opened it.
    toggleRef.current?.focus();
  };
  const deals = sponsor.dealCount === 1 ? '1 deal' : `${sponsor.dealCount} deals`;
  return (
    <li className="rounded-card border border-paper-edge bg-white/60 p-4 shadow-card" data-sponsor={sponsor.name}>
      <div className="flex flex-wrap items-start justify-between gap-2">
        <div className="min-w-0">
          <h3 className="break-words font-bold">{sponsor.name}</h3>
          <p className="text-sm text-ink-soft">{deals}</p>
        </div>
        <div className="flex flex-wrap gap-2">
          <button
            type="button"
            ref={toggleRef}
            aria-expanded={editing}
            aria-controls={editing ? formId : undefined}
            onClick={() => setEditing((v) => !v)}
            className="inline-flex min-h-touch min-w-touch items-center justify-center rounded-md border border-ink/30 bg-white/60 px-4 text-sm font-bold hover:bg-white"
          >
            Edit<span className="sr-only"> {sponsor.name}</span>
          </button>
          {sponsor.dealCount === 0 ? (
            <button
              type="button"
              disabled={m.deleteSponsor.isPending}
              onClick={() => {
                if (!window.confirm(`Delete ${sponsor.name} and its contacts?`)) return;
                m.deleteSponsor.mutate(sponsor.id);
              }}
              className="inline-flex min-h-touch items-center justify-center rounded-md border border-attention px-4 text-sm font-bold text-attention-ink hover:bg-attention-soft disabled:opacity-60"
            >
              Delete<span className="sr-only"> {sponsor.name}</span>
            </button>
          ) : null}
        </div>
      </div>
      {m.deleteSponsor.isError ? (
        <p role="alert" className="mt-2 text-sm font-bold text-attention-ink">
          {m.deleteSponsor.error.message}
        </p>
      ) : null}
      {editing ? (
        <div id={formId} className="mt-3 border-t border-paper-edge pt-3">
          <SponsorEditForm channelSlug={channelSlug} sponsor={sponsor} onDone={close} />
        </div>
      ) : (
        <SponsorDetails sponsor={sponsor} />
      )}
    </li>
  );
}

function SponsorDetails({ sponsor }: { sponsor: SponsorWithDealsDto }) {
  return (
    <div className="mt-2 space-y-2 text-sm">
      {sponsor.contacts.length === 0 ? (
        <p className="text-ink-faint">No contacts yet: add one to send approval links.</p>
      ) : (
        <ul className="space-y-1">
          {sponsor.contacts.map((c) => (
            <li key={c.email} className="break-words">
              {c.name}{' '}
              <a href={`mailto:${c.email}`} className="text-blueprint underline">
                {c.email}
              </a>
            </li>
          ))}
        </ul>
      )}
      {sponsor.notes ? <p className="whitespace-pre-line break-words text-ink-soft">{sponsor.notes}</p> : null}
    </div>
  );
}
