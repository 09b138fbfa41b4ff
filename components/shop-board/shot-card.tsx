'use client';

import { useSortable } from '@dnd-kit/sortable';
import { CSS } from '@dnd-kit/utilities';
import Link from 'next/link';
import { useId, useState, type ReactNode } from 'react';
import { ClipList } from '@/components/clips/clip-list';
import { UploadPanel } from '@/components/clips/upload-panel';
import { useViewer } from '@/components/providers/viewer-provider';
import { CautionsList } from '@/components/shots/cautions-list';
import { can } from '@/lib/auth/policy';
import { cameraLabels, framingLabels, shotStateLabels, type ShotState } from '@/lib/shots/catalog';
import { shotLabel, type BoardShotDto } from '@/lib/shots/schemas';
import { shotHref } from './board-query';
import { formatDay, LocalTime } from './dates';
import { DragHandle, DragHandlePreview } from '@/components/ui/drag-handle';
import { DueBadge } from '@/components/shots/due-badge';
import { Badge, type BadgeTone } from '@/components/ui/badge';

const statePills: Record<ShotState, BadgeTone> = {
  planned: 'neutral',
  captured: 'ok',
  retake: 'attentionSolid',
};

const changedText: Record<ShotState, string> = {
  planned: 'Moved back to Planned by',
  captured: 'Marked Captured by',
  retake: 'Marked Retake by',
};

export function StatePill({ state }: { state: ShotState }) {
  return <Badge tone={statePills[state]}>{shotStateLabels[state]}</Badge>;
}

type BodyProps = {
  slug: string;
  shot: BoardShotDto;
  handle?: ReactNode;
  footer?: ReactNode;
  /** In the phone list, where cards are not sorted into state columns. */
  showState?: boolean;
  /** The drag overlay: a picture of the card, with nothing focusable in it. */
  overlay?: boolean;
  placeholder?: boolean;
};

export function ShotCardBody({ slug, shot, handle, footer, showState = false, overlay = false, placeholder = false }: BodyProps) {
  const frame = placeholder
    ? 'border-2 border-dashed border-ink-faint bg-paper-deep opacity-50'
    : overlay
      ? 'border border-ink/40 bg-white shadow-xl ring-2 ring-blueprint-line'
      : shot.state === 'retake'
        ? 'border border-attention/60 bg-white/90 shadow-card'
        : 'border border-paper-edge bg-white/80 shadow-card';
  const place = `${shot.episodeTitle} / ${shot.segmentTitle}`;
  const headingId = useId();

  return (
    <article aria-labelledby={overlay ? undefined : headingId} className={`flex overflow-hidden rounded-card ${frame}`}>
      {handle}
      <div className="min-w-0 flex-1 space-y-1.5 px-3 py-2.5">
        <p className="flex flex-wrap items-center gap-x-2 gap-y-1 text-xs text-ink-soft">
          {showState ? <StatePill state={shot.state} /> : null}
          <span className="font-mono font-bold text-ink">Shot {shotLabel(shot)}</span>
          <span>{framingLabels[shot.framing]}</span>
          <span aria-hidden="true">·</span>
          <span>{cameraLabels[shot.camera]}</span>
          {shot.clipCount > 0 ? <FootageBadge /> : null}
        </p>
        <h3 id={headingId} className="break-words font-bold leading-snug">
          {shot.description}
        </h3>
        <p className="break-words text-xs text-ink-soft">
          {overlay ? (
            place
          ) : (
            <Link href={shotHref(slug, shot)} className="underline decoration-ink/25 underline-offset-2 hover:decoration-ink">
              {place}
            </Link>
          )}
        </p>
        <dl className="flex flex-wrap gap-x-4 gap-y-0.5 text-xs">
          <div className="flex gap-1">
            <dt className="text-ink-faint">Assignee</dt>
            <dd className="font-bold">{shot.assigneeName ?? 'Unassigned'}</dd>
          </div>
          <div className="flex gap-1">
            <dt className="text-ink-faint">Due</dt>
            <dd className="font-mono">
              {shot.dueDate ? formatDay(shot.dueDate) : '—'} <DueBadge dueDate={shot.dueDate} state={shot.state} />
            </dd>
          </div>
        </dl>
        <RetakeReason shot={shot} />
        {shot.stateChangedBy && shot.stateChangedAt ? (
          <p className="text-xs text-ink-faint">
            {changedText[shot.state]} {shot.stateChangedBy}, <LocalTime iso={shot.stateChangedAt} />
          </p>
        ) : null}
        {shot.safetyPending ? <SafetyPendingBadge /> : null}
        {shot.tools.length > 0 && !overlay ? (
          <details className="group text-sm">
            <summary className="inline-flex min-h-touch cursor-pointer items-center gap-1 rounded-md font-bold text-ink-soft hover:text-ink">
              <svg aria-hidden="true" width="10" height="10" viewBox="0 0 10 10" className="transition-transform group-open:rotate-90">
                <path d="M3 1.5L7 5 3 8.5" fill="none" stroke="currentColor" strokeWidth="1.6" />
              </svg>
              Safety
            </summary>
            <div className="pb-1">
              <CautionsList tools={shot.tools} compact />
            </div>
          </details>
        ) : null}
        {overlay || placeholder ? null : <ShotClips slug={slug} shot={shot} />}
        {footer}
      </div>
    </article>
  );
}

