import { route } from '@/lib/api/handler';
import { getProfile, updateProfile } from '@/lib/users/queries';
import { updateProfileSchema } from '@/lib/users/schemas';

export const GET = route({}, async ({ user }) => ({ profile: await getProfile(user.id) }));

export const PATCH = route({ body: updateProfileSchema }, async ({ user, body }) => ({ profile: await updateProfile(user.id, body) }));
