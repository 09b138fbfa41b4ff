'use client';

import { useState } from 'react';
import { LocalTime } from '@/components/shop-board/dates';
import { Button } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';
import { useFormMutation } from '@/components/ui/use-schema-form';
import { ApiError } from '@/lib/api/client';
import type { CreateNoteInput, EditNoteDto } from '@/lib/edit/schemas';
import { frameRates, playerTimeToTimecode, type FrameRateId } from '@/lib/timecode';
import { usePlayerTime } from './player-time';
import { useNoteMutations, useVersionNotes } from './use-handoff';

export type NoteTarget = { value: string; label: string };

type Props = {
  slug: string;
  episodeId: string;
  version: number;
  frameRate: FrameRateId;
  targets: NoteTarget[];
  targetLabels: Record<string, string>;
  initial: EditNoteDto[];
  canWrite: boolean;
};

/** Edit notes of one version: threads pinned to a timecode on a segment or a clip. */
export function NotesPanel({ slug, episodeId, version, frameRate, targets, targetLabels, initial, canWrite }: Props) {
  const { data: notes } = useVersionNotes(slug, episodeId, version, initial);
  const { create: createNote, reply, resolve } = useNoteMutations(slug, episodeId, version);
  const { fields, submit, mutation: create, message } = useFormMutation({ send: (input: CreateNoteInput) => createNote.mutateAsync(input) });
  const [target, setTarget] = useState(targets[0]?.value ?? '');
  const [timecode, setTimecode] = useState('');
  const [body, setBody] = useState('');
  const rate = frameRates[frameRate];
  const example = rate.dropFrame ? '00:01:00;02' : '00:01:00:00';
  const player = usePlayerTime().current;
  const [fromPlayer, setFromPlayer] = useState<string | null>(null);
  const takePlayerTime = () => {
    if (!player) return;
    const tc = playerTimeToTimecode(player.seconds, rate);
    const clipTarget = `clip:${player.clipId}`;
    // The player's time is the clip's own, so the note goes on that clip.
    if (targets.some((t) => t.value === clipTarget)) setTarget(clipTarget);
    setTimecode(tc);
    setFromPlayer(`${tc} in ${player.clipName}`);
  };

  return (
    <section aria-labelledby="notes-heading" className="rounded-card border border-paper-edge bg-white/50 p-4 print:border-black">
      <h2 id="notes-heading" className="text-lg font-bold">
        Edit notes
      </h2>
      <p className="text-sm text-ink-faint">
        Timecodes at <span className="font-mono">{rate.label}</span>.
      </p>
      {canWrite ? (
        <form
          className="mt-3 grid gap-3 print:hidden"
          onSubmit={(e) => {
            e.preventDefault();
            const [kind, id] = target.split(':');
            submit(
              { ...(kind === 'clip' ? { clipId: id } : { segmentId: id }), timecode, body },
              {
                onSuccess: () => {
                  setBody('');
                  setTimecode('');
                  setFromPlayer(null);
                },
              },
            );
          }}
        >
          <SelectField label="Pinned to" value={target} onChange={(e) => setTarget(e.target.value)} error={fields.segmentId ?? fields.clipId}>
            {targets.map((t) => (
              <option key={t.value} value={t.value}>
                {t.label}
              </option>
            ))}
          </SelectField>
          <div className="flex flex-wrap items-end gap-2">
            <TextField
              label="Timecode"
              value={timecode}
              onChange={(e) => {
                setTimecode(e.target.value);
                setFromPlayer(null);
              }}
              placeholder={example}
              className="min-w-40 flex-1"
              inputClassName="font-mono"
              inputMode="numeric"
              autoComplete="off"
              error={fields.timecode}
              {...(fields.timecode ? {} : { 'aria-describedby': 'player-time-hint' })}
            />
            <Button type="button" variant="secondary" disabled={!player} onClick={takePlayerTime}>
              Use player time
            </Button>
            <p id="player-time-hint" className="basis-full text-sm text-ink-faint">
              Like <span className="font-mono">{example}</span>.{' '}
              {!player ? 'Preview a clip to take its time from the player.' : null}
              {player && !fromPlayer ? (
                <>
                  Player at <span className="font-mono">{playerTimeToTimecode(player.seconds, rate)}</span> in {player.clipName}
                </>
              ) : null}
              {/* Announced once when the button fills the field, not at every tick of a playing video. */}
              <span role="status">
                {fromPlayer ? (
                  <>
                    From the player: <span className="font-mono">{fromPlayer}</span>
                  </>
                ) : null}
              </span>
            </p>
          </div>
          <div>
            <label htmlFor="note-body" className="mb-1 block text-sm font-bold">
              Note
            </label>
            <textarea
              id="note-body"
              value={body}
              onChange={(e) => setBody(e.target.value)}
              rows={3}
              maxLength={4000}
              aria-invalid={fields.body ? true : undefined}
              aria-describedby={fields.body ? 'note-body-error' : undefined}
              className="block w-full rounded-md border border-ink/30 bg-white px-3 py-2 text-base"
            />
            {fields.body ? (
              <p id="note-body-error" className="mt-1 text-sm text-attention-ink">
                {fields.body}
              </p>
            ) : null}
          </div>
          {message && !Object.keys(fields).length ? (
            <p role="alert" className="text-sm text-attention-ink">
              {message}
            </p>
          ) : null}
          <Button type="submit" disabled={create.isPending} className="justify-self-start">
            {create.isPending ? 'Saving…' : 'Add note'}
          </Button>
        </form>
      ) : null}
      {notes.length === 0 ? (
        <p className="mt-3 text-sm text-ink-soft">No notes on this version yet.</p>
      ) : (
        <ol className="mt-4 grid gap-3" aria-label="Note threads">
          {notes.map((n) => (
            <NoteThread key={n.id} note={n} target={targetLabels[n.segmentId ?? n.clipId ?? ''] ?? 'Removed item'} canWrite={canWrite} onReply={(text) => reply.mutateAsync({ noteId: n.id, body: text })} onResolve={(resolved) => resolve.mutate({ noteId: n.id, resolved })} />
          ))}
        </ol>
      )}
    </section>
  );
}

