'use client';

import { useState, type FormEvent } from 'react';
import { FormActions } from '@/components/ui/form-actions';
import { SelectField, TextAreaField, TextField } from '@/components/ui/field';
import type { FieldErrors } from '@/lib/errors';
import { offersToText, parseOffersText } from '@/lib/stock/offers-text';
import { stockKindLabels, stockKinds, type StockItemDto, type StockKind } from '@/lib/stock/schemas';

type Props = {
  item?: StockItemDto | undefined;
  errors: FieldErrors;
  pending: boolean;
  onSubmit: (body: Record<string, unknown>) => void;
  onCancel?: (() => void) | undefined;
};

const hints: Record<StockKind, { nominal: string; offers: string }> = {
  softwood: { nominal: 'Nominal size, like 2x4 or 1x6.', offers: "Length and price each, like 8 ft 4.50, 10' 6.20, or one per line" },
  hardwood: { nominal: 'Thickness in quarters, like 4/4 or 8/4.', offers: `Board width x length, like 6" x 8', 10' (same width) or one board per line` },
  sheet: { nominal: 'Nominal thickness, like 3/4.', offers: 'Sheet size and price, like 48 x 96 68.00, one per line' },
};

export function StockForm({ item, errors, pending, onSubmit, onCancel }: Props) {
  const [kind, setKind] = useState<StockKind>(item?.kind ?? 'softwood');
  const [offersError, setOffersError] = useState<string | undefined>();
  const serverOffersError = Object.entries(errors).find(([k]) => k.startsWith('offers'))?.[1];
  function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    const text = (k: string) => String(form.get(k) ?? '').trim();
    const parsed = parseOffersText(kind, text('offers'));
    if (parsed.error) return setOffersError(parsed.error);
    setOffersError(undefined);
    const body: Record<string, unknown> = { kind, species: text('species'), nominal: text('nominal'), offers: parsed.offers };
    if (kind === 'hardwood') body.pricePerBoardFoot = text('pricePerBoardFoot');
    if (kind === 'sheet') body.plywood = form.get('plywood') === 'on';
    onSubmit(body);
  }
  return (
    <form onSubmit={submit} onKeyDown={(e) => e.key === 'Escape' && onCancel?.()} noValidate className="grid gap-3 sm:grid-cols-2">
      <SelectField label="Kind" name="kind" value={kind} onChange={(e) => setKind(e.target.value as StockKind)} error={errors.kind} disabled={item !== undefined}>
        {stockKinds.map((k) => (
          <option key={k} value={k}>
            {stockKindLabels[k]}
          </option>
        ))}
      </SelectField>
      <TextField label={kind === 'sheet' ? 'Material' : 'Species'} name="species" defaultValue={item?.species} error={errors.species} placeholder={kind === 'sheet' ? 'Birch plywood' : kind === 'hardwood' ? 'White oak' : 'SPF'} />
      <TextField label={kind === 'hardwood' ? 'Thickness (quarters)' : kind === 'sheet' ? 'Thickness' : 'Profile'} name="nominal" defaultValue={item?.nominal} error={errors.nominal} hint={hints[kind].nominal} />
      {kind === 'hardwood' ? (
        <TextField label="Price per board foot" name="pricePerBoardFoot" inputMode="decimal" defaultValue={item?.pricePerBoardFootCents ? (item.pricePerBoardFootCents / 100).toFixed(2) : ''} error={errors.pricePerBoardFoot} />
      ) : null}
      {kind === 'sheet' ? (
        <label className="flex min-h-touch items-center gap-2 text-sm font-bold sm:mt-6">
          <input type="checkbox" name="plywood" defaultChecked={item ? item.thicknessIn !== Number(item.nominal) : true} className="h-5 w-5" />
          Plywood (actual thickness under nominal)
        </label>
      ) : null}
      <TextAreaField label="Sizes on sale" name="offers" rows={3} defaultValue={item ? offersToText(item) : ''} error={offersError ?? serverOffersError} hint={hints[kind].offers} className="sm:col-span-2" />
      <FormActions pending={pending} label={item ? 'Save stock' : 'Add to rack'} onCancel={onCancel} />
    </form>
  );
}
