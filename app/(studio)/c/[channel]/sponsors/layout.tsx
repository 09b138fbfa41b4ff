import type { ReactNode } from 'react';
import { pageAccess } from '@/lib/auth/page-access';
import { requireMember } from '@/lib/auth/session';

// The access check runs here, above the list's loading boundary, so a refused visitor gets a real
// 403 status instead of a streamed 200 (issue 12 item 15). The deal page has no loading boundary for
// the same reason: its 404 for another channel's deal must reach the browser as a 404.
export default async function SponsorsLayout({ children, params }: { children: ReactNode; params: Promise<{ channel: string }> }) {
  await requireMember((await params).channel, pageAccess.sponsors.capability);
  return children;
}
