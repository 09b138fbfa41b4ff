import { created, route } from '@/lib/api/handler';
import { countAttempt, refuseIfThrottled, signUpKey } from '@/lib/auth/attempts';
import { clientIp } from '@/lib/auth/sign-in';
import { signUpSchema } from '@/lib/users/schemas';
import { signUp } from '@/lib/users/queries';

export const POST = route({ auth: 'none', body: signUpSchema }, async ({ req, body }) => {
  const keys = [signUpKey(clientIp(req.headers))];
  await refuseIfThrottled(keys);
  // Every sign-up counts, accepted or not: each one that passes the checks costs a password hash.
  await countAttempt(keys);
  return created(await signUp(body));
});
