import { noContent, route } from '@/lib/api/handler';
import { deleteEpisode, findEpisode, updateEpisode } from '@/lib/episodes/queries';
import { episodeParamsSchema, updateEpisodeSchema } from '@/lib/episodes/schemas';

export const GET = route({ params: episodeParamsSchema, channel: 'scripts.read' }, async ({ member, params }) => ({
  episode: await findEpisode(member.channel.id, params.episodeId),
}));

export const PATCH = route({ params: episodeParamsSchema, body: updateEpisodeSchema, channel: 'episodes.edit' }, async ({ member, params, body }) => ({
  episode: await updateEpisode(member.channel.id, params.episodeId, body),
}));

export const DELETE = route({ params: episodeParamsSchema, channel: 'episodes.edit' }, async ({ member, params }) => {
  await deleteEpisode(member.channel.id, params.episodeId);
  return noContent();
});
