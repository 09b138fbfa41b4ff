'use client';

import { useSortable } from '@dnd-kit/sortable';
import { CSS } from '@dnd-kit/utilities';
import Link from 'next/link';
import { useId, useRef, useState, type ReactNode } from 'react';
import type { EpisodeDto } from '@/lib/episodes/schemas';
import { formatDuration, type SegmentForecast } from '@/lib/runtime';
import { kindLabels, type SegmentDto } from '@/lib/segments/schemas';
import type { ShotProgress } from '@/lib/shots/schemas';
import { kindSwatches } from './runtime-bar';
import { levelText, SegmentEditForm } from './segment-edit-form';
import { DragHandle, DragHandlePreview } from '@/components/ui/drag-handle';
import { channelPage } from '@/lib/api/paths';
import { Badge } from '@/components/ui/badge';

export const segmentHref = (channelSlug: string, episodeId: string, segmentId: string) =>
  channelPage(channelSlug, 'episodes', episodeId, 'segments', segmentId);

type ItemProps = {
  channelSlug: string;
  episode: EpisodeDto;
  segment: SegmentDto;
  forecast: SegmentForecast | undefined;
  shotProgress: ShotProgress | undefined;
  /** A sponsor read whose script changed after the sponsor approved it. */
  changedSinceApproval: boolean;
  position: number;
};

/** A card a Host can drag by its handle and edit in place. */
export function SortableSegmentItem({ onDeleted, ...props }: ItemProps & { onDeleted: (title: string) => void }) {
  const { segment, channelSlug, episode } = props;
  const { attributes, listeners, setNodeRef, setActivatorNodeRef, transform, transition, isDragging } = useSortable({ id: segment.id });
  const [editing, setEditing] = useState(false);
  const editorId = useId();
  const toggleRef = useRef<HTMLButtonElement>(null);
  const closeEditor = () => {
    setEditing(false);
    // The form that had focus is gone; hand focus back to the control that opened it.
    toggleRef.current?.focus();
  };

  const handle = <DragHandle sortable={{ attributes, listeners, setActivatorNodeRef }} label={`Move ${segment.title}`} layout="strip" className="min-h-touch w-12" />;

  const editToggle = (
    <button
      type="button"
      ref={toggleRef}
      onClick={() => setEditing((v) => !v)}
      aria-expanded={editing}
      aria-controls={editing ? editorId : undefined}
      className={`flex min-h-touch min-w-touch shrink-0 items-center justify-center self-stretch border-l border-paper-edge px-3 text-sm font-bold hover:bg-paper-deep hover:text-ink ${editing ? 'bg-paper-deep text-ink' : 'text-ink-soft'}`}
    >
      Edit
      <span className="sr-only"> {segment.title}</span>
    </button>
  );

  return (
    <li
      ref={setNodeRef}
      style={{ transform: CSS.Translate.toString(transform), transition }}
    >
      <SegmentCardBody {...props} handle={handle} actions={editToggle} placeholder={isDragging} />
      {editing ? (
        <div id={editorId} className="-mt-1 rounded-b-card border border-t-0 border-paper-edge bg-paper-deep/60 px-4 pb-4 pt-5">
          <SegmentEditForm
            channelSlug={channelSlug}
            episode={episode}
            segment={segment}
            onDone={closeEditor}
            onDeleted={() => onDeleted(segment.title)}
          />
        </div>
      ) : null}
    </li>
  );
}

/** A card for crew who may read the running order but not change it. */
export function StaticSegmentItem(props: ItemProps) {
  return (
    <li>
      <SegmentCardBody {...props} />
    </li>
  );
}

/** What the drag overlay shows: the card, without links or buttons, so nothing is focusable twice. */
export function SegmentCardPreview(props: ItemProps) {
  return (
    <SegmentCardBody
      {...props}
      overlay
      handle={<DragHandlePreview className="w-12" />}
    />
  );
}

