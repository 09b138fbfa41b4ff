'use client';

import { signIn } from 'next-auth/react';
import { useRouter } from 'next/navigation';
import { useState, type FormEvent } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { ApiError, apiFetch } from '@/lib/api/client';
import { fieldErrorsFrom } from '@/lib/api/validation';
import type { FieldErrors } from '@/lib/errors';
import { signUpSchema } from '@/lib/users/schemas';

export function SignUpForm() {
  const router = useRouter();
  const [fields, setFields] = useState<FieldErrors>({});
  const [error, setError] = useState<string | null>(null);
  const [notice, setNotice] = useState<string | null>(null);
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
    setNotice(null);
    setPending(true);
    try {
      // The server answers the same whether or not the address had an account; signing in tells.
      await apiFetch<{ message: string }>('/api/sign-up', { method: 'POST', body: parsed.data });
      const result = await signIn('credentials', { redirect: false, email: parsed.data.email, password: parsed.data.password });
      if (result && !result.error) {
        router.push('/');
        router.refresh();
        return;
      }
      setPending(false);
      setNotice('We sent a message to that address. If you already have a Kerfline account, sign in with it instead.');
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
      {notice ? <Alert tone="info">{notice}</Alert> : null}
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
