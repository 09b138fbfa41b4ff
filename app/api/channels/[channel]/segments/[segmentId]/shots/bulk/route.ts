import { created, route } from '@/lib/api/handler';
import { createShotsFromText } from '@/lib/shots/queries';
import { bulkShotsSchema, segmentShotsParamsSchema } from '@/lib/shots/schemas';

export const POST = route({ params: segmentShotsParamsSchema, body: bulkShotsSchema, channel: 'shots.edit' }, async ({ member, params, body }) =>
  created({ shots: await createShotsFromText(member.channel.id, params.segmentId, body) }),
);
