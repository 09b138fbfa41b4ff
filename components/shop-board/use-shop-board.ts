'use client';

import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '@/lib/api/client';
import { cachedView, optimisticMove } from '@/lib/api/optimistic';
import { moveAfter } from '@/lib/segments/order';
import type { RunningOrderDto } from '@/lib/segments/schemas';
import type { ShotState } from '@/lib/shots/catalog';
import type { PendingSafetyDto } from '@/lib/safety/schemas';
import type { BoardShotDto } from '@/lib/shots/schemas';
import { filtersToSearch, type BoardFilters } from './board-query';
import { channelApi } from '@/lib/api/paths';
import { queryKeys, mutationKeys } from '@/lib/api/query-keys';

export type BoardData = { shots: BoardShotDto[]; pendingSafety: PendingSafetyDto[] };

// Under the same queryKeys.shots(slug) prefix as the segment shot lists, so an edit in either view refreshes the other.

export function useBoardShots(slug: string, filters: BoardFilters, initial: { filters: BoardFilters; data: BoardData }) {
  const search = filtersToSearch(filters);
  return useQuery({
    queryKey: queryKeys.shopBoard(slug, filtersToSearch(filters)),
    queryFn: () => apiFetch<BoardData>(`${channelApi(slug, 'shots')}${search ? `?${search}` : ''}`),
    // The server's first view only answers the filters it was rendered for.
    initialData: search === filtersToSearch(initial.filters) ? initial.data : undefined,
    // Keeps the old cards on screen while the next filter loads, instead of a blank board.
    placeholderData: (previous) => previous,
  });
}

export function useMyShots(slug: string, initialShots: BoardShotDto[]) {
  return useQuery({
    queryKey: queryKeys.myShots(slug),
    queryFn: () => apiFetch<{ shots: BoardShotDto[] }>(channelApi(slug, 'shots', 'mine')).then((r) => r.shots),
    initialData: initialShots,
  });
}

/** Segments of the chosen episode, for the Segment filter; shares the running order's cache. */
export function useEpisodeSegments(slug: string, episodeId: string | undefined, initialRunningOrder: RunningOrderDto | null) {
  return useQuery({
    queryKey: queryKeys.runningOrder(slug, episodeId ?? ''),
    queryFn: () => apiFetch<RunningOrderDto>(channelApi(slug, 'episodes', episodeId ?? '', 'running-order')),
    enabled: episodeId !== undefined,
    initialData: initialRunningOrder && initialRunningOrder.episode.id === episodeId ? initialRunningOrder : undefined,
    select: (board) => board.segments,
  });
}

export type StateChange = {
  shot: BoardShotDto;
  state: ShotState;
  reason?: string;
  /** The card above it in the target column (null = top); undefined keeps its place on the board. */
  afterId?: string | null;
};

function applyChange(shots: BoardShotDto[], v: StateChange, viewerName: string, now: string, reorder: boolean): BoardShotDto[] {
  const next = shots.map((s) => {
    if (s.id !== v.shot.id) return s;
    const reason = v.state === 'retake' ? (v.reason ?? s.retakeReason) : null;
    const changing = s.state !== v.state || reason !== s.retakeReason;
    return changing ? { ...s, state: v.state, retakeReason: reason, stateChangedBy: viewerName, stateChangedAt: now } : s;
  });
  return reorder && v.afterId !== undefined ? moveAfter(next, v.shot.id, v.afterId) : next;
}

const replaceShot = (shots: BoardShotDto[], shot: BoardShotDto) => shots.map((s) => (s.id === shot.id ? shot : s));

/**
 * One state change for the board, the phone list and "My shots": the card moves at once in every
 * cached view and goes back where it was if the server refuses (a pending safety review, say).
 */
export function useChangeShotState(slug: string, viewerName: string) {
  const qc = useQueryClient();
  const stamp = () => new Date().toISOString();
  const move = optimisticMove<StateChange>(qc, {
    views: [
      cachedView<BoardData, StateChange>(queryKeys.shopBoards(slug), (data, v) => ({ ...data, shots: applyChange(data.shots, v, viewerName, stamp(), true) }), { exact: false }),
      cachedView<BoardShotDto[], StateChange>(queryKeys.myShots(slug), (mine, v) => applyChange(mine, v, viewerName, stamp(), false)),
    ],
    mutationKey: mutationKeys.setShotState(slug),
    refresh: () =>
      Promise.all([
        qc.invalidateQueries({ queryKey: queryKeys.shots(slug) }),
        // Running orders show shot progress per segment.
        qc.invalidateQueries({ queryKey: queryKeys.runningOrders(slug) }),
      ]),
  });
  const { mutateAsync } = useMutation({
    mutationKey: move.handlers.mutationKey,
    mutationFn: ({ shot, state, reason, afterId }: StateChange) =>
      apiFetch<{ shot: BoardShotDto }>(channelApi(slug, 'shots', shot.id, 'state'), {
        method: 'PUT',
        body: { state, ...(reason !== undefined && { reason }), ...(afterId !== undefined && { afterId }) },
      }).then((r) => r.shot),
    onSuccess: (shot) => {
      for (const [key, data] of qc.getQueriesData<BoardData>({ queryKey: queryKeys.shopBoards(slug) })) {
        if (data) qc.setQueryData<BoardData>(key, { ...data, shots: replaceShot(data.shots, shot) });
      }
      const mine = qc.getQueryData<BoardShotDto[]>(queryKeys.myShots(slug));
      if (mine) qc.setQueryData(queryKeys.myShots(slug), replaceShot(mine, shot));
    },
    onSettled: move.handlers.onSettled,
  });

  return (v: StateChange): Promise<BoardShotDto> => {
    // Written here rather than in onMutate, which TanStack runs a tick later: the cache must hold the new
    // column in the same render as the drop, or the card is drawn back in its old column for a frame.
    const snapshot = move.apply(v);
    return mutateAsync(v).catch((err: unknown) => {
      move.restore(snapshot);
      throw err;
    });
  };
}

export function useShotMail(slug: string, initialWaiting: number) {
  const qc = useQueryClient();
  const waiting = useQuery({
    queryKey: queryKeys.shotMail(slug),
    queryFn: () => apiFetch<{ waiting: number }>(channelApi(slug, 'shot-mail')).then((r) => r.waiting),
    initialData: initialWaiting,
    // Assignments made in another tab or by the worker change the count.
    refetchInterval: 60_000,
  });
  const send = useMutation({
    mutationFn: () => apiFetch<{ sent: number; failed: number }>(channelApi(slug, 'shot-mail'), { method: 'POST' }),
    onSettled: () => qc.invalidateQueries({ queryKey: queryKeys.shotMail(slug) }),
  });
  return { waiting, send };
}
