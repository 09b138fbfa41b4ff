'use client';

import { useState, type FormEvent } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { useSchemaForm } from '@/components/ui/use-schema-form';
import type { EpisodeDto } from '@/lib/episodes/schemas';
import { createSegmentSchema, type SegmentKind } from '@/lib/segments/schemas';
import { KindAndLevelFields, levelFrom } from './segment-edit-form';
import { useAddSegment } from './use-running-order';

/** Adds a segment at the end of the running order. */
export function AddSegmentForm({ channelSlug, episode }: { channelSlug: string; episode: EpisodeDto }) {
  const addSegment = useAddSegment(channelSlug, episode.id);
  const [title, setTitle] = useState('');
  const [kind, setKind] = useState<SegmentKind>('build');
  const { fields, submit, mutation: add, message } = useSchemaForm({
    schema: createSegmentSchema,
    send: (input) => addSegment.mutateAsync(input),
    resetOnInvalid: true,
  });

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const formEl = event.currentTarget;
    const form = new FormData(formEl);
    submit(
      { title, kind, level: kind === 'build' ? levelFrom(form.get('level')) : null },
      {
        onSuccess: () => {
          setTitle('');
          // Ready for the next one: most running orders are typed in one after another.
          const input = formEl.elements.namedItem('title');
          if (input instanceof HTMLInputElement) input.focus();
        },
      },
    );
  }

  return (
    <form
      onSubmit={onSubmit}
      noValidate
      aria-labelledby="add-segment-heading"
      className="space-y-4 rounded-card border border-paper-edge bg-white/60 p-4 shadow-card sm:p-5"
    >
      <h2 id="add-segment-heading" className="text-lg font-bold">
        Add a segment
      </h2>
      {message ? <Alert tone="attention">{message}</Alert> : null}
      {add.isSuccess ? <Alert tone="ok">Added {add.data.segment.title} at the end of the running order.</Alert> : null}
      <div className="grid gap-4 sm:grid-cols-[minmax(0,2fr)_minmax(0,1fr)_minmax(0,1fr)] sm:items-start">
        <TextField
          label="Title"
          name="title"
          value={title}
          onChange={(e) => setTitle(e.target.value)}
          required
          maxLength={160}
          autoComplete="off"
          placeholder="e.g. Cutting the half-laps"
          error={fields.title}
        />
        <KindAndLevelFields kind={kind} onKind={setKind} defaultLevel="1" levelLabels={episode.levelLabels} fields={fields} />
      </div>
      {fields._ ? <p className="text-sm font-bold text-attention-ink">{fields._}</p> : null}
      <Button type="submit" disabled={add.isPending}>
        {add.isPending ? 'Adding…' : 'Add segment'}
      </Button>
    </form>
  );
}
