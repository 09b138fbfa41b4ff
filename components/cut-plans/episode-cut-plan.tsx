'use client';

import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { ApiError, apiFetch } from '@/lib/api/client';
import type { EpisodePlanDto } from '@/lib/cut-plans/queries';
import type { ShoppingTickInput, TakeBackResult } from '@/lib/cut-plans/schemas';
import { CutPlanView, money } from './cut-plan-view';
import { CutRecords } from './cut-records';
import type { TakeBack } from './take-back-cuts';
import { SafetyNote } from './safety-note';
import { channelApi } from '@/lib/api/paths';
import { queryKeys } from '@/lib/api/query-keys';
import { countOf } from '@/lib/text/count-of';

/** What a "Take back" did, in the numbers its confirmation promised. */
const takenBackNote = (r: TakeBackResult, sheet: boolean) =>
  `Cuts taken back: ${countOf(r.piecesBack, sheet ? 'sheet is' : 'board is', sheet ? 'sheets are' : 'boards are')} back on the rack, ${countOf(r.offcutsRemoved, 'kept offcut', 'kept offcuts')} removed, ${countOf(r.piecesUnticked, 'piece', 'pieces')} unticked.`;

type Props = { channelSlug: string; episodeId: string; levelLabels: string[]; canEdit: boolean; initial: EpisodePlanDto };

