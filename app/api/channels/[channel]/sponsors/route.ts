import { created, route } from '@/lib/api/handler';
import { channelParamsSchema } from '@/lib/channels/schemas';
import { createSponsor, listSponsors } from '@/lib/sponsors/queries';
import { createSponsorSchema } from '@/lib/sponsors/schemas';

export const GET = route({ params: channelParamsSchema, channel: 'sponsors.manage' }, async ({ member }) => ({
  sponsors: await listSponsors(member.channel.id),
}));

export const POST = route({ params: channelParamsSchema, body: createSponsorSchema, channel: 'sponsors.manage' }, async ({ member, body }) =>
  created({ sponsor: await createSponsor(member.channel.id, body) }),
);
