'use client';

import { useMutation } from '@tanstack/react-query';
import { useRouter } from 'next/navigation';
import { apiFetch } from '@/lib/api/client';
import { channelApi } from '@/lib/api/paths';
import type { DealDto, DueDateKind, SponsorDto } from '@/lib/sponsors/schemas';

/**
 * Writes to the sponsor routes; each success refreshes the server-rendered page, so the deal, its
 * due dates and the live checks are read again from the database (the same forecast as the board).
 */
export function useSponsorMutations(slug: string) {
  const router = useRouter();
  const base = `/api/channels/${slug}`;
  const refresh = () => router.refresh();
  return {
    createSponsor: useMutation({
      mutationFn: (body: Record<string, unknown>) => apiFetch<{ sponsor: SponsorDto }>(`${base}/sponsors`, { method: 'POST', body }),
    }),
    updateSponsor: useMutation({
      mutationFn: (v: { sponsorId: string; body: Record<string, unknown> }) =>
        apiFetch<{ sponsor: SponsorDto }>(channelApi(slug, 'sponsors', v.sponsorId), { method: 'PATCH', body: v.body }),
      onSuccess: refresh,
    }),
    deleteSponsor: useMutation({
      mutationFn: (sponsorId: string) => apiFetch<void>(channelApi(slug, 'sponsors', sponsorId), { method: 'DELETE' }),
      onSuccess: refresh,
    }),
    createDeal: useMutation({
      mutationFn: (body: Record<string, unknown>) => apiFetch<{ deal: DealDto }>(`${base}/deals`, { method: 'POST', body }),
    }),
    updateDeal: useMutation({
      mutationFn: (v: { dealId: string; body: Record<string, unknown> }) => apiFetch<{ deal: DealDto }>(`${base}/deals/${v.dealId}`, { method: 'PATCH', body: v.body }),
      onSuccess: refresh,
    }),
    deleteDeal: useMutation({
      mutationFn: (dealId: string) => apiFetch<void>(`${base}/deals/${dealId}`, { method: 'DELETE' }),
    }),
    addDeliverable: useMutation({
      mutationFn: (v: { dealId: string; body: Record<string, unknown> }) =>
        apiFetch<{ deal: DealDto }>(`${base}/deals/${v.dealId}/deliverables`, { method: 'POST', body: v.body }),
      onSuccess: refresh,
    }),
    updateDeliverable: useMutation({
      mutationFn: (v: { deliverableId: string; body: Record<string, unknown> }) =>
        apiFetch<{ deal: DealDto }>(`${base}/deliverables/${v.deliverableId}`, { method: 'PATCH', body: v.body }),
      onSuccess: refresh,
    }),
    deleteDeliverable: useMutation({
      mutationFn: (deliverableId: string) => apiFetch<void>(`${base}/deliverables/${deliverableId}`, { method: 'DELETE' }),
      onSuccess: refresh,
    }),
    sendApprovalLink: useMutation({
      mutationFn: (v: { deliverableId: string; contactEmail: string }) =>
        apiFetch<{ delivered: boolean }>(`${base}/deliverables/${v.deliverableId}/approval-links`, { method: 'POST', body: { contactEmail: v.contactEmail } }),
      onSuccess: refresh,
    }),
    revokeApprovalLink: useMutation({
      mutationFn: (linkId: string) => apiFetch<void>(`${base}/approval-links/${linkId}`, { method: 'DELETE' }),
      onSuccess: refresh,
    }),
    updateDueDate: useMutation({
      mutationFn: (v: { deliverableId: string; kind: DueDateKind; body: { dueOn?: string | null; done?: boolean } }) =>
        apiFetch<{ deal: DealDto }>(`${base}/deliverables/${v.deliverableId}/due-dates/${v.kind}`, { method: 'PATCH', body: v.body }),
      onSuccess: refresh,
    }),
  };
}
