import type { Metadata } from 'next';
import { EpisodeForm } from '@/components/episodes/episode-form';
import { PageHeader } from '@/components/ui/page-header';
import { pageAccess } from '@/lib/auth/page-access';
import { requireMember } from '@/lib/auth/session';

export const metadata: Metadata = { title: 'New episode' };

export default async function NewEpisodePage({ params }: { params: Promise<{ channel: string }> }) {
  const member = await requireMember((await params).channel, pageAccess.newEpisode.capability);
  return (
    <>
      <PageHeader title="New episode" />
      <EpisodeForm channelSlug={member.channel.slug} />
    </>
  );
}
