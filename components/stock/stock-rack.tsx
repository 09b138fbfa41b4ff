'use client';

import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState, type FormEvent } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';
import { ApiError, apiFetch } from '@/lib/api/client';
import type { FieldErrors } from '@/lib/errors';
import { stockKindLabels, stockKinds, type CutSettingsDto, type StockItemDto } from '@/lib/stock/schemas';
import { formatLength } from '@/lib/units';
import { StockForm } from './stock-form';
import { channelApi } from '@/lib/api/paths';
import { queryKeys } from '@/lib/api/query-keys';

type Props = { channelSlug: string; canEdit: boolean; initialStock: StockItemDto[]; initialSettings: CutSettingsDto };

const money = (cents: number) => `$${(cents / 100).toFixed(2)}`;

export function StockRack({ channelSlug, canEdit, initialStock, initialSettings }: Props) {
  const client = useQueryClient();
  const stock = useQuery({ queryKey: queryKeys.stock(channelSlug), queryFn: () => apiFetch<{ stock: StockItemDto[] }>(channelApi(channelSlug, 'stock')).then((r) => r.stock), initialData: initialStock });
  const [editing, setEditing] = useState<string | null>(null);
  const [errors, setErrors] = useState<FieldErrors>({});
  const [message, setMessage] = useState<string | undefined>();
  const [formKey, setFormKey] = useState(0);
  const onError = (e: unknown) => {
    setErrors(e instanceof ApiError ? e.fields : {});
    setMessage(e instanceof ApiError ? e.message : 'Could not save.');
  };
  const done = async () => {
    setErrors({});
    setMessage(undefined);
    await Promise.all([client.invalidateQueries({ queryKey: queryKeys.stock(channelSlug) }), client.invalidateQueries({ queryKey: queryKeys.cutPlans() })]);
  };
  const add = useMutation({ mutationFn: (b: Record<string, unknown>) => apiFetch(channelApi(channelSlug, 'stock'), { method: 'POST', body: b }), onSuccess: () => done().then(() => setFormKey((k) => k + 1)), onError });
  const save = useMutation({
    mutationFn: ({ id, b }: { id: string; b: Record<string, unknown> }) => apiFetch(channelApi(channelSlug, 'stock', id), { method: 'PUT', body: b }),
    onSuccess: () => done().then(() => setEditing(null)),
    onError,
  });
  const remove = useMutation({ mutationFn: (id: string) => apiFetch(channelApi(channelSlug, 'stock', id), { method: 'DELETE' }), onSuccess: done, onError });
  const inch = (n: number) => formatLength(n, { unit: initialSettings.lengthUnit });

  return (
    <div className="space-y-8">
      <CutSettingsForm channelSlug={channelSlug} canEdit={canEdit} initial={initialSettings} />
      {message ? <Alert tone="attention">{message}</Alert> : null}
      {stock.data.length === 0 ? <p className="text-sm text-ink-faint">The rack is empty. Add the lumber and sheet goods your store sells.</p> : null}
      {stockKinds.map((kind) => {
        const items = stock.data.filter((s) => s.kind === kind);
        if (items.length === 0) return null;
        return (
          <section key={kind} aria-label={stockKindLabels[kind]}>
            <h2 className="mb-2 text-lg font-bold">{stockKindLabels[kind]}</h2>
            <ul className="space-y-2">
              {items.map((s) => (
                <li key={s.id} className="rounded-card border border-paper-edge bg-white/60 p-3">
                  {editing === s.id ? (
                    <StockForm item={s} errors={errors} pending={save.isPending} onSubmit={(b) => save.mutate({ id: s.id, b })} onCancel={() => setEditing(null)} />
                  ) : (
                    <div className="flex flex-wrap items-start justify-between gap-2">
                      <div>
                        <p className="font-bold">{s.name}</p>
                        <p className="font-mono text-xs text-ink-soft">
                          actual {formatLength(s.thicknessIn, { unit: initialSettings.lengthUnit, denominator: 32 })}
                          {s.widthIn !== null ? ` × ${inch(s.widthIn)}` : ''}
                          {s.pricePerBoardFootCents !== null ? ` · ${money(s.pricePerBoardFootCents)} per board foot` : ''}
                        </p>
                        <p className="mt-1 font-mono text-sm">
                          {s.offers
                            .map((o) => ('widthIn' in o ? `${inch(o.widthIn)} × ${inch(o.lengthIn)} ${money(o.priceCents)}` : s.kind === 'hardwood' ? inch(o.lengthIn) : `${inch(o.lengthIn)} ${money(o.priceCents)}`))
                            .join(' · ')}
                        </p>
                      </div>
                      {canEdit ? (
                        <div className="flex gap-1">
                          <Button variant="quiet" aria-label={`Edit ${s.name}`} onClick={() => setEditing(s.id)}>
                            Edit
                          </Button>
                          <Button variant="quiet" aria-label={`Delete ${s.name}`} disabled={remove.isPending} onClick={() => remove.mutate(s.id)}>
                            Delete
                          </Button>
                        </div>
                      ) : null}
                    </div>
                  )}
                </li>
              ))}
            </ul>
          </section>
        );
      })}
      {canEdit && editing === null ? (
        <section aria-labelledby="add-stock-heading" className="rounded-card border border-paper-edge bg-white/60 p-4">
          <h2 id="add-stock-heading" className="mb-2 font-bold">
            Add stock
          </h2>
          <StockForm key={formKey} errors={errors} pending={add.isPending} onSubmit={(b) => add.mutate(b)} />
        </section>
      ) : null}
    </div>
  );
}

