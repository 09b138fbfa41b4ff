import { noContent, route } from '@/lib/api/handler';
import { deleteDeliverable, findDeal, updateDeliverable } from '@/lib/sponsors/deliverable-queries';
import { deliverableParamsSchema, updateDeliverableSchema } from '@/lib/sponsors/schemas';

export const PATCH = route({ params: deliverableParamsSchema, body: updateDeliverableSchema, channel: 'sponsors.manage' }, async ({ member, params, body, user }) => {
  const dealId = await updateDeliverable(member.channel.id, params.deliverableId, body, user.id);
  return { deal: await findDeal(member.channel.id, dealId, member.channel.speakingRateWpm) };
});

export const DELETE = route({ params: deliverableParamsSchema, channel: 'sponsors.manage' }, async ({ member, params }) => {
  await deleteDeliverable(member.channel.id, params.deliverableId);
  return noContent();
});
