import { created, route } from '@/lib/api/handler';
import { channelParamsSchema } from '@/lib/channels/schemas';
import { findDeal } from '@/lib/sponsors/deliverable-queries';
import { createDeal, getPipeline, listDeals } from '@/lib/sponsors/queries';
import { createDealSchema, dealListQuerySchema } from '@/lib/sponsors/schemas';

export const GET = route({ params: channelParamsSchema, query: dealListQuerySchema, channel: 'sponsors.manage' }, async ({ member, query }) => {
  const [deals, pipeline] = await Promise.all([listDeals(member.channel.id, query), getPipeline(member.channel.id, { episodeId: query.episodeId })]);
  return { deals, pipeline };
});

export const POST = route({ params: channelParamsSchema, body: createDealSchema, channel: 'sponsors.manage' }, async ({ member, body }) => {
  const { id } = await createDeal(member.channel.id, body);
  return created({ deal: await findDeal(member.channel.id, id, member.channel.speakingRateWpm) });
});
