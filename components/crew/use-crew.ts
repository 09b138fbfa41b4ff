'use client';

import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '@/lib/api/client';
import type { Role } from '@/lib/auth/policy';
import type { CrewMemberDto, InvitationDto, InviteInput } from '@/lib/crew/schemas';
import { channelApi } from '@/lib/api/paths';
import { queryKeys } from '@/lib/api/query-keys';


export function useCrew(slug: string, initialData: CrewMemberDto[]) {
  return useQuery({
    queryKey: queryKeys.crew(slug),
    queryFn: () => apiFetch<{ crew: CrewMemberDto[] }>(channelApi(slug, 'crew')).then((r) => r.crew),
    initialData,
  });
}

export function useInvitations(slug: string, initialData: InvitationDto[]) {
  return useQuery({
    queryKey: queryKeys.invitations(slug),
    queryFn: () => apiFetch<{ invitations: InvitationDto[] }>(channelApi(slug, 'invitations')).then((r) => r.invitations),
    initialData,
  });
}

type Delivery = { invitation: InvitationDto; delivered: boolean };

export function useCrewMutations(slug: string) {
  const qc = useQueryClient();
  const refresh = () => Promise.all([qc.invalidateQueries({ queryKey: queryKeys.crew(slug) }), qc.invalidateQueries({ queryKey: queryKeys.invitations(slug) })]);
  return {
    invite: useMutation({
      mutationFn: (input: InviteInput) => apiFetch<Delivery>(channelApi(slug, 'invitations'), { method: 'POST', body: input }),
      onSettled: refresh,
    }),
    resend: useMutation({
      mutationFn: (id: string) => apiFetch<Delivery>(channelApi(slug, 'invitations', id, 'resend'), { method: 'POST' }),
      onSettled: refresh,
    }),
    revoke: useMutation({
      mutationFn: (id: string) => apiFetch<void>(channelApi(slug, 'invitations', id), { method: 'DELETE' }),
      onSettled: refresh,
    }),
    changeRole: useMutation({
      mutationFn: (v: { userId: string; role: Role }) =>
        apiFetch<{ member: CrewMemberDto }>(channelApi(slug, 'crew', v.userId), { method: 'PATCH', body: { role: v.role } }),
      onSettled: refresh,
    }),
    remove: useMutation({
      mutationFn: (userId: string) => apiFetch<void>(channelApi(slug, 'crew', userId), { method: 'DELETE' }),
      onSettled: refresh,
    }),
  };
}
