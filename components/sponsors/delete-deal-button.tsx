'use client';

import { useRouter } from 'next/navigation';
import { Button } from '@/components/ui/button';
import { useSponsorMutations } from './use-sponsor-mutations';

export function DeleteDealButton({ channelSlug, dealId }: { channelSlug: string; dealId: string }) {
  const router = useRouter();
  const m = useSponsorMutations(channelSlug);
  return (
    <Button
      variant="danger"
      disabled={m.deleteDeal.isPending}
      onClick={() => {
        if (!window.confirm('Delete this deal, its deliverables and due dates?')) return;
        m.deleteDeal.mutate(dealId, { onSuccess: () => router.push(`/c/${channelSlug}/sponsors`) });
      }}
    >
      Delete deal
    </Button>
  );
}
