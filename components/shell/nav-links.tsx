'use client';

import Link from 'next/link';
import { usePathname } from 'next/navigation';
import { channelPage } from '@/lib/api/paths';

const sections = [
  { href: '', label: 'Dashboard' },
  { href: '/episodes', label: 'Episodes' },
  { href: '/shots', label: 'Shots' },
  { href: '/stock', label: 'Stock rack' },
  { href: '/sponsors', label: 'Sponsors' },
  { href: '/settings', label: 'Settings' },
] as const;

export function NavLinks({ channelSlug }: { channelSlug: string }) {
  const pathname = usePathname();
  const base = channelPage(channelSlug);
  return (
    <nav aria-label="Main" className="px-2 pb-2 md:px-3">
      <ul className="grid grid-cols-3 gap-1 md:flex md:flex-col">
        {sections.map((s) => {
          const href = `${base}${s.href}`;
          const active = s.href === '' ? pathname === base : pathname === href || pathname.startsWith(`${href}/`);
          return (
            <li key={s.label}>
              <Link
                href={href}
                aria-current={active ? 'page' : undefined}
                className={`flex min-h-touch items-center justify-center whitespace-nowrap rounded-md px-1 text-[13px] font-bold md:justify-start md:px-3 md:text-sm ${
                  active ? 'bg-ink text-paper' : 'text-ink-soft hover:bg-paper'
                }`}
              >
                {s.label}
              </Link>
            </li>
          );
        })}
      </ul>
    </nav>
  );
}
