'use client';

import { useQuery, useQueryClient } from '@tanstack/react-query';
import type { FormEvent } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';
import { useListEdits } from '@/components/ui/use-list-edits';
import { useFormMutation } from '@/components/ui/use-schema-form';
import { apiFetch } from '@/lib/api/client';
import { stockKindLabels, stockKinds, type CutSettingsDto, type StockItemDto } from '@/lib/stock/schemas';
import { formatBoardSize } from '@/lib/stock/board-size';
import { formatLength } from '@/lib/units';
import { StockForm } from './stock-form';
import { channelApi } from '@/lib/api/paths';
import { queryKeys } from '@/lib/api/query-keys';

type Props = { channelSlug: string; canEdit: boolean; initialStock: StockItemDto[]; initialSettings: CutSettingsDto };

type StockBody = Record<string, unknown>;

const money = (cents: number) => `$${(cents / 100).toFixed(2)}`;

/** One size on sale as the rack lists it; hardwood boards by width and length, priced by the board foot. */
function offerLabel(kind: StockItemDto['kind'], o: StockItemDto['offers'][number], unit: CutSettingsDto['lengthUnit']): string {
  const f = (n: number) => formatLength(n, { unit });
  if (kind === 'hardwood') return 'widthIn' in o ? formatBoardSize(o.widthIn, o.lengthIn, unit) : f(o.lengthIn);
  return 'widthIn' in o ? `${f(o.widthIn)} × ${f(o.lengthIn)} ${money(o.priceCents)}` : `${f(o.lengthIn)} ${money(o.priceCents)}`;
}

export function StockRack({ channelSlug, canEdit, initialStock, initialSettings }: Props) {
  const client = useQueryClient();
  const stock = useQuery({ queryKey: queryKeys.stock(channelSlug), queryFn: () => apiFetch<{ stock: StockItemDto[] }>(channelApi(channelSlug, 'stock')).then((r) => r.stock), initialData: initialStock });
  const { editing, startEditing, stopEditing, addFormKey, adding, saving, removing, message } = useListEdits<StockBody, StockBody>({
    add: (b) => apiFetch(channelApi(channelSlug, 'stock'), { method: 'POST', body: b }),
    save: (id, b) => apiFetch(channelApi(channelSlug, 'stock', id), { method: 'PUT', body: b }),
    remove: (id) => apiFetch(channelApi(channelSlug, 'stock', id), { method: 'DELETE' }),
    refresh: () => Promise.all([client.invalidateQueries({ queryKey: queryKeys.stock(channelSlug) }), client.invalidateQueries({ queryKey: queryKeys.cutPlans() })]),
    failureMessage: 'Could not save.',
  });
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
                    <StockForm item={s} errors={saving.fields} pending={saving.mutation.isPending} onSubmit={(b) => saving.submit({ id: s.id, body: b })} onCancel={stopEditing} />
                  ) : (
                    <div className="flex flex-wrap items-start justify-between gap-2">
                      <div>
                        <p className="font-bold">{s.name}</p>
                        <p className="font-mono text-xs text-ink-soft">
                          actual {formatLength(s.thicknessIn, { unit: initialSettings.lengthUnit, denominator: 32 })}
                          {s.widthIn !== null && s.kind !== 'hardwood' ? ` × ${inch(s.widthIn)}` : ''}
                          {s.pricePerBoardFootCents !== null ? ` · ${money(s.pricePerBoardFootCents)} per board foot` : ''}
                        </p>
                        <p className="mt-1 font-mono text-sm">
                          {s.offers
                            .map((o) => offerLabel(s.kind, o, initialSettings.lengthUnit))
                            .join(' · ')}
                        </p>
                      </div>
                      {canEdit ? (
                        <div className="flex gap-1">
                          <Button variant="quiet" aria-label={`Edit ${s.name}`} onClick={() => startEditing(s.id)}>
                            Edit
                          </Button>
                          <Button variant="quiet" aria-label={`Delete ${s.name}`} disabled={removing.mutation.isPending} onClick={() => removing.submit(s.id)}>
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
          <StockForm key={addFormKey} errors={adding.fields} pending={adding.mutation.isPending} onSubmit={(b) => adding.submit(b)} />
        </section>
      ) : null}
    </div>
  );
}

function CutSettingsForm({ channelSlug, canEdit, initial }: { channelSlug: string; canEdit: boolean; initial: CutSettingsDto }) {
  const client = useQueryClient();
  const { fields, submit: send, mutation: save, message } = useFormMutation({
    send: (b: Record<string, string>) => apiFetch(channelApi(channelSlug, 'cut-settings'), { method: 'PATCH', body: b }),
    onSuccess: () => client.invalidateQueries({ queryKey: queryKeys.cutPlans() }),
    failureMessage: 'Could not save.',
  });
  // The message shows only when no field of this form carries one.
  const unplaced = message !== null && Object.keys(fields).every((k) => k === '_') ? message : null;
  const f = (n: number) => formatLength(n, { unit: 'in', denominator: 32 }).replace('"', '');
  function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    const text = (k: string) => String(form.get(k) ?? '').trim();
    send({ kerfIn: text('kerfIn'), endTrimIn: text('endTrimIn'), minOffcutIn: text('minOffcutIn'), jointIn: text('jointIn'), lengthUnit: text('lengthUnit') });
  }
  return (
    <section aria-labelledby="cut-settings-heading" className="max-w-3xl rounded-card border border-paper-edge bg-white/60 p-4">
      <h2 id="cut-settings-heading" className="mb-2 font-bold">
        Shop settings
      </h2>
      <form onSubmit={submit} noValidate className="grid grid-cols-2 gap-3 sm:grid-cols-3">
        <TextField label="Saw kerf (in)" name="kerfIn" defaultValue={f(initial.kerfIn)} error={fields.kerfIn} disabled={!canEdit} />
        <TextField label="End trim (in)" name="endTrimIn" defaultValue={f(initial.endTrimIn)} error={fields.endTrimIn} disabled={!canEdit} />
        <TextField label="Keep offcuts from (in)" name="minOffcutIn" defaultValue={f(initial.minOffcutIn)} error={fields.minOffcutIn} disabled={!canEdit} />
        <TextField label="Jointing per rip (in)" name="jointIn" defaultValue={f(initial.jointIn)} error={fields.jointIn} disabled={!canEdit} />
        <SelectField label="Show lengths in" name="lengthUnit" defaultValue={initial.lengthUnit} error={fields.lengthUnit} disabled={!canEdit}>
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
      {unplaced ? <p className="mt-2 text-sm text-attention-ink">{unplaced}</p> : null}
      <p className="mt-2 text-xs text-ink-faint">End trim is cut off each end of every board (checks, snipe). Offcuts shorter than the keep length are drawn as scrap.</p>
    </section>
  );
}
