import { created, noContent, route } from '@/lib/api/handler';
import { createCalendarFeed, revokeCalendarFeed } from '@/lib/calendar/queries';

// The signed-in person's own feed: a new secret URL (the old one stops), or none.
export const POST = route({}, async ({ user }) => created(await createCalendarFeed(user.id)));

export const DELETE = route({}, async ({ user }) => {
  await revokeCalendarFeed(user.id);
  return noContent();
});
