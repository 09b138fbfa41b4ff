'use client';

import { useRouter } from 'next/navigation';
import type { FormEvent } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { useSchemaForm } from '@/components/ui/use-schema-form';
import { apiFetch } from '@/lib/api/client';
import { channelSettingsSchema, type ChannelDto } from '@/lib/channels/schemas';
import { channelApi } from '@/lib/api/paths';

export function ChannelSettingsForm({ channel }: { channel: ChannelDto }) {
  const router = useRouter();
  const { fields, submit, mutation: save } = useSchemaForm({
    schema: channelSettingsSchema,
    send: (input) => apiFetch<{ channel: ChannelDto }>(channelApi(channel.slug), { method: 'PATCH', body: input }),
    onSuccess: () => router.refresh(),
  });

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    submit({ name: String(form.get('name') ?? ''), speakingRateWpm: Number(form.get('speakingRateWpm')) });
  }

  return (
    <form onSubmit={onSubmit} className="mt-4 space-y-4" noValidate>
      {save.isError ? <Alert tone="attention">{save.error.message}</Alert> : null}
      {save.isSuccess ? <Alert tone="ok">Saved.</Alert> : null}
      <TextField label="Channel name" name="name" defaultValue={channel.name} required error={fields.name} />
      <TextField
        label="Speaking rate (words per minute)"
        name="speakingRateWpm"
        type="number"
        inputMode="numeric"
        min={60}
        max={300}
        defaultValue={channel.speakingRateWpm}
        error={fields.speakingRateWpm}
        hint="Used for the runtime forecast. 150 is common for conversational delivery."
      />
      <Button type="submit" disabled={save.isPending}>
        {save.isPending ? 'Saving…' : 'Save settings'}
      </Button>
    </form>
  );
}
