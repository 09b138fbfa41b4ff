import type { Metadata } from 'next';
import Link from 'next/link';
import { CalendarFeedPanel } from '@/components/calendar/calendar-feed-panel';
import { ProfileForm } from '@/components/profile/profile-form';
import { SignOutEverywhere } from '@/components/profile/sign-out-everywhere';
import { ChannelSettingsForm } from '@/components/settings/channel-settings-form';
import { PageHeader } from '@/components/ui/page-header';
import { can } from '@/lib/auth/policy';
import { requireMember } from '@/lib/auth/session';
import { hasCalendarFeed } from '@/lib/calendar/queries';
import { getProfile } from '@/lib/users/queries';
import { channelPage } from '@/lib/api/paths';

export const metadata: Metadata = { title: 'Settings' };

export default async function SettingsPage({ params }: { params: Promise<{ channel: string }> }) {
  const member = await requireMember((await params).channel);
  const host = can(member.role, 'channel.settings');
  const [profile, feedActive] = await Promise.all([getProfile(member.userId), hasCalendarFeed(member.userId)]);
  return (
    <>
      <PageHeader title="Settings">Your profile, channel settings{host ? ' and crew' : ''}.</PageHeader>
      {host ? (
        <nav aria-label="Settings sections" className="mb-6">
          <Link href={channelPage(member.channel.slug, 'settings', 'crew')} className="font-bold text-blueprint underline">
            Crew and invitations
          </Link>
        </nav>
      ) : null}
      <section id="profile" aria-labelledby="profile-heading" className="mb-6 max-w-xl rounded-card border border-paper-edge bg-white/60 p-5 shadow-card">
        <h2 id="profile-heading" className="text-lg font-bold">
          Your profile
        </h2>
        <ProfileForm profile={profile} />
        <SignOutEverywhere />
      </section>
      <section aria-labelledby="calendar-heading" className="mb-6 max-w-xl rounded-card border border-paper-edge bg-white/60 p-5 shadow-card">
        <h2 id="calendar-heading" className="text-lg font-bold">
          Calendar feed
        </h2>
        <CalendarFeedPanel initiallyActive={feedActive} />
      </section>
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
            <dt className="text-ink-faint">Reminder days</dt>
            <dd className="font-mono">{member.channel.reminderDays.join(', ')} days before a due date</dd>
            <dd className="col-span-2 text-ink-faint">Only a Host can change channel settings.</dd>
          </dl>
        )}
      </section>
    </>
  );
}
