import { route } from '@/lib/api/handler';
import { changeShotState } from '@/lib/shots/queries';
import { shotParamsSchema, shotStateSchema } from '@/lib/shots/schemas';

export const PUT = route({ params: shotParamsSchema, body: shotStateSchema, channel: 'shots.changeState' }, async ({ member, params, body }) => ({
  shot: await changeShotState(member, params.shotId, body),
}));
