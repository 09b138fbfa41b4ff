import { route } from '@/lib/api/handler';
import { channelParamsSchema } from '@/lib/channels/schemas';
import { listMyShots } from '@/lib/shots/queries';

export const GET = route({ params: channelParamsSchema, channel: 'member' }, async ({ member }) => ({
  shots: await listMyShots(member.channel.id, member.userId),
}));
