'use client';

import { signIn, signOut } from 'next-auth/react';
import { useRouter } from 'next/navigation';
import { useState, type FormEvent } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { useSchemaForm } from '@/components/ui/use-schema-form';
import { ApiError, apiFetch } from '@/lib/api/client';
import { acceptAsNewSchema } from '@/lib/crew/schemas';
import { api, channelPage } from '@/lib/api/paths';

type Props = { token: string; email: string; accountExists: boolean; signedInAs: string | null };
type Accepted = { accepted: { channelSlug: string } };

export function AcceptInvitation({ token, email, accountExists, signedInAs }: Props) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const [pending, setPending] = useState(false);
  const signedInAsInvitee = signedInAs?.toLowerCase() === email.toLowerCase();
  const newAccount = useSchemaForm({
    schema: acceptAsNewSchema,
    send: async (input) => {
      const { accepted } = await apiFetch<Accepted>(api('invitations', token, 'accept'), { method: 'POST', body: input });
      await signIn('credentials', { redirect: false, email, password: input.password });
      return accepted;
    },
    onSuccess: (accepted) => {
      router.push(channelPage(accepted.channelSlug));
      router.refresh();
    },
  });
  // Joined: the button stays pending while the channel page loads.
  const creating = newAccount.mutation.isPending || newAccount.mutation.isSuccess;

  async function join(afterSignIn?: { password: string }) {
    setPending(true);
    setError(null);
    try {
      if (afterSignIn) {
        const result = await signIn('credentials', { redirect: false, email, password: afterSignIn.password });
        if (!result || result.error) {
          setPending(false);
          return setError('That password did not match, or there were too many tries. Wait a minute and try again.');
        }
      }
      const { accepted } = await apiFetch<Accepted>(api('invitations', token, 'accept'), { method: 'POST', body: {} });
      router.push(channelPage(accepted.channelSlug));
      router.refresh();
    } catch (err) {
      setPending(false);
      setError(err instanceof ApiError ? err.message : 'Something went wrong. Try again.');
    }
  }

  function createAccount(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    newAccount.submit(Object.fromEntries(new FormData(event.currentTarget)));
  }

  if (signedInAs && !signedInAsInvitee) {
    return (
      <div className="mt-6 space-y-4">
        <Alert tone="attention">
          You are signed in as <span className="font-mono">{signedInAs}</span>. This invitation is for{' '}
          <span className="font-mono">{email}</span>.
        </Alert>
        <Button variant="secondary" onClick={() => signOut({ redirect: false }).then(() => router.refresh())}>
          Sign out to continue
        </Button>
      </div>
    );
  }

  if (signedInAsInvitee) {
    return (
      <div className="mt-6 space-y-4">
        {error ? <Alert tone="attention">{error}</Alert> : null}
        <Button className="w-full" disabled={pending} onClick={() => join()}>
          {pending ? 'Joining…' : 'Join the channel'}
        </Button>
      </div>
    );
  }

  if (accountExists) {
    return (
      <form
        className="mt-6 space-y-4"
        noValidate
        onSubmit={(e) => {
          e.preventDefault();
          void join({ password: String(new FormData(e.currentTarget).get('password') ?? '') });
        }}
      >
        <p className="text-sm text-ink-soft">You already have a Kerfline account. Sign in to join.</p>
        {error ? <Alert tone="attention">{error}</Alert> : null}
        <TextField label="Password" name="password" type="password" autoComplete="current-password" required />
        <Button type="submit" className="w-full" disabled={pending}>
          {pending ? 'Joining…' : 'Sign in and join'}
        </Button>
      </form>
    );
  }

  return (
    <form onSubmit={createAccount} className="mt-6 space-y-4" noValidate>
      {newAccount.message ? <Alert tone="attention">{newAccount.message}</Alert> : null}
      <TextField label="Your name" name="name" autoComplete="name" required error={newAccount.fields.name} />
      <TextField
        label="Choose a password"
        name="password"
        type="password"
        autoComplete="new-password"
        required
        hint="At least 10 characters."
        error={newAccount.fields.password}
      />
      <Button type="submit" className="w-full" disabled={creating}>
        {creating ? 'Joining…' : 'Create account and join'}
      </Button>
    </form>
  );
}
