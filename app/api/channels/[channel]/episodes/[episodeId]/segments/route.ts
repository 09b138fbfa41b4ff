import { created, route } from '@/lib/api/handler';
import { episodeParamsSchema } from '@/lib/episodes/schemas';
import { createSegment } from '@/lib/segments/queries';
import { createSegmentSchema } from '@/lib/segments/schemas';

export const POST = route({ params: episodeParamsSchema, body: createSegmentSchema, channel: 'episodes.edit' }, async ({ member, params, body }) =>
  created({ segment: await createSegment(member.channel.id, params.episodeId, body) }),
);
