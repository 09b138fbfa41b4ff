'use client';

import { useMutation } from '@tanstack/react-query';
import { useRouter } from 'next/navigation';
import { useState, type FormEvent } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { apiFetch } from '@/lib/api/client';
import { fieldErrorsFrom } from '@/lib/api/validation';
import { newChannelSchema, type ChannelDto } from '@/lib/channels/schemas';
import type { FieldErrors } from '@/lib/errors';
import { channelPage } from '@/lib/api/paths';

export function NewChannelForm() {
  const router = useRouter();
  const [fields, setFields] = useState<FieldErrors>({});
  const create = useMutation({
    mutationFn: (name: string) => apiFetch<{ channel: ChannelDto }>('/api/channels', { method: 'POST', body: { name } }),
    onSuccess: ({ channel }) => router.push(channelPage(channel.slug)),
  });

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const parsed = newChannelSchema.safeParse({ name: new FormData(event.currentTarget).get('name') });
    if (!parsed.success) return setFields(fieldErrorsFrom(parsed.error));
    setFields({});
    create.mutate(parsed.data.name);
  }

  return (
    <form onSubmit={onSubmit} noValidate className="mt-6 space-y-4">
      {create.isError ? <Alert tone="attention">{create.error.message}</Alert> : null}
      <TextField label="Channel name" name="name" required error={fields.name} />
      <Button type="submit" disabled={create.isPending}>
        {create.isPending ? 'Creating…' : 'Create channel'}
      </Button>
    </form>
  );
}
