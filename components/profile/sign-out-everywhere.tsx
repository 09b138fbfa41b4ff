'use client';

import { useMutation } from '@tanstack/react-query';
import { signOut } from 'next-auth/react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { apiFetch } from '@/lib/api/client';

/** Ends every session of this person (a lost phone, a shared shop computer), then this one. */
export function SignOutEverywhere() {
  const end = useMutation({
    mutationFn: () => apiFetch<void>('/api/profile/sessions', { method: 'DELETE' }),
    onSuccess: () => void signOut({ callbackUrl: '/sign-in' }),
  });
  return (
    <div className="mt-6 border-t border-paper-edge pt-4">
      <h3 className="font-bold">Signed-in devices</h3>
      <p className="mt-1 text-sm text-ink-soft">
        Signs you out on every phone and computer where you are signed in, this one included.
      </p>
      {end.isError ? (
        <div className="mt-3">
          <Alert tone="attention">{end.error.message}</Alert>
        </div>
      ) : null}
      <Button type="button" variant="secondary" className="mt-3" disabled={end.isPending || end.isSuccess} onClick={() => end.mutate()}>
        {end.isPending || end.isSuccess ? 'Signing out…' : 'Sign out everywhere'}
      </Button>
    </div>
  );
}