function NoteThread({ note, target, canWrite, onReply, onResolve }: { note: EditNoteDto; target: string; canWrite: boolean; onReply: (body: string) => Promise<unknown>; onResolve: (resolved: boolean) => void }) {
  const [text, setText] = useState('');
  const [error, setError] = useState<string | null>(null);
  const resolved = note.resolvedAt !== null;
  return (
    <li className={`rounded-md border p-3 ${resolved ? 'border-paper-edge bg-paper-deep/60' : 'border-ink/30 bg-white'}`}>
      <p className="flex flex-wrap items-baseline gap-x-3 text-sm">
        <span className="font-mono font-bold">{note.timecode ?? '—'}</span>
        <span className="text-ink-soft">{target}</span>
        <span className="text-ink-faint">
          {note.author ?? 'someone who left'}, <LocalTime iso={note.createdAt} />
        </span>
        {resolved ? <span className="font-bold">Resolved by {note.resolvedBy ?? 'someone'}</span> : null}
      </p>
      <p className="mt-1 whitespace-pre-wrap">{note.body}</p>
      {note.replies.length ? (
        <ol className="mt-2 grid gap-1 border-l-2 border-paper-edge pl-3 text-sm">
          {note.replies.map((r) => (
            <li key={r.id}>
              <span className="text-ink-faint">{r.author ?? 'someone'}:</span> <span className="whitespace-pre-wrap">{r.body}</span>
            </li>
          ))}
        </ol>
      ) : null}
      {canWrite ? (
        <div className="mt-2 flex flex-wrap items-end gap-2 print:hidden">
          <form
            className="flex flex-1 flex-wrap items-end gap-2"
            onSubmit={(e) => {
              e.preventDefault();
              setError(null);
              onReply(text).then(
                () => setText(''),
                (err: unknown) => setError(err instanceof ApiError ? (err.fields.body ?? err.message) : 'The reply was not saved.'),
              );
            }}
          >
            <TextField label="Reply" value={text} onChange={(e) => setText(e.target.value)} className="min-w-40 flex-1" error={error ?? undefined} />
            <Button type="submit" variant="secondary">
              Reply
            </Button>
          </form>
          <Button variant="quiet" onClick={() => onResolve(!resolved)}>
            {resolved ? 'Reopen' : 'Resolve'}
          </Button>
        </div>
      ) : null}
    </li>
  );
}
