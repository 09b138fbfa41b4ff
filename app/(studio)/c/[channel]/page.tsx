import type { Metadata } from 'next';
import Link from 'next/link';
import { buttonClasses } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';
import { can, roleLabels } from '@/lib/auth/policy';
import { requireMember } from '@/lib/auth/session';
import { listCrew } from '@/lib/crew/queries';
import { channelPage } from '@/lib/api/paths';

export const metadata: Metadata = { title: 'Dashboard' };

export default async function DashboardPage({ params }: { params: Promise<{ channel: string }> }) {
  const { channel } = await params;
  const member = await requireMember(channel);
  const crew = await listCrew(member.channel.id);
  const base = channelPage(member.channel.slug);
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
        <section className="rounded-card border border-paper-edge bg-white/60 p-5 shadow-card" aria-labelledby="crew-heading">
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
