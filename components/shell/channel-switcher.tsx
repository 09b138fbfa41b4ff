import Link from 'next/link';
import { roleLabels } from '@/lib/auth/policy';
import type { ChannelWithRoleDto } from '@/lib/channels/schemas';
import { channelPage } from '@/lib/api/paths';

// A disclosure of plain links: keyboard and screen readers get it for free, and it works before hydration.
export function ChannelSwitcher({ current, channels }: { current: { slug: string; name: string }; channels: ChannelWithRoleDto[] }) {
  return (
    <details className="group relative">
      <summary className="flex min-h-touch cursor-pointer list-none items-center gap-2 rounded-md border border-ink/20 bg-white/60 px-3 text-sm font-bold">
        <span className="sr-only">Channel: </span>
        <span className="max-w-[10rem] truncate">{current.name}</span>
        <span aria-hidden="true" className="text-ink-faint group-open:rotate-180">
          ▾
        </span>
      </summary>
      <div className="absolute right-0 z-20 mt-1 w-64 rounded-md border border-paper-edge bg-white p-1 shadow-card md:left-0 md:right-auto">
        <p className="px-3 py-2 text-xs uppercase tracking-wide text-ink-faint">Switch channel</p>
        <ul>
          {channels.map((c) => (
            <li key={c.id}>
              <Link
                href={channelPage(c.slug)}
                aria-current={c.slug === current.slug ? 'true' : undefined}
                className="flex min-h-touch items-center justify-between gap-2 rounded px-3 text-sm hover:bg-paper aria-[current=true]:font-bold"
              >
                <span className="truncate">{c.name}</span>
                <span className="text-xs text-ink-faint">{roleLabels[c.role]}</span>
              </Link>
            </li>
          ))}
        </ul>
        <Link href="/welcome" className="mt-1 flex min-h-touch items-center rounded px-3 text-sm text-blueprint hover:bg-paper">
          + New channel
        </Link>
      </div>
    </details>
  );
}
