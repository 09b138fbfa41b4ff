import type { Metadata } from 'next';
import Link from 'next/link';
import { EpisodeCutPlan } from '@/components/cut-plans/episode-cut-plan';
import { can } from '@/lib/auth/policy';
import { pageAccess } from '@/lib/auth/page-access';
import { requireMember } from '@/lib/auth/session';
import { planEpisode } from '@/lib/cut-plans/queries';
import { findEpisode } from '@/lib/episodes/queries';
import { orNotFound, uuidOr404 } from '@/lib/page-data';
import { Breadcrumb } from '@/components/ui/breadcrumb';
import { channelPage } from '@/lib/api/paths';

export const metadata: Metadata = { title: 'Cut plan' };

export default async function EpisodeCutPlanPage({ params }: { params: Promise<{ channel: string; episodeId: string }> }) {
  const { channel, episodeId } = await params;
  const member = await requireMember(channel, pageAccess.cutPlan.capability);
  const id = uuidOr404(episodeId);
  const [episode, plan] = await orNotFound(Promise.all([findEpisode(member.channel.id, id), planEpisode(member.channel.id, id)]));
  return (
    <>
      {/* The plan belongs to its episode (issue 15); the stock rack it prices from is linked below, not above. */}
      <Breadcrumb items={[{ href: channelPage(member.channel.slug, 'episodes'), label: 'Episodes' }, { href: channelPage(member.channel.slug, 'episodes', episode.id), label: episode.title }]} />
      <header className="mb-6 border-b border-paper-edge pb-4">
        <h1 className="text-2xl font-bold tracking-tight">Cut plan: {episode.title}</h1>
        <p className="text-sm text-ink-soft">
          What to buy for every build in this episode, and where each cut goes. Sizes and prices come from the{' '}
          <Link href={channelPage(member.channel.slug, 'stock')} className="text-blueprint underline">
            stock rack
          </Link>
          .
        </p>
      </header>
      <EpisodeCutPlan channelSlug={member.channel.slug} episodeId={episode.id} levelLabels={episode.levelLabels} canEdit={can(member.role, 'cutlist.edit')} initial={plan} />
    </>
  );
}
