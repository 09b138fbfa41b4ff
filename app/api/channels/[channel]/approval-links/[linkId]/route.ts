import { noContent, route } from '@/lib/api/handler';
import { revokeApprovalLink } from '@/lib/approvals/queries';
import { approvalLinkParamsSchema } from '@/lib/approvals/schemas';

export const DELETE = route({ params: approvalLinkParamsSchema, channel: 'sponsors.manage' }, async ({ member, params }) => {
  await revokeApprovalLink(member.channel.id, params.linkId);
  return noContent();
});
