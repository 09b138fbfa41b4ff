import { route } from '@/lib/api/handler';
import { signUpSchema } from '@/lib/users/schemas';
import { signUpWithoutDisclosure } from '@/lib/users/sign-up';

// 202 whether or not the address already had an account (lib/users/sign-up.ts says why).
export const POST = route({ auth: 'none', body: signUpSchema }, async ({ body }) =>
  Response.json(await signUpWithoutDisclosure(body), { status: 202 }),
);
