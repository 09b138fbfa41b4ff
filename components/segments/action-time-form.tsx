'use client';

import { useMutation } from '@tanstack/react-query';
import { useRouter } from 'next/navigation';
import { useState, type FormEvent } from 'react';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { ApiError, apiFetch } from '@/lib/api/client';
import { formatDuration, parseDuration } from '@/lib/runtime';
import type { SegmentDto } from '@/lib/segments/schemas';
import { channelApi } from '@/lib/api/paths';

export function ActionTimeForm({ channelSlug, segment }: { channelSlug: string; segment: SegmentDto }) {
  const router = useRouter();
  const [error, setError] = useState<string | undefined>();
  const save = useMutation({
    mutationFn: (actionSeconds: number) =>
      apiFetch<{ segment: SegmentDto }>(channelApi(channelSlug, 'segments', segment.id), { method: 'PATCH', body: { actionSeconds } }),
    onSuccess: () => router.refresh(),
    onError: (err) => setError(err instanceof ApiError ? (err.fields.actionSeconds ?? err.message) : 'Could not save.'),
  });

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const seconds = parseDuration(String(new FormData(event.currentTarget).get('actionTime') ?? ''));
    if (seconds === null || seconds > 36_000) return setError('Enter a time like 2:30 (minutes:seconds).');
    setError(undefined);
    save.mutate(seconds);
  }

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-wrap items-start gap-3">
      <TextField
        label="Action time (mm:ss)"
        name="actionTime"
        inputMode="numeric"
        defaultValue={formatDuration(segment.actionSeconds)}
        error={error}
        hint="Footage without speech: build montage, glue-up."
        className="w-56"
      />
      <Button type="submit" variant="secondary" className="sm:mt-6" disabled={save.isPending}>
        {save.isPending ? 'Saving…' : save.isSuccess ? 'Saved' : 'Save action time'}
      </Button>
    </form>
  );
}
