import { noContent, route } from '@/lib/api/handler';
import { endAllSessions } from '@/lib/auth/session-queries';

/** "Sign out everywhere": every session of the caller ends, this one included. */
export const DELETE = route({}, async ({ user }) => {
  await endAllSessions(user.id);
  return noContent();
});
