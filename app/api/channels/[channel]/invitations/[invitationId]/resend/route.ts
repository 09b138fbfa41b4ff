import { route } from '@/lib/api/handler';
import { deliverInvitation } from '@/lib/mail/invitation-delivery';
import { renewInvitation } from '@/lib/crew/queries';
import { invitationParamsSchema } from '@/lib/crew/schemas';

export const POST = route({ params: invitationParamsSchema, channel: 'crew.manage' }, async ({ member, user, params }) => {
  const { invitation, token } = await renewInvitation(member.channel.id, params.invitationId);
  return deliverInvitation(member.channel, user, invitation, token);
});
