'use client';

import Link from 'next/link';
import { usePathname } from 'next/navigation';
import { signOut } from 'next-auth/react';

export function UserMenu({ name, email, roleLabel }: { name: string; email: string; roleLabel: string }) {
  const slug = /^\/c\/([^/]+)/.exec(usePathname() ?? '')?.[1];
  return (
    <details className="relative">
      <summary className="flex min-h-touch cursor-pointer list-none items-center gap-2 rounded-md px-3 text-sm font-bold hover:bg-paper-deep">
        <span aria-hidden="true" className="grid h-8 w-8 place-items-center rounded-full bg-sawdust text-ink">
          {name.slice(0, 1).toUpperCase()}
        </span>
        <span className="max-w-[9rem] truncate">{name}</span>
        <span className="sr-only">, account menu</span>
      </summary>
      <div className="absolute right-0 z-20 mt-1 w-64 rounded-md border border-paper-edge bg-white p-3 shadow-card">
        <p className="font-bold">{name}</p>
        <p className="truncate font-mono text-xs text-ink-soft">{email}</p>
        <p className="mt-1 text-xs text-ink-faint">{roleLabel} on this channel</p>
        {slug ? (
          <Link href={`/c/${slug}/settings#profile`} className="mt-3 flex min-h-touch items-center justify-center rounded-md border border-ink/30 text-sm font-bold hover:bg-paper">
            Your profile and e-mail
          </Link>
        ) : null}
        <button
          type="button"
          onClick={() => void signOut({ callbackUrl: '/sign-in' })}
          className="mt-3 flex min-h-touch w-full items-center justify-center rounded-md border border-ink/30 text-sm font-bold hover:bg-paper"
        >
          Sign out
        </button>
      </div>
    </details>
  );
}
