import { created, route } from '@/lib/api/handler';
import { createChannel, listChannelsForUser } from '@/lib/channels/queries';
import { newChannelSchema } from '@/lib/channels/schemas';

export const GET = route({}, async ({ user }) => ({ channels: await listChannelsForUser(user.id) }));

export const POST = route({ body: newChannelSchema }, async ({ user, body }) => created({ channel: await createChannel(body.name, user.id) }));
