import { created, route } from '@/lib/api/handler';
import { createShot, listSegmentShots } from '@/lib/shots/queries';
import { createShotSchema, segmentShotsParamsSchema } from '@/lib/shots/schemas';

export const GET = route({ params: segmentShotsParamsSchema, channel: 'member' }, async ({ member, params }) => ({
  shots: await listSegmentShots(member.channel.id, params.segmentId),
}));

export const POST = route({ params: segmentShotsParamsSchema, body: createShotSchema, channel: 'shots.edit' }, async ({ member, params, body }) =>
  created({ shot: await createShot(member.channel.id, params.segmentId, body) }),
);
