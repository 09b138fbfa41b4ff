'use client';

import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '@/lib/api/client';
import { can } from '@/lib/auth/policy';
import type { ClipDto } from '@/lib/clips/schemas';
import type { Viewer } from '@/components/providers/viewer-provider';
import { channelApi } from '@/lib/api/paths';
import { optimisticReorder } from '@/lib/api/optimistic';
import { mutationKeys, queryKeys } from '@/lib/api/query-keys';



export const clipFileUrl = (slug: string, clipId: string) => channelApi(slug, 'clips', clipId, 'file');
export const clipPosterUrl = (slug: string, clipId: string) => channelApi(slug, 'clips', clipId, 'poster');

export function useSegmentClips(slug: string, segmentId: string, initialClips?: ClipDto[]) {
  return useQuery({
    queryKey: queryKeys.segmentClips(slug, segmentId),
    queryFn: () => apiFetch<{ clips: ClipDto[] }>(channelApi(slug, 'segments', segmentId, 'clips')).then((r) => r.clips),
    initialData: initialClips,
    // The media worker reads duration and poster a few seconds after an upload finishes.
    refetchInterval: (query) => (query.state.data?.some((c) => c.probeState === 'pending') ? 2000 : false),
  });
}

/** The Host deletes any clip; a Shop hand only their own uploads. The server decides; this only hides the button. */
export const mayDeleteClip = (viewer: Viewer, clip: ClipDto) =>
  can(viewer.role, 'clips.delete') || (can(viewer.role, 'clips.deleteOwn') && clip.uploadedBy === viewer.userId);

export function useDeleteClip(slug: string, segmentId: string) {
  const qc = useQueryClient();
  const key = queryKeys.segmentClips(slug, segmentId);
  return useMutation({
    mutationFn: (clip: ClipDto) => apiFetch<void>(channelApi(slug, 'clips', clip.id), { method: 'DELETE' }),
    ...optimisticReorder<ClipDto[], ClipDto>(qc, {
      key,
      mutationKey: mutationKeys.deleteClip(slug, segmentId),
      reorder: (current, clip) => current.filter((c) => c.id !== clip.id),
      refresh: () =>
        Promise.all([
          qc.invalidateQueries({ queryKey: key }),
          // Shot cards say "Has footage" from their clip count.
          qc.invalidateQueries({ queryKey: queryKeys.shots(slug) }),
        ]),
    }),
  });
}

/** Host any clip, its uploader their own (lib/clips/policy.ts mayFileClip); this only shows the form. */
export const mayFileClip = (viewer: Viewer, clip: ClipDto) =>
  can(viewer.role, 'clips.delete') || (can(viewer.role, 'clips.upload') && clip.uploadedBy === viewer.userId);

export function useFileClip(slug: string, segmentId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ clip, body }: { clip: ClipDto; body: { segmentId?: string; shotId?: string | null } }) =>
      apiFetch<{ clip: ClipDto }>(channelApi(slug, 'clips', clip.id), { method: 'PATCH', body }).then((r) => r.clip),
    onSettled: (clip) =>
      Promise.all([
        qc.invalidateQueries({ queryKey: queryKeys.segmentClips(slug, segmentId) }),
        clip && clip.segmentId !== segmentId ? qc.invalidateQueries({ queryKey: queryKeys.segmentClips(slug, clip.segmentId) }) : null,
        qc.invalidateQueries({ queryKey: queryKeys.shots(slug) }),
      ]),
  });
}
