import { route } from '@/lib/api/handler';
import { restoreShot } from '@/lib/shots/queries';
import { shotParamsSchema } from '@/lib/shots/schemas';

export const POST = route({ params: shotParamsSchema, channel: 'shots.edit' }, async ({ member, params }) => ({
  shot: await restoreShot(member.channel.id, params.shotId),
}));
