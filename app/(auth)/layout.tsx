import type { ReactNode } from 'react';
import { Logo } from '@/components/ui/logo';

export default function AuthLayout({ children }: { children: ReactNode }) {
  return (
    <main className="flex min-h-screen flex-col items-center px-4 py-10 sm:py-16">
      <Logo className="text-2xl" />
      <p className="mt-2 text-center text-sm text-ink-soft">Plan the build, the shoot and the edit in one place.</p>
      <div className="mt-8 w-full max-w-md rounded-card border border-paper-edge bg-white/70 p-6 shadow-card sm:p-8">{children}</div>
    </main>
  );
}
