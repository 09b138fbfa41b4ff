import { created, route } from '@/lib/api/handler';
import { duplicateShot } from '@/lib/shots/queries';
import { shotParamsSchema } from '@/lib/shots/schemas';

export const POST = route({ params: shotParamsSchema, channel: 'shots.edit' }, async ({ member, params }) =>
  created({ shot: await duplicateShot(member.channel.id, params.shotId) }),
);
