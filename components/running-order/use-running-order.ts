'use client';

import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '@/lib/api/client';
import { reorderRunningOrder } from '@/lib/segments/order';
import type { RunningOrderDto, CreateSegmentInput, SegmentDto, UpdateSegmentInput } from '@/lib/segments/schemas';
import { channelApi } from '@/lib/api/paths';
import { queryKeys, mutationKeys } from '@/lib/api/query-keys';
import { optimisticReorder } from '@/lib/api/optimistic';


export function useRunningOrder(slug: string, initialRunningOrder: RunningOrderDto) {
  return useQuery({
    queryKey: queryKeys.runningOrder(slug, initialRunningOrder.episode.id),
    queryFn: () => apiFetch<RunningOrderDto>(channelApi(slug, 'episodes', initialRunningOrder.episode.id, 'running-order')),
    initialData: initialRunningOrder,
  });
}

export type MoveVariables = { segmentId: string; afterId: string | null; title: string };

export function useMoveSegment(slug: string, episodeId: string) {
  const qc = useQueryClient();
  const key = queryKeys.runningOrder(slug, episodeId);
  return useMutation({
    mutationFn: ({ segmentId, afterId }: MoveVariables) =>
      apiFetch<{ segment: SegmentDto }>(channelApi(slug, 'segments', segmentId, 'position'), { method: 'PUT', body: { afterId } }),
    ...optimisticReorder<RunningOrderDto, MoveVariables>(qc, {
      key,
      mutationKey: mutationKeys.moveSegment(slug, episodeId),
      reorder: (current, { segmentId, afterId }) => reorderRunningOrder(current, segmentId, afterId),
      refresh: () => qc.invalidateQueries({ queryKey: key, exact: true }),
    }),
  });
}

// Returning the invalidation from onSettled keeps the mutation pending until the fresh running order
// (with the server's forecast) is in, so buttons do not re-enable over stale cards.

export function useAddSegment(slug: string, episodeId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateSegmentInput) =>
      apiFetch<{ segment: SegmentDto }>(channelApi(slug, 'episodes', episodeId, 'segments'), { method: 'POST', body: input }),
    onSettled: () => qc.invalidateQueries({ queryKey: queryKeys.runningOrder(slug, episodeId), exact: true }),
  });
}

export function useUpdateSegment(slug: string, episodeId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ segmentId, patch }: { segmentId: string; patch: UpdateSegmentInput }) =>
      apiFetch<{ segment: SegmentDto }>(channelApi(slug, 'segments', segmentId), { method: 'PATCH', body: patch }),
    onSettled: () => qc.invalidateQueries({ queryKey: queryKeys.runningOrder(slug, episodeId), exact: true }),
  });
}

export function useDeleteSegment(slug: string, episodeId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (segmentId: string) => apiFetch<void>(channelApi(slug, 'segments', segmentId), { method: 'DELETE' }),
    onSettled: () => qc.invalidateQueries({ queryKey: queryKeys.runningOrder(slug, episodeId), exact: true }),
  });
}
