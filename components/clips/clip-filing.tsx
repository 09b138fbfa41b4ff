'use client';

import { useId, useState, type FormEvent } from 'react';
import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/field';
import { ApiError } from '@/lib/api/client';
import type { ClipDto } from '@/lib/clips/schemas';
import { useFileClip } from './use-clips';

export type Choice = { id: string; label: string };

type Props = { slug: string; clip: ClipDto; shots: Choice[]; segments: Choice[]; onFiled: (text: string) => void };

/**
 * Ties a clip to a shot of its segment, or moves it to another segment of the episode, after the upload
 * (issue 15). A move leaves the shot: the new segment's shots are chosen on that segment's page.
 */
export function ClipFiling({ slug, clip, shots, segments, onFiled }: Props) {
  const file = useFileClip(slug, clip.segmentId);
  const [segmentId, setSegmentId] = useState(clip.segmentId);
  const [shotId, setShotId] = useState(clip.shotId ?? '');
  const hintId = useId();
  const moving = segmentId !== clip.segmentId;
  const fields = file.error instanceof ApiError ? file.error.fields : {};

  function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const body = moving ? { segmentId } : { shotId: shotId || null };
    const target = moving ? segments.find((s) => s.id === segmentId)?.label : shots.find((s) => s.id === shotId)?.label;
    // mutateAsync, not mutate's onSuccess: a moved clip leaves this list once the list refetches, and
    // TanStack Query skips mutate's own callbacks when the component has unmounted by then.
    file
      .mutateAsync({ clip, body })
      .then(() => onFiled(moving ? `Moved ${clip.originalName} to ${target ?? 'another segment'}.` : shotId ? `Tied ${clip.originalName} to ${target ?? 'the shot'}.` : `${clip.originalName} is no longer tied to a shot.`))
      // The error is shown from the mutation's state below.
      .catch(() => undefined);
  }

  return (
    <details className="group text-sm">
      <summary className="inline-flex min-h-touch cursor-pointer items-center gap-1 rounded-md font-bold text-ink-soft hover:text-ink">
        <svg aria-hidden="true" width="10" height="10" viewBox="0 0 10 10" className="transition-transform group-open:rotate-90">
          <path d="M3 1.5L7 5 3 8.5" fill="none" stroke="currentColor" strokeWidth="1.6" />
        </svg>
        Shot and segment<span className="sr-only"> of {clip.originalName}</span>
      </summary>
      <form onSubmit={submit} noValidate className="mt-2 grid gap-3 sm:grid-cols-2">
        <SelectField label="Segment" value={segmentId} onChange={(e) => setSegmentId(e.target.value)} error={fields.segmentId}>
          {segments.map((s) => (
            <option key={s.id} value={s.id}>
              {s.label}
            </option>
          ))}
        </SelectField>
        <SelectField label="Shot" value={moving ? '' : shotId} onChange={(e) => setShotId(e.target.value)} disabled={moving} aria-describedby={moving ? hintId : undefined} error={fields.shotId}>
          <option value="">No shot</option>
          {shots.map((s) => (
            <option key={s.id} value={s.id}>
              {s.label}
            </option>
          ))}
        </SelectField>
        {moving ? (
          <p id={hintId} className="text-ink-soft sm:col-span-2">
            Moved, the clip leaves its shot; tie it to a shot of the new segment on that segment’s page.
          </p>
        ) : null}
        {file.isError && !fields.segmentId && !fields.shotId ? <p className="font-bold text-attention-ink sm:col-span-2">{file.error.message}</p> : null}
        <div>
          <Button type="submit" variant="secondary" disabled={file.isPending || (!moving && shotId === (clip.shotId ?? ''))}>
            {file.isPending ? 'Saving…' : moving ? 'Move clip' : 'Save shot'}
          </Button>
        </div>
      </form>
    </details>
  );
}
