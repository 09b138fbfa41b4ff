'use client';

import { useRouter } from 'next/navigation';
import type { FormEvent } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { useSchemaForm } from '@/components/ui/use-schema-form';
import { apiFetch } from '@/lib/api/client';
import { channelSettingsSchema, MAX_REMINDER_DAYS, type ChannelDto } from '@/lib/channels/schemas';
import { channelApi } from '@/lib/api/paths';
import { parseReminderDays } from '@/lib/channels/reminder-days';

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
    submit({
      name: String(form.get('name') ?? ''),
      speakingRateWpm: Number(form.get('speakingRateWpm')),
      reminderDays: parseReminderDays(String(form.get('reminderDays') ?? '')),
    });
  }
  // A bad entry in the list is reported on its index (reminderDays.1); the field shows it all the same.
  const reminderError = fields.reminderDays ?? Object.entries(fields).find(([key]) => key.startsWith('reminderDays.'))?.[1];

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
      <TextField
        label="Reminder days before a due date"
        name="reminderDays"
        inputMode="numeric"
        autoComplete="off"
        defaultValue={channel.reminderDays.join(', ')}
        error={reminderError}
        className="[&_input]:font-mono"
        hint={`Whole days, up to ${MAX_REMINDER_DAYS}, separated by commas; 0 is the due day. Hosts and owners get one e-mail per day listed, and one more when a date is overdue.`}
      />
      <Button type="submit" disabled={save.isPending}>
        {save.isPending ? 'Saving…' : 'Save settings'}
      </Button>
    </form>
  );
}
