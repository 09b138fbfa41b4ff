'use client';

import { signIn } from 'next-auth/react';
import { useRouter } from 'next/navigation';
import type { FormEvent } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { useSchemaForm } from '@/components/ui/use-schema-form';
import { apiFetch } from '@/lib/api/client';
import { signUpSchema } from '@/lib/users/schemas';

export function SignUpForm() {
  const router = useRouter();
  const { fields, submit, mutation, message } = useSchemaForm({
    schema: signUpSchema,
    // The server answers the same whether or not the address had an account; signing in tells.
    send: async (input) => {
      await apiFetch<{ message: string }>('/api/sign-up', { method: 'POST', body: input });
      const result = await signIn('credentials', { redirect: false, email: input.email, password: input.password });
      return Boolean(result && !result.error);
    },
    onSuccess: (signedIn) => {
      if (!signedIn) return;
      router.push('/');
      router.refresh();
    },
    failureMessage: 'Could not create the channel. Try again.',
  });
  // Signed in: the button stays pending while the channel page loads.
  const pending = mutation.isPending || mutation.data === true;

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    submit(Object.fromEntries(new FormData(event.currentTarget)));
  }

  return (
    <form onSubmit={onSubmit} className="mt-6 space-y-4" noValidate>
      {message ? <Alert tone="attention">{message}</Alert> : null}
      {mutation.data === false ? (
        <Alert tone="info">We sent a message to that address. If you already have a Kerfline account, sign in with it instead.</Alert>
      ) : null}
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
