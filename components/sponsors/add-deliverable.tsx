'use client';

import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { DeliverableForm, type CrewChoice, type EpisodeChoice } from './deliverable-form';
import { useSponsorMutations } from './use-sponsor-mutations';

export function AddDeliverable({ channelSlug, dealId, episodes, crew, startOpen }: { channelSlug: string; dealId: string; episodes: EpisodeChoice[]; crew: CrewChoice[]; startOpen: boolean }) {
  const m = useSponsorMutations(channelSlug);
  const [open, setOpen] = useState(startOpen);
  if (episodes.length === 0) return <p className="text-sm text-ink-soft">Outline an episode first: every deliverable belongs to one.</p>;
  if (!open) return <Button onClick={() => setOpen(true)}>Add a deliverable</Button>;
  return (
    <section aria-labelledby="add-deliverable-heading" className="rounded-card border border-paper-edge bg-white/60 p-5 shadow-card">
      <h3 id="add-deliverable-heading" className="mb-3 font-bold">
        New deliverable
      </h3>
      <DeliverableForm
        episodes={episodes}
        crew={crew}
        pending={m.addDeliverable.isPending}
        submitLabel="Add deliverable"
        onSubmit={async (body) => {
          await m.addDeliverable.mutateAsync({ dealId, body });
          setOpen(false);
        }}
        onCancel={startOpen ? undefined : () => setOpen(false)}
      />
    </section>
  );
}
