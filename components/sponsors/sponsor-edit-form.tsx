'use client';

import { useId, useState, type FormEvent } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { validateForm } from '@/lib/api/form';
import { ApiError } from '@/lib/api/client';
import type { FieldErrors } from '@/lib/errors';
import { updateSponsorSchema, type SponsorContact, type SponsorDto } from '@/lib/sponsors/schemas';
import { useSponsorMutations } from './use-sponsor-mutations';

// Up to 10 contacts, the schema's limit (lib/sponsors/schemas.ts).
const MAX_CONTACTS = 10;

type Row = SponsorContact & { key: number };

/** Name, contacts and notes of one sponsor; checked with the same schema the route uses. */
export function SponsorEditForm({ channelSlug, sponsor, onDone }: { channelSlug: string; sponsor: SponsorDto; onDone: () => void }) {
  const m = useSponsorMutations(channelSlug);
  const notesId = useId();
  const [rows, setRows] = useState<Row[]>(() => sponsor.contacts.map((c, i) => ({ ...c, key: i })));
  const [nextKey, setNextKey] = useState(sponsor.contacts.length);
  const [errors, setErrors] = useState<FieldErrors>({});
  const [message, setMessage] = useState<string | null>(null);

  function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    const body = {
      name: String(form.get('name') ?? ''),
      contacts: rows.map((r) => ({ name: r.name, email: r.email })),
      notes: String(form.get('notes') ?? ''),
    };
    const checked = validateForm(updateSponsorSchema, body);
    if (!checked.ok) return setErrors(checked.fields);
    setErrors({});
    setMessage(null);
    m.updateSponsor.mutate(
      { sponsorId: sponsor.id, body: checked.data },
      {
        onSuccess: onDone,
        onError: (err) => {
          if (err instanceof ApiError) setErrors(err.fields);
          setMessage(err.message);
        },
      },
    );
  }

  const change = (key: number, field: keyof SponsorContact, value: string) => setRows((all) => all.map((r) => (r.key === key ? { ...r, [field]: value } : r)));

  return (
    <form onSubmit={submit} noValidate aria-label={`Edit ${sponsor.name}`} className="space-y-3">
      {message ? <Alert tone="attention">{message}</Alert> : null}
      <TextField label="Sponsor name" name="name" defaultValue={sponsor.name} error={errors.name} autoComplete="organization" />
      <fieldset className="space-y-3">
        <legend className="mb-1 text-sm font-bold">Contacts</legend>
        {errors.contacts ? <p className="text-sm font-bold text-attention-ink">{errors.contacts}</p> : null}
        {rows.length === 0 ? <p className="text-sm text-ink-faint">No contacts.</p> : null}
        {rows.map((r, i) => (
          <div key={r.key} className="grid gap-2 rounded-md border border-paper-edge p-3 sm:grid-cols-[1fr_1fr_auto] sm:items-end">
            <TextField label={`Contact ${i + 1} name`} value={r.name} onChange={(e) => change(r.key, 'name', e.target.value)} error={errors[`contacts.${i}.name`]} autoComplete="off" />
            <TextField
              label={`Contact ${i + 1} e-mail`}
              type="email"
              value={r.email}
              onChange={(e) => change(r.key, 'email', e.target.value)}
              error={errors[`contacts.${i}.email`]}
              autoComplete="off"
            />
            <Button type="button" variant="quiet" onClick={() => setRows((all) => all.filter((x) => x.key !== r.key))}>
              Remove<span className="sr-only"> contact {i + 1}</span>
            </Button>
          </div>
        ))}
        {rows.length < MAX_CONTACTS ? (
          <Button
            type="button"
            variant="secondary"
            onClick={() => {
              setRows((all) => [...all, { name: '', email: '', key: nextKey }]);
              setNextKey((k) => k + 1);
            }}
          >
            Add contact
          </Button>
        ) : null}
      </fieldset>
      <div>
        <label htmlFor={notesId} className="mb-1 block text-sm font-bold">
          Notes
        </label>
        <textarea
          id={notesId}
          name="notes"
          rows={3}
          defaultValue={sponsor.notes}
          aria-invalid={errors.notes ? true : undefined}
          aria-describedby={errors.notes ? `${notesId}-error` : undefined}
          className="block w-full rounded-md border border-ink/30 bg-white px-3 py-2 text-base"
        />
        {errors.notes ? (
          <p id={`${notesId}-error`} className="mt-1 text-sm font-bold text-attention-ink">
            {errors.notes}
          </p>
        ) : null}
      </div>
      <div className="flex flex-wrap gap-2">
        <Button type="submit" disabled={m.updateSponsor.isPending}>
          {m.updateSponsor.isPending ? 'Saving…' : 'Save sponsor'}
        </Button>
        <Button type="button" variant="quiet" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
