'use client';

import { Button } from '@/components/ui/button';

export default function ChannelError({ reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <div className="rounded-card border border-attention bg-attention-soft p-6">
      <h1 className="text-lg font-bold text-attention-ink">This page could not be loaded</h1>
      <p className="mt-1 text-sm">Nothing you saved was lost. Try again in a moment.</p>
      <Button className="mt-4" onClick={reset}>
        Try again
      </Button>
    </div>
  );
}
