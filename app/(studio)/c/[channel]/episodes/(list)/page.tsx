import type { Metadata } from 'next';
import Link from 'next/link';
import { EpisodesTable } from '@/components/episodes/episodes-table';
import { buttonClasses } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';
import { can } from '@/lib/auth/policy';
import { requireMember } from '@/lib/auth/session';
import { listEpisodes } from '@/lib/episodes/queries';
import { channelPage } from '@/lib/api/paths';

export const metadata: Metadata = { title: 'Episodes' };

export default async function EpisodesPage({ params }: { params: Promise<{ channel: string }> }) {
  const member = await requireMember((await params).channel);
  const episodes = await listEpisodes(member.channel.id, member.channel.speakingRateWpm);
  const base = channelPage(member.channel.slug, 'episodes');
  const newEpisode = can(member.role, 'episodes.edit') ? (
    <Link href={`${base}/new`} className={buttonClasses('primary')}>
      New episode
    </Link>
  ) : undefined;
  return (
    <>
      <PageHeader title="Episodes" actions={newEpisode}>
        Runtime forecasts at {member.channel.speakingRateWpm} words per minute.
      </PageHeader>
      {episodes.length === 0 ? (
        <EmptyState title="No episodes yet" action={newEpisode}>
          {newEpisode
            ? 'Start one: outline a build at three skill levels, add a sponsor read and an outro, and see the runtime forecast against your target.'
            : 'When a Host outlines an episode it shows here.'}
        </EmptyState>
      ) : (
        <EpisodesTable episodes={episodes} channelSlug={member.channel.slug} />
      )}
    </>
  );
}
