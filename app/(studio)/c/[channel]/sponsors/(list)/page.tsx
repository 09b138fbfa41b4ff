import type { Metadata } from 'next';
import { DealsTable } from '@/components/sponsors/deals-table';
import { EditorDeliverables } from '@/components/sponsors/editor-deliverables';
import { NewDealForm } from '@/components/sponsors/new-deal-form';
import { PipelineTable } from '@/components/sponsors/pipeline-table';
import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';
import { can } from '@/lib/auth/policy';
import { pageAccess } from '@/lib/auth/page-access';
import { requireMember } from '@/lib/auth/session';
import { dayOf } from '@/lib/sponsors/dates';
import { listChannelDeliverablesForEditor } from '@/lib/sponsors/deliverable-queries';
import { getPipeline, listDeals, listSponsors } from '@/lib/sponsors/queries';

export const metadata: Metadata = { title: 'Sponsors' };

export default async function SponsorsPage({ params }: { params: Promise<{ channel: string }> }) {
  const member = await requireMember((await params).channel, pageAccess.sponsors.capability);
  if (!can(member.role, 'sponsors.manage')) {
    const deliverables = await listChannelDeliverablesForEditor(member.channel.id);
    return (
      <>
        <PageHeader title="Sponsor reads">What each sponsor read must say, and its disclosure. Deals and fees stay with the Host.</PageHeader>
        <EditorDeliverables deliverables={deliverables} channelSlug={member.channel.slug} />
      </>
    );
  }
  const [deals, sponsors, pipeline] = await Promise.all([listDeals(member.channel.id), listSponsors(member.channel.id), getPipeline(member.channel.id)]);
  return (
    <>
      <PageHeader title="Sponsors">Sponsor deals, what each asks for in the video, and their due dates.</PageHeader>
      {deals.length === 0 ? (
        <EmptyState title="No sponsor deals yet">Add a deal below: its reads are then checked against the script and the runtime forecast.</EmptyState>
      ) : (
        <DealsTable deals={deals} channelSlug={member.channel.slug} today={dayOf(new Date())} />
      )}
      <PipelineTable rows={pipeline} />
      <div className="mt-8">
        <NewDealForm channelSlug={member.channel.slug} sponsors={sponsors} />
      </div>
    </>
  );
}
