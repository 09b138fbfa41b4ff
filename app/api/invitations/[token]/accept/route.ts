import { route } from '@/lib/api/handler';
import { acceptKey, refuseIfThrottled } from '@/lib/auth/attempts';
import { recordFailure } from '@/lib/auth/throttle-queries';
import { clientIp } from '@/lib/auth/sign-in';
import { acceptInvitationAsNewUser, acceptInvitationAsUser } from '@/lib/crew/queries';
import { acceptSchema, tokenParamsSchema } from '@/lib/crew/schemas';
import { AppError, unauthenticated } from '@/lib/errors';

// A new person sends name and password; someone with an account signs in first and sends {}.
export const POST = route({ auth: 'none', params: tokenParamsSchema, body: acceptSchema }, async ({ req, params, body, user }) => {
  const keys = [acceptKey(clientIp(req.headers))];
  await refuseIfThrottled(keys);
  try {
    if (body.name !== undefined && body.password !== undefined) {
      return { accepted: await acceptInvitationAsNewUser(params.token, { name: body.name, password: body.password }) };
    }
    if (!user) throw unauthenticated();
    return { accepted: await acceptInvitationAsUser(params.token, user) };
  } catch (err) {
    // Guessing tokens is what the throttle stops; a used or expired link of one's own is not a guess.
    if (err instanceof AppError && err.code === 'not_found') await recordFailure(keys);
    throw err;
  }
});