function CutSettingsForm({ channelSlug, canEdit, initial }: { channelSlug: string; canEdit: boolean; initial: CutSettingsDto }) {
  const client = useQueryClient();
  const [errors, setErrors] = useState<FieldErrors>({});
  const save = useMutation({
    mutationFn: (b: Record<string, string>) => apiFetch(channelApi(channelSlug, 'cut-settings'), { method: 'PATCH', body: b }),
    onSuccess: () => {
      setErrors({});
      return client.invalidateQueries({ queryKey: queryKeys.cutPlans() });
    },
    onError: (e) => setErrors(e instanceof ApiError ? { ...e.fields, _: e.message } : { _: 'Could not save.' }),
  });
  const f = (n: number) => formatLength(n, { unit: 'in', denominator: 32 }).replace('"', '');
  function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    const text = (k: string) => String(form.get(k) ?? '').trim();
    save.mutate({ kerfIn: text('kerfIn'), endTrimIn: text('endTrimIn'), minOffcutIn: text('minOffcutIn'), jointIn: text('jointIn'), lengthUnit: text('lengthUnit') });
  }
  return (
    <section aria-labelledby="cut-settings-heading" className="max-w-3xl rounded-card border border-paper-edge bg-white/60 p-4">
      <h2 id="cut-settings-heading" className="mb-2 font-bold">
        Shop settings
      </h2>
      <form onSubmit={submit} noValidate className="grid grid-cols-2 gap-3 sm:grid-cols-3">
        <TextField label="Saw kerf (in)" name="kerfIn" defaultValue={f(initial.kerfIn)} error={errors.kerfIn} disabled={!canEdit} />
        <TextField label="End trim (in)" name="endTrimIn" defaultValue={f(initial.endTrimIn)} error={errors.endTrimIn} disabled={!canEdit} />
        <TextField label="Keep offcuts from (in)" name="minOffcutIn" defaultValue={f(initial.minOffcutIn)} error={errors.minOffcutIn} disabled={!canEdit} />
        <TextField label="Jointing per rip (in)" name="jointIn" defaultValue={f(initial.jointIn)} error={errors.jointIn} disabled={!canEdit} />
        <SelectField label="Show lengths in" name="lengthUnit" defaultValue={initial.lengthUnit} error={errors.lengthUnit} disabled={!canEdit}>
          <option value="in">Inches</option>
          <option value="mm">Millimetres</option>
        </SelectField>
        {canEdit ? (
          <div className="flex items-end">
            <Button type="submit" variant="secondary" disabled={save.isPending}>
              {save.isPending ? 'Saving…' : save.isSuccess ? 'Saved' : 'Save settings'}
            </Button>
          </div>
        ) : null}
      </form>
      {errors._ && Object.keys(errors).length === 1 ? <p className="mt-2 text-sm text-attention-ink">{errors._}</p> : null}
      <p className="mt-2 text-xs text-ink-faint">End trim is cut off each end of every board (checks, snipe). Offcuts shorter than the keep length are drawn as scrap.</p>
    </section>
  );
}
