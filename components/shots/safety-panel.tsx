'use client';

import { useId, useState, type FormEvent } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { useFormMutation } from '@/components/ui/use-schema-form';
import { ApiError } from '@/lib/api/client';
import { needsSafetyReview, toolInfo, tools, type Tool } from '@/lib/safety/tools';
import type { SegmentSafetyDto } from '@/lib/safety/schemas';
import { CautionsList } from './cautions-list';
import { useSafetyReview, useSaveTools, useSegmentSafety } from './use-shots';

type Props = {
  channelSlug: string;
  segmentId: string;
  initialSafety: SegmentSafetyDto;
  canEditTools: boolean;
  canReview: boolean;
};

const sameTools = (a: readonly Tool[], b: readonly Tool[]) => a.length === b.length && a.every((t) => b.includes(t));
const reviewedFormat = new Intl.DateTimeFormat('en', { dateStyle: 'medium', timeStyle: 'short' });

export function SafetyPanel({ channelSlug, segmentId, initialSafety, canEditTools, canReview }: Props) {
  const { data: safety } = useSegmentSafety(channelSlug, segmentId, initialSafety);
  const [chosen, setChosen] = useState<Tool[]>(safety.tools);
  const [otherTool, setOtherTool] = useState(safety.otherTool);
  const [saved, setSaved] = useState(false);
  const toolsMutation = useSaveTools(channelSlug, segmentId);
  const { fields, submit, mutation: saveTools, message } = useFormMutation({
    send: (body: { tools: Tool[]; otherTool: string }) => toolsMutation.mutateAsync(body),
  });
  const review = useSafetyReview(channelSlug, segmentId);
  const legendId = useId();

  const dirty = canEditTools && (!sameTools(chosen, safety.tools) || (chosen.includes('other') && otherTool.trim() !== safety.otherTool));
  const shown = canEditTools ? chosen : safety.tools;
  const shownOther = canEditTools ? otherTool.trim() : safety.otherTool;

  function toggle(tool: Tool, on: boolean) {
    setSaved(false);
    setChosen((list) => (on ? tools.filter((t) => t === tool || list.includes(t)) : list.filter((t) => t !== tool)));
  }

  function onSave(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    setSaved(false);
    submit(
      { tools: chosen, otherTool: chosen.includes('other') ? otherTool : '' },
      {
        onSuccess: (next) => {
          setChosen(next.tools);
          setOtherTool(next.otherTool);
          setSaved(true);
        },
      },
    );
  }

  return (
    <div className="space-y-4">
      {canEditTools ? (
        <form onSubmit={onSave} noValidate className="space-y-3">
          <fieldset aria-describedby={fields.tools ? `${legendId}-error` : undefined}>
            <legend id={legendId} className="mb-2 text-sm font-bold">
              Tools used
            </legend>
            <div className="grid grid-cols-1 gap-x-4 sm:grid-cols-2 lg:grid-cols-3">
              {tools.map((tool) => (
                <label key={tool} className="flex min-h-touch cursor-pointer items-center gap-3 rounded-md px-2 hover:bg-paper-deep">
                  <input
                    type="checkbox"
                    className="size-5 accent-ink"
                    checked={chosen.includes(tool)}
                    onChange={(e) => toggle(tool, e.currentTarget.checked)}
                  />
                  <span>{toolInfo[tool].label}</span>
                </label>
              ))}
            </div>
            {fields.tools ? (
              <p id={`${legendId}-error`} className="mt-1 text-sm font-bold text-attention-ink">
                {fields.tools}
              </p>
            ) : null}
          </fieldset>
          {chosen.includes('other') ? (
            <TextField
              label="Other tool"
              className="max-w-sm"
              value={otherTool}
              maxLength={80}
              error={fields.otherTool}
              onChange={(e) => {
                setSaved(false);
                setOtherTool(e.currentTarget.value);
              }}
            />
          ) : null}
          {message && !Object.keys(fields).length ? <Alert tone="attention">{message}</Alert> : null}
          <div className="flex flex-wrap items-center gap-3">
            <Button type="submit" variant="secondary" disabled={saveTools.isPending}>
              {saveTools.isPending ? 'Saving…' : 'Save tools'}
            </Button>
            <p role="status" className="text-sm text-ink-soft">
              {dirty
                ? needsSafetyReview(chosen) && safety.reviewedAt
                  ? 'Not saved yet. Saving a changed tool list asks for a fresh safety review.'
                  : 'Not saved yet.'
                : saved
                  ? 'Tools saved.'
                  : ''}
            </p>
          </div>
        </form>
      ) : (
        <div>
          <h3 className="mb-1 text-sm font-bold">Tools used</h3>
          {safety.tools.length === 0 ? (
            <p className="text-sm text-ink-soft">No tools listed yet.</p>
          ) : (
            <ul className="flex flex-wrap gap-2">
              {safety.tools.map((t) => (
                <li key={t} className="rounded-md border border-paper-edge bg-white/70 px-2 py-1 text-sm">
                  {t === 'other' && safety.otherTool ? `Other: ${safety.otherTool}` : toolInfo[t].label}
                </li>
              ))}
            </ul>
          )}
        </div>
      )}

      <section aria-label="Cautions">
        <h3 className="mb-2 text-sm font-bold">Cautions{dirty ? ' for the tools ticked above' : ''}</h3>
        <CautionsList tools={shown} otherTool={shownOther} />
      </section>

      <ReviewStatus safety={safety} canReview={canReview} pending={review.isPending} onChange={(v) => review.mutate(v)} error={review.error} />
    </div>
  );
}

function ReviewStatus({
  safety,
  canReview,
  pending,
  onChange,
  error,
}: {
  safety: SegmentSafetyDto;
  canReview: boolean;
  pending: boolean;
  onChange: (reviewed: boolean) => void;
  error: Error | null;
}) {
  if (!safety.needsReview) {
    return <p className="text-sm text-ink-soft">No power tools listed, so no safety review is needed.</p>;
  }
  const fieldError = error instanceof ApiError ? (error.fields.reviewed ?? error.message) : error?.message;
  return (
    <div className="space-y-2">
      {canReview ? (
        <label className="flex min-h-touch w-fit cursor-pointer items-center gap-3 rounded-md px-2 font-bold hover:bg-paper-deep">
          <input
            type="checkbox"
            className="size-5 accent-ink"
            checked={safety.reviewedAt !== null}
            disabled={pending}
            onChange={(e) => onChange(e.currentTarget.checked)}
          />
          Safety reviewed
        </label>
      ) : null}
      {fieldError ? <Alert tone="attention">{fieldError}</Alert> : null}
      {safety.reviewedAt ? (
        <p className="rounded-md border-l-4 border-ok bg-ok-soft px-4 py-3 text-sm text-ok">
          Safety reviewed by {safety.reviewedBy ?? 'a Host'} on{' '}
          <time dateTime={safety.reviewedAt} suppressHydrationWarning>
            {reviewedFormat.format(new Date(safety.reviewedAt))}
          </time>
          .
        </p>
      ) : (
        <p className="rounded-md border-l-4 border-attention bg-attention-soft px-4 py-3 text-sm font-bold text-attention-ink">
          {"Waiting for a Host's safety review: shots cannot be marked Captured until then."}
        </p>
      )}
    </div>
  );
}
