'use client';

import { useSortable } from '@dnd-kit/sortable';
import { CSS } from '@dnd-kit/utilities';
import { useId, useRef, useState, type FormEvent, type KeyboardEvent, type ReactNode } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';
import { ApiError } from '@/lib/api/client';
import type { FieldErrors } from '@/lib/errors';
import { cameraLabels, cameras, framingLabels, framings, MAX_DESCRIPTION, type Camera, type Framing } from '@/lib/shots/catalog';
import type { ShotDto, UpdateShotInput } from '@/lib/shots/schemas';
import { useUpdateShot } from './use-shots';
import { DragHandle } from '@/components/ui/drag-handle';
import { DueBadge } from './due-badge';
import { ShotHistory } from './shot-history';
import { formatDay } from '@/components/shop-board/dates';
import { Badge } from '@/components/ui/badge';

export type CrewOption = { userId: string; name: string };

type Props = {
  channelSlug: string;
  shot: ShotDto;
  crew: CrewOption[];
  columns: number;
  canReorder: boolean;
  canEdit: boolean;
  canManage: boolean;
  canAssign: boolean;
  editing: boolean;
  editLocked: boolean;
  onEdit: () => void;
  onClose: () => void;
  onDuplicate: () => void;
  onDelete: () => void;
  busy: boolean;
};


// Below sm each row is a card; the inline labels stand in for the hidden column headers there.
const cell = 'block sm:table-cell sm:border-b sm:border-paper-edge/70 sm:py-2 sm:pr-3 sm:align-top';
const smallLabel = 'text-xs font-bold text-ink-faint sm:hidden';
// On a phone the row actions read as buttons at a glance; in the desktop table they stay quiet.
const mobileBorder = 'max-sm:border max-sm:border-ink/20';

export function ShotRow(props: Props) {
  const { shot, canReorder, editing } = props;
  const { attributes, listeners, setNodeRef, setActivatorNodeRef, transform, transition, isDragging } = useSortable({
    id: shot.id,
    disabled: !canReorder || editing,
  });
  const style = { transform: CSS.Translate.toString(transform), transition };
  const dragClass = isDragging ? 'relative z-10 bg-white shadow-xl ring-2 ring-blueprint-line' : '';

  if (editing) {
    return (
      <tr ref={setNodeRef} id={`shot-${shot.id}`} style={style} className="block scroll-mt-4 sm:table-row">
        <td colSpan={props.columns} className="block rounded-card border border-ink/30 bg-paper-deep/60 p-4 sm:table-cell sm:rounded-none">
          <ShotEditor {...props} />
        </td>
      </tr>
    );
  }

  const handle = canReorder ? (
    <DragHandle sortable={{ attributes, listeners, setActivatorNodeRef }} label={`Move shot ${shot.number}`} layout="button" small />
  ) : null;

  return (
    <tr
      ref={setNodeRef}
      id={`shot-${shot.id}`}
      style={style}
      className={`flex scroll-mt-4 flex-wrap items-center gap-x-4 gap-y-1 rounded-card border border-paper-edge bg-white/80 p-3 target:ring-2 target:ring-blueprint-line sm:table-row sm:rounded-none sm:border-0 sm:bg-transparent sm:p-0 ${dragClass}`}
    >
      <td className={`${cell} sm:w-20`}>
        <span className="flex items-center gap-1">
          {handle}
          <span className="font-mono font-bold">
            <span className="sr-only">Shot </span>
            {shot.number}
          </span>
        </span>
      </td>
      <td className={`${cell} sm:whitespace-nowrap`}>
        <span className="sr-only sm:hidden">Framing: </span>
        {framingLabels[shot.framing]}
      </td>
      <td className={`${cell} sm:whitespace-nowrap`}>
        <span className="sr-only sm:hidden">Camera: </span>
        {cameraLabels[shot.camera]}
      </td>
      <td className={`${cell} basis-full font-bold sm:font-normal`}>
        <span className="sr-only sm:hidden">Description: </span>
        <span className="break-words">{shot.description}</span>
      </td>
      <td className={cell}>
        <span className={smallLabel}>Assignee </span>
        {shot.assigneeName ?? <span className="text-ink-faint">Unassigned</span>}
      </td>
      <td className={`${cell} sm:whitespace-nowrap`}>
        <span className={smallLabel}>Due </span>
        {shot.dueDate ? <time dateTime={shot.dueDate}>{formatDay(shot.dueDate)}</time> : <span className="text-ink-faint">No date</span>}{' '}
        <DueBadge dueDate={shot.dueDate} state={shot.state} />
      </td>
      <td className={`${cell} basis-full ${shot.notes ? '' : 'max-sm:hidden'}`}>
        <span className={smallLabel}>Notes </span>
        {shot.notes ? <span className="whitespace-pre-line break-words text-ink-soft">{shot.notes}</span> : <span className="text-ink-faint">—</span>}
      </td>
      <td className={cell}>
        <span className="sr-only sm:hidden">State: </span>
        <StateBadge shot={shot} />
        <ShotHistory channelSlug={props.channelSlug} shotId={shot.id} number={shot.number} />
      </td>
      {props.columns === 9 ? (
        <td className={`${cell} basis-full sm:whitespace-nowrap`}>
          <RowActions {...props} />
        </td>
      ) : null}
    </tr>
  );
}

