import type { Metadata } from 'next';
import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';
import { requireMember } from '@/lib/auth/session';

export const metadata: Metadata = { title: 'Sponsors' };

export default async function SponsorsPage({ params }: { params: Promise<{ channel: string }> }) {
  await requireMember((await params).channel);
  return (
    <>
      <PageHeader title="Sponsors" />
      <EmptyState title="No sponsor deals">Sponsor deals, their deliverables and due dates (script due, approval due, go-live, report due) will be tracked here.</EmptyState>
    </>
  );
}
