'use client';

import { signIn } from 'next-auth/react';
import { useRouter } from 'next/navigation';
import { useState, type FormEvent } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { ApiError, apiFetch } from '@/lib/api/client';
import { fieldErrorsFrom } from '@/lib/api/validation';
import type { ChannelDto } from '@/lib/channels/schemas';
import type { FieldErrors } from '@/lib/errors';
import { signUpSchema } from '@/lib/users/schemas';
import { channelPage } from '@/lib/api/paths';

export function SignUpForm() {
  const router = useRouter();
  const [fields, setFields] = useState<FieldErrors>({});
  const [error, setError] = useState<string | null>(null);
  const [pending, setPending] = useState(false);

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = Object.fromEntries(new FormData(event.currentTarget)) as Record<string, string>;
    const parsed = signUpSchema.safeParse(form);
    if (!parsed.success) {
      setFields(fieldErrorsFrom(parsed.error));
      return;
    }
    setFields({});
    setError(null);
    setPending(true);
    try {
      const { channel } = await apiFetch<{ channel: ChannelDto }>('/api/sign-up', { method: 'POST', body: parsed.data });
      await signIn('credentials', { redirect: false, email: parsed.data.email, password: parsed.data.password });
      router.push(channelPage(channel.slug));
      router.refresh();
    } catch (err) {
      setPending(false);
      if (err instanceof ApiError) {
        setFields(err.fields);
        setError(err.message);
      } else setError('Could not create the channel. Try again.');
    }
  }

  return (
    <form onSubmit={onSubmit} className="mt-6 space-y-4" noValidate>
      {error ? <Alert tone="attention">{error}</Alert> : null}
      <TextField label="Your name" name="name" autoComplete="name" required error={fields.name} />
      <TextField label="E-mail" name="email" type="email" autoComplete="email" required error={fields.email} />
      <TextField
        label="Password"
        name="password"
        type="password"
        autoComplete="new-password"
        required
        hint="At least 10 characters."
        error={fields.password}
      />
      <TextField label="Channel name" name="channelName" required error={fields.channelName} />
      <Button type="submit" className="w-full" disabled={pending}>
        {pending ? 'Creating…' : 'Create channel'}
      </Button>
    </form>
  );
}
