'use client';

import Link from 'next/link';
import { EmptyState } from '@/components/ui/empty-state';
import { cameraLabels, framingLabels, shotStates } from '@/lib/shots/catalog';
import { shotLabel, type BoardShotDto } from '@/lib/shots/schemas';
import { shotHref } from './board-query';
import { formatLongDay } from './dates';
import { StateButtons, useShotActions, type ShotActions } from './shot-actions';
import { RetakeReason, SafetyPendingBadge, StatePill } from './shot-card';
import { useMyShots } from './use-shop-board';
import { RetryAlert } from '@/components/ui/retry-alert';

type DayGroup = { day: string | null; episodes: { id: string; title: string; shots: BoardShotDto[] }[] };

/** The shoot day of a shot is its own due date, else its episode's shoot date; the server already sorts by it. */
function groupByDay(shots: BoardShotDto[]): DayGroup[] {
  const days = new Map<string | null, DayGroup>();
  for (const shot of shots) {
    const day = shot.dueDate ?? shot.shootDate;
    let group = days.get(day);
    if (!group) days.set(day, (group = { day, episodes: [] }));
    let episode = group.episodes.find((e) => e.id === shot.episodeId);
    if (!episode) group.episodes.push((episode = { id: shot.episodeId, title: shot.episodeTitle, shots: [] }));
    episode.shots.push(shot);
  }
  // Undated work goes last whatever order it arrived in.
  return [...days.values()].sort((a, b) => (a.day === null ? 1 : 0) - (b.day === null ? 1 : 0));
}

type Props = { slug: string; viewerName: string; canChange: boolean; initialShots: BoardShotDto[] };

export function MyShots({ slug, viewerName, canChange, initialShots }: Props) {
  const query = useMyShots(slug, initialShots);
  const actions = useShotActions(slug, viewerName);
  const shots = query.data;

  if (shots.length === 0) {
    return (
      <EmptyState title="Nothing assigned to you">
        When a Host assigns you shots in this channel they show here, by shoot date, with the segment each belongs to.
      </EmptyState>
    );
  }

  const counts = shotStates.map((s) => `${shots.filter((x) => x.state === s).length} ${s}`).join(', ');
  return (
    <div className="space-y-6">
      <p role="status" className="text-sm text-ink-soft">
        {`${shots.length} ${shots.length === 1 ? 'shot' : 'shots'} assigned to you: ${counts}.`}
      </p>
      {query.isError ? (
        <RetryAlert title="Could not refresh your shots." onRetry={() => void query.refetch()}>
          {query.error.message} The list below may be out of date.
        </RetryAlert>
      ) : null}
      {groupByDay(shots).map((group) => (
        <section key={group.day ?? 'none'} aria-labelledby={`day-${group.day ?? 'none'}`} className="space-y-4">
          <h2 id={`day-${group.day ?? 'none'}`} className="border-b border-paper-edge pb-1 text-lg font-bold">
            {group.day ? <time dateTime={group.day}>{formatLongDay(group.day)}</time> : 'No date'}
          </h2>
          {group.episodes.map((episode) => (
            <div key={episode.id} className="space-y-2">
              <h3 className="font-bold text-ink-soft">{episode.title}</h3>
              <ul className="grid gap-3 md:grid-cols-2">
                {episode.shots.map((shot) => (
                  <MyShotItem key={shot.id} slug={slug} shot={shot} actions={canChange ? actions : null} />
                ))}
              </ul>
            </div>
          ))}
        </section>
      ))}
      {actions.dialog}
    </div>
  );
}

function MyShotItem({ slug, shot, actions }: { slug: string; shot: BoardShotDto; actions: ShotActions | null }) {
  return (
    <li
      className={`flex flex-col gap-1.5 rounded-card border bg-white/80 px-3 py-2.5 shadow-card ${shot.state === 'retake' ? 'border-attention/60' : 'border-paper-edge'}`}
    >
      <p className="text-sm">
        <Link href={shotHref(slug, shot)} className="underline decoration-ink/25 underline-offset-2 hover:decoration-ink">
          {shot.segmentTitle} · Shot {shotLabel(shot)}
        </Link>
      </p>
      <p className="break-words font-bold leading-snug">{shot.description}</p>
      <p className="flex flex-wrap items-center gap-x-2 gap-y-1 text-xs text-ink-soft">
        <StatePill state={shot.state} />
        <span>{framingLabels[shot.framing]}</span>
        <span aria-hidden="true">·</span>
        <span>{cameraLabels[shot.camera]}</span>
      </p>
      <RetakeReason shot={shot} />
      {shot.safetyPending ? <SafetyPendingBadge /> : null}
      {actions ? (
        <div className="mt-auto">
          <StateButtons shot={shot} actions={actions} />
        </div>
      ) : null}
    </li>
  );
}
