import type { ReactNode } from 'react';
import { ViewerProvider } from '@/components/providers/viewer-provider';
import { AppShell } from '@/components/shell/app-shell';
import { requireMember } from '@/lib/auth/session';
import { listChannelsForUser } from '@/lib/channels/queries';

export default async function ChannelLayout({ children, params }: { children: ReactNode; params: Promise<{ channel: string }> }) {
  const { channel } = await params;
  const member = await requireMember(channel);
  const channels = await listChannelsForUser(member.user.id);
  return (
    <AppShell channelSlug={member.channel.slug} channelName={member.channel.name} role={member.role} channels={channels} user={member.user}>
      <ViewerProvider viewer={{ role: member.role, userId: member.user.id }}>{children}</ViewerProvider>
    </AppShell>
  );
}
