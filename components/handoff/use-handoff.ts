'use client';

import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '@/lib/api/client';
import type { CreateNoteInput, EditNoteDto, EditStageEventDto } from '@/lib/edit/schemas';
import type { EditStage } from '@/lib/edit/stages';
import type { HandoffSummaryDto } from '@/lib/handoffs/schemas';

const episodeApi = (slug: string, episodeId: string) => `/api/channels/${slug}/episodes/${episodeId}`;
export const handoffsKey = (slug: string, episodeId: string) => ['handoffs', slug, episodeId] as const;
const notesKey = (slug: string, episodeId: string, version: number) => ['handoffs', slug, episodeId, version, 'notes'] as const;

export function useHandoffs(slug: string, episodeId: string, initial: HandoffSummaryDto[]) {
  return useQuery({
    queryKey: handoffsKey(slug, episodeId),
    queryFn: () => apiFetch<{ handoffs: HandoffSummaryDto[] }>(`${episodeApi(slug, episodeId)}/handoffs`).then((r) => r.handoffs),
    initialData: initial,
  });
}

export function useLockHandoff(slug: string, episodeId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (note: string) => apiFetch<{ handoff: HandoffSummaryDto }>(`${episodeApi(slug, episodeId)}/handoffs`, { method: 'POST', body: { note } }).then((r) => r.handoff),
    onSettled: () => qc.invalidateQueries({ queryKey: handoffsKey(slug, episodeId) }),
  });
}

export function useSetEditStage(slug: string, episodeId: string) {
  return useMutation({
    mutationFn: (stage: EditStage) =>
      apiFetch<{ editStage: EditStage; history: EditStageEventDto[] }>(`${episodeApi(slug, episodeId)}/edit-stage`, { method: 'PUT', body: { stage } }),
  });
}

export function useVersionNotes(slug: string, episodeId: string, version: number, initial: EditNoteDto[]) {
  return useQuery({
    queryKey: notesKey(slug, episodeId, version),
    queryFn: () => apiFetch<{ notes: EditNoteDto[] }>(`${episodeApi(slug, episodeId)}/handoffs/${version}/notes`).then((r) => r.notes),
    initialData: initial,
  });
}

export function useNoteMutations(slug: string, episodeId: string, version: number) {
  const qc = useQueryClient();
  const refresh = () => qc.invalidateQueries({ queryKey: notesKey(slug, episodeId, version) });
  const notes = `/api/channels/${slug}/edit-notes`;
  return {
    create: useMutation({
      mutationFn: (input: CreateNoteInput) => apiFetch<{ note: EditNoteDto }>(`${episodeApi(slug, episodeId)}/handoffs/${version}/notes`, { method: 'POST', body: input }),
      onSuccess: refresh,
    }),
    reply: useMutation({
      mutationFn: ({ noteId, body }: { noteId: string; body: string }) => apiFetch<{ note: EditNoteDto }>(`${notes}/${noteId}/replies`, { method: 'POST', body: { body } }),
      onSuccess: refresh,
    }),
    resolve: useMutation({
      mutationFn: ({ noteId, resolved }: { noteId: string; resolved: boolean }) => apiFetch<{ note: EditNoteDto }>(`${notes}/${noteId}`, { method: 'PATCH', body: { resolved } }),
      onSuccess: refresh,
    }),
  };
}
