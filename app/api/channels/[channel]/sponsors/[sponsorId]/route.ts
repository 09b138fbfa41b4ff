import { noContent, route } from '@/lib/api/handler';
import { deleteSponsor, updateSponsor } from '@/lib/sponsors/queries';
import { sponsorParamsSchema, updateSponsorSchema } from '@/lib/sponsors/schemas';

export const PATCH = route({ params: sponsorParamsSchema, body: updateSponsorSchema, channel: 'sponsors.manage' }, async ({ member, params, body }) => ({
  sponsor: await updateSponsor(member.channel.id, params.sponsorId, body),
}));

/** Only a sponsor without deals goes: 409 otherwise, so no deal is lost with it. */
export const DELETE = route({ params: sponsorParamsSchema, channel: 'sponsors.manage' }, async ({ member, params }) => {
  await deleteSponsor(member.channel.id, params.sponsorId);
  return noContent();
});
