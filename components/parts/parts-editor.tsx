'use client';

import { useQuery, useQueryClient } from '@tanstack/react-query';
import Link from 'next/link';
import { CutPlanView } from '@/components/cut-plans/cut-plan-view';
import { SafetyNote } from '@/components/cut-plans/safety-note';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { useListEdits } from '@/components/ui/use-list-edits';
import { apiFetch } from '@/lib/api/client';
import type { CutPlan } from '@/lib/cut-plans/build';
import type { PartDto } from '@/lib/parts/schemas';
import type { StockItemDto } from '@/lib/stock/schemas';
import { formatLength } from '@/lib/units';
import { PartForm, type PartFormValues } from './part-form';
import { channelApi, channelPage } from '@/lib/api/paths';
import { queryKeys } from '@/lib/api/query-keys';

type SegmentPlan = { plan: CutPlan; lengthUnit: 'in' | 'mm'; kerfIn: number; allCut: boolean };
type Props = {
  channelSlug: string;
  segmentId: string;
  episodeId: string;
  canEdit: boolean;
  stock: StockItemDto[];
  initialParts: PartDto[];
  initialPlan: SegmentPlan;
};

export function PartsEditor({ channelSlug, segmentId, episodeId, canEdit, stock, initialParts, initialPlan }: Props) {
  const client = useQueryClient();
  const partsKey = queryKeys.parts(segmentId);
  const parts = useQuery({ queryKey: partsKey, queryFn: () => apiFetch<{ parts: PartDto[] }>(channelApi(channelSlug, 'segments', segmentId, 'parts')).then((r) => r.parts), initialData: initialParts });
  const plan = useQuery({ queryKey: queryKeys.segmentCutPlan(segmentId), queryFn: () => apiFetch<SegmentPlan>(channelApi(channelSlug, 'segments', segmentId, 'cut-plan')), initialData: initialPlan });
  const unit = plan.data.lengthUnit;
  // A part the plan could not cut is flagged on its own row, in the plan's plain words.
  const problems = new Map<string, string>();
  for (const u of [...plan.data.plan.noStock, ...plan.data.plan.groups.flatMap((g) => g.unplaced)]) {
    problems.set(u.partId, u.quantity < (parts.data.find((p) => p.id === u.partId)?.quantity ?? 0) ? `${u.quantity} cannot be cut: ${u.reason}` : `Cannot be cut: ${u.reason}`);
  }
  const fmt = (n: number | null) => (n === null ? '—' : formatLength(n, { unit }));
  const { editing, startEditing, stopEditing, addFormKey, adding, saving, removing, message } = useListEdits<PartFormValues, PartFormValues>({
    add: (v) => apiFetch(channelApi(channelSlug, 'segments', segmentId, 'parts'), { method: 'POST', body: v }),
    save: (id, v) => apiFetch(channelApi(channelSlug, 'parts', id), { method: 'PATCH', body: v }),
    remove: (id) => apiFetch(channelApi(channelSlug, 'parts', id), { method: 'DELETE' }),
    refresh: () => Promise.all([client.invalidateQueries({ queryKey: partsKey }), client.invalidateQueries({ queryKey: queryKeys.cutPlans() })]),
    failureMessage: 'Could not save the part.',
  });
  const stockName = (id: string | null) => stock.find((s) => s.id === id)?.name ?? 'Not chosen';

  return (
    <div className="space-y-6">
      {message ? <Alert tone="attention">{message}</Alert> : null}
      {stock.length === 0 ? (
        <Alert tone="info">
          The stock rack is empty.{' '}
          <Link href={channelPage(channelSlug, 'stock')} className="underline">
            Add the lumber and sheet goods you buy
          </Link>{' '}
          to plan cuts.
        </Alert>
      ) : null}
      {parts.data.length === 0 ? (
        <p className="text-sm text-ink-faint">No parts yet.{canEdit ? ' Add the finished pieces this build needs below.' : ''}</p>
      ) : (
        <div className="sm:overflow-x-auto">
          <table className="stack-on-phone w-full text-left text-sm sm:min-w-[40rem]">
            <caption className="sr-only">Parts list</caption>
            <thead>
              <tr className="border-b border-paper-edge text-xs text-ink-faint">
                <th className="py-1 pr-2">Part</th>
                <th className="py-1 pr-2 text-right">Qty</th>
                <th className="py-1 pr-2">Length</th>
                <th className="py-1 pr-2">Width</th>
                <th className="py-1 pr-2">Thick</th>
                <th className="py-1 pr-2">Stock</th>
                <th className="py-1 pr-2">Grain</th>
                <th className="py-1 pr-2">Cut</th>
                {canEdit ? <th className="py-1">Actions</th> : null}
              </tr>
            </thead>
            <tbody>
              {parts.data.map((p) =>
                editing === p.id ? (
                  <tr key={p.id}>
                    <td colSpan={9} className="py-3">
                      <PartForm
                        stock={stock}
                        unit={unit}
                        part={p}
                        errors={saving.fields}
                        pending={saving.mutation.isPending}
                        submitLabel="Save part"
                        onSubmit={(v) => saving.submit({ id: p.id, body: v })}
                        onCancel={stopEditing}
                      />
                    </td>
                  </tr>
                ) : (
                  <tr key={p.id} className="border-b border-paper-edge/60">
                    <td className="py-1 pr-2 font-bold">
                      {p.name}
                      {p.note ? <span className="block text-xs font-normal text-ink-faint">{p.note}</span> : null}
                      {problems.get(p.id) ? (
                        <span className="mt-1 block rounded-sm bg-attention-soft px-2 py-1 text-xs font-normal text-attention-ink">{problems.get(p.id)}</span>
                      ) : null}
                    </td>
                    <td data-label="Qty" className="py-1 pr-2 text-right font-mono">{p.quantity}</td>
                    <td data-label="Length" className="py-1 pr-2 font-mono">{fmt(p.lengthIn)}</td>
                    <td data-label="Width" className="py-1 pr-2 font-mono">{fmt(p.widthIn)}</td>
                    <td data-label="Thick" className="py-1 pr-2 font-mono">{fmt(p.thicknessIn)}</td>
                    <td data-label="Stock" className="py-1 pr-2">{stockName(p.stockItemId)}</td>
                    <td data-label="Grain" className="py-1 pr-2">{p.grain === 'length' ? 'Along length' : 'Any'}</td>
                    <td data-label="Cut" className="py-1 pr-2 font-mono">
                      {p.cutCount}/{p.quantity}
                    </td>
                    {canEdit ? (
                      <td className="py-1">
                        <div className="flex gap-1">
                          <Button variant="quiet" aria-label={`Edit ${p.name}`} onClick={() => startEditing(p.id)}>
                            Edit
                          </Button>
                          <Button variant="quiet" aria-label={`Delete ${p.name}`} disabled={removing.mutation.isPending} onClick={() => removing.submit(p.id)}>
                            Delete
                          </Button>
                        </div>
                      </td>
                    ) : null}
                  </tr>
                ),
              )}
            </tbody>
          </table>
        </div>
      )}
      {canEdit && editing === null ? (
        <section aria-labelledby="add-part-heading" className="rounded-card border border-paper-edge bg-white/60 p-4">
          <h3 id="add-part-heading" className="mb-2 font-bold">
            Add a part
          </h3>
          <PartForm key={addFormKey} stock={stock} unit={unit} errors={adding.fields} pending={adding.mutation.isPending} submitLabel="Add part" onSubmit={(v) => adding.submit(v)} />
        </section>
      ) : null}
      <section aria-labelledby="segment-plan-heading" className="space-y-3">
        <div className="flex flex-wrap items-center justify-between gap-2">
          <h3 id="segment-plan-heading" className="text-lg font-bold">
            Cut plan for this build {plan.isFetching ? <span className="text-sm font-normal text-ink-faint">Recomputing…</span> : null}
          </h3>
          <Link href={channelPage(channelSlug, 'episodes', episodeId, 'cut-plan')} className="text-sm font-bold text-blueprint underline">
            Whole episode, shopping and cut lists
          </Link>
        </div>
        {plan.data.plan.pieceCount > 0 ? <SafetyNote /> : null}
        <CutPlanView plan={plan.data.plan} unit={unit} kerfIn={plan.data.kerfIn} emptyNote={plan.data.allCut ? 'Every part here is cut: see Cuts done on the episode’s cut plan.' : undefined} />
      </section>
    </div>
  );
}