function SegmentCardBody({
  channelSlug,
  episode,
  segment,
  forecast,
  shotProgress,
  changedSinceApproval,
  position,
  handle,
  actions,
  placeholder = false,
  overlay = false,
}: ItemProps & { handle?: ReactNode; actions?: ReactNode; placeholder?: boolean; overlay?: boolean }) {
  const frame = placeholder
    ? 'border-2 border-dashed border-ink-faint bg-paper-deep opacity-50'
    : overlay
      ? 'border border-ink/40 bg-white shadow-xl ring-2 ring-blueprint-line'
      : 'border border-paper-edge bg-white/80 shadow-card';

  return (
    <article aria-label={overlay ? undefined : segment.title} className={`flex overflow-hidden rounded-card ${frame}`}>
      <span aria-hidden="true" className={`w-1.5 shrink-0 ${kindSwatches[segment.kind]}`} />
      {handle}
      <div className="flex min-w-0 flex-1 flex-wrap items-center gap-x-3 gap-y-1 px-3 py-2.5 sm:grid sm:grid-cols-[minmax(0,1fr)_auto] sm:gap-x-4 sm:px-4">
        <div className="min-w-0 basis-full sm:col-start-1 sm:row-start-1">
          <p className="flex flex-wrap items-center gap-x-2 gap-y-0.5 text-xs text-ink-soft">
            <span className="font-mono text-ink-faint">
              <span className="sr-only">Position </span>
              {String(position).padStart(2, '0')}
            </span>
            <span className="font-bold uppercase tracking-wide text-ink">{kindLabels[segment.kind]}</span>
            {segment.kind === 'build' && segment.level !== null ? <span>{levelText(segment.level, episode.levelLabels)}</span> : null}
          </p>
          <h3 className="text-base font-bold leading-snug">
            {overlay ? (
              <span className="flex min-h-touch items-center">{segment.title}</span>
            ) : (
              <Link
                href={segmentHref(channelSlug, episode.id, segment.id)}
                className="inline-flex min-h-touch items-center break-words underline decoration-ink/20 underline-offset-4 hover:decoration-ink"
              >
                {segment.title}
              </Link>
            )}
          </h3>
        </div>
        <p className="flex items-baseline gap-2 sm:col-start-2 sm:row-span-2 sm:row-start-1 sm:flex-col sm:items-end sm:gap-0.5">
          <span className="font-mono text-lg font-bold tabular-nums">
            <span className="sr-only">Runs </span>
            {formatDuration(forecast?.totalSeconds ?? 0)}
          </span>
          <span className="font-mono text-xs tabular-nums text-ink-soft">starts {formatDuration(forecast?.startSeconds ?? 0)}</span>
        </p>
        <div className="flex flex-wrap items-center gap-x-3 gap-y-1 sm:col-start-1 sm:row-start-2">
          <ScriptBadge hasScript={segment.hasScript} />
          {changedSinceApproval ? (
            <span data-approval="changed">
              <Badge tone="attention">Changed since approval</Badge>
            </span>
          ) : null}
          <ShotProgressLine progress={shotProgress} />
        </div>
      </div>
      {actions}
    </article>
  );
}

/**
 * This card's slice of the running-order query the list already holds. `select` re-renders a card only
 * when its own numbers change; no refetch on mount, so picking a card up for a drag costs no request.
 */
function ShotProgressLine({ progress }: { progress: ShotProgress | undefined }) {
  if (!progress || progress.total === 0) return <span className="text-xs text-ink-faint">No shots yet</span>;
  const { total, captured, retake } = progress;
  return (
    <span className="flex flex-wrap items-center gap-x-2 text-xs">
      <span className="text-ink-soft">
        Shots{' '}
        <span aria-hidden="true" className="font-mono font-bold tabular-nums text-ink">
          {captured}/{total}
        </span>
        <span className="sr-only">
          {captured} of {total}
        </span>{' '}
        captured
      </span>
      {retake > 0 ? (
        <span className="rounded-full bg-attention-soft px-2 py-0.5 font-bold text-attention-ink">
          {retake} {retake === 1 ? 'retake' : 'retakes'}
        </span>
      ) : null}
    </span>
  );
}

function ScriptBadge({ hasScript }: { hasScript: boolean }) {
  return hasScript ? (
    <Badge
      tone="ok"
      icon={
        <svg aria-hidden="true" width="12" height="12" viewBox="0 0 12 12">
          <path d="M2.5 6.5l2.2 2.2 4.8-5" fill="none" stroke="currentColor" strokeWidth="1.8" strokeLinecap="round" strokeLinejoin="round" />
        </svg>
      }
    >
      Script
    </Badge>
  ) : (
    <Badge tone="missing">No script yet</Badge>
  );
}
