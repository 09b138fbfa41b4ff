import { noContent, route } from '@/lib/api/handler';
import { revokeInvitation } from '@/lib/crew/queries';
import { invitationParamsSchema } from '@/lib/crew/schemas';

export const DELETE = route({ params: invitationParamsSchema, channel: 'crew.manage' }, async ({ member, params }) => {
  await revokeInvitation(member.channel.id, params.invitationId);
  return noContent();
});
