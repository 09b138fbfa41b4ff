import { noContent, route } from '@/lib/api/handler';
import { changeRole, removeMember } from '@/lib/crew/queries';
import { changeRoleSchema, memberParamsSchema } from '@/lib/crew/schemas';

export const PATCH = route(
  { params: memberParamsSchema, body: changeRoleSchema, channel: 'crew.manage' },
  async ({ member, params, body }) => ({ member: await changeRole(member.channel.id, member.userId, params.userId, body.role) }),
);

export const DELETE = route({ params: memberParamsSchema, channel: 'crew.manage' }, async ({ member, params }) => {
  await removeMember(member.channel.id, member.userId, params.userId);
  return noContent();
});
