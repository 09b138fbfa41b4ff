import { route } from '@/lib/api/handler';
import { getSegmentSafety, setSegmentTools } from '@/lib/safety/queries';
import { segmentToolsSchema } from '@/lib/safety/schemas';
import { segmentShotsParamsSchema } from '@/lib/shots/schemas';

export const GET = route({ params: segmentShotsParamsSchema, channel: 'member' }, async ({ member, params }) => ({
  safety: await getSegmentSafety(member.channel.id, params.segmentId),
}));

export const PUT = route({ params: segmentShotsParamsSchema, body: segmentToolsSchema, channel: 'episodes.edit' }, async ({ member, params, body }) => ({
  safety: await setSegmentTools(member.channel.id, params.segmentId, body),
}));
