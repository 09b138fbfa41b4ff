'use client';

import Link from 'next/link';
import { usePathname } from 'next/navigation';
import { useViewer } from '@/components/providers/viewer-provider';
import { buttonClasses } from '@/components/ui/button';
import { channelPage } from '@/lib/api/paths';
import { pageCapability } from '@/lib/auth/page-access';
import { roleLabels, rolesWith, type Role } from '@/lib/auth/policy';

const joinRoles = (rs: readonly Role[]) => {
  const names = rs.map((r) => `the ${roleLabels[r]}`);
  return names.length > 1 ? `${names.slice(0, -1).join(', ')} and ${names[names.length - 1]}` : (names[0] ?? 'another role');
};

/**
 * The one not-allowed page of a channel (issue 15): inside the app shell, answered with a real 403 by
 * Next's forbidden(), saying which role the page is for and who can change a role.
 */
export function NotAllowed() {
  const pathname = usePathname();
  const viewer = useViewer();
  const capability = pageCapability(pathname);
  const slug = pathname.split('/')[2] ?? '';
  return (
    <section aria-labelledby="not-allowed-heading" className="mx-auto max-w-lg py-10">
      <p className="text-sm font-bold uppercase tracking-wide text-ink-faint">403 · Not allowed</p>
      <h1 id="not-allowed-heading" className="mt-1 text-2xl font-bold">
        Not for your role
      </h1>
      <p className="mt-3 text-ink-soft">
        {/* One string each, so the server's HTML carries the sentence whole (no React text separators). */}
        {capability ? `This page is for ${joinRoles(rolesWith(capability))}. ` : null}
        {`You are signed in as ${roleLabels[viewer.role]} on this channel. A Host of the channel can change your role under Settings, Crew.`}
      </p>
      <Link href={channelPage(slug)} className={buttonClasses('secondary', 'mt-6')}>
        Back to the dashboard
      </Link>
    </section>
  );
}
