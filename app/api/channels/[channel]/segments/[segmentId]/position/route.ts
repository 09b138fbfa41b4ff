import { route } from '@/lib/api/handler';
import { moveSegment } from '@/lib/segments/queries';
import { moveSegmentSchema, segmentParamsSchema } from '@/lib/segments/schemas';

export const PUT = route({ params: segmentParamsSchema, body: moveSegmentSchema, channel: 'episodes.edit' }, async ({ member, params, body }) => ({
  segment: await moveSegment(member.channel.id, params.segmentId, body.afterId),
}));