function RowActions({ shot, canEdit, canManage, editLocked, onEdit, onDuplicate, onDelete, busy }: Props) {
  if (!canEdit && !canManage) return <span className="sr-only">No actions</span>;
  return (
    <span className="flex flex-wrap gap-2 sm:-my-2 sm:flex-nowrap sm:gap-0">
      {canEdit ? (
        <Button data-shot-edit variant="quiet" aria-label={`Edit shot ${shot.number}`} disabled={editLocked} onClick={onEdit} className={mobileBorder}>
          Edit
        </Button>
      ) : null}
      {canManage ? (
        <>
          <Button variant="quiet" aria-label={`Duplicate shot ${shot.number}`} disabled={busy} onClick={onDuplicate} className={mobileBorder}>
            Duplicate
          </Button>
          <Button variant="quiet" aria-label={`Delete shot ${shot.number}`} disabled={busy} onClick={onDelete} className={`${mobileBorder} text-attention-ink`}>
            Delete
          </Button>
        </>
      ) : null}
    </span>
  );
}

function StateBadge({ shot }: { shot: ShotDto }) {
  if (shot.state === 'captured') {
    return <Badge tone="okOutlined">Captured</Badge>;
  }
  if (shot.state === 'retake') {
    return (
      <span className="inline-flex flex-col gap-0.5">
        <Badge tone="attention" className="w-fit">
          Retake
        </Badge>
        {shot.retakeReason ? <span className="text-xs text-attention-ink">{shot.retakeReason}</span> : null}
      </span>
    );
  }
  return <Badge tone="neutral">Planned</Badge>;
}

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

function ShotEditor({ channelSlug, shot, crew, canAssign, onClose }: Props) {
  const update = useUpdateShot(channelSlug, shot.segmentId);
  const [draft, setDraft] = useState<Draft>(() => draftOf(shot));
  const [fields, setFields] = useState<FieldErrors>({});
  const formRef = useRef<HTMLFormElement>(null);
  const set = <K extends keyof Draft>(key: K, value: Draft[K]) => setDraft((d) => ({ ...d, [key]: value }));
  // Someone who left the crew keeps their name here until the shot is reassigned.
  const options = shot.assigneeId && !crew.some((c) => c.userId === shot.assigneeId) ? [...crew, { userId: shot.assigneeId, name: shot.assigneeName ?? 'Former crew member' }] : crew;

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    if (update.isPending) return;
    const patch = changesFrom(shot, draft, canAssign);
    if (Object.keys(patch).length === 0) return onClose();
    update.mutate(
      { shotId: shot.id, patch },
      { onSuccess: () => onClose(), onError: (err) => setFields(err instanceof ApiError ? err.fields : {}) },
    );
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
  const unplaced = update.isError && !Object.keys(fields).some((k) => known.includes(k));

  return (
    <form ref={formRef} onSubmit={onSubmit} onKeyDown={onKeyDown} noValidate aria-label={`Editing shot ${shot.number}`} className="space-y-3">
      <p className="font-bold">
        Editing shot <span className="font-mono">{shot.number}</span>
        <span className="ml-2 text-xs font-normal text-ink-faint">Enter saves, Escape cancels.</span>
      </p>
      {unplaced ? <Alert tone="attention">{update.error.message}</Alert> : null}
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
      <div className="flex flex-wrap gap-2">
        <Button type="submit" disabled={update.isPending}>
          {update.isPending ? 'Saving…' : 'Save'}
        </Button>
        <Button variant="secondary" onClick={onClose}>
          Cancel
        </Button>
      </div>
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
