import { created, route } from '@/lib/api/handler';
import { signUpSchema } from '@/lib/users/schemas';
import { signUp } from '@/lib/users/queries';

export const POST = route({ auth: 'none', body: signUpSchema }, async ({ body }) => created(await signUp(body)));
