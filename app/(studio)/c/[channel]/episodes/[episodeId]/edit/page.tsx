import type { Metadata } from 'next';
import { EpisodeDangerZone } from '@/components/episodes/episode-danger-zone';
import { EpisodeForm } from '@/components/episodes/episode-form';
import { PageHeader } from '@/components/ui/page-header';
import { pageAccess } from '@/lib/auth/page-access';
import { requireMember } from '@/lib/auth/session';
import { orNotFound, uuidOr404 } from '@/lib/page-data';
import { getRunningOrder } from '@/lib/segments/queries';

export const metadata: Metadata = { title: 'Edit episode' };

export default async function EditEpisodePage({ params }: { params: Promise<{ channel: string; episodeId: string }> }) {
  const { channel, episodeId } = await params;
  const member = await requireMember(channel, pageAccess.editEpisode.capability);
  const runningOrder = await orNotFound(getRunningOrder(member, uuidOr404(episodeId)));
  return (
    <>
      <PageHeader title={`Edit “${runningOrder.episode.title}”`} />
      <EpisodeForm channelSlug={member.channel.slug} episode={runningOrder.episode} />
      <EpisodeDangerZone channelSlug={member.channel.slug} episode={runningOrder.episode} segmentCount={runningOrder.segments.length} />
    </>
  );
}
