'use client';

import { useId, type FormEvent, type KeyboardEvent } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';
import { useFormMutation } from '@/components/ui/use-schema-form';
import { cameraLabels, framingLabels, MAX_QUICK_ADD_LINES } from '@/lib/shots/catalog';
import { parseShotLines, type QuickAddResult } from '@/lib/shots/quick-add';
import { countOf } from '@/lib/text/count-of';
import { TextArea, type CrewOption } from './shot-editor';
import { useBulkAddShots, type BulkVariables } from './use-shots';

export type QuickAddDraft = { text: string; assigneeId: string; dueDate: string };
export const emptyQuickAdd: QuickAddDraft = { text: '', assigneeId: '', dueDate: '' };

type Props = {
  channelSlug: string;
  segmentId: string;
  crew: CrewOption[];
  // Held by the list, so hiding the form while a row is edited loses nothing that was pasted.
  draft: QuickAddDraft;
  onDraft: (draft: QuickAddDraft) => void;
  onAdded: (count: number) => void;
};

const plural = (n: number) => countOf(n, 'shot', 'shots');

export function ShotQuickAdd({ channelSlug, segmentId, crew, draft, onDraft, onAdded }: Props) {
  const bulkAdd = useBulkAddShots(channelSlug, segmentId);
  const { fields, submit: send, mutation: add, message } = useFormMutation({ send: (body: BulkVariables) => bulkAdd.mutateAsync(body) });
  const headingId = useId();
  const preview = parseShotLines(draft.text);
  const count = preview.shots.length;
  const set = (patch: Partial<QuickAddDraft>) => onDraft({ ...draft, ...patch });

  function submit() {
    if (add.isPending) return;
    const body: BulkVariables = { text: draft.text, assigneeId: draft.assigneeId || null, dueDate: draft.dueDate || null };
    send(body, {
      onSuccess: (shots) => {
        onDraft(emptyQuickAdd);
        onAdded(shots.length);
      },
    });
  }

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    submit();
  }

  function onTextKeyDown(event: KeyboardEvent<HTMLTextAreaElement>) {
    if (event.key === 'Enter' && (event.ctrlKey || event.metaKey)) {
      event.preventDefault();
      submit();
    }
  }

  return (
    <section aria-labelledby={headingId} className="rounded-card border border-paper-edge bg-white/60 p-4">
      <h3 id={headingId} className="mb-2 font-bold">
        Quick add
      </h3>
      <form onSubmit={onSubmit} noValidate className="space-y-3">
        <TextArea
          label="Paste shots, one per line"
          rows={4}
          value={draft.text}
          error={fields.text}
          onChange={(text) => set({ text })}
          onKeyDown={onTextKeyDown}
          hint={
            <>
              A leading <kbd className="font-mono">CU:</kbd>, <kbd className="font-mono">Wide:</kbd>, <kbd className="font-mono">Overhead / Top cam:</kbd> or{' '}
              <kbd className="font-mono">B cam, close-up:</kbd> sets the framing and camera; otherwise a shot is Medium on A cam. Ctrl+Enter adds.
            </>
          }
        />
        <Preview result={preview} empty={!draft.text.trim()} />
        <div className="grid grid-cols-1 gap-3 sm:grid-cols-2 lg:max-w-2xl">
          <SelectField label="Assign to" value={draft.assigneeId} error={fields.assigneeId} onChange={(e) => set({ assigneeId: e.currentTarget.value })}>
            <option value="">Unassigned</option>
            {crew.map((c) => (
              <option key={c.userId} value={c.userId}>
                {c.name}
              </option>
            ))}
          </SelectField>
          <TextField label="Due date" type="date" value={draft.dueDate} error={fields.dueDate} onChange={(e) => set({ dueDate: e.currentTarget.value })} />
        </div>
        {message && !fields.text && !fields.assigneeId && !fields.dueDate ? <Alert tone="attention">{message}</Alert> : null}
        <Button type="submit" disabled={add.isPending}>
          {add.isPending ? 'Adding…' : 'Add shots'}
        </Button>
        {count > MAX_QUICK_ADD_LINES ? <p className="text-sm text-attention-ink">That is {plural(count)}; paste at most {MAX_QUICK_ADD_LINES} at a time.</p> : null}
      </form>
    </section>
  );
}

function Preview({ result: { shots, errors }, empty }: { result: QuickAddResult; empty: boolean }) {
  const summary = shots.length > 0 ? `${plural(shots.length)} will be added` : empty ? '' : 'No shots read yet.';
  return (
    <div className="space-y-2">
      <p aria-live="polite" className="text-sm font-bold">
        {summary}
      </p>
      {shots.length > 0 ? (
        <ol aria-label="Preview of the pasted shots" className="max-h-64 space-y-1 overflow-y-auto rounded-md border border-paper-edge bg-paper/70 p-2 text-sm">
          {shots.map((s, i) => (
            <li key={i} className="flex flex-wrap gap-x-2">
              <span className="font-mono text-ink-faint">{i + 1}.</span>
              <span className="font-bold">
                {framingLabels[s.framing]} · {cameraLabels[s.camera]}
              </span>
              <span className="min-w-0 break-words">{s.description}</span>
            </li>
          ))}
        </ol>
      ) : null}
      {errors.length > 0 ? (
        <div className="text-sm text-attention-ink">
          <p className="font-bold">Fix {errors.length === 1 ? 'this line' : 'these lines'} first: nothing is added while a line is wrong.</p>
          <ul className="list-disc pl-5">
            {errors.map((e) => (
              <li key={e.line}>
                Line {e.line}: {e.message}
              </li>
            ))}
          </ul>
        </div>
      ) : null}
    </div>
  );
}
