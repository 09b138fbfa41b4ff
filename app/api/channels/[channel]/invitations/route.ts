import { created, route } from '@/lib/api/handler';
import { channelParamsSchema } from '@/lib/channels/schemas';
import { deliverInvitation } from '@/lib/mail/invitation-delivery';
import { createInvitation, listOpenInvitations } from '@/lib/crew/queries';
import { inviteSchema } from '@/lib/crew/schemas';

export const GET = route({ params: channelParamsSchema, channel: 'crew.manage' }, async ({ member }) => ({
  invitations: await listOpenInvitations(member.channel.id),
}));

export const POST = route(
  { params: channelParamsSchema, body: inviteSchema, channel: 'crew.manage' },
  async ({ member, user, body }) => {
    const { invitation, token } = await createInvitation(member.channel.id, user.id, body);
    return created(await deliverInvitation(member.channel, user, invitation, token));
  },
);
