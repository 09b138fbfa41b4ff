import Link from 'next/link';
import { deliverableKindLabels, type DeliverableDto } from '@/lib/sponsors/schemas';
import { SponsorChecksList } from './sponsor-checks-list';

/** On a segment that carries a sponsor read: the read's checks, live from the saved script. */
export function SegmentSponsorChecks({ deliverables, channelSlug, canManage }: { deliverables: DeliverableDto[]; channelSlug: string; canManage: boolean }) {
  return (
    <section aria-labelledby="sponsor-checks-heading" className="mt-8 space-y-3">
      <h2 id="sponsor-checks-heading" className="text-lg font-bold">
        Sponsor read
      </h2>
      {deliverables.map((d) => (
        <div key={d.id} className="space-y-2">
          <p className="text-sm text-ink-soft">
            {deliverableKindLabels[d.kind]}
            {d.disclosure ? (
              <>
                {' · disclosure: '}
                <q>{d.disclosure}</q>
              </>
            ) : null}
            {canManage ? (
              <>
                {' · '}
                <Link href={`/c/${channelSlug}/sponsors/${d.dealId}`} className="text-blueprint underline">
                  Open the deal
                </Link>
              </>
            ) : null}
          </p>
          {d.approval.changedSinceApproval ? (
            <p className="rounded-md bg-attention-soft px-3 py-2 text-sm font-bold text-attention-ink" data-approval="changed">
              Changed since approval: the sponsor approved script v{d.approval.approvedScriptVersion}.
            </p>
          ) : null}
          {d.checks ? <SponsorChecksList checks={d.checks} title="Checks against this script" /> : null}
        </div>
      ))}
    </section>
  );
}
