import type { ReactNode } from 'react';
import { Logo } from '@/components/ui/logo';

// Pages for people outside any channel (a sponsor's approval link): no shell, no navigation.
export default function PublicLayout({ children }: { children: ReactNode }) {
  return (
    <main className="flex min-h-screen flex-col items-center px-4 py-10">
      <Logo className="text-2xl" />
      <div className="mt-8 w-full max-w-2xl rounded-card border border-paper-edge bg-white/70 p-6 shadow-card sm:p-8">{children}</div>
    </main>
  );
}
