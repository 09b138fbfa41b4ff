import type { Metadata } from 'next';
import Link from 'next/link';
import { DashboardView } from '@/components/dashboard/dashboard-view';
import { PageHeader } from '@/components/ui/page-header';
import { can, roleLabels } from '@/lib/auth/policy';
import { requireMember } from '@/lib/auth/session';
import { listCrew } from '@/lib/crew/queries';
import { channelPage } from '@/lib/api/paths';
import { getDashboard } from '@/lib/dashboard/queries';
import { now } from '@/lib/clock/queries';
import { dayOf } from '@/lib/sponsors/dates';
import { editStageLabels } from '@/lib/edit/stages';
import { listEpisodes } from '@/lib/episodes/queries';

export const metadata: Metadata = { title: 'Dashboard' };

export default async function DashboardPage({ params }: { params: Promise<{ channel: string }> }) {
  const { channel } = await params;
  const member = await requireMember(channel);
  // The app clock, so overdue and due-soon agree with the reminder e-mails (and a test can move it).
  const today = dayOf(await now());
  const [crew, dashboard, episodes] = await Promise.all([
    listCrew(member.channel.id),
    getDashboard(member, today),
    listEpisodes(member.channel.id, member.channel.speakingRateWpm, { archived: false }),
  ]);
  const inEdit = episodes.filter((e) => e.editStage !== null);
  const base = channelPage(member.channel.slug);
  return (
    <>
      <PageHeader title={member.channel.name}>
        Signed in as {member.user.name}, {roleLabels[member.role]}.
      </PageHeader>
      <div className="grid gap-6 xl:grid-cols-[3fr_1fr]">
        <div className="space-y-6">
          <DashboardView data={dashboard} slug={member.channel.slug} canEditEpisodes={can(member.role, 'episodes.edit')} />
          {inEdit.length ? (
            <section className="rounded-card border border-paper-edge bg-white/60 p-5 shadow-card" aria-labelledby="edit-heading">
              <h2 id="edit-heading" className="font-bold">
                In the edit
              </h2>
              <ul className="mt-3 space-y-1 text-sm">
                {inEdit.map((e) => (
                  <li key={e.id} className="flex justify-between gap-2">
                    <Link href={channelPage(member.channel.slug, 'episodes', e.id)} className="inline-flex min-h-touch items-center truncate underline">
                      {e.title}
                    </Link>
                    <span className="inline-flex items-center font-bold">{e.editStage ? editStageLabels[e.editStage] : ''}</span>
                  </li>
                ))}
              </ul>
            </section>
          ) : null}
        </div>
        <section className="rounded-card border border-paper-edge bg-white/60 p-5 shadow-card self-start" aria-labelledby="crew-heading">
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
