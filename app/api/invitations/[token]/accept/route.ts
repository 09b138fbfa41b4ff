import { route } from '@/lib/api/handler';
import { acceptInvitationAsNewUser, acceptInvitationAsUser } from '@/lib/crew/queries';
import { acceptSchema, tokenParamsSchema } from '@/lib/crew/schemas';
import { unauthenticated } from '@/lib/errors';

// A new person sends name and password; someone with an account signs in first and sends {}.
export const POST = route({ auth: 'none', params: tokenParamsSchema, body: acceptSchema }, async ({ params, body, user }) => {
  if (body.name !== undefined && body.password !== undefined) {
    return { accepted: await acceptInvitationAsNewUser(params.token, { name: body.name, password: body.password }) };
  }
  if (!user) throw unauthenticated();
  return { accepted: await acceptInvitationAsUser(params.token, user) };
});
