'use client';

import { useRouter } from 'next/navigation';
import { useState, type FormEvent } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';
import { useFormMutation } from '@/components/ui/use-schema-form';
import type { FieldErrors } from '@/lib/errors';
import { isCurrency, parseMoney } from '@/lib/sponsors/money';
import type { SponsorDto } from '@/lib/sponsors/schemas';
import { useSponsorMutations } from './use-sponsor-mutations';

const NEW = 'new';

type NewSponsor = { name: string; contacts: { name: string; email: string }[] };
type NewDeal = { sponsorId: string; title: string; feeMinor: number; currency: string; paymentTermsDays: number };

/** A deal for an existing sponsor, or for a new one entered here; opens the deal page when saved. */
export function NewDealForm({ channelSlug, sponsors }: { channelSlug: string; sponsors: SponsorDto[] }) {
  const router = useRouter();
  const m = useSponsorMutations(channelSlug);
  const [sponsorId, setSponsorId] = useState(sponsors[0]?.id ?? NEW);
  const { fields: errors, submit: send, refuse, mutation, message } = useFormMutation({
    send: async ({ newSponsor, deal }: { newSponsor: NewSponsor | null; deal: Omit<NewDeal, 'sponsorId'> }) => {
      let id = sponsorId;
      if (newSponsor) {
        id = (await m.createSponsor.mutateAsync(newSponsor)).sponsor.id;
        // Saved even if the deal is refused, so a second try does not make the sponsor twice.
        setSponsorId(id);
      }
      return (await m.createDeal.mutateAsync({ ...deal, sponsorId: id })).deal;
    },
    onSuccess: (deal) => router.push(`/c/${channelSlug}/sponsors/${deal.id}`),
    // The contact's errors come back as contacts.0.name / contacts.0.email.
    fieldNames: { 'contacts.0.name': 'contactName', 'contacts.0.email': 'contactEmail', name: 'sponsorName' },
  });
  const pending = mutation.isPending;

  function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    const text = (k: string) => String(form.get(k) ?? '').trim();
    const currency = text('currency').toUpperCase();
    const local: FieldErrors = {};
    if (!isCurrency(currency)) local.currency = 'Use an ISO 4217 currency code, like USD or EUR.';
    const feeMinor = isCurrency(currency) ? parseMoney(text('fee'), currency) : null;
    if (feeMinor === null) local.feeMinor = 'Enter the fee as an amount, like 2500 or 2500.00.';
    const terms = Number(text('paymentTermsDays'));
    if (Object.keys(local).length > 0 || feeMinor === null) return refuse(local);
    const contact = text('contactName') || text('contactEmail') ? [{ name: text('contactName'), email: text('contactEmail') }] : [];
    send({
      newSponsor: sponsorId === NEW ? { name: text('sponsorName'), contacts: contact } : null,
      deal: { title: text('title'), feeMinor, currency, paymentTermsDays: Number.isFinite(terms) ? terms : -1 },
    });
  }

  return (
    <form onSubmit={submit} noValidate className="grid gap-3 rounded-card border border-paper-edge bg-white/60 p-5 shadow-card sm:grid-cols-2" aria-labelledby="new-deal-heading">
      <h2 id="new-deal-heading" className="text-lg font-bold sm:col-span-2">
        New deal
      </h2>
      {message ? (
        <div className="sm:col-span-2">
          <Alert tone="attention">{message}</Alert>
        </div>
      ) : null}
      <SelectField label="Sponsor" name="sponsorId" value={sponsorId} onChange={(e) => setSponsorId(e.target.value)} error={errors.sponsorId}>
        {sponsors.map((s) => (
          <option key={s.id} value={s.id}>
            {s.name}
          </option>
        ))}
        <option value={NEW}>New sponsor…</option>
      </SelectField>
      {sponsorId === NEW ? (
        <>
          <TextField label="Sponsor name" name="sponsorName" error={errors.sponsorName} autoComplete="organization" />
          <TextField label="Contact name" name="contactName" error={errors.contactName} autoComplete="off" />
          <TextField label="Contact e-mail" name="contactEmail" type="email" error={errors.contactEmail} autoComplete="off" />
        </>
      ) : null}
      <TextField label="Deal title" name="title" error={errors.title} placeholder="Spring sanding read" />
      <TextField label="Fee" name="fee" inputMode="decimal" error={errors.feeMinor} placeholder="2500.00" />
      <TextField label="Currency" name="currency" defaultValue="USD" maxLength={3} error={errors.currency} hint="ISO 4217 code, like USD, EUR or GBP." />
      <TextField label="Payment terms (days)" name="paymentTermsDays" type="number" min={0} max={365} defaultValue={30} error={errors.paymentTermsDays} />
      <div className="sm:col-span-2">
        <Button type="submit" disabled={pending}>
          {pending ? 'Saving…' : 'Create deal'}
        </Button>
      </div>
    </form>
  );
}
