import { route } from '@/lib/api/handler';
import { findDeal } from '@/lib/sponsors/deliverable-queries';
import { updateDueDate } from '@/lib/sponsors/due-date-queries';
import { dueDateParamsSchema, updateDueDateSchema } from '@/lib/sponsors/schemas';

export const PATCH = route({ params: dueDateParamsSchema, body: updateDueDateSchema, channel: 'sponsors.manage' }, async ({ member, params, body, user }) => {
  const dealId = await updateDueDate(member.channel.id, params.deliverableId, params.kind, body, user.id);
  return { deal: await findDeal(member.channel.id, dealId, member.channel.speakingRateWpm) };
});
