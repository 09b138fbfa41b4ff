'use client';

import { useState, type FormEvent } from 'react';
import { Alert } from '@/components/ui/alert';
import { FormActions } from '@/components/ui/form-actions';
import { SelectField, TextField } from '@/components/ui/field';
import { useFormMutation } from '@/components/ui/use-schema-form';
import { formatDuration } from '@/lib/runtime';
import { deliverableKindLabels, deliverableKinds, dueDateKinds, dueDateLabels, type DeliverableDto, type DeliverableKind } from '@/lib/sponsors/schemas';

export type EpisodeChoice = { id: string; title: string; segments: { id: string; title: string; kind: string }[] };
export type CrewChoice = { userId: string; name: string };

type Props = {
  deliverable?: DeliverableDto;
  episodes: EpisodeChoice[];
  crew: CrewChoice[];
  pending: boolean;
  submitLabel: string;
  onSubmit: (body: Record<string, unknown>) => Promise<unknown>;
  onCancel?: () => void;
};

/** What a deliverable asks for: where, what to say, how long, how early. Durations go as "m:ss" text. */
export function DeliverableForm({ deliverable: d, episodes, crew, pending, submitLabel, onSubmit, onCancel }: Props) {
  const [episodeId, setEpisodeId] = useState(d?.episodeId ?? episodes[0]?.id ?? '');
  const [kind, setKind] = useState<DeliverableKind>(d?.kind ?? 'segment_read');
  const [placementKind, setPlacementKind] = useState<'none' | 'starts_before' | 'within_percent'>(d?.placement?.kind ?? 'starts_before');
  const { fields: errors, submit: send, message } = useFormMutation({ send: onSubmit });
  const segments = episodes.find((e) => e.id === episodeId)?.segments ?? [];
  const defaultSegment = d?.segmentId ?? segments.find((s) => s.kind === 'sponsor_read')?.id ?? '';

  function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    const text = (k: string) => String(form.get(k) ?? '').trim();
    const orNull = (k: string) => text(k) || null;
    const body: Record<string, unknown> = {
      episodeId,
      segmentId: orNull('segmentId'),
      kind,
      mustSay: text('mustSay')
        .split('\n')
        .map((l) => l.trim())
        .filter(Boolean),
      disclosure: text('disclosure'),
      tracking: text('tracking'),
      readMinSeconds: orNull('readMin'),
      readMaxSeconds: orNull('readMax'),
      ownerId: orNull('ownerId'),
      placement:
        placementKind === 'none'
          ? null
          : placementKind === 'starts_before'
            ? { kind: 'starts_before', seconds: text('placementSeconds') }
            : { kind: 'within_percent', percent: Number(text('placementPercent')) },
    };
    if (!d) body.dueDates = Object.fromEntries(dueDateKinds.filter((k) => k !== 'payment_due').map((k) => [k, orNull(`due-${k}`)]));
    send(body);
  }

  const placementError = Object.entries(errors).find(([k]) => k.startsWith('placement'))?.[1];
  return (
    <form onSubmit={submit} noValidate className="grid gap-3 sm:grid-cols-2" aria-label={submitLabel}>
      {message ? (
        <div className="sm:col-span-2">
          <Alert tone="attention">{message}</Alert>
        </div>
      ) : null}
      <SelectField label="What the deal asks for" name="kind" value={kind} onChange={(e) => setKind(e.target.value as DeliverableKind)} error={errors.kind}>
        {deliverableKinds.map((k) => (
          <option key={k} value={k}>
            {deliverableKindLabels[k]}
          </option>
        ))}
      </SelectField>
      <SelectField label="Episode" name="episodeId" value={episodeId} onChange={(e) => setEpisodeId(e.target.value)} error={errors.episodeId}>
        {episodes.map((e) => (
          <option key={e.id} value={e.id}>
            {e.title}
          </option>
        ))}
      </SelectField>
      <SelectField key={episodeId} label="Segment that carries it" name="segmentId" defaultValue={episodeId === d?.episodeId ? defaultSegment : (segments.find((s) => s.kind === 'sponsor_read')?.id ?? '')} error={errors.segmentId}>
        <option value="">No segment</option>
        {segments.map((s) => (
          <option key={s.id} value={s.id}>
            {s.title}
          </option>
        ))}
      </SelectField>
      <SelectField label="Owner" name="ownerId" defaultValue={d?.ownerId ?? ''} error={errors.ownerId}>
        <option value="">Nobody in particular</option>
        {crew.map((c) => (
          <option key={c.userId} value={c.userId}>
            {c.name}
          </option>
        ))}
      </SelectField>
      <TextField label="Disclosure wording" name="disclosure" defaultValue={d?.disclosure ?? ''} error={errors.disclosure} placeholder="This video is sponsored by …" className="sm:col-span-2" />
      <div className="sm:col-span-2">
        <label htmlFor="must-say" className="mb-1 block text-sm font-bold">
          Must-say phrases (one per line)
        </label>
        <textarea
          id="must-say"
          name="mustSay"
          rows={3}
          defaultValue={d?.mustSay.join('\n') ?? ''}
          aria-invalid={Object.keys(errors).some((k) => k.startsWith('mustSay')) ? true : undefined}
          className="block w-full rounded-md border border-ink/30 bg-white px-3 py-2 text-base"
        />
        {Object.entries(errors).find(([k]) => k.startsWith('mustSay')) ? (
          <p className="mt-1 text-sm font-bold text-attention-ink">{Object.entries(errors).find(([k]) => k.startsWith('mustSay'))?.[1]}</p>
        ) : null}
      </div>
      <TextField label="Tracking link or code" name="tracking" defaultValue={d?.tracking ?? ''} error={errors.tracking} className="sm:col-span-2" />
      <TextField label="Shortest read (m:ss)" name="readMin" defaultValue={d?.readMinSeconds != null ? formatDuration(d.readMinSeconds) : ''} error={errors.readMinSeconds} placeholder="1:00" />
      <TextField label="Longest read (m:ss)" name="readMax" defaultValue={d?.readMaxSeconds != null ? formatDuration(d.readMaxSeconds) : ''} error={errors.readMaxSeconds} placeholder="1:30" />
      <SelectField label="Placement rule" name="placementKind" value={placementKind} onChange={(e) => setPlacementKind(e.target.value as typeof placementKind)} error={placementError}>
        <option value="starts_before">Read starts before a time</option>
        <option value="within_percent">Read starts within the first N % of the runtime</option>
        <option value="none">No placement rule</option>
      </SelectField>
      {placementKind === 'starts_before' ? (
        <TextField label="Starts before (m:ss)" name="placementSeconds" defaultValue={d?.placement?.kind === 'starts_before' ? formatDuration(d.placement.seconds) : '3:00'} />
      ) : placementKind === 'within_percent' ? (
        <TextField label="Within the first (%)" name="placementPercent" type="number" min={1} max={100} defaultValue={d?.placement?.kind === 'within_percent' ? d.placement.percent : 30} />
      ) : (
        <span />
      )}
      {!d ? (
        <fieldset className="grid gap-3 sm:col-span-2 sm:grid-cols-2">
          <legend className="mb-1 text-sm font-bold">Due dates (Payment due follows go-live and the terms)</legend>
          {dueDateKinds
            .filter((k) => k !== 'payment_due')
            .map((k) => (
              <TextField key={k} label={dueDateLabels[k]} name={`due-${k}`} type="date" error={errors[`dueDates.${k}`]} />
            ))}
        </fieldset>
      ) : null}
      <FormActions pending={pending} label={submitLabel} onCancel={onCancel} className="flex gap-2 sm:col-span-2" />
    </form>
  );
}