function FootageBadge() {
  return (
    <Badge
      tone="ok"
      icon={
        <svg aria-hidden="true" width="12" height="12" viewBox="0 0 12 12" fill="none" stroke="currentColor" strokeWidth="1.3" strokeLinejoin="round">
          <path d="M1 3h7v6H1zM8 5l3-1.5v5L8 7" />
        </svg>
      }
    >
      Has footage
    </Badge>
  );
}

/** The shot's clips, mounted only while open: a board of fifty cards does not run fifty uploaders. */
function ShotClips({ slug, shot }: { slug: string; shot: BoardShotDto }) {
  const [open, setOpen] = useState(false);
  return (
    <details className="group text-sm" onToggle={(e) => setOpen(e.currentTarget.open)}>
      <summary className="inline-flex min-h-touch cursor-pointer items-center gap-1 rounded-md font-bold text-ink-soft hover:text-ink">
        <svg aria-hidden="true" width="10" height="10" viewBox="0 0 10 10" className="transition-transform group-open:rotate-90">
          <path d="M3 1.5L7 5 3 8.5" fill="none" stroke="currentColor" strokeWidth="1.6" />
        </svg>
        Clips
      </summary>
      {open ? <ShotClipsBody slug={slug} shot={shot} /> : null}
    </details>
  );
}

function ShotClipsBody({ slug, shot }: { slug: string; shot: BoardShotDto }) {
  // No picker the server would refuse (an Editor's).
  const mayUpload = can(useViewer().role, 'clips.upload');
  return (
    <div className="space-y-3 pb-1 pt-1">
      {mayUpload ? <UploadPanel slug={slug} segmentId={shot.segmentId} shotId={shot.id} compact /> : null}
      <ClipList slug={slug} segmentId={shot.segmentId} shotId={shot.id} nested />
    </div>
  );
}

export function SafetyPendingBadge() {
  return (
    <Badge
      tone="attention"
      icon={
        <svg aria-hidden="true" width="12" height="12" viewBox="0 0 12 12">
          <path d="M6 1.2L11 10.5H1z" fill="none" stroke="currentColor" strokeWidth="1.4" strokeLinejoin="round" />
          <path d="M6 4.6v2.8M6 8.6v.4" stroke="currentColor" strokeWidth="1.4" strokeLinecap="round" />
        </svg>
      }
    >
      Safety review pending
    </Badge>
  );
}

/** A board card a Host or Shop hand drags by its handle. */
export function SortableShotCard({ slug, shot }: { slug: string; shot: BoardShotDto }) {
  const { attributes, listeners, setNodeRef, setActivatorNodeRef, transform, transition, isDragging } = useSortable({ id: shot.id });
  const handle = (
    <DragHandle
      sortable={{ attributes, listeners, setActivatorNodeRef }}
      label={`Move: ${shot.description}`}
      layout="strip"
      className="w-11 focus-visible:[outline-offset:-4px]"
      data-shot-handle={shot.id}
    />
  );
  return (
    <li ref={setNodeRef} style={{ transform: CSS.Translate.toString(transform), transition }}>
      <ShotCardBody slug={slug} shot={shot} handle={handle} placeholder={isDragging} />
    </li>
  );
}

export function StaticShotCard({ slug, shot }: { slug: string; shot: BoardShotDto }) {
  return (
    <li>
      <ShotCardBody slug={slug} shot={shot} />
    </li>
  );
}

export function ShotCardPreview({ slug, shot }: { slug: string; shot: BoardShotDto }) {
  return (
    <ShotCardBody
      slug={slug}
      shot={shot}
      overlay
      handle={<DragHandlePreview className="w-11" />}
    />
  );
}

/** Why a shot needs a retake, in the attention colour, wherever the shot is shown as a card. */
export function RetakeReason({ shot }: { shot: Pick<BoardShotDto, 'state' | 'retakeReason'> }) {
  if (shot.state !== 'retake' || !shot.retakeReason) return null;
  return (
    <p className="rounded-md bg-attention-soft px-2 py-1 text-sm text-attention-ink">
      <span className="font-bold">Retake: </span>
      {shot.retakeReason}
    </p>
  );
}
