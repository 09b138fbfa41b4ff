import { route } from '@/lib/api/handler';
import { moveShot } from '@/lib/shots/queries';
import { moveShotSchema, shotParamsSchema } from '@/lib/shots/schemas';

export const PUT = route({ params: shotParamsSchema, body: moveShotSchema, channel: 'shots.edit' }, async ({ member, params, body }) => ({
  shot: await moveShot(member.channel.id, params.shotId, body.afterId),
}));
