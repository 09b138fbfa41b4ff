import type { Metadata } from 'next';
import Link from 'next/link';
import { AcceptInvitation } from '@/components/auth/accept-invitation';
import { buttonClasses } from '@/components/ui/button';
import { roleLabels } from '@/lib/auth/policy';
import { getCurrentUser } from '@/lib/auth/session';
import { lookupInvitation } from '@/lib/crew/queries';
import { tokenParamsSchema, type InvitationStatus } from '@/lib/crew/schemas';

export const metadata: Metadata = { title: 'Invitation' };

const closed: Record<Exclude<InvitationStatus, 'open'>, { title: string; body: string }> = {
  expired: { title: 'This invitation has expired', body: 'Invitations work for 7 days. Ask the Host of the channel to resend it.' },
  revoked: { title: 'This invitation was withdrawn', body: 'The Host of the channel withdrew it. Ask them if you think that was a mistake.' },
  accepted: { title: 'This invitation has already been used', body: 'Each link works once. If it was you, sign in to reach the channel.' },
  unknown: { title: 'This link is not valid', body: 'Check that you opened the whole link from the e-mail, or ask for a new invitation.' },
};

export default async function InvitePage({ params }: { params: Promise<{ token: string }> }) {
  const parsed = tokenParamsSchema.safeParse(await params);
  const invitation = parsed.success ? await lookupInvitation(parsed.data.token) : { status: 'unknown' as const };
  if (invitation.status !== 'open' || !parsed.success) {
    const copy = closed[invitation.status === 'open' ? 'unknown' : invitation.status];
    return (
      <>
        <h1 className="text-xl font-bold">{copy.title}</h1>
        <p className="mt-2 text-ink-soft">{copy.body}</p>
        <Link href="/sign-in" className={buttonClasses('secondary', 'mt-6')}>
          Go to sign-in
        </Link>
      </>
    );
  }
  const user = await getCurrentUser();
  return (
    <>
      <h1 className="text-xl font-bold">Join {invitation.channelName}</h1>
      <p className="mt-1 text-ink-soft">
        You are invited as <strong>{roleLabels[invitation.role ?? 'editor']}</strong> for{' '}
        <span className="font-mono">{invitation.email}</span>.
      </p>
      <AcceptInvitation
        token={parsed.data.token}
        email={invitation.email ?? ''}
        accountExists={invitation.accountExists ?? false}
        signedInAs={user?.email ?? null}
      />
    </>
  );
}
