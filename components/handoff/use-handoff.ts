'use client';

import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useRouter } from 'next/navigation';
import { apiFetch } from '@/lib/api/client';
import { channelApi } from '@/lib/api/paths';
import { queryKeys } from '@/lib/api/query-keys';
import type { CreateNoteInput, EditNoteDto, EditStageEventDto } from '@/lib/edit/schemas';
import type { EditStage } from '@/lib/edit/stages';
import type { HandoffSummaryDto } from '@/lib/handoffs/schemas';

const episodeApi = (slug: string, episodeId: string, ...parts: (string | number)[]) => channelApi(slug, 'episodes', episodeId, ...parts);

export function useHandoffs(slug: string, episodeId: string, initial: HandoffSummaryDto[]) {
  return useQuery({
    queryKey: queryKeys.handoffs(slug, episodeId),
    queryFn: () => apiFetch<{ handoffs: HandoffSummaryDto[] }>(episodeApi(slug, episodeId, 'handoffs')).then((r) => r.handoffs),
    initialData: initial,
  });
}

/**
 * Locks a new version. The version list shows it at once (the answer is the new summary), then refetches
 * in case another Host locked too, and the server-rendered parts of the page are refreshed.
 */
export function useLockHandoff(slug: string, episodeId: string) {
  const qc = useQueryClient();
  const router = useRouter();
  const key = queryKeys.handoffs(slug, episodeId);
  return useMutation({
    mutationFn: (note: string) => apiFetch<{ handoff: HandoffSummaryDto }>(episodeApi(slug, episodeId, 'handoffs'), { method: 'POST', body: { note } }).then((r) => r.handoff),
    onSuccess: (handoff) => {
      qc.setQueryData<HandoffSummaryDto[]>(key, (old = []) => [handoff, ...old.filter((v) => v.version !== handoff.version)].sort((a, b) => b.version - a.version));
      router.refresh();
    },
    onSettled: () => qc.invalidateQueries({ queryKey: key }),
  });
}

export function useSetEditStage(slug: string, episodeId: string) {
  return useMutation({
    mutationFn: (stage: EditStage) =>
      apiFetch<{ editStage: EditStage; history: EditStageEventDto[] }>(episodeApi(slug, episodeId, 'edit-stage'), { method: 'PUT', body: { stage } }),
  });
}

export function useVersionNotes(slug: string, episodeId: string, version: number, initial: EditNoteDto[]) {
  return useQuery({
    queryKey: queryKeys.versionNotes(slug, episodeId, version),
    queryFn: () => apiFetch<{ notes: EditNoteDto[] }>(episodeApi(slug, episodeId, 'handoffs', version, 'notes')).then((r) => r.notes),
    initialData: initial,
  });
}

export function useNoteMutations(slug: string, episodeId: string, version: number) {
  const qc = useQueryClient();
  const refresh = () => qc.invalidateQueries({ queryKey: queryKeys.versionNotes(slug, episodeId, version) });
  const note = (noteId: string, ...parts: string[]) => channelApi(slug, 'edit-notes', noteId, ...parts);
  return {
    create: useMutation({
      mutationFn: (input: CreateNoteInput) => apiFetch<{ note: EditNoteDto }>(episodeApi(slug, episodeId, 'handoffs', version, 'notes'), { method: 'POST', body: input }),
      onSuccess: refresh,
    }),
    reply: useMutation({
      mutationFn: ({ noteId, body }: { noteId: string; body: string }) => apiFetch<{ note: EditNoteDto }>(note(noteId, 'replies'), { method: 'POST', body: { body } }),
      onSuccess: refresh,
    }),
    resolve: useMutation({
      mutationFn: ({ noteId, resolved }: { noteId: string; resolved: boolean }) => apiFetch<{ note: EditNoteDto }>(note(noteId), { method: 'PATCH', body: { resolved } }),
      onSuccess: refresh,
    }),
  };
}
