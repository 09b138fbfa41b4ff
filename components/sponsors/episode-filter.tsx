'use client';

import { usePathname, useRouter } from 'next/navigation';
import { useId, useTransition } from 'react';

/**
 * Narrows the Sponsors page (deals and pipeline) to one episode. The choice lives in the URL
 * (`?episode=<id>`), so a reload, the back button or a shared link shows the same view.
 */
export function EpisodeFilter({ episodes, selected }: { episodes: { id: string; title: string }[]; selected: string | null }) {
  const router = useRouter();
  const pathname = usePathname();
  const id = useId();
  const [pending, startTransition] = useTransition();
  return (
    <div className="mb-4">
      <label htmlFor={id} className="mb-1 block text-sm font-bold">
        Episode
      </label>
      <select
        id={id}
        value={selected ?? ''}
        aria-busy={pending || undefined}
        onChange={(e) => {
          const value = e.target.value;
          startTransition(() => router.replace(value ? `${pathname}?${new URLSearchParams({ episode: value })}` : pathname, { scroll: false }));
        }}
        className="min-h-touch w-full max-w-md rounded-md border border-ink/30 bg-white px-3 sm:w-auto"
      >
        <option value="">All episodes</option>
        {episodes.map((e) => (
          <option key={e.id} value={e.id}>
            {e.title}
          </option>
        ))}
      </select>
      {pending ? <span className="ml-3 text-sm text-ink-soft">Loading…</span> : null}
    </div>
  );
}
