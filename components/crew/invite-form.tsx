'use client';

import type { FormEvent } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';
import { useSchemaForm } from '@/components/ui/use-schema-form';
import { roleLabels, roles } from '@/lib/auth/policy';
import { inviteSchema } from '@/lib/crew/schemas';
import type { useCrewMutations } from './use-crew';

export function InviteForm({ invite: crewInvite }: { invite: ReturnType<typeof useCrewMutations>['invite'] }) {
  // The crew's own mutation refreshes the lists; this one holds the form's answer.
  const { fields, submit, mutation: invite, message } = useSchemaForm({ schema: inviteSchema, send: (input) => crewInvite.mutateAsync(input) });

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const formEl = event.currentTarget;
    submit(Object.fromEntries(new FormData(formEl)), { onSuccess: () => formEl.reset() });
  }

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-labelledby="invite-heading">
      <h2 id="invite-heading" className="text-lg font-bold">
        Invite someone
      </h2>
      {message ? <Alert tone="attention">{message}</Alert> : null}
      {invite.data ? (
        invite.data.delivered ? (
          <Alert tone="ok">Invitation sent to {invite.data.invitation.email}.</Alert>
        ) : (
          <Alert tone="attention">
            The invitation to {invite.data.invitation.email} was saved, but the e-mail could not be sent. Try Resend in a moment.
          </Alert>
        )
      ) : null}
      <div className="grid gap-4 sm:grid-cols-[2fr_1fr_auto] sm:items-start">
        <TextField label="E-mail" name="email" type="email" autoComplete="off" required error={fields.email} />
        <SelectField label="Role" name="role" defaultValue="shop_hand" error={fields.role}>
          {roles.map((r) => (
            <option key={r} value={r}>
              {roleLabels[r]}
            </option>
          ))}
        </SelectField>
        <Button type="submit" className="sm:mt-6" disabled={invite.isPending}>
          {invite.isPending ? 'Sending…' : 'Send invitation'}
        </Button>
      </div>
    </form>
  );
}
