import { noContent, route } from '@/lib/api/handler';
import { deleteSegment, findSegment, updateSegment } from '@/lib/segments/queries';
import { segmentParamsSchema, updateSegmentSchema } from '@/lib/segments/schemas';

export const GET = route({ params: segmentParamsSchema, channel: 'scripts.read' }, async ({ member, params }) => ({
  segment: await findSegment(member.channel.id, params.segmentId),
}));

export const PATCH = route({ params: segmentParamsSchema, body: updateSegmentSchema, channel: 'episodes.edit' }, async ({ member, params, body }) => ({
  segment: await updateSegment(member.channel.id, params.segmentId, body),
}));

export const DELETE = route({ params: segmentParamsSchema, channel: 'episodes.edit' }, async ({ member, params }) => {
  await deleteSegment(member.channel.id, params.segmentId);
  return noContent();
});
