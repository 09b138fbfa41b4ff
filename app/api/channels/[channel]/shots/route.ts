import { route } from '@/lib/api/handler';
import { channelParamsSchema } from '@/lib/channels/schemas';
import { listBoardShots } from '@/lib/shots/queries';
import { listPendingSafety } from '@/lib/safety/queries';
import { boardQuerySchema } from '@/lib/shots/schemas';

export const GET = route({ params: channelParamsSchema, query: boardQuerySchema, channel: 'member' }, async ({ member, query }) => {
  const [shots, pendingSafety] = await Promise.all([listBoardShots(member.channel.id, query), listPendingSafety(member.channel.id, query.episodeId)]);
  return { shots, pendingSafety };
});
