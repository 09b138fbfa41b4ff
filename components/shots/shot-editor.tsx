'use client';

import { useId, useRef, useState, type FormEvent, type KeyboardEvent, type ReactNode } from 'react';
import { Alert } from '@/components/ui/alert';
import { FormActions } from '@/components/ui/form-actions';
import { SelectField, TextField } from '@/components/ui/field';
import { useFormMutation } from '@/components/ui/use-schema-form';
import { cameraLabels, cameras, framingLabels, framings, MAX_DESCRIPTION, type Camera, type Framing } from '@/lib/shots/catalog';
import type { ShotDto, UpdateShotInput } from '@/lib/shots/schemas';
import { useUpdateShot } from './use-shots';

export type CrewOption = { userId: string; name: string };

type Draft = { description: string; framing: Framing; camera: Camera; assigneeId: string; dueDate: string; notes: string };

const draftOf = (s: ShotDto): Draft => ({
  description: s.description,
  framing: s.framing,
  camera: s.camera,
  assigneeId: s.assigneeId ?? '',
  dueDate: s.dueDate ?? '',
  notes: s.notes,
});

/** Only what changed goes to the server, so a field someone else just changed is not written back. */
function changesFrom(shot: ShotDto, d: Draft, canAssign: boolean): UpdateShotInput {
  const patch: UpdateShotInput = {};
  if (d.description !== shot.description) patch.description = d.description;
  if (d.framing !== shot.framing) patch.framing = d.framing;
  if (d.camera !== shot.camera) patch.camera = d.camera;
  if (canAssign && (d.assigneeId || null) !== shot.assigneeId) patch.assigneeId = d.assigneeId || null;
  if ((d.dueDate || null) !== shot.dueDate) patch.dueDate = d.dueDate || null;
  if (d.notes !== shot.notes) patch.notes = d.notes;
  return patch;
}

type ShotEditorProps = { channelSlug: string; shot: ShotDto; crew: CrewOption[]; canAssign: boolean; onClose: () => void };

