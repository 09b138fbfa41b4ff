'use client';

import { signIn } from 'next-auth/react';
import { useRouter } from 'next/navigation';
import { useState, type FormEvent } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';

const FAILED =
  'That e-mail and password did not match, or there were too many tries. Check them, or wait a minute and try again.';

export function SignInForm({ callbackUrl, defaultEmail }: { callbackUrl: string; defaultEmail: string }) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const [pending, setPending] = useState(false);

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    setPending(true);
    setError(null);
    const result = await signIn('credentials', {
      redirect: false,
      email: String(form.get('email') ?? ''),
      password: String(form.get('password') ?? ''),
    }).catch(() => null);
    setPending(false);
    if (!result) return setError('Could not reach Kerfline. Check the connection and try again.');
    if (result.error) return setError(FAILED);
    router.push(callbackUrl);
    router.refresh();
  }

  return (
    <form onSubmit={onSubmit} className="mt-6 space-y-4" noValidate>
      {error ? <Alert tone="attention">{error}</Alert> : null}
      <TextField label="E-mail" name="email" type="email" autoComplete="email" required defaultValue={defaultEmail} />
      <TextField label="Password" name="password" type="password" autoComplete="current-password" required />
      <Button type="submit" className="w-full" disabled={pending}>
        {pending ? 'Signing in…' : 'Sign in'}
      </Button>
    </form>
  );
}
