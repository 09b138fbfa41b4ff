import type { Metadata } from 'next';
import Link from 'next/link';
import { buttonClasses } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';
import { can, roleLabels } from '@/lib/auth/policy';
import { requireMember } from '@/lib/auth/session';
import { listCrew } from '@/lib/crew/queries';
import { editStageLabels } from '@/lib/edit/stages';
import { listEpisodes } from '@/lib/episodes/queries';

export const metadata: Metadata = { title: 'Dashboard' };

export default async function DashboardPage({ params }: { params: Promise<{ channel: string }> }) {
  const { channel } = await params;
  const member = await requireMember(channel);
  const [crew, episodes] = await Promise.all([listCrew(member.channel.id), listEpisodes(member.channel.id, member.channel.speakingRateWpm, { archived: false })]);
  const inEdit = episodes.filter((e) => e.editStage !== null);
  const base = `/c/${member.channel.slug}`;
  return (
    <>
      <PageHeader title={member.channel.name}>
        Signed in as {member.user.name}, {roleLabels[member.role]}.
      </PageHeader>
      <div className="grid gap-6 lg:grid-cols-[2fr_1fr]">
        <EmptyState
          title="No episodes yet"
          action={
            can(member.role, 'episodes.edit') ? (
              <Link href={`${base}/episodes`} className={buttonClasses('primary')}>
                Go to episodes
              </Link>
            ) : undefined
          }
        >
          {can(member.role, 'episodes.edit')
            ? 'Outline your first episode: its running order, scripts and runtime forecast will show here.'
            : 'When a Host outlines an episode, its running order and what needs you will show here.'}
        </EmptyState>
        {inEdit.length ? (
          <section className="rounded-card border border-paper-edge bg-white/60 p-5 shadow-card lg:col-start-1" aria-labelledby="edit-heading">
            <h2 id="edit-heading" className="font-bold">
              In the edit
            </h2>
            <ul className="mt-3 space-y-1 text-sm">
              {inEdit.map((e) => (
                <li key={e.id} className="flex justify-between gap-2">
                  <Link href={`${base}/episodes/${e.id}`} className="inline-flex min-h-touch items-center truncate underline">
                    {e.title}
                  </Link>
                  <span className="inline-flex items-center font-bold">{e.editStage ? editStageLabels[e.editStage] : ''}</span>
                </li>
              ))}
            </ul>
          </section>
        ) : null}
        <section className="rounded-card border border-paper-edge bg-white/60 p-5 shadow-card lg:col-start-2 lg:row-start-1" aria-labelledby="crew-heading">
          <h2 id="crew-heading" className="font-bold">
            Crew
          </h2>
          <ul className="mt-3 space-y-2 text-sm">
            {crew.map((m) => (
              <li key={m.userId} className="flex justify-between gap-2">
                <span className="truncate">{m.name}</span>
                <span className="text-ink-faint">{roleLabels[m.role]}</span>
              </li>
            ))}
          </ul>
          {can(member.role, 'crew.manage') ? (
            <Link href={`${base}/settings/crew`} className="mt-4 inline-block text-sm font-bold text-blueprint underline">
              Invite and manage crew
            </Link>
          ) : null}
        </section>
      </div>
    </>
  );
}
