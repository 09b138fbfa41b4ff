import { route } from '@/lib/api/handler';
import { updateSponsor } from '@/lib/sponsors/queries';
import { sponsorParamsSchema, updateSponsorSchema } from '@/lib/sponsors/schemas';

export const PATCH = route({ params: sponsorParamsSchema, body: updateSponsorSchema, channel: 'sponsors.manage' }, async ({ member, params, body }) => ({
  sponsor: await updateSponsor(member.channel.id, params.sponsorId, body),
}));
