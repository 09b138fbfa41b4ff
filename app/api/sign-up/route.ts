import { route } from '@/lib/api/handler';
import { claimAttempt, signUpKey } from '@/lib/auth/attempts';
import { clientIp } from '@/lib/auth/sign-in';
import { signUpSchema } from '@/lib/users/schemas';
import { signUpWithoutDisclosure } from '@/lib/users/sign-up';

// Every sign-up counts against the client address, accepted or not: each one costs a password hash.
// 202 whether or not the address already had an account (lib/users/sign-up.ts says why).
export const POST = route({ auth: 'none', body: signUpSchema }, async ({ req, body }) => {
  await claimAttempt([signUpKey(clientIp(req.headers))]);
  return Response.json(await signUpWithoutDisclosure(body), { status: 202 });
});
