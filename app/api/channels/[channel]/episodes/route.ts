import { created, route } from '@/lib/api/handler';
import { channelParamsSchema } from '@/lib/channels/schemas';
import { createEpisode, listEpisodes } from '@/lib/episodes/queries';
import { createEpisodeSchema, episodeListQuerySchema } from '@/lib/episodes/schemas';

export const GET = route({ params: channelParamsSchema, query: episodeListQuerySchema, channel: 'scripts.read' }, async ({ member, query }) => ({
  episodes: await listEpisodes(member.channel.id, member.channel.speakingRateWpm, {
    ...(query.stage && { stage: query.stage }),
    ...(query.archived && { archived: query.archived === 'true' }),
  }),
}));

export const POST = route({ params: channelParamsSchema, body: createEpisodeSchema, channel: 'episodes.edit' }, async ({ member, body }) =>
  created({ episode: await createEpisode(member.channel.id, body) }),
);
