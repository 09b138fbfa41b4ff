import type { Metadata } from 'next';
import { parseBoardFilters, viewOf } from '@/components/shop-board/board-query';
import { MyShots } from '@/components/shop-board/my-shots';
import { ShopBoard } from '@/components/shop-board/shop-board';
import { ViewTabs } from '@/components/shop-board/view-tabs';
import { PageHeader } from '@/components/ui/page-header';
import { can } from '@/lib/auth/policy';
import { requireMember } from '@/lib/auth/session';
import { listCrew } from '@/lib/crew/queries';
import { listEpisodes } from '@/lib/episodes/queries';
import { getRunningOrder } from '@/lib/segments/queries';
import { countOpenBursts } from '@/lib/mail/assignment-queries';
import { listBoardShots, listMyShots } from '@/lib/shots/queries';
import { listPendingSafety } from '@/lib/safety/queries';

export const metadata: Metadata = { title: 'Shots' };

type Props = {
  params: Promise<{ channel: string }>;
  searchParams: Promise<Record<string, string | string[] | undefined>>;
};

export default async function ShotsPage({ params, searchParams }: Props) {
  const member = await requireMember((await params).channel);
  const query = await searchParams;
  const { channel, user } = member;
  const canChange = can(member.role, 'shots.changeState');
  // Shots are assigned only to roles that may work on them; an Editor has no "My shots" to promise (issue 15).
  const holdsShots = can(member.role, 'shots.editAssigned');
  const view = holdsShots ? viewOf(query) : 'board';

  if (view === 'mine') {
    const shots = await listMyShots(channel.id, member.userId);
    return (
      <>
        <PageHeader title="Shots">Everything assigned to you in {channel.name}, by shoot date.</PageHeader>
        <ViewTabs slug={channel.slug} current="mine" />
        <MyShots slug={channel.slug} viewerName={user.name} canChange={canChange} initialShots={shots} />
      </>
    );
  }

  const [episodes, crew] = await Promise.all([listEpisodes(channel.id, channel.speakingRateWpm, { archived: false }), listCrew(channel.id)]);
  const filters = parseBoardFilters(query);
  // An archived or foreign episode in the URL filters nothing rather than showing an empty board.
  if (filters.episodeId && !episodes.some((e) => e.id === filters.episodeId)) {
    delete filters.episodeId;
    delete filters.segmentId;
  }
  const isHost = can(member.role, 'shots.edit');
  const [shots, pendingSafety, episodeBoard, waiting] = await Promise.all([
    listBoardShots(channel.id, filters),
    listPendingSafety(channel.id, filters.episodeId),
    filters.episodeId ? getRunningOrder(member, filters.episodeId) : null,
    isHost ? countOpenBursts(channel.id) : 0,
  ]);

  return (
    <>
      <PageHeader title="Shots">
        {canChange ? 'Every planned shot by state. Drag a card by its handle, or use the buttons on a phone.' : 'Every planned shot by state.'}
      </PageHeader>
      {holdsShots ? <ViewTabs slug={channel.slug} current="board" /> : null}
      <ShopBoard
        slug={channel.slug}
        viewerName={user.name}
        canMove={canChange}
        shotMail={isHost ? { waiting } : null}
        initial={{ filters, data: { shots, pendingSafety } }}
        episodes={episodes.map((e) => ({ id: e.id, title: e.title }))}
        assignees={crew.filter((m) => m.role !== 'editor').map((m) => ({ userId: m.userId, name: m.name, role: m.role }))}
        initialRunningOrder={episodeBoard}
      />
    </>
  );
}
