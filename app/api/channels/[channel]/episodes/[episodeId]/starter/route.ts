import { created, route } from '@/lib/api/handler';
import { episodeParamsSchema } from '@/lib/episodes/schemas';
import { addThreeLevelBuild } from '@/lib/segments/queries';

// The "three-level build" starter: appends the six segments of that outline in one transaction.
export const POST = route({ params: episodeParamsSchema, channel: 'episodes.edit' }, async ({ member, params }) =>
  created({ segments: await addThreeLevelBuild(member.channel.id, params.episodeId) }),
);
