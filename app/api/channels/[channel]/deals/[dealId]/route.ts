import { noContent, route } from '@/lib/api/handler';
import { findDeal } from '@/lib/sponsors/deliverable-queries';
import { deleteDeal, updateDeal } from '@/lib/sponsors/queries';
import { dealParamsSchema, updateDealSchema } from '@/lib/sponsors/schemas';

export const GET = route({ params: dealParamsSchema, channel: 'sponsors.manage' }, async ({ member, params }) => ({
  deal: await findDeal(member.channel.id, params.dealId, member.channel.speakingRateWpm),
}));

export const PATCH = route({ params: dealParamsSchema, body: updateDealSchema, channel: 'sponsors.manage' }, async ({ member, params, body, user }) => {
  await updateDeal(member.channel.id, params.dealId, body, user.id);
  return { deal: await findDeal(member.channel.id, params.dealId, member.channel.speakingRateWpm) };
});

export const DELETE = route({ params: dealParamsSchema, channel: 'sponsors.manage' }, async ({ member, params }) => {
  await deleteDeal(member.channel.id, params.dealId);
  return noContent();
});
