import type { Metadata } from 'next';
import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';
import { requireMember } from '@/lib/auth/session';

export const metadata: Metadata = { title: 'Episodes' };

export default async function EpisodesPage({ params }: { params: Promise<{ channel: string }> }) {
  await requireMember((await params).channel);
  return (
    <>
      <PageHeader title="Episodes" />
      <EmptyState title="No episodes yet">Episodes and their running order of segments will live here: outline a build at three skill levels, add a sponsor read and an outro, and see the runtime forecast against your target.</EmptyState>
    </>
  );
}
