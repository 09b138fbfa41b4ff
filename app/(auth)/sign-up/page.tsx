import type { Metadata } from 'next';
import Link from 'next/link';
import { SignUpForm } from '@/components/auth/sign-up-form';

export const metadata: Metadata = { title: 'Create a channel' };

export default function SignUpPage() {
  return (
    <>
      <h1 className="text-xl font-bold">Create your channel</h1>
      <p className="mt-1 text-sm text-ink-soft">You will be its Host and can invite a shop hand and an editor next.</p>
      <SignUpForm />
      <p className="mt-6 text-sm text-ink-soft">
        Already have an account?{' '}
        <Link href="/sign-in" className="font-bold text-blueprint underline">
          Sign in
        </Link>
      </p>
    </>
  );
}
