'use client';

import Link from 'next/link';
import { usePathname, useRouter } from 'next/navigation';
import { useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import type { RunningOrderDto } from '@/lib/segments/schemas';
import { toolInfo } from '@/lib/safety/tools';
import type { PendingSafetyDto } from '@/lib/safety/schemas';
import { BoardFilterBar, type AssigneeOption, type EpisodeOption } from './board-filters';
import { filtersToSearch, sameFilters, segmentHref, type BoardFilters } from './board-query';
import { DesktopBoard } from './desktop-board';
import { PhoneShotList } from './phone-shot-list';
import { SendToCrew } from './send-to-crew';
import { useShotActions } from './shot-actions';
import { useBoardShots, useEpisodeSegments, type BoardData } from './use-shop-board';
import { RetryAlert } from '@/components/ui/retry-alert';
import { channelPage } from '@/lib/api/paths';
import { countOf } from '@/lib/text/count-of';

type Props = {
  slug: string;
  viewerName: string;
  canMove: boolean;
  /** Null unless the viewer is a Host, who alone may send assignment e-mail. */
  shotMail: { waiting: number } | null;
  initial: { filters: BoardFilters; data: BoardData };
  episodes: EpisodeOption[];
  assignees: AssigneeOption[];
  initialRunningOrder: RunningOrderDto | null;
};

export function ShopBoard({ slug, viewerName, canMove, shotMail, initial, episodes, assignees, initialRunningOrder }: Props) {
  const router = useRouter();
  const pathname = usePathname();
  // Local first so a select answers at once; the URL follows for reloads and links, and Back brings old filters in as props.
  const [filters, setFilters] = useState(initial.filters);
  const [fromServer, setFromServer] = useState(initial.filters);
  if (!sameFilters(fromServer, initial.filters)) {
    setFromServer(initial.filters);
    setFilters(initial.filters);
  }
  const board = useBoardShots(slug, filters, initial);
  const segments = useEpisodeSegments(slug, filters.episodeId, initialRunningOrder);
  const actions = useShotActions(slug, viewerName);

  function changeFilters(next: BoardFilters) {
    setFilters(next);
    const search = filtersToSearch(next);
    router.replace(search ? `${pathname}?${search}` : pathname, { scroll: false });
  }

  const shots = board.data?.shots ?? [];
  // The server narrows the list to an episode; a chosen segment narrows it further.
  const pendingSafety = (board.data?.pendingSafety ?? []).filter((p) => !filters.segmentId || p.segmentId === filters.segmentId);
  const filtered = Object.keys(filters).length > 0;
  const stale = board.isPlaceholderData && board.isFetching;

  return (
    <div className="space-y-5">
      {shotMail ? <SendToCrew slug={slug} initialWaiting={shotMail.waiting} /> : null}

      <BoardFilterBar
        filters={filters}
        onChange={changeFilters}
        episodes={episodes}
        assignees={assignees}
        segments={segments.data?.map((s) => ({ id: s.id, title: s.title }))}
      />

      {pendingSafety.length > 0 ? <PendingSafety slug={slug} pending={pendingSafety} /> : null}

      {!canMove ? (
        <p className="rounded-md border border-paper-edge bg-paper-deep/60 px-3 py-2 text-sm text-ink-soft">
          Read-only: a Host or Shop hand marks shots Captured or Retake.
        </p>
      ) : null}

      {actions.failure ? (
        // On a phone the same message shows on the card itself, next to the button that was pressed.
        // Sticky, so a refusal stays in view while the card that bounced back is far down the board.
        <div className="sticky top-2 z-30 hidden shadow-card md:block">
          <Alert tone="attention">
            <div className="flex flex-wrap items-center justify-between gap-2">
              <span>{actions.failure.message}</span>
              <Button variant="quiet" className="-my-2" onClick={actions.dismiss}>
                Dismiss
              </Button>
            </div>
          </Alert>
        </div>
      ) : null}

      <p role="status" className="min-h-5 text-sm text-ink-soft">
        {stale ? 'Loading shots…' : board.data && !(board.isError && board.isPlaceholderData) ? countText(shots.length, filtered) : ''}
      </p>

      {board.isError ? (
        <RetryAlert title="Could not load the shots." onRetry={() => void board.refetch()}>
          {board.error.message} The board below may be out of date.
        </RetryAlert>
      ) : null}

      {!board.data && board.isPending ? (
        <div aria-hidden="true" className="h-48 animate-pulse rounded-card bg-paper-deep" />
      ) : shots.length === 0 ? (
        <EmptyState
          title={filtered ? 'No shots match these filters.' : 'No shots planned yet.'}
          action={
            filtered ? (
              <Button variant="secondary" onClick={() => changeFilters({})}>
                Clear filters
              </Button>
            ) : undefined
          }
        >
          {filtered ? (
            'Try another episode, assignee or camera.'
          ) : (
            <>
              Shots are planned on each segment page of an{' '}
              <Link href={channelPage(slug, 'episodes')} className="text-blueprint underline">
                episode
              </Link>
              ; they show here by state for the shop.
            </>
          )}
        </EmptyState>
      ) : (
        <div className={`transition-opacity ${stale ? 'opacity-60' : ''}`} aria-busy={stale || undefined}>
          <DesktopBoard slug={slug} shots={shots} canMove={canMove} onMove={actions.move} askRetake={actions.askRetake} />
          <PhoneShotList slug={slug} shots={shots} actions={canMove ? actions : null} />
        </div>
      )}
      {actions.dialog}
    </div>
  );
}

function countText(n: number, filtered: boolean): string {
  const shots = countOf(n, 'shot', 'shots');
  return filtered ? `${shots} ${n === 1 ? 'matches' : 'match'} these filters.` : `${shots}.`;
}

function PendingSafety({ slug, pending }: { slug: string; pending: PendingSafetyDto[] }) {
  return (
    <Alert tone="attention" title="Waiting for a Host's safety review:">
      <ul className="mt-1 space-y-0.5">
        {pending.map((p) => (
          <li key={p.segmentId} className="flex flex-wrap items-baseline gap-x-2">
            <Link
              href={segmentHref(slug, p.episodeId, p.segmentId)}
              className="inline-flex min-h-touch items-center font-bold underline underline-offset-2 md:min-h-0 md:py-1"
            >
              {p.segmentTitle}
            </Link>
            <span className="text-xs">
              {p.episodeTitle} · {p.tools.map((t) => toolInfo[t].label).join(', ')}
            </span>
          </li>
        ))}
      </ul>
      <p className="mt-1">Their shots can be marked Captured once a Host has reviewed the tool cautions on the segment page.</p>
    </Alert>
  );
}
