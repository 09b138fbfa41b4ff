import type { Metadata } from 'next';
import Link from 'next/link';
import { redirect } from 'next/navigation';
import { SignInForm } from '@/components/auth/sign-in-form';
import { safeRedirectPath } from '@/lib/auth/redirect';
import { getCurrentUser } from '@/lib/auth/session';
import { appUrl } from '@/lib/config';

export const metadata: Metadata = { title: 'Sign in' };

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ callbackUrl?: string; email?: string }> }) {
  if (await getCurrentUser()) redirect('/');
  const { callbackUrl, email } = await searchParams;
  // Only same-origin paths, so a crafted link cannot bounce the user elsewhere after sign-in.
  const next = safeRedirectPath(callbackUrl, appUrl());
  return (
    <>
      <h1 className="text-xl font-bold">Sign in</h1>
      <SignInForm callbackUrl={next} defaultEmail={email ?? ''} />
      <p className="mt-6 text-sm text-ink-soft">
        New to Kerfline?{' '}
        <Link href="/sign-up" className="font-bold text-blueprint underline">
          Create a channel
        </Link>
      </p>
    </>
  );
}
