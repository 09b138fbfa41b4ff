'use client';

import { useQuery, useQueryClient } from '@tanstack/react-query';
import { useState, type FormEvent } from 'react';
import { Alert } from '@/components/ui/alert';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';
import { FormActions } from '@/components/ui/form-actions';
import { useListEdits } from '@/components/ui/use-list-edits';
import { apiFetch } from '@/lib/api/client';
import { channelApi } from '@/lib/api/paths';
import { queryKeys } from '@/lib/api/query-keys';
import type { OnHandPieceDto } from '@/lib/on-hand/schemas';
import type { StockItemDto } from '@/lib/stock/schemas';
import { formatLength } from '@/lib/units';

type Props = { channelSlug: string; canEdit: boolean; initialStock: StockItemDto[]; initialPieces: OnHandPieceDto[]; unit: 'in' | 'mm' };
type Body = Record<string, unknown>;

// UTC, so the server's render and the browser's agree.
const day = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' });
const countOf = (text: string) => (/^\d+$/.test(text) ? Number(text) : text === '' ? undefined : text);

/**
 * The rack's "On hand" section: boards and offcuts the shop already has, added by hand or kept from a
 * plan whose cuts were marked done. Plans pull them before buying.
 */
export function OnHandList({ channelSlug, canEdit, initialStock, initialPieces, unit }: Props) {
  const client = useQueryClient();
  // The rack's own query (same key and fetch as StockRack), so stock added above is offered here at once.
  const stock = useQuery({ queryKey: queryKeys.stock(channelSlug), queryFn: () => apiFetch<{ stock: StockItemDto[] }>(channelApi(channelSlug, 'stock')).then((r) => r.stock), initialData: initialStock });
  const pieces = useQuery({
    queryKey: queryKeys.onHand(channelSlug),
    queryFn: () => apiFetch<{ pieces: OnHandPieceDto[] }>(channelApi(channelSlug, 'on-hand')).then((r) => r.pieces),
    initialData: initialPieces,
  });
  const { editing, startEditing, stopEditing, addFormKey, adding, saving, removing, message } = useListEdits<Body, Body>({
    add: (b) => apiFetch(channelApi(channelSlug, 'on-hand'), { method: 'POST', body: b }),
    save: (id, b) => apiFetch(channelApi(channelSlug, 'on-hand', id), { method: 'PATCH', body: b }),
    remove: (id) => apiFetch(channelApi(channelSlug, 'on-hand', id), { method: 'DELETE' }),
    refresh: () => Promise.all([client.invalidateQueries({ queryKey: queryKeys.onHand(channelSlug) }), client.invalidateQueries({ queryKey: queryKeys.cutPlans() })]),
    failureMessage: 'Could not save.',
  });
  const fmt = (n: number) => formatLength(n, { unit });
  const size = (p: OnHandPieceDto) => (p.widthIn !== null ? `${fmt(p.widthIn)} × ${fmt(p.lengthIn)}` : fmt(p.lengthIn));

  function saveCount(event: FormEvent<HTMLFormElement>, id: string) {
    event.preventDefault();
    saving.submit({ id, body: { count: countOf(String(new FormData(event.currentTarget).get('count') ?? '').trim()) } });
  }

  return (
    <section aria-labelledby="on-hand-heading" className="space-y-3">
      <div>
        <h2 id="on-hand-heading" className="text-lg font-bold">
          On hand
        </h2>
        <p className="text-sm text-ink-soft">Boards and offcuts already in the shop. Cut plans pull them from the rack before buying, at no cost.</p>
      </div>
      {message ? <Alert tone="attention">{message}</Alert> : null}
      {pieces.data.length === 0 ? (
        <p className="rounded-card border-2 border-dashed border-paper-edge px-4 py-6 text-center text-sm text-ink-soft">
          Nothing on hand yet. {canEdit ? 'Add a board or offcut you already have, or mark a plan’s cuts done to keep its offcuts here.' : ''}
        </p>
      ) : (
        <ul className="space-y-2">
          {pieces.data.map((p) => (
            <li key={p.id} className="rounded-card border border-paper-edge bg-white/60 p-3">
              <div className="flex flex-wrap items-center justify-between gap-2">
                <div className="min-w-0">
                  <p className="font-bold">
                    <span className="font-mono">{p.count} ×</span> {p.stockName}, <span className="font-mono">{size(p)}</span>
                  </p>
                  <p className="flex flex-wrap items-center gap-2 text-xs text-ink-soft">
                    {p.source === 'kept' ? <Badge tone="ok">Kept offcut</Badge> : <Badge tone="neutral">Added by hand</Badge>}
                    <span>
                      {p.source === 'kept' ? `from ${p.episodeTitle ?? 'a deleted episode'}, ` : ''}
                      {day.format(new Date(p.addedAt))}
                    </span>
                  </p>
                </div>
                {canEdit && editing !== p.id ? (
                  <div className="flex gap-1">
                    <Button variant="quiet" aria-label={`Change count of ${p.stockName} ${size(p)}`} onClick={() => startEditing(p.id)}>
                      Edit count
                    </Button>
                    <Button variant="quiet" aria-label={`Remove ${p.stockName} ${size(p)}`} disabled={removing.mutation.isPending} onClick={() => removing.submit(p.id)}>
                      Remove
                    </Button>
                  </div>
                ) : null}
              </div>
              {editing === p.id ? (
                <form onSubmit={(e) => saveCount(e, p.id)} onKeyDown={(e) => e.key === 'Escape' && stopEditing()} noValidate className="mt-2 flex flex-wrap items-end gap-2">
                  <TextField label="How many" name="count" inputMode="numeric" defaultValue={String(p.count)} error={saving.fields.count} className="w-32" autoFocus />
                  <FormActions pending={saving.mutation.isPending} label="Save count" onCancel={stopEditing} />
                </form>
              ) : null}
            </li>
          ))}
        </ul>
      )}
      {canEdit && stock.data.length > 0 ? <AddOnHandForm key={addFormKey} stock={stock.data} errors={adding.fields} pending={adding.mutation.isPending} onSubmit={(b) => adding.submit(b)} /> : null}
    </section>
  );
}

