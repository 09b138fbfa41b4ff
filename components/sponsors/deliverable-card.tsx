'use client';

import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { formatDuration } from '@/lib/runtime';
import { deliverableKindLabels, type DeliverableDto } from '@/lib/sponsors/schemas';
import { ApprovalPanel } from './approval-panel';
import { DeliverableForm, type CrewChoice, type EpisodeChoice } from './deliverable-form';
import { DueDatesPanel } from './due-dates-panel';
import { SponsorChecksList } from './sponsor-checks-list';
import { TalkingPointsEditor } from './talking-points-editor';
import { useSponsorMutations } from './use-sponsor-mutations';

type Props = { channelSlug: string; deliverable: DeliverableDto; episodes: EpisodeChoice[]; crew: CrewChoice[]; today: string; contactEmail: string };

export function DeliverableCard({ channelSlug, deliverable: d, episodes, crew, today, contactEmail }: Props) {
  const m = useSponsorMutations(channelSlug);
  const [editing, setEditing] = useState(false);
  const segmentHref = d.segmentId ? `/c/${channelSlug}/episodes/${d.episodeId}/segments/${d.segmentId}` : null;
  return (
    <article className="rounded-card border border-paper-edge bg-white/60 p-5 shadow-card" aria-label={`${deliverableKindLabels[d.kind]} in ${d.episodeTitle}`}>
      <header className="mb-3 flex flex-wrap items-start justify-between gap-2">
        <div>
          <h3 className="font-bold">{deliverableKindLabels[d.kind]}</h3>
          <p className="text-sm text-ink-soft">
            {d.episodeTitle}
            {d.segmentTitle ? (
              <>
                {' · '}
                <a href={segmentHref ?? undefined} className="text-blueprint underline">
                  {d.segmentTitle}
                </a>
              </>
            ) : null}
          </p>
        </div>
        <div className="flex gap-2">
          <Button variant="secondary" onClick={() => setEditing((v) => !v)} aria-expanded={editing}>
            {editing ? 'Close' : 'Edit'}
          </Button>
          <Button
            variant="danger"
            onClick={() => {
              if (window.confirm('Delete this deliverable and its due dates?')) m.deleteDeliverable.mutate(d.id);
            }}
          >
            Delete
          </Button>
        </div>
      </header>
      {editing ? (
        <div className="mb-4 rounded-md bg-paper-deep/50 p-4">
          <DeliverableForm
            deliverable={d}
            episodes={episodes}
            crew={crew}
            pending={m.updateDeliverable.isPending}
            submitLabel="Save deliverable"
            onSubmit={async (body) => {
              await m.updateDeliverable.mutateAsync({ deliverableId: d.id, body });
              setEditing(false);
            }}
            onCancel={() => setEditing(false)}
          />
        </div>
      ) : (
        <dl className="mb-4 grid gap-2 text-sm sm:grid-cols-2">
          <Item label="Disclosure">{d.disclosure || '—'}</Item>
          <Item label="Must-say">{d.mustSay.length ? d.mustSay.map((p) => `“${p}”`).join(', ') : '—'}</Item>
          <Item label="Tracking">{d.tracking ? <span className="font-mono break-all">{d.tracking}</span> : '—'}</Item>
          <Item label="Read length">
            <span className="font-mono">
              {d.readMinSeconds != null ? formatDuration(d.readMinSeconds) : '…'}–{d.readMaxSeconds != null ? formatDuration(d.readMaxSeconds) : '…'}
            </span>
          </Item>
          <Item label="Placement">
            {d.placement ? (d.placement.kind === 'starts_before' ? <>starts before <span className="font-mono">{formatDuration(d.placement.seconds)}</span></> : `within the first ${d.placement.percent} %`) : '—'}
          </Item>
        </dl>
      )}
      <div className="grid gap-4 lg:grid-cols-2">
        <div className="space-y-4">
          {d.checks ? <SponsorChecksList checks={d.checks} /> : null}
          <TalkingPointsEditor channelSlug={channelSlug} deliverableId={d.id} initialDoc={d.talkingPoints} />
        </div>
        <div className="space-y-4">
          <ApprovalPanel channelSlug={channelSlug} deliverableId={d.id} approval={d.approval} links={d.approvalLinks} defaultEmail={contactEmail} hasSegment={d.segmentId !== null} />
          <DueDatesPanel channelSlug={channelSlug} deliverableId={d.id} dueDates={d.dueDates} today={today} />
        </div>
      </div>
    </article>
  );
}

function Item({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <div>
      <dt className="text-xs font-bold text-ink-faint">{label}</dt>
      <dd>{children}</dd>
    </div>
  );
}
