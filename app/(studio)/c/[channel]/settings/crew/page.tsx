import type { Metadata } from 'next';
import { CrewManager } from '@/components/crew/crew-manager';
import { PageHeader } from '@/components/ui/page-header';
import { pageAccess } from '@/lib/auth/page-access';
import { requireMember } from '@/lib/auth/session';
import { listCrew, listOpenInvitations } from '@/lib/crew/queries';

export const metadata: Metadata = { title: 'Crew' };

export default async function CrewPage({ params }: { params: Promise<{ channel: string }> }) {
  const member = await requireMember((await params).channel, pageAccess.crew.capability);
  const [crew, invitations] = await Promise.all([listCrew(member.channel.id), listOpenInvitations(member.channel.id)]);
  return (
    <>
      <PageHeader title="Crew">Invite your shop hand and editor, change roles, and withdraw invitations.</PageHeader>
      <CrewManager channelSlug={member.channel.slug} currentUserId={member.user.id} initialCrew={crew} initialInvitations={invitations} />
    </>
  );
}
