import type { Metadata } from 'next';
import { DealsTable } from '@/components/sponsors/deals-table';
import { EpisodeFilter } from '@/components/sponsors/episode-filter';
import { SponsorList } from '@/components/sponsors/sponsor-list';
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
import { now } from '@/lib/clock/queries';
import { getPipeline, listDeals, listSponsoredEpisodes, listSponsorsWithDeals } from '@/lib/sponsors/queries';

export const metadata: Metadata = { title: 'Sponsors' };

type SearchParams = Promise<Record<string, string | string[] | undefined>>;

export default async function SponsorsPage({ params, searchParams }: { params: Promise<{ channel: string }>; searchParams: SearchParams }) {
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
  const channelId = member.channel.id;
  const wanted = (await searchParams).episode;
  const episodes = await listSponsoredEpisodes(channelId);
  // Only an episode that carries a deliverable filters; anything else in the URL shows every deal.
  const episodeId = episodes.find((e) => e.id === wanted)?.id;
  const [deals, sponsors, pipeline, at] = await Promise.all([
    listDeals(channelId, { episodeId }),
    listSponsorsWithDeals(channelId),
    getPipeline(channelId, { episodeId }),
    now(),
  ]);
  return (
    <>
      <PageHeader title="Sponsors">Sponsor deals, what each asks for in the video, and their due dates.</PageHeader>
      {episodes.length > 0 ? <EpisodeFilter episodes={episodes} selected={episodeId ?? null} /> : null}
      {deals.length === 0 ? (
        <EmptyState title="No sponsor deals yet">Add a deal below: its reads are then checked against the script and the runtime forecast.</EmptyState>
      ) : (
        <DealsTable deals={deals} channelSlug={member.channel.slug} today={dayOf(at)} />
      )}
      <PipelineTable rows={pipeline} />
      <div className="mt-8">
        <NewDealForm channelSlug={member.channel.slug} sponsors={sponsors} />
      </div>
      <SponsorList channelSlug={member.channel.slug} sponsors={sponsors} />
    </>
  );
}
