'use client';

import { useId, useState, type FormEvent } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { FormActions } from '@/components/ui/form-actions';
import { SelectField, TextField } from '@/components/ui/field';
import { useSchemaForm } from '@/components/ui/use-schema-form';
import type { EpisodeDto } from '@/lib/episodes/schemas';
import type { FieldErrors } from '@/lib/errors';
import { formatDuration } from '@/lib/runtime';
import {
  kindLabels,
  levels,
  segmentKinds,
  updateSegmentSchema,
  type Level,
  type SegmentDto,
  type SegmentKind,
  type UpdateSegmentInput,
} from '@/lib/segments/schemas';
import { useDeleteSegment, useUpdateSegment } from './use-running-order';

/** "Level 2 · Intermediate", with the episode's own names for its levels. */
export function levelText(level: Level, labels: EpisodeDto['levelLabels']): string {
  const name = labels[level - 1];
  return name ? `Level ${level} · ${name}` : `Level ${level}`;
}

/** Reads a form's kind select back into a kind; anything else keeps the current one. */
export function asKind(value: string, fallback: SegmentKind): SegmentKind {
  return segmentKinds.find((k) => k === value) ?? fallback;
}

/** '' is "no level"; anything else goes to the schema, which names a bad value. */
export function levelFrom(value: FormDataEntryValue | null): number | null {
  const text = typeof value === 'string' ? value : '';
  return text === '' ? null : Number(text);
}

/** The kind select and, for a build, its level select: a segment's kind and level travel together. */
export function KindAndLevelFields({
  kind,
  onKind,
  defaultLevel,
  levelLabels,
  fields,
}: {
  kind: SegmentKind;
  onKind: (kind: SegmentKind) => void;
  defaultLevel: string;
  levelLabels: EpisodeDto['levelLabels'];
  fields: FieldErrors;
}) {
  return (
    <>
      <SelectField label="Kind" name="kind" value={kind} onChange={(e) => onKind(asKind(e.target.value, kind))} error={fields.kind}>
        {segmentKinds.map((k) => (
          <option key={k} value={k}>
            {kindLabels[k]}
          </option>
        ))}
      </SelectField>
      {kind === 'build' ? (
        <SelectField label="Level" name="level" defaultValue={defaultLevel} error={fields.level}>
          {levels.map((l) => (
            <option key={l} value={String(l)}>
              {levelText(l, levelLabels)}
            </option>
          ))}
          <option value="">No level</option>
        </SelectField>
      ) : null}
    </>
  );
}

type Props = {
  channelSlug: string;
  episode: EpisodeDto;
  segment: SegmentDto;
  onDone: () => void;
  onDeleted: () => void;
};

export function SegmentEditForm({ channelSlug, episode, segment, onDone, onDeleted }: Props) {
  const updateSegment = useUpdateSegment(channelSlug, episode.id);
  const remove = useDeleteSegment(channelSlug, episode.id);
  const [kind, setKind] = useState<SegmentKind>(segment.kind);
  const [confirm, setConfirm] = useState<'closed' | 'asking' | 'cancelled'>('closed');
  const confirmTextId = useId();
  const { fields, submit, mutation: update, message } = useSchemaForm({
    schema: updateSegmentSchema,
    // An unchanged form sends nothing and just closes.
    send: (input) => {
      const patch = changesTo(segment, input);
      return patch ? updateSegment.mutateAsync({ segmentId: segment.id, patch }) : Promise.resolve(null);
    },
    onSuccess: onDone,
  });

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    const actionText = String(form.get('actionSeconds') ?? '').trim();
    submit({
      title: String(form.get('title') ?? ''),
      kind,
      level: kind === 'build' ? levelFrom(form.get('level')) : null,
      actionSeconds: actionText === '' ? 0 : actionText,
    });
  }

  return (
    <div className="space-y-5">
      <form onSubmit={onSubmit} noValidate aria-label={`Edit ${segment.title}`} className="space-y-4">
        {message ? <Alert tone="attention">{message}</Alert> : null}
        <TextField label="Title" name="title" defaultValue={segment.title} autoFocus required maxLength={160} error={fields.title} />
        <div className="grid gap-4 sm:grid-cols-3">
          <KindAndLevelFields
            kind={kind}
            onKind={setKind}
            defaultLevel={segment.level === null ? '' : String(segment.level)}
            levelLabels={episode.levelLabels}
            fields={fields}
          />
          <TextField
            label="Action time"
            name="actionSeconds"
            defaultValue={formatDuration(segment.actionSeconds)}
            autoComplete="off"
            className="[&_input]:font-mono"
            error={fields.actionSeconds}
            hint="Footage without speech (montage, glue-up), as mm:ss."
          />
        </div>
        {fields._ ? <p className="text-sm font-bold text-attention-ink">{fields._}</p> : null}
        <FormActions pending={update.isPending} label="Save changes" onCancel={onDone} className="flex flex-wrap gap-2" />
      </form>

      <div className="border-t border-paper-edge pt-4">
        {remove.isError ? (
          <div className="mb-3">
            <Alert tone="attention">
              Could not delete {segment.title}: {remove.error.message}
            </Alert>
          </div>
        ) : null}
        {confirm === 'asking' ? (
          <div role="group" aria-labelledby={confirmTextId} className="space-y-3 rounded-md border border-attention bg-attention-soft/60 p-3">
            <p id={confirmTextId} className="text-sm">
              <strong>Delete {segment.title}?</strong> Its script goes with it, and this cannot be undone.
            </p>
            <div className="flex flex-wrap gap-2">
              <Button variant="danger" className="bg-white" disabled={remove.isPending} onClick={() => remove.mutate(segment.id, { onSuccess: onDeleted })}>
                {remove.isPending ? 'Deleting…' : 'Confirm'}
                <span className="sr-only"> delete {segment.title}</span>
              </Button>
              <Button variant="quiet" autoFocus disabled={remove.isPending} onClick={() => setConfirm('cancelled')}>
                Cancel
              </Button>
            </div>
          </div>
        ) : (
          <Button variant="danger" autoFocus={confirm === 'cancelled'} onClick={() => setConfirm('asking')}>
            Delete segment
          </Button>
        )}
      </div>
    </div>
  );
}

/** Only what differs, so an unchanged form sends nothing; kind and level travel together so the server can check the pair. */
function changesTo(segment: SegmentDto, next: UpdateSegmentInput): UpdateSegmentInput | null {
  const patch: UpdateSegmentInput = {};
  if (next.title !== undefined && next.title !== segment.title) patch.title = next.title;
  const nextLevel = next.level === undefined ? segment.level : next.level;
  if ((next.kind !== undefined && next.kind !== segment.kind) || nextLevel !== segment.level) {
    patch.kind = next.kind ?? segment.kind;
    patch.level = nextLevel;
  }
  if (next.actionSeconds !== undefined && next.actionSeconds !== segment.actionSeconds) patch.actionSeconds = next.actionSeconds;
  return Object.keys(patch).length > 0 ? patch : null;
}