function AddOnHandForm({ stock, errors, pending, onSubmit }: { stock: StockItemDto[]; errors: Record<string, string>; pending: boolean; onSubmit: (b: Body) => void }) {
  const [stockItemId, setStockItemId] = useState(stock[0]?.id ?? '');
  const sheet = stock.find((s) => s.id === stockItemId)?.kind === 'sheet';
  function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    const text = (k: string) => String(form.get(k) ?? '').trim();
    onSubmit({ stockItemId, lengthIn: text('lengthIn'), ...(sheet ? { widthIn: text('widthIn') } : {}), count: countOf(text('count')) });
  }
  return (
    <form onSubmit={submit} noValidate aria-labelledby="add-on-hand-heading" className="grid gap-3 rounded-card border border-paper-edge bg-white/60 p-4 sm:grid-cols-4">
      <h3 id="add-on-hand-heading" className="font-bold sm:col-span-4">
        Add a piece on hand
      </h3>
      <SelectField label="Stock" name="stockItemId" value={stockItemId} onChange={(e) => setStockItemId(e.target.value)} error={errors.stockItemId} className="sm:col-span-2">
        {stock.map((s) => (
          <option key={s.id} value={s.id}>
            {s.name}
          </option>
        ))}
      </SelectField>
      <TextField label="Length" name="lengthIn" error={errors.lengthIn} hint={`Like 3' 2" or 965mm`} />
      {sheet ? <TextField label="Width" name="widthIn" error={errors.widthIn} hint="Like 24 or 610mm" /> : null}
      <TextField label="How many" name="count" inputMode="numeric" defaultValue="1" error={errors.count} />
      <FormActions pending={pending} label="Add on hand" className="flex gap-2 sm:col-span-4" />
    </form>
  );
}
