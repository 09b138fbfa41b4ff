'use client';

import { useRouter } from 'next/navigation';
import type { FormEvent } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { useSchemaForm } from '@/components/ui/use-schema-form';
import { apiFetch } from '@/lib/api/client';
import { api, channelPage } from '@/lib/api/paths';
import { newChannelSchema, type ChannelDto } from '@/lib/channels/schemas';

export function NewChannelForm() {
  const router = useRouter();
  const { fields, submit, mutation: create } = useSchemaForm({
    schema: newChannelSchema,
    send: ({ name }) => apiFetch<{ channel: ChannelDto }>(api('channels'), { method: 'POST', body: { name } }),
    onSuccess: ({ channel }) => router.push(channelPage(channel.slug)),
  });

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    submit({ name: new FormData(event.currentTarget).get('name') });
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
