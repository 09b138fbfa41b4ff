'use client';

import { useRouter } from 'next/navigation';
import type { FormEvent } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';
import { useSchemaForm } from '@/components/ui/use-schema-form';
import { frameRateIds, frameRates } from '@/lib/timecode';
import { apiFetch } from '@/lib/api/client';
import { createEpisodeSchema, episodeStages, stageLabels, updateEpisodeSchema, type EpisodeDto } from '@/lib/episodes/schemas';
import { formatDuration } from '@/lib/runtime';
import { channelApi, channelPage } from '@/lib/api/paths';

type Props = { channelSlug: string; episode?: EpisodeDto };

function readForm(form: HTMLFormElement, withLevels: boolean) {
  const data = new FormData(form);
  const text = (name: string) => String(data.get(name) ?? '');
  const orNull = (name: string) => (text(name).trim() === '' ? null : text(name).trim());
  return {
    title: text('title'),
    premise: text('premise'),
    stage: text('stage'),
    targetSeconds: orNull('targetSeconds'),
    shootDate: orNull('shootDate'),
    publishDate: orNull('publishDate'),
    ...(withLevels && { levelLabels: [text('level1'), text('level2'), text('level3')], frameRate: text('frameRate') }),
  };
}

export function EpisodeForm({ channelSlug, episode }: Props) {
  const router = useRouter();
  const base = channelApi(channelSlug, 'episodes');
  const { fields, submit, mutation: save, message } = useSchemaForm({
    schema: episode ? updateEpisodeSchema : createEpisodeSchema,
    // The values go as typed ("15:00", "" dates): the route parses them with the same schema.
    send: (_input, raw) =>
      episode
        ? apiFetch<{ episode: EpisodeDto }>(channelApi(channelSlug, 'episodes', episode.id), { method: 'PATCH', body: raw })
        : apiFetch<{ episode: EpisodeDto }>(base, { method: 'POST', body: raw }),
    onSuccess: ({ episode: saved }) => {
      router.push(channelPage(channelSlug, 'episodes', saved.id));
      router.refresh();
    },
  });

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    submit(readForm(event.currentTarget, Boolean(episode)));
  }

  return (
    <form onSubmit={onSubmit} noValidate className="max-w-2xl space-y-5">
      {message ? <Alert tone="attention">{message}</Alert> : null}
      <TextField label="Title" name="title" required defaultValue={episode?.title} error={fields.title} />
      <TextField label="Premise (one line)" name="premise" defaultValue={episode?.premise} error={fields.premise} />
      <div className="grid gap-5 sm:grid-cols-2">
        <SelectField label="Stage" name="stage" defaultValue={episode?.stage ?? 'idea'} error={fields.stage}>
          {episodeStages.map((s) => (
            <option key={s} value={s}>
              {stageLabels[s]}
            </option>
          ))}
        </SelectField>
        {episode ? (
          <SelectField label="Edit frame rate" name="frameRate" defaultValue={episode.frameRate} error={fields.frameRate}>
            {frameRateIds.map((id) => (
              <option key={id} value={id}>
                {frameRates[id].label}
              </option>
            ))}
          </SelectField>
        ) : null}
        <TextField
          label="Target runtime (mm:ss)"
          name="targetSeconds"
          inputMode="numeric"
          placeholder="15:00"
          defaultValue={episode?.targetSeconds != null ? formatDuration(episode.targetSeconds) : ''}
          error={fields.targetSeconds}
        />
        <TextField label="Shoot date" name="shootDate" type="date" defaultValue={episode?.shootDate ?? ''} error={fields.shootDate} />
        <TextField label="Publish date" name="publishDate" type="date" defaultValue={episode?.publishDate ?? ''} error={fields.publishDate} />
      </div>
      {episode ? (
        <fieldset className="rounded-card border border-paper-edge p-4">
          <legend className="px-1 text-sm font-bold">Level names for this episode</legend>
          <div className="grid gap-4 sm:grid-cols-3">
            {[0, 1, 2].map((i) => (
              <TextField
                key={i}
                label={`Level ${i + 1}`}
                name={`level${i + 1}`}
                defaultValue={episode.levelLabels[i]}
                error={fields[`levelLabels.${i}`]}
              />
            ))}
          </div>
        </fieldset>
      ) : null}
      <div className="flex gap-3">
        <Button type="submit" disabled={save.isPending}>
          {save.isPending ? 'Saving…' : episode ? 'Save episode' : 'Create episode'}
        </Button>
        <Button variant="quiet" onClick={() => router.back()}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
