import type { Metadata } from 'next';
import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';
import { requireMember } from '@/lib/auth/session';

export const metadata: Metadata = { title: 'Shots' };

export default async function ShotsPage({ params }: { params: Promise<{ channel: string }> }) {
  await requireMember((await params).channel);
  return (
    <>
      <PageHeader title="Shots" />
      <EmptyState title="No shots planned">Planned camera setups for each segment, the shop board and your assigned shots will show here once a Host plans an episode.</EmptyState>
    </>
  );
}