/** A shot's fields as a form in place of its row; sends only what changed. */
export function ShotEditor({ channelSlug, shot, crew, canAssign, onClose }: ShotEditorProps) {
  const updateShot = useUpdateShot(channelSlug, shot.segmentId);
  const [draft, setDraft] = useState<Draft>(() => draftOf(shot));
  const { fields, submit, mutation: update, message } = useFormMutation({
    send: (patch: UpdateShotInput) => updateShot.mutateAsync({ shotId: shot.id, patch }),
    onSuccess: () => onClose(),
  });
  const formRef = useRef<HTMLFormElement>(null);
  const set = <K extends keyof Draft>(key: K, value: Draft[K]) => setDraft((d) => ({ ...d, [key]: value }));
  // Someone who left the crew keeps their name here until the shot is reassigned.
  const options = shot.assigneeId && !crew.some((c) => c.userId === shot.assigneeId) ? [...crew, { userId: shot.assigneeId, name: shot.assigneeName ?? 'Former crew member' }] : crew;

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    if (update.isPending) return;
    const patch = changesFrom(shot, draft, canAssign);
    if (Object.keys(patch).length === 0) return onClose();
    submit(patch);
  }

  function onKeyDown(event: KeyboardEvent<HTMLFormElement>) {
    if (event.nativeEvent.isComposing) return;
    if (event.key === 'Escape') {
      event.preventDefault();
      onClose();
      return;
    }
    const tag = (event.target as HTMLElement).tagName;
    if (event.key === 'Enter' && !event.shiftKey && (tag === 'INPUT' || tag === 'SELECT' || tag === 'TEXTAREA')) {
      event.preventDefault();
      formRef.current?.requestSubmit();
    }
  }

  const known = ['description', 'framing', 'camera', 'assigneeId', 'dueDate', 'notes'];
  const unplaced = message !== null && !Object.keys(fields).some((k) => known.includes(k));

  return (
    <form ref={formRef} onSubmit={onSubmit} onKeyDown={onKeyDown} noValidate aria-label={`Editing shot ${shot.number}`} className="space-y-3">
      <p className="font-bold">
        Editing shot <span className="font-mono">{shot.number}</span>
        <span className="ml-2 text-xs font-normal text-ink-faint">Enter saves, Escape cancels.</span>
      </p>
      {unplaced ? <Alert tone="attention">{message}</Alert> : null}
      <TextField
        label="Description"
        value={draft.description}
        maxLength={MAX_DESCRIPTION}
        error={fields.description}
        autoFocus
        onChange={(e) => set('description', e.currentTarget.value)}
      />
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-2 lg:grid-cols-4">
        <SelectField label="Framing" value={draft.framing} error={fields.framing} onChange={(e) => set('framing', framings.find((f) => f === e.currentTarget.value) ?? draft.framing)}>
          {framings.map((f) => (
            <option key={f} value={f}>
              {framingLabels[f]}
            </option>
          ))}
        </SelectField>
        <SelectField label="Camera" value={draft.camera} error={fields.camera} onChange={(e) => set('camera', cameras.find((c) => c === e.currentTarget.value) ?? draft.camera)}>
          {cameras.map((c) => (
            <option key={c} value={c}>
              {cameraLabels[c]}
            </option>
          ))}
        </SelectField>
        <div>
          <SelectField
            label="Assignee"
            value={draft.assigneeId}
            error={fields.assigneeId}
            disabled={!canAssign}
            onChange={(e) => set('assigneeId', e.currentTarget.value)}
          >
            <option value="">Unassigned</option>
            {options.map((c) => (
              <option key={c.userId} value={c.userId}>
                {c.name}
              </option>
            ))}
          </SelectField>
          {!canAssign ? <p className="mt-1 text-xs text-ink-faint">Only a Host reassigns shots.</p> : null}
        </div>
        <TextField label="Due date" type="date" value={draft.dueDate} error={fields.dueDate} onChange={(e) => set('dueDate', e.currentTarget.value)} />
      </div>
      <TextArea label="Notes" value={draft.notes} error={fields.notes} hint="Shift+Enter starts a new line." onChange={(v) => set('notes', v)} />
      <FormActions pending={update.isPending} label="Save" onCancel={onClose} cancelVariant="secondary" className="flex flex-wrap gap-2" />
    </form>
  );
}

export function TextArea({
  label,
  value,
  error,
  hint,
  onChange,
  onKeyDown,
  rows = 2,
}: {
  label: string;
  value: string;
  error?: string | undefined;
  hint?: ReactNode;
  onChange: (value: string) => void;
  onKeyDown?: (event: KeyboardEvent<HTMLTextAreaElement>) => void;
  rows?: number;
}) {
  const id = useId();
  const described = [hint ? `${id}-hint` : '', error ? `${id}-error` : ''].filter(Boolean).join(' ') || undefined;
  return (
    <div>
      <label htmlFor={id} className="mb-1 block text-sm font-bold">
        {label}
      </label>
      <textarea
        id={id}
        rows={rows}
        value={value}
        aria-invalid={error ? true : undefined}
        aria-describedby={described}
        onChange={(e) => onChange(e.currentTarget.value)}
        onKeyDown={onKeyDown}
        className="block min-h-touch w-full rounded-md border border-ink/30 bg-white px-3 py-2 text-base text-ink placeholder:text-ink-faint aria-[invalid=true]:border-attention"
      />
      {hint ? (
        <div id={`${id}-hint`} className="mt-1 text-sm text-ink-faint">
          {hint}
        </div>
      ) : null}
      {error ? (
        <p id={`${id}-error`} className="mt-1 text-sm font-bold text-attention-ink">
          {error}
        </p>
      ) : null}
    </div>
  );
}
