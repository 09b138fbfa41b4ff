import type { Metadata } from 'next';
import Link from 'next/link';
import { ChannelSettingsForm } from '@/components/settings/channel-settings-form';
import { PageHeader } from '@/components/ui/page-header';
import { can } from '@/lib/auth/policy';
import { requireMember } from '@/lib/auth/session';

export const metadata: Metadata = { title: 'Settings' };

export default async function SettingsPage({ params }: { params: Promise<{ channel: string }> }) {
  const member = await requireMember((await params).channel);
  const host = can(member.role, 'channel.settings');
  return (
    <>
      <PageHeader title="Settings">Channel settings{host ? ' and crew' : ''}.</PageHeader>
      {host ? (
        <nav aria-label="Settings sections" className="mb-6">
          <Link href={`/c/${member.channel.slug}/settings/crew`} className="font-bold text-blueprint underline">
            Crew and invitations
          </Link>
        </nav>
      ) : null}
      <section aria-labelledby="channel-heading" className="max-w-xl rounded-card border border-paper-edge bg-white/60 p-5 shadow-card">
        <h2 id="channel-heading" className="text-lg font-bold">
          Channel
        </h2>
        {host ? (
          <ChannelSettingsForm channel={member.channel} />
        ) : (
          <dl className="mt-3 grid grid-cols-[auto_1fr] gap-x-6 gap-y-2 text-sm">
            <dt className="text-ink-faint">Name</dt>
            <dd>{member.channel.name}</dd>
            <dt className="text-ink-faint">Speaking rate</dt>
            <dd className="font-mono">{member.channel.speakingRateWpm} words per minute</dd>
            <dd className="col-span-2 text-ink-faint">Only a Host can change channel settings.</dd>
          </dl>
        )}
      </section>
    </>
  );
}
