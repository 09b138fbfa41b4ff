import { route } from '@/lib/api/handler';
import { channelParamsSchema } from '@/lib/channels/schemas';
import { listCrew } from '@/lib/crew/queries';

export const GET = route({ params: channelParamsSchema, channel: 'crew.read' }, async ({ member }) => ({
  crew: await listCrew(member.channel.id),
}));
