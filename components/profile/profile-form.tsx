'use client';

import { useRouter } from 'next/navigation';
import type { FormEvent } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { useSchemaForm } from '@/components/ui/use-schema-form';
import { apiFetch } from '@/lib/api/client';
import { api } from '@/lib/api/paths';
import { updateProfileSchema, type ProfileDto } from '@/lib/users/schemas';

export function ProfileForm({ profile }: { profile: ProfileDto }) {
  const router = useRouter();
  const { fields, submit, mutation: save } = useSchemaForm({
    schema: updateProfileSchema,
    send: (input) => apiFetch<{ profile: ProfileDto }>(api('profile'), { method: 'PATCH', body: input }),
    onSuccess: () => router.refresh(),
  });

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    submit({ name: String(form.get('name') ?? ''), emailOptOut: form.get('shotMail') !== 'on' });
  }

  return (
    <form onSubmit={onSubmit} className="mt-4 space-y-4" noValidate>
      {save.isError ? <Alert tone="attention">{save.error.message}</Alert> : null}
      {save.isSuccess ? <Alert tone="ok">Saved.</Alert> : null}
      <TextField label="Your name" name="name" defaultValue={profile.name} required error={fields.name} autoComplete="name" />
      <p className="text-sm">
        <span className="text-ink-faint">E-mail: </span>
        <span className="font-mono">{profile.email}</span>
      </p>
      <label className="flex min-h-touch items-start gap-3 text-sm">
        <input type="checkbox" name="shotMail" defaultChecked={!profile.emailOptOut} className="mt-1 h-5 w-5 accent-blueprint" />
        <span>
          <span className="font-bold">E-mail me when shots are assigned to me</span>
          <span className="block text-ink-faint">One message per burst of changes, listing new shots and shots taken off your list.</span>
        </span>
      </label>
      {fields.emailOptOut ? <p className="text-sm text-attention-ink">{fields.emailOptOut}</p> : null}
      <Button type="submit" disabled={save.isPending}>
        {save.isPending ? 'Saving…' : 'Save profile'}
      </Button>
    </form>
  );
}
