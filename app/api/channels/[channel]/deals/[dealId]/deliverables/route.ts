import { created, route } from '@/lib/api/handler';
import { createDeliverable, findDeal } from '@/lib/sponsors/deliverable-queries';
import { createDeliverableSchema, dealParamsSchema } from '@/lib/sponsors/schemas';

export const POST = route({ params: dealParamsSchema, body: createDeliverableSchema, channel: 'sponsors.manage' }, async ({ member, params, body, user }) => {
  await createDeliverable(member.channel.id, params.dealId, body, user.id);
  return created({ deal: await findDeal(member.channel.id, params.dealId, member.channel.speakingRateWpm) });
});
