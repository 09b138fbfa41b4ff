import { route } from '@/lib/api/handler';
import { decideApproval, lookupApproval } from '@/lib/approvals/queries';
import { approvalTokenParamsSchema, decideApprovalSchema } from '@/lib/approvals/schemas';
import { clientIp } from '@/lib/auth/sign-in';
import { notFound } from '@/lib/errors';

// The sponsor's side: no sign-in, the token is the only key, and it opens one read and nothing else.
export const GET = route({ auth: 'none', params: approvalTokenParamsSchema }, async ({ req, params }) => {
  const view = await lookupApproval(params.token, clientIp(req.headers));
  if (view.status === 'unknown' || view.status === 'revoked' || view.status === 'expired') throw notFound('That approval link');
  return { approval: view };
});

export const POST = route({ auth: 'none', params: approvalTokenParamsSchema, body: decideApprovalSchema }, async ({ req, params, body }) =>
  decideApproval(params.token, clientIp(req.headers), body),
);
