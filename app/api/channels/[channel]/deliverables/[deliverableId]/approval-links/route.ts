import { created, route } from '@/lib/api/handler';
import { sendApprovalLink } from '@/lib/approvals/queries';
import { sendApprovalSchema } from '@/lib/approvals/schemas';
import { deliverableParamsSchema } from '@/lib/sponsors/schemas';

export const POST = route({ params: deliverableParamsSchema, body: sendApprovalSchema, channel: 'sponsors.manage' }, async ({ member, params, body, user }) =>
  created(await sendApprovalLink(member.channel, params.deliverableId, body.contactEmail, user)),
);
