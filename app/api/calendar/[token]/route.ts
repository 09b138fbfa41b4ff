import { route } from '@/lib/api/handler';
import { approvalTokenParamsSchema } from '@/lib/approvals/schemas';
import { clientIp } from '@/lib/auth/sign-in';
import { renderCalendarFeed } from '@/lib/calendar/queries';
import { now } from '@/lib/clock/queries';

// Calendar apps fetch this without a session: the secret in the URL is the only key.
export const GET = route({ auth: 'none', params: approvalTokenParamsSchema }, async ({ req, params }) => {
  const body = await renderCalendarFeed(params.token, clientIp(req.headers), await now());
  // Source: RFC 5545 §8.1 registers text/calendar; private, because the feed is one person's.
  return new Response(body, { headers: { 'content-type': 'text/calendar; charset=utf-8', 'cache-control': 'private, no-store' } });
});
