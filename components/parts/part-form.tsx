'use client';

import { useState, type FormEvent, type KeyboardEvent } from 'react';
import { FormActions } from '@/components/ui/form-actions';
import { SelectField, TextField } from '@/components/ui/field';
import type { FieldErrors } from '@/lib/errors';
import type { PartDto } from '@/lib/parts/schemas';
import type { StockItemDto } from '@/lib/stock/schemas';
import { formatLength } from '@/lib/units';

export type PartFormValues = {
  name: string;
  quantity: number;
  lengthIn: string;
  widthIn: string | null;
  thicknessIn: string | null;
  stockItemId: string | null;
  grain: 'length' | 'any';
  note: string;
};

type Props = {
  stock: StockItemDto[];
  unit: 'in' | 'mm';
  part?: PartDto | undefined;
  errors: FieldErrors;
  pending: boolean;
  submitLabel: string;
  onSubmit: (values: PartFormValues) => void;
  onCancel?: (() => void) | undefined;
};

export function PartForm({ stock, unit, part, errors, pending, submitLabel, onSubmit, onCancel }: Props) {
  const fmt = (n: number | null | undefined) => (n == null ? '' : formatLength(n, { unit }).replace('"', ''));
  const [localError, setLocalError] = useState<string | undefined>();
  function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    const text = (k: string) => String(form.get(k) ?? '').trim();
    const quantity = Number(text('quantity'));
    if (!Number.isInteger(quantity) || quantity < 1) return setLocalError('Enter how many, as a whole number.');
    setLocalError(undefined);
    onSubmit({
      name: text('name'),
      quantity,
      lengthIn: text('lengthIn'),
      widthIn: text('widthIn') || null,
      thicknessIn: text('thicknessIn') || null,
      stockItemId: text('stockItemId') || null,
      grain: text('grain') === 'length' ? 'length' : 'any',
      note: text('note'),
    });
  }
  const onKeyDown = (e: KeyboardEvent<HTMLFormElement>) => {
    if (e.key === 'Escape' && onCancel) onCancel();
  };
  return (
    <form onSubmit={submit} onKeyDown={onKeyDown} noValidate className="grid grid-cols-2 gap-3 sm:grid-cols-4">
      <TextField label="Part" name="name" defaultValue={part?.name} error={errors.name} className="col-span-2" required maxLength={80} />
      <TextField label="Qty" name="quantity" inputMode="numeric" defaultValue={part?.quantity ?? 1} error={localError ?? errors.quantity} />
      <TextField label="Length" name="lengthIn" defaultValue={fmt(part?.lengthIn)} error={errors.lengthIn} placeholder='32 1/2 or 2′ 8"' />
      <TextField label="Width" name="widthIn" defaultValue={fmt(part?.widthIn)} error={errors.widthIn} />
      <TextField label="Thickness" name="thicknessIn" defaultValue={fmt(part?.thicknessIn)} error={errors.thicknessIn} />
      <SelectField label="Stock" name="stockItemId" defaultValue={part?.stockItemId ?? ''} error={errors.stockItemId}>
        <option value="">Not chosen</option>
        {stock.map((s) => (
          <option key={s.id} value={s.id}>
            {s.name}
          </option>
        ))}
      </SelectField>
      <SelectField label="Grain" name="grain" defaultValue={part?.grain ?? 'any'} error={errors.grain}>
        <option value="any">Any direction</option>
        <option value="length">Along the length</option>
      </SelectField>
      <TextField label="Grain note" name="note" defaultValue={part?.note} error={errors.note} className="col-span-2 sm:col-span-3" maxLength={200} />
      <FormActions pending={pending} label={submitLabel} onCancel={onCancel} className="col-span-2 flex items-end gap-2 sm:col-span-1" />
    </form>
  );
}
