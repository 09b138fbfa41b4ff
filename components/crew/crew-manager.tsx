'use client';

import { useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { roleLabels, roles, isRole } from '@/lib/auth/policy';
import type { CrewMemberDto, InvitationDto } from '@/lib/crew/schemas';
import { InviteForm } from './invite-form';
import { useCrew, useCrewMutations, useInvitations } from './use-crew';

type Props = { channelSlug: string; currentUserId: string; initialCrew: CrewMemberDto[]; initialInvitations: InvitationDto[] };

const dateFormat = new Intl.DateTimeFormat('en', { dateStyle: 'medium', timeZone: 'UTC' });

export function CrewManager({ channelSlug, currentUserId, initialCrew, initialInvitations }: Props) {
  const crew = useCrew(channelSlug, initialCrew);
  const invitations = useInvitations(channelSlug, initialInvitations);
  const m = useCrewMutations(channelSlug);
  const [confirming, setConfirming] = useState<string | null>(null);
  const failure = [m.changeRole, m.remove, m.resend, m.revoke].find((x) => x.isError)?.error;

  return (
    <div className="space-y-8">
      <section className="rounded-card border border-paper-edge bg-white/60 p-5 shadow-card">
        <InviteForm invite={m.invite} />
      </section>

      {failure ? <Alert tone="attention">{failure.message}</Alert> : null}
      {m.resend.data ? (
        <Alert tone={m.resend.data.delivered ? 'ok' : 'attention'}>
          {m.resend.data.delivered
            ? `A new link was sent to ${m.resend.data.invitation.email}; the old one no longer works.`
            : 'A new link was made but the e-mail could not be sent. Try again in a moment.'}
        </Alert>
      ) : null}

      <section aria-labelledby="crew-list-heading">
        <h2 id="crew-list-heading" className="mb-3 text-lg font-bold">
          Crew ({crew.data.length})
        </h2>
        <ul className="divide-y divide-paper-edge rounded-card border border-paper-edge bg-white/60">
          {crew.data.map((person) => (
            <li key={person.userId} className="flex flex-wrap items-center gap-3 p-4">
              <div className="min-w-0 flex-1">
                <p className="font-bold">
                  {person.name}
                  {person.userId === currentUserId ? <span className="font-normal text-ink-faint"> (you)</span> : null}
                </p>
                <p className="truncate font-mono text-xs text-ink-soft">{person.email}</p>
              </div>
              <label className="sr-only" htmlFor={`role-${person.userId}`}>
                Role of {person.name}
              </label>
              <select
                id={`role-${person.userId}`}
                value={person.role}
                disabled={m.changeRole.isPending}
                onChange={(e) => {
                  const role = e.target.value;
                  if (isRole(role)) m.changeRole.mutate({ userId: person.userId, role });
                }}
                className="min-h-touch rounded-md border border-ink/30 bg-white px-3 text-sm"
              >
                {roles.map((r) => (
                  <option key={r} value={r}>
                    {roleLabels[r]}
                  </option>
                ))}
              </select>
              {confirming === person.userId ? (
                <span className="flex gap-2">
                  <Button variant="danger" onClick={() => m.remove.mutate(person.userId, { onSettled: () => setConfirming(null) })}>
                    Remove {person.name}
                  </Button>
                  <Button variant="quiet" onClick={() => setConfirming(null)}>
                    Cancel
                  </Button>
                </span>
              ) : (
                <Button variant="quiet" onClick={() => setConfirming(person.userId)} aria-label={`Remove ${person.name} from the crew`}>
                  Remove
                </Button>
              )}
            </li>
          ))}
        </ul>
      </section>

      <section aria-labelledby="invitations-heading">
        <h2 id="invitations-heading" className="mb-3 text-lg font-bold">
          Open invitations
        </h2>
        {invitations.data.length === 0 ? (
          <p className="rounded-card border border-dashed border-paper-edge p-4 text-sm text-ink-soft">
            No open invitations. People you invite show here until they accept.
          </p>
        ) : (
          <ul className="divide-y divide-paper-edge rounded-card border border-paper-edge bg-white/60">
            {invitations.data.map((inv) => (
              <li key={inv.id} className="flex flex-wrap items-center gap-3 p-4">
                <div className="min-w-0 flex-1">
                  <p className="truncate font-mono text-sm">{inv.email}</p>
                  <p className="text-xs text-ink-soft">
                    {roleLabels[inv.role]} ·{' '}
                    {inv.expired ? (
                      <span className="font-bold text-attention-ink">expired</span>
                    ) : (
                      `expires ${dateFormat.format(new Date(inv.expiresAt))}`
                    )}
                    {inv.sentAt ? '' : ' · e-mail not sent yet'}
                  </p>
                </div>
                <Button variant="secondary" disabled={m.resend.isPending} onClick={() => m.resend.mutate(inv.id)}>
                  Resend<span className="sr-only"> to {inv.email}</span>
                </Button>
                <Button variant="quiet" disabled={m.revoke.isPending} onClick={() => m.revoke.mutate(inv.id)}>
                  Withdraw<span className="sr-only"> invitation for {inv.email}</span>
                </Button>
              </li>
            ))}
          </ul>
        )}
      </section>
    </div>
  );
}
