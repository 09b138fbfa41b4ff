import Link from 'next/link';
import type { ReactNode } from 'react';
import { Logo } from '@/components/ui/logo';
import type { Role } from '@/lib/auth/policy';
import { roleLabels } from '@/lib/auth/policy';
import type { ChannelWithRoleDto } from '@/lib/channels/schemas';
import type { UserDto } from '@/lib/users/schemas';
import { ChannelSwitcher } from './channel-switcher';
import { NavLinks } from './nav-links';
import { UserMenu } from './user-menu';
import { channelPage } from '@/lib/api/paths';

type Props = { channelSlug: string; channelName: string; role: Role; channels: ChannelWithRoleDto[]; user: UserDto; children: ReactNode };

export function AppShell({ channelSlug, channelName, role, channels, user, children }: Props) {
  return (
    <div className="min-h-screen md:grid md:grid-cols-[15rem_1fr] print:block print:min-h-0 print:bg-white print:text-black">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-50 focus:bg-white focus:p-2">
        Skip to content
      </a>
      <aside className="border-b border-paper-edge bg-paper-deep md:min-h-screen md:border-b-0 md:border-r print:hidden">
        <div className="flex items-center justify-between gap-2 px-4 py-3 md:block md:space-y-4 md:py-5">
          <Link href={channelPage(channelSlug)} aria-label="Kerfline dashboard">
            <Logo className="text-lg" />
          </Link>
          <div className="flex items-center gap-2 md:block md:space-y-3">
            <ChannelSwitcher current={{ slug: channelSlug, name: channelName }} channels={channels} />
            <p className="hidden text-xs uppercase tracking-wide text-ink-faint md:block">
              Your role: <span className="font-bold text-ink-soft">{roleLabels[role]}</span>
            </p>
          </div>
        </div>
        <NavLinks channelSlug={channelSlug} />
      </aside>
      <div className="flex min-w-0 flex-col">
        <div className="flex items-center justify-end border-b border-paper-edge px-4 py-2 md:px-8 print:hidden">
          <UserMenu name={user.name} email={user.email} roleLabel={roleLabels[role]} />
        </div>
        <main id="main" className="mx-auto w-full max-w-6xl flex-1 px-4 py-6 md:px-8 print:max-w-none print:p-0">
          {children}
        </main>
      </div>
    </div>
  );
}
