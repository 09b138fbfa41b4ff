'use client';

import { useState, type FormEvent } from 'react';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { ApiError } from '@/lib/api/client';
import type { ApprovalLinkDto } from '@/lib/approvals/schemas';
import type { ApprovalStateDto } from '@/lib/sponsors/schemas';
import { useSponsorMutations } from './use-sponsor-mutations';

const linkState = (l: ApprovalLinkDto) =>
  l.decision === 'approved'
    ? `approved script v${l.scriptVersion}`
    : l.decision === 'changes_requested'
      ? 'changes requested'
      : l.revoked
        ? 'withdrawn'
        : l.expired
          ? 'expired'
          : 'waiting';

/** Send the sponsor contact a link to approve the read; see what they answered and whether the script moved on. */
export function ApprovalPanel(props: { channelSlug: string; deliverableId: string; approval: ApprovalStateDto; links: ApprovalLinkDto[]; defaultEmail: string; hasSegment: boolean }) {
  const m = useSponsorMutations(props.channelSlug);
  const [error, setError] = useState<string | null>(null);
  const [note, setNote] = useState<string | null>(null);
  function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const contactEmail = String(new FormData(event.currentTarget).get('contactEmail') ?? '').trim();
    setError(null);
    m.sendApprovalLink.mutate(
      { deliverableId: props.deliverableId, contactEmail },
      {
        onSuccess: (r) => setNote(r.delivered ? `Link sent to ${contactEmail}.` : 'The link was made but the e-mail did not go; withdraw it and send again.'),
        onError: (err) => setError(err instanceof ApiError ? (err.fields.contactEmail ?? err.message) : 'Could not send the link.'),
      },
    );
  }
  const { approval } = props;
  return (
    <div>
      <h4 className="mb-2 text-sm font-bold">Sponsor approval</h4>
      {approval.changedSinceApproval ? (
        <p className="mb-2 rounded-md bg-attention-soft px-3 py-2 text-sm font-bold text-attention-ink" data-approval="changed">
          Changed since approval: the sponsor approved script v{approval.approvedScriptVersion}; the script has been saved since.
        </p>
      ) : approval.approvedScriptVersion !== null ? (
        <p className="mb-2 rounded-md bg-ok-soft px-3 py-2 text-sm text-ok" data-approval="approved">
          Approved at script v{approval.approvedScriptVersion}.
        </p>
      ) : null}
      {props.hasSegment ? (
        <form onSubmit={submit} noValidate className="flex flex-wrap items-end gap-2" aria-label="Send approval link">
          <TextField label="Sponsor contact e-mail" name="contactEmail" type="email" defaultValue={props.defaultEmail} error={error ?? undefined} className="min-w-56 flex-1" />
          <Button type="submit" variant="secondary" disabled={m.sendApprovalLink.isPending}>
            Send approval link
          </Button>
        </form>
      ) : (
        <p className="text-sm text-ink-soft">Pick the segment that carries the read to ask the sponsor for approval.</p>
      )}
      {note ? (
        <p role="status" className="mt-1 text-sm text-ink-soft">
          {note}
        </p>
      ) : null}
      {props.links.length ? (
        <ul className="mt-2 space-y-1 text-sm">
          {props.links.map((l) => (
            <li key={l.id} className="flex flex-wrap items-center gap-2">
              <span className="font-mono text-xs">{l.createdAt.slice(0, 10)}</span>
              <span>{l.contactEmail}</span>
              <span className="text-ink-soft">· {linkState(l)}</span>
              {l.comment ? <q className="basis-full text-ink-soft">{l.comment}</q> : null}
              {!l.decision && !l.revoked && !l.expired ? (
                <Button variant="quiet" onClick={() => m.revokeApprovalLink.mutate(l.id)} aria-label={`Withdraw the link sent to ${l.contactEmail}`}>
                  Withdraw
                </Button>
              ) : null}
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}
