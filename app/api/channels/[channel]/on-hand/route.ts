import { created, route } from '@/lib/api/handler';
import { channelParamsSchema } from '@/lib/channels/schemas';
import { addOnHand, listOnHand } from '@/lib/on-hand/queries';
import { createOnHandSchema } from '@/lib/on-hand/schemas';

// On-hand stock is part of the rack: the rack's readers see it, the rack's keepers change it.
export const GET = route({ params: channelParamsSchema, channel: 'cutlist.read' }, async ({ member }) => ({ pieces: await listOnHand(member.channel.id) }));

export const POST = route({ params: channelParamsSchema, body: createOnHandSchema, channel: 'cutlist.edit' }, async ({ member, user, body }) =>
  created({ piece: await addOnHand(member.channel.id, user.id, body) }),
);
