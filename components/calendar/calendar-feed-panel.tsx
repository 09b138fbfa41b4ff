'use client';

import { useMutation } from '@tanstack/react-query';
import { useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { apiFetch } from '@/lib/api/client';

/** Makes, replaces or stops the person's secret calendar feed URL; the URL is shown once. */
export function CalendarFeedPanel({ initiallyActive }: { initiallyActive: boolean }) {
  const [active, setActive] = useState(initiallyActive);
  const [url, setUrl] = useState<string | null>(null);
  const create = useMutation({
    mutationFn: () => apiFetch<{ url: string }>('/api/profile/calendar-feed', { method: 'POST' }),
    onSuccess: (r) => {
      setUrl(r.url);
      setActive(true);
    },
  });
  const revoke = useMutation({
    mutationFn: () => apiFetch<void>('/api/profile/calendar-feed', { method: 'DELETE' }),
    onSuccess: () => {
      setUrl(null);
      setActive(false);
    },
  });
  const error = create.error ?? revoke.error;
  return (
    <div className="space-y-3">
      <p className="text-sm text-ink-soft">
        Subscribe to your due dates, shoot days and publish dates in any calendar app. The address is secret: anyone who has it can read these dates.
      </p>
      {error ? <Alert tone="attention">{error.message}</Alert> : null}
      {url ? (
        <div>
          <label htmlFor="feed-url" className="mb-1 block text-sm font-bold">
            Your feed address (copy it now, it is shown once)
          </label>
          <input id="feed-url" readOnly value={url} onFocus={(e) => e.target.select()} className="block w-full min-h-touch rounded-md border border-ink/30 bg-white px-3 font-mono text-sm" />
        </div>
      ) : active ? (
        <p className="text-sm">You have a feed address. Make a new one if you lost it; the old one then stops working.</p>
      ) : null}
      <div className="flex flex-wrap gap-2">
        <Button variant="secondary" onClick={() => create.mutate()} disabled={create.isPending}>
          {active ? 'Make a new feed address' : 'Make a feed address'}
        </Button>
        {active ? (
          <Button variant="danger" onClick={() => revoke.mutate()} disabled={revoke.isPending}>
            Stop the feed
          </Button>
        ) : null}
      </div>
    </div>
  );
}
