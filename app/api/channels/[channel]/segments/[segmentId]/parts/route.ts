import { created, route } from '@/lib/api/handler';
import { createPart, listSegmentParts } from '@/lib/parts/queries';
import { createPartSchema, segmentPartsParamsSchema } from '@/lib/parts/schemas';

export const GET = route({ params: segmentPartsParamsSchema, channel: 'cutlist.read' }, async ({ member, params }) => ({
  parts: await listSegmentParts(member.channel.id, params.segmentId),
}));

export const POST = route({ params: segmentPartsParamsSchema, body: createPartSchema, channel: 'cutlist.edit' }, async ({ member, params, body }) =>
  created({ part: await createPart(member.channel.id, params.segmentId, body) }),
);
