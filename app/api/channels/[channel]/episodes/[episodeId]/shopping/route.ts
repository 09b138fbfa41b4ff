import { route } from '@/lib/api/handler';
import { setShoppingTick } from '@/lib/cut-plans/queries';
import { episodePlanParamsSchema, shoppingTickSchema } from '@/lib/cut-plans/schemas';

export const PUT = route({ params: episodePlanParamsSchema, body: shoppingTickSchema, channel: 'cutlist.edit' }, async ({ member, params, body, user }) => ({
  tick: await setShoppingTick(member.channel.id, params.episodeId, user.id, body),
}));