export function EpisodeCutPlan({ channelSlug, episodeId, levelLabels, canEdit, initial }: Props) {
  const key = queryKeys.episodeCutPlan(episodeId);
  const client = useQueryClient();
  const [scope, setScope] = useState<'whole' | number>('whole');
  const [error, setError] = useState<string | undefined>();
  const plan = useQuery({
    queryKey: key,
    queryFn: () => apiFetch<EpisodePlanDto>(channelApi(channelSlug, 'episodes', episodeId, 'cut-plan')),
    initialData: initial,
    staleTime: 5_000,
  });
  const onError = (e: unknown) => setError(e instanceof ApiError ? e.message : 'Could not save.');
  const tick = useMutation({
    mutationFn: (t: ShoppingTickInput) => apiFetch(channelApi(channelSlug, 'episodes', episodeId, 'shopping'), { method: 'PUT', body: t }),
    onError,
    onSettled: () => client.invalidateQueries({ queryKey: key }),
  });
  // Optimistic and synchronous, so the checkbox a shop hand taps flips at once.
  const markBought = (t: ShoppingTickInput) => {
    setError(undefined);
    const same = (x: EpisodePlanDto['ticks'][number]) => x.stockItemId === t.stockItemId && x.sizeKey === t.sizeKey && x.board === t.board;
    client.setQueryData<EpisodePlanDto>(key, (d) => {
      if (!d) return d;
      const others = d.ticks.filter((x) => !same(x));
      return { ...d, ticks: t.bought ? [...others, { stockItemId: t.stockItemId, sizeKey: t.sizeKey, board: t.board }] : others };
    });
    tick.mutate(t);
  };
  const cut = useMutation({
    mutationFn: ({ partId, cutCount }: { partId: string; cutCount: number }) =>
      apiFetch(channelApi(channelSlug, 'parts', partId), { method: 'PATCH', body: { cutCount } }),
    onError,
    onSettled: () => client.invalidateQueries({ queryKey: key }),
  });
  const [doneNote, setDoneNote] = useState<string | undefined>();
  const [takeBackNote, setTakeBackNote] = useState<string | undefined>();
  const [refusal, setRefusal] = useState<TakeBack['refusal']>(null);
  // Marking done and taking back each answer in their own place; a new press clears what the last one said.
  const clearMessages = () => {
    setError(undefined);
    setDoneNote(undefined);
    setTakeBackNote(undefined);
    setRefusal(null);
  };
  const done = useMutation({
    mutationFn: (stockItemId: string) =>
      apiFetch<{ alreadyDone: boolean; keptPieces: number }>(channelApi(channelSlug, 'episodes', episodeId, 'cut-plan', 'done'), { method: 'POST', body: { stockItemId } }),
    onMutate: clearMessages,
    onSuccess: (r) =>
      setDoneNote(
        r.alreadyDone
          ? 'Those cuts were already marked done.'
          : `Cuts recorded. ${r.keptPieces > 0 ? `${countOf(r.keptPieces, 'offcut is', 'offcuts are')} now on hand.` : 'No offcut was long enough to keep.'}`,
      ),
    onError,
    // The rack changed too: pieces pulled are used up, kept offcuts are on hand.
    onSettled: () => Promise.all([client.invalidateQueries({ queryKey: key }), client.invalidateQueries({ queryKey: queryKeys.onHand(channelSlug) })]),
  });
  const takeBack = useMutation({
    mutationFn: (recordId: string) => apiFetch<TakeBackResult>(channelApi(channelSlug, 'episodes', episodeId, 'cut-plan', 'done', recordId), { method: 'DELETE' }),
    onMutate: clearMessages,
    onSuccess: (r) => setTakeBackNote(takenBackNote(r, plan.data.records.find((x) => x.id === r.recordId)?.plan.stock.kind === 'sheet')),
    // A refusal (newer cuts done, an offcut used or changed) belongs on the record it refused.
    onError: (e, recordId) => {
      const message = e instanceof ApiError ? e.message : 'Could not take the cuts back. Nothing was changed; try again.';
      // 404: taken back already (by someone else); the record leaves the list, so say it above.
      if (e instanceof ApiError && e.status === 404) setError(message);
      else setRefusal({ recordId, message });
    },
    // The plan, the rack (pieces back, offcuts gone) and every cut list (pieces unticked) changed.
    onSettled: () =>
      Promise.all([
        client.invalidateQueries({ queryKey: queryKeys.cutPlans() }),
        client.invalidateQueries({ queryKey: queryKeys.onHand(channelSlug) }),
        client.invalidateQueries({ queryKey: queryKeys.allParts() }),
      ]),
  });
  const markCut = (partId: string, cutCount: number) => {
    setError(undefined);
    client.setQueryData<EpisodePlanDto>(key, (d) => {
      if (!d) return d;
      const patch = (p: EpisodePlanDto['whole']) => ({ ...p, cutCounts: { ...p.cutCounts, [partId]: cutCount } });
      return { ...d, whole: patch(d.whole), levels: d.levels.map((l) => ({ ...l, plan: patch(l.plan) })) };
    });
    cut.mutate({ partId, cutCount });
  };

  const data = plan.data;
  const levelName = (n: number) => `Level ${n}${levelLabels[n - 1] ? ` · ${levelLabels[n - 1]}` : ''}`;
  const shown = scope === 'whole' ? data.whole : data.levels.find((l) => l.level === scope)?.plan ?? data.whole;
  const separately = data.levels.reduce((a, l) => a + l.plan.costCents, 0);
  return (
    <div className="space-y-6">
      {error ? <Alert tone="attention">{error}</Alert> : null}
      <p role="status" className={doneNote ? 'rounded-md bg-ok-soft px-4 py-2 text-sm text-ok' : 'sr-only'}>
        {doneNote}
      </p>
      {data.levels.length > 1 ? (
        <section aria-labelledby="compare-heading" className="rounded-card border border-paper-edge bg-white/60 p-4 print:hidden">
          <h2 id="compare-heading" className="font-bold">
            Levels together or apart
          </h2>
          <table className="mt-2 w-full max-w-lg text-left text-sm">
            <tbody>
              {data.levels.map((l) => (
                <tr key={l.level} className="border-b border-paper-edge/60">
                  <th scope="row" className="py-1 font-normal">
                    {levelName(l.level)} alone
                  </th>
                  <td className="py-1 text-right font-mono">{money(l.plan.costCents)}</td>
                </tr>
              ))}
              <tr className="border-b border-paper-edge/60">
                <th scope="row" className="py-1 font-normal">
                  Each level bought separately
                </th>
                <td className="py-1 text-right font-mono">{money(separately)}</td>
              </tr>
              <tr>
                <th scope="row" className="py-1 font-bold">
                  Whole episode, shared stock
                </th>
                <td className="py-1 text-right font-mono font-bold">{money(data.whole.costCents)}</td>
              </tr>
            </tbody>
          </table>
          {separately > data.whole.costCents ? (
            <p className="mt-2 text-sm text-ok">Buying for all levels at once saves {money(separately - data.whole.costCents)}.</p>
          ) : null}
        </section>
      ) : null}
      <div role="group" aria-label="Plan for" className="flex flex-wrap gap-2 print:hidden">
        <Button variant={scope === 'whole' ? 'primary' : 'secondary'} aria-pressed={scope === 'whole'} onClick={() => setScope('whole')}>
          Whole episode
        </Button>
        {data.levels.map((l) => (
          <Button key={l.level} variant={scope === l.level ? 'primary' : 'secondary'} aria-pressed={scope === l.level} onClick={() => setScope(l.level)}>
            {levelName(l.level)}
          </Button>
        ))}
        <Button variant="quiet" onClick={() => window.print()}>
          Print
        </Button>
        {plan.isFetching ? <span className="self-center text-sm text-ink-faint">Recomputing…</span> : null}
      </div>
      <SafetyNote />
      <CutPlanView
        plan={shown}
        unit={data.lengthUnit}
        kerfIn={data.kerfIn}
        shopping={scope === 'whole' && canEdit ? { ticks: data.ticks, onTick: markBought, disabled: false } : undefined}
        cutting={canEdit ? { onCut: markCut, disabled: false } : undefined}
        emptyNote={data.records.length > 0 ? 'Every part with stock is cut: nothing left to buy or cut. What was cut is listed below.' : undefined}
        cutsDone={scope === 'whole' && canEdit ? { onDone: (id) => done.mutate(id), pendingStockId: done.isPending ? (done.variables ?? null) : null } : undefined}
      />
      <CutRecords
        records={data.records}
        unit={data.lengthUnit}
        note={takeBackNote}
        takeBack={canEdit ? { onTakeBack: (id) => takeBack.mutate(id), pendingId: takeBack.isPending ? (takeBack.variables ?? null) : null, refusal } : undefined}
      />
    </div>
  );
}
