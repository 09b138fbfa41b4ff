import type { Metadata } from 'next';
import { headers } from 'next/headers';
import { ApprovalForm } from '@/components/approvals/approval-form';
import { ScriptView } from '@/components/script/script-view';
import { lookupApproval } from '@/lib/approvals/queries';
import { approvalTokenParamsSchema } from '@/lib/approvals/schemas';
import { clientIp } from '@/lib/auth/sign-in';
import { AppError } from '@/lib/errors';

export const metadata: Metadata = { title: 'Review a sponsor read', robots: { index: false } };

const closed = {
  unknown: { title: 'This link is not valid', body: 'Check that you opened the whole link from the e-mail.' },
  revoked: { title: 'This link was withdrawn', body: 'The channel withdrew this link. Ask them for a new one if you still need to review the read.' },
  expired: { title: 'This link has expired', body: 'Ask the channel to send you a new link.' },
  throttled: { title: 'Too many tries', body: 'Too many invalid links were opened from here. Wait 15 minutes and try again.' },
} as const;

export default async function ApprovePage({ params }: { params: Promise<{ token: string }> }) {
  const parsed = approvalTokenParamsSchema.safeParse(await params);
  let view: Awaited<ReturnType<typeof lookupApproval>> | { status: 'throttled' } = { status: 'unknown' };
  if (parsed.success) {
    try {
      view = await lookupApproval(parsed.data.token, clientIp(await headers()));
    } catch (err) {
      if (!(err instanceof AppError && err.code === 'too_many_requests')) throw err;
      view = { status: 'throttled' };
    }
  }
  if (!('sponsorName' in view) || !parsed.success) {
    const copy = closed[view.status === 'open' || view.status === 'decided' ? 'unknown' : view.status];
    return (
      <>
        <h1 className="text-xl font-bold">{copy.title}</h1>
        <p className="mt-2 text-ink-soft">{copy.body}</p>
      </>
    );
  }
  return (
    <>
      <p className="text-sm font-bold uppercase tracking-wide text-ink-faint">{view.sponsorName} · review</p>
      <h1 className="text-xl font-bold">
        The sponsor read in “{view.episodeTitle}” by {view.channelName}
      </h1>
      <p className="mt-1 text-sm text-ink-soft">This is the script as it is now (version {view.scriptVersion}). The link works until {view.expiresAt.slice(0, 10)}.</p>
      <section aria-labelledby="script-heading" className="mt-6">
        <h2 id="script-heading" className="mb-2 font-bold">
          Script{view.segmentTitle ? `: ${view.segmentTitle}` : ''}
        </h2>
        <div className="rounded-md border border-paper-edge bg-white p-4">
          <ScriptView doc={view.script} />
        </div>
      </section>
      <section aria-labelledby="points-heading" className="mt-6">
        <h2 id="points-heading" className="mb-2 font-bold">
          Talking points
        </h2>
        <ScriptView doc={view.talkingPoints} />
        {view.disclosure ? (
          <p className="mt-3 text-sm">
            <strong>Disclosure:</strong> {view.disclosure}
          </p>
        ) : null}
        {view.mustSay.length ? (
          <p className="mt-1 text-sm">
            <strong>Must-say:</strong> {view.mustSay.map((p) => `“${p}”`).join(', ')}
          </p>
        ) : null}
      </section>
      <div className="mt-8 border-t border-paper-edge pt-6">
        {view.status === 'decided' ? (
          <p role="status" className="font-bold">
            {view.decision === 'approved' ? 'You approved this read. Thank you.' : 'You asked for changes. The channel will send a new link when the script is ready.'}
          </p>
        ) : (
          <ApprovalForm token={parsed.data.token} scriptVersion={view.scriptVersion} />
        )}
      </div>
    </>
  );
}
