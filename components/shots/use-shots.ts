'use client';

import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '@/lib/api/client';
import { moveAfter } from '@/lib/segments/order';
import type { Tool } from '@/lib/safety/tools';
import type { SegmentSafetyDto } from '@/lib/safety/schemas';
import type { ShotDto, UpdateShotInput } from '@/lib/shots/schemas';
import { channelApi } from '@/lib/api/paths';
import { queryKeys, mutationKeys } from '@/lib/api/query-keys';
import { optimisticReorder } from '@/lib/api/optimistic';



// Numbers follow the list order, so an optimistic move or delete renumbers at once, as the server will.
const renumber = (shots: ShotDto[]): ShotDto[] => shots.map((s, i) => (s.number === i + 1 ? s : { ...s, number: i + 1 }));

export function useSegmentShots(slug: string, segmentId: string, initialShots: ShotDto[]) {
  return useQuery({
    queryKey: queryKeys.segmentShots(slug, segmentId),
    queryFn: () => apiFetch<{ shots: ShotDto[] }>(channelApi(slug, 'segments', segmentId, 'shots')).then((r) => r.shots),
    initialData: initialShots,
  });
}

/** Settles a shot mutation: the segment's list refetches, and so does any other shot view under the same prefix. */
function useRefreshShots(slug: string) {
  const qc = useQueryClient();
  return () => qc.invalidateQueries({ queryKey: queryKeys.shots(slug) });
}

export function useUpdateShot(slug: string, segmentId: string) {
  const qc = useQueryClient();
  const refresh = useRefreshShots(slug);
  return useMutation({
    mutationFn: ({ shotId, patch }: { shotId: string; patch: UpdateShotInput }) =>
      apiFetch<{ shot: ShotDto }>(channelApi(slug, 'shots', shotId), { method: 'PATCH', body: patch }).then((r) => r.shot),
    onSuccess: (shot) => {
      qc.setQueryData<ShotDto[]>(queryKeys.segmentShots(slug, segmentId), (list) => list?.map((s) => (s.id === shot.id ? { ...shot, number: s.number } : s)));
      return refresh();
    },
  });
}

export type DeleteVariables = { shotId: string; number: number };

export function useDeleteShot(slug: string, segmentId: string) {
  const qc = useQueryClient();
  const key = queryKeys.segmentShots(slug, segmentId);
  const refresh = useRefreshShots(slug);
  return useMutation({
    mutationFn: ({ shotId }: DeleteVariables) => apiFetch<void>(channelApi(slug, 'shots', shotId), { method: 'DELETE' }),
    ...optimisticReorder<ShotDto[], DeleteVariables>(qc, {
      key,
      mutationKey: mutationKeys.deleteShot(slug, segmentId),
      reorder: (current, { shotId }) => renumber(current.filter((s) => s.id !== shotId)),
      refresh,
    }),
  });
}

export function useRestoreShot(slug: string) {
  const refresh = useRefreshShots(slug);
  return useMutation({
    mutationFn: (shotId: string) => apiFetch<{ shot: ShotDto }>(channelApi(slug, 'shots', shotId, 'restore'), { method: 'POST' }).then((r) => r.shot),
    onSettled: refresh,
  });
}

export function useDuplicateShot(slug: string) {
  const refresh = useRefreshShots(slug);
  return useMutation({
    mutationFn: (shotId: string) => apiFetch<{ shot: ShotDto }>(channelApi(slug, 'shots', shotId, 'duplicate'), { method: 'POST' }).then((r) => r.shot),
    onSettled: refresh,
  });
}

export type MoveVariables = { shotId: string; afterId: string | null; number: number };

export function useMoveShot(slug: string, segmentId: string) {
  const qc = useQueryClient();
  const key = queryKeys.segmentShots(slug, segmentId);
  return useMutation({
    mutationFn: ({ shotId, afterId }: MoveVariables) =>
      apiFetch<{ shot: ShotDto }>(channelApi(slug, 'shots', shotId, 'position'), { method: 'PUT', body: { afterId } }),
    ...optimisticReorder<ShotDto[], MoveVariables>(qc, {
      key,
      mutationKey: mutationKeys.moveShot(slug, segmentId),
      reorder: (current, { shotId, afterId }) => renumber(moveAfter(current, shotId, afterId)),
      refresh: () => qc.invalidateQueries({ queryKey: queryKeys.shots(slug) }),
    }),
  });
}

export type BulkVariables = { text: string; assigneeId: string | null; dueDate: string | null };

export function useBulkAddShots(slug: string, segmentId: string) {
  const refresh = useRefreshShots(slug);
  return useMutation({
    mutationFn: (body: BulkVariables) =>
      apiFetch<{ shots: ShotDto[] }>(channelApi(slug, 'segments', segmentId, 'shots', 'bulk'), { method: 'POST', body }).then((r) => r.shots),
    onSuccess: refresh,
  });
}

export function useSegmentSafety(slug: string, segmentId: string, initialSafety: SegmentSafetyDto) {
  return useQuery({
    queryKey: queryKeys.segmentSafety(slug, segmentId),
    queryFn: () => apiFetch<{ safety: SegmentSafetyDto }>(channelApi(slug, 'segments', segmentId, 'tools')).then((r) => r.safety),
    initialData: initialSafety,
  });
}

/** Tools and review change whether shots may be marked Captured, so the board refetches as well. */
function useSafetyMutation<V>(slug: string, segmentId: string, request: (v: V) => Promise<{ safety: SegmentSafetyDto }>) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (v: V) => request(v).then((r) => r.safety),
    onSuccess: (safety) => {
      qc.setQueryData(queryKeys.segmentSafety(slug, segmentId), safety);
      return qc.invalidateQueries({ queryKey: queryKeys.shots(slug) });
    },
  });
}

export function useSaveTools(slug: string, segmentId: string) {
  return useSafetyMutation(slug, segmentId, (body: { tools: Tool[]; otherTool: string }) =>
    apiFetch<{ safety: SegmentSafetyDto }>(channelApi(slug, 'segments', segmentId, 'tools'), { method: 'PUT', body }),
  );
}

export function useSafetyReview(slug: string, segmentId: string) {
  return useSafetyMutation(slug, segmentId, (reviewed: boolean) =>
    apiFetch<{ safety: SegmentSafetyDto }>(channelApi(slug, 'segments', segmentId, 'safety-review'), { method: 'PUT', body: { reviewed } }),
  );
}
