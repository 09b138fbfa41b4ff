'use client';

import { useMemo, useRef, useState } from 'react';
import { useSegmentShots } from '@/components/shots/use-shots';
import { Alert } from '@/components/ui/alert';
import type { ClipDto } from '@/lib/clips/schemas';
import type { ShotDto } from '@/lib/shots/schemas';
import { mayReadClipNotes } from '@/lib/edit/policy';
import type { Choice } from './clip-filing';
import { ClipItem } from './clip-item';
import { useViewer } from '@/components/providers/viewer-provider';
import { mayDeleteClip, mayFileClip, useDeleteClip, useSegmentClips } from './use-clips';
import { RetryAlert } from '@/components/ui/retry-alert';

type Props = {
  slug: string;
  segmentId: string;
  /** Only this shot's clips; undefined lists the whole segment. */
  shotId?: string | undefined;
  initialClips?: ClipDto[] | undefined;
  /** On the segment page: each clip then says which shot it belongs to. */
  initialShots?: ShotDto[] | undefined;
  /** On the segment page: the episode's segments a clip can be moved to. */
  segments?: Choice[] | undefined;
  nested?: boolean;
};

export function ClipList(props: Props) {
  return props.initialShots ? <WithShotLabels {...props} initialShots={props.initialShots} /> : <ClipListBody {...props} />;
}

function WithShotLabels(props: Props & { initialShots: ShotDto[] }) {
  // The segment's shot list cache, so a renumbered shot reads the same here as in the table above.
  const shots = useSegmentShots(props.slug, props.segmentId, props.initialShots);
  const labels = useMemo(() => new Map(shots.data.map((s) => [s.id, `Shot ${s.number}: ${s.description}`])), [shots.data]);
  const shotChoices = useMemo(() => shots.data.map((s) => ({ id: s.id, label: `Shot ${s.number}: ${s.description}` })), [shots.data]);
  return <ClipListBody {...props} labels={labels} shotChoices={shotChoices} />;
}

function ClipListBody({ slug, segmentId, shotId, initialClips, nested = false, labels, segments, shotChoices }: Props & { labels?: Map<string, string>; shotChoices?: Choice[] }) {
  const clips = useSegmentClips(slug, segmentId, initialClips);
  const who = useViewer();
  const remove = useDeleteClip(slug, segmentId);
  const listRef = useRef<HTMLUListElement>(null);
  const [notice, setNotice] = useState<{ tone: 'ok' | 'attention'; text: string } | null>(null);

  const list = (clips.data ?? []).filter((c) => shotId === undefined || c.shotId === shotId);

  function onDelete(clip: ClipDto) {
    setNotice(null);
    // The item is gone at once; focus goes to the list rather than to the page's top.
    requestAnimationFrame(() => listRef.current?.focus());
    remove.mutate(clip, {
      onSuccess: () => setNotice({ tone: 'ok', text: `Deleted ${clip.originalName}.` }),
      onError: (err) => setNotice({ tone: 'attention', text: `Could not delete ${clip.originalName}. ${err.message}` }),
    });
  }

  if (!clips.data) {
    if (clips.isError) {
      return (
        <RetryAlert title="Could not load the clips." onRetry={() => void clips.refetch()}>
          {clips.error.message}
        </RetryAlert>
      );
    }
    return (
      <p role="status" className="text-sm text-ink-soft">
        Loading clips…
      </p>
    );
  }

  return (
    <div className="space-y-3">
      {notice ? (
        <Alert tone={notice.tone}>{notice.text}</Alert>
      ) : null}
      {clips.isError ? <p className="text-sm text-attention-ink">Could not refresh the clips: {clips.error.message}</p> : null}
      <ul ref={listRef} tabIndex={-1} aria-label={shotId === undefined ? 'Clips of this segment' : 'Clips of this shot'} className={`grid gap-3 focus:outline-none ${nested ? '' : 'lg:grid-cols-2 lg:items-start'}`}>
        {list.map((clip) => (
          <li key={clip.id}>
            <ClipItem
              slug={slug}
              clip={clip}
              mayDelete={mayDeleteClip(who, clip)}
              mayReadNotes={mayReadClipNotes(who.role, clip.uploadedBy, who.userId)}
              onDelete={onDelete}
              shotLabel={clip.shotId ? labels?.get(clip.shotId) : undefined}
              nested={nested}
              filing={
                segments && shotChoices && mayFileClip(who, clip)
                  ? { shots: shotChoices, segments, onFiled: (text) => setNotice({ tone: 'ok', text }) }
                  : undefined
              }
            />
          </li>
        ))}
      </ul>
      {list.length === 0 ? <p className="text-sm text-ink-soft">No clips yet.</p> : null}
    </div>
  );
}
