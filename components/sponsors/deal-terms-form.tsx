'use client';

import { useState, type FormEvent } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';
import { useFormMutation } from '@/components/ui/use-schema-form';
import { isCurrency, minorToInput, parseMoney } from '@/lib/sponsors/money';
import { invoiceStateLabels, invoiceStates, type DealDto, type InvoiceState } from '@/lib/sponsors/schemas';
import { useSponsorMutations } from './use-sponsor-mutations';

/** The deal's terms and invoice state; the dates that do not apply to a state are not sent. */
export function DealTermsForm({ channelSlug, deal }: { channelSlug: string; deal: DealDto }) {
  const m = useSponsorMutations(channelSlug);
  const [state, setState] = useState<InvoiceState>(deal.invoiceState);
  const { fields: errors, submit: send, refuse, mutation: save, message } = useFormMutation({
    send: (body: Record<string, unknown>) => m.updateDeal.mutateAsync({ dealId: deal.id, body }),
  });

  function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    const text = (k: string) => String(form.get(k) ?? '').trim();
    const currency = text('currency').toUpperCase();
    const feeMinor = isCurrency(currency) ? parseMoney(text('fee'), currency) : null;
    if (!isCurrency(currency)) return refuse({ currency: 'Use an ISO 4217 currency code, like USD or EUR.' });
    if (feeMinor === null) return refuse({ feeMinor: 'Enter the fee as an amount, like 2500 or 2500.00.' });
    const body = {
      title: text('title'),
      feeMinor,
      currency,
      // An empty or non-numeric field goes as null, which the server answers with a field error.
      paymentTermsDays: text('paymentTermsDays') === '' ? null : Number(text('paymentTermsDays')),
      invoiceState: state,
      invoiceSentOn: state === 'not_sent' ? null : text('invoiceSentOn') || null,
      paidOn: state === 'paid' ? text('paidOn') || null : null,
      notes: text('notes'),
    };
    send(body);
  }

  return (
    <form onSubmit={submit} noValidate className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3" aria-label="Deal terms">
      {message ? (
        <div className="sm:col-span-2 lg:col-span-3">
          <Alert tone="attention">{message}</Alert>
        </div>
      ) : null}
      <TextField label="Deal title" name="title" defaultValue={deal.title} error={errors.title} />
      <TextField label="Fee" name="fee" inputMode="decimal" defaultValue={minorToInput(deal.feeMinor, deal.currency)} error={errors.feeMinor} />
      <TextField label="Currency" name="currency" maxLength={3} defaultValue={deal.currency} error={errors.currency} />
      <TextField label="Payment terms (days)" name="paymentTermsDays" type="number" min={0} max={365} defaultValue={deal.paymentTermsDays} error={errors.paymentTermsDays} />
      <SelectField label="Invoice" name="invoiceState" value={state} onChange={(e) => setState(e.target.value as InvoiceState)} error={errors.invoiceState}>
        {invoiceStates.map((s) => (
          <option key={s} value={s}>
            {s === 'not_sent' ? 'Not sent' : s === 'sent' ? 'Sent' : 'Paid'} ({invoiceStateLabels[s]})
          </option>
        ))}
      </SelectField>
      {state !== 'not_sent' ? <TextField label="Invoice sent on" name="invoiceSentOn" type="date" defaultValue={deal.invoiceSentOn ?? ''} error={errors.invoiceSentOn} /> : null}
      {state === 'paid' ? <TextField label="Paid on" name="paidOn" type="date" defaultValue={deal.paidOn ?? ''} error={errors.paidOn} /> : null}
      <TextField label="Notes" name="notes" defaultValue={deal.notes} error={errors.notes} className="sm:col-span-2 lg:col-span-3" />
      <div className="flex items-center gap-3 sm:col-span-2 lg:col-span-3">
        <Button type="submit" disabled={save.isPending}>
          {save.isPending ? 'Saving…' : 'Save terms'}
        </Button>
        {save.isSuccess ? (
          <span role="status" className="text-sm text-ok">
            Saved.
          </span>
        ) : null}
      </div>
    </form>
  );
}
