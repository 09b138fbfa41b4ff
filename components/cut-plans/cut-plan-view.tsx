'use client';

import type { CutPlan, StockPlan } from '@/lib/cut-plans/build';
import { formatBoardFeet, formatBoardSize } from '@/lib/stock/board-size';
import { formatLength } from '@/lib/units';
import { BoardDiagram } from './board-diagram';
import { BoardTicks, boughtOf, type Shopping } from './board-ticks';
import { Fragment } from 'react';
import { Badge } from '@/components/ui/badge';
import { Stat } from '@/components/ui/stat';
import { countOf } from '@/lib/text/count-of';
import { MarkCutsDone, type CutsDone } from './mark-cuts-done';

export const money = (cents: number) => `$${(cents / 100).toFixed(2)}`;

/** One sentence on the difference, shown below the plan's verdict and on hover beside each stock. */
const PLAN_QUALITY_NOTE =
  'A least-cost plan was checked against every cheaper way to buy the stock; a good plan is the best found in the time allowed, and a cheaper one may exist.';

type Props = {
  plan: CutPlan;
  unit: 'in' | 'mm';
  kerfIn: number;
  shopping?: Shopping | undefined;
  cutting?: { onCut: (partId: string, cutCount: number) => void; disabled: boolean } | undefined;
  /** "Mark these cuts done" per stock item: the whole episode's plan, for those who keep the rack. */
  cutsDone?: CutsDone | undefined;
  /** What an empty plan says; an episode whose cuts are all done says so instead. */
  emptyNote?: string | undefined;
};

export function CutPlanView({ plan, unit, kerfIn, shopping, cutting, cutsDone, emptyNote }: Props) {
  const fmt = (n: number) => formatLength(n, { unit });
  if (plan.groups.length === 0 && plan.noStock.length === 0) {
    return <p className="text-sm text-ink-faint">{emptyNote ?? 'No parts yet. Add parts to a Build segment to see what to buy and how to cut it.'}</p>;
  }
  const cutCounts = new Map(Object.entries(plan.cutCounts));
  const pulled = plan.groups.reduce((a, g) => a + g.pulled.reduce((s, p) => s + p.count, 0), 0);
  return (
    <div className="space-y-6">
      <dl className={`grid grid-cols-2 gap-3 text-sm ${pulled > 0 ? 'sm:grid-cols-5' : 'sm:grid-cols-4'}`}>
        <Stat label="Stock to buy" value={money(plan.costCents)} />
        {pulled > 0 ? <Stat label="Pull from rack" value={countOf(pulled, 'piece', 'pieces')} /> : null}
        <Stat label="Board feet" value={plan.boardFeet.toFixed(2)} />
        <Stat label="Pieces" value={String(plan.pieceCount)} />
        <Stat label="Kerf" value={fmt(kerfIn)} />
      </dl>
      <div role="status" className="text-sm">
        <p className={`font-bold ${plan.optimal ? 'text-ok' : 'text-ink-soft'}`}>{plan.optimal ? 'Least-cost plan.' : 'Good plan, may not be the cheapest.'}</p>
        <p className="text-ink-faint">{PLAN_QUALITY_NOTE}</p>
      </div>
      {plan.noStock.length > 0 ? (
        <div className="rounded-md border-l-4 border-attention bg-attention-soft px-4 py-3 text-sm text-attention-ink">
          <p className="font-bold">Parts without stock</p>
          <ul className="list-disc pl-5">
            {plan.noStock.map((u) => (
              <li key={u.partId}>
                {u.quantity} × {u.name}: choose stock for it in the parts list.
              </li>
            ))}
          </ul>
        </div>
      ) : null}
      {plan.groups.map((g) => (
        <StockSection key={g.stock.id} group={g} fmt={fmt} unit={unit} shopping={shopping} cutting={cutting} cutCounts={cutCounts} cutsDone={cutsDone} />
      ))}
    </div>
  );
}

function StockSection({
  group: g,
  fmt,
  unit,
  shopping,
  cutting,
  cutCounts,
  cutsDone,
}: {
  group: StockPlan;
  fmt: (n: number) => string;
  unit: 'in' | 'mm';
  shopping: Props['shopping'];
  cutting: Props['cutting'];
  cutCounts: Map<string, number>;
  cutsDone: Props['cutsDone'];
}) {
  const sheet = g.stock.kind === 'sheet';
  const hardwood = g.stock.kind === 'hardwood';
  // Hardwood is bought by width and length (issue 16): "7 1/4" × 8'".
  const sizeLabel = (p: { lengthIn: number; widthIn: number | null }) =>
    p.widthIn === null ? fmt(p.lengthIn) : hardwood ? formatBoardSize(p.widthIn, p.lengthIn, unit) : `${fmt(p.widthIn)} × ${fmt(p.lengthIn)}`;
  return (
    <section aria-label={g.stock.name} className="break-inside-avoid rounded-card border border-paper-edge bg-white/60 p-4 shadow-card">
      <h3 className="text-base font-bold">{g.stock.name}</h3>
      <p className="text-xs text-ink-faint">
        {sheet ? `${g.squareFeet?.toFixed(1)} sq ft` : `${g.boardFeet?.toFixed(2)} board feet`}
        {g.pulled.length > 0 ? ' to buy' : ''} · waste {g.wastePercent.toFixed(1)}% ·{' '}
        <span title={PLAN_QUALITY_NOTE}>{g.optimal ? 'least-cost plan' : 'good plan, may not be the cheapest'}</span>
      </p>
      {g.pulled.length > 0 ? <PullTable group={g} sizeLabel={sizeLabel} /> : null}
      {g.pulled.length > 0 ? <h4 className="mt-3 text-sm font-bold">Buy</h4> : null}
      {g.purchase.length === 0 ? <p className="mt-1 text-sm text-ok">Nothing to buy: every board comes from the rack.</p> : null}
      <table className={`mt-3 w-full text-left text-sm ${g.purchase.length === 0 ? 'hidden' : ''}`}>
        <caption className="sr-only">Buy: {g.stock.name}</caption>
        <thead>
          <tr className="border-b border-paper-edge text-xs text-ink-faint">
            {shopping ? <th className="py-1 pr-2">Bought</th> : null}
            <th className="py-1 pr-2">Size</th>
            <th className="py-1 pr-2 text-right">Count</th>
            <th className="py-1 pr-2 text-right">Each</th>
            <th className="py-1 text-right">Cost</th>
          </tr>
        </thead>
        <tbody>
          {g.purchase.map((p) => {
            const label = `${p.count} × ${g.stock.name}, ${sizeLabel(p)}`;
            return (
              <Fragment key={p.sizeKey}>
                <tr className={shopping ? '' : 'border-b border-paper-edge/60'}>
                  {shopping ? (
                    <td className="py-1 pr-2 font-mono">
                      {boughtOf(shopping, g.stock.id, p.sizeKey, p.count)}/{p.count}
                    </td>
                  ) : null}
                  <td className="py-1 pr-2 font-mono">
                    {sizeLabel(p)}
                    {p.boardFeetEach !== undefined ? <span className="block text-xs text-ink-soft sm:inline"> — {formatBoardFeet(p.boardFeetEach)}</span> : null}
                  </td>
                  <td className="py-1 pr-2 text-right font-mono">{p.count}</td>
                  <td className="py-1 pr-2 text-right font-mono">{money(p.unitCents)}</td>
                  <td className="py-1 text-right font-mono">{money(p.costCents)}</td>
                </tr>
                {shopping ? (
                  <tr className="border-b border-paper-edge/60">
                    <td colSpan={5} className="pb-2">
                      <BoardTicks shopping={shopping} stockItemId={g.stock.id} sizeKey={p.sizeKey} count={p.count} label={label} />
                    </td>
                  </tr>
                ) : null}
              </Fragment>
            );
          })}
        </tbody>
      </table>
      {g.unplaced.length > 0 ? (
        <ul className="mt-3 list-disc rounded-md bg-attention-soft py-2 pl-8 pr-3 text-sm text-attention-ink">
          {g.unplaced.map((u) => (
            <li key={u.partId}>
              {u.quantity} × {u.name} cannot be cut from this stock: {u.reason}
            </li>
          ))}
        </ul>
      ) : null}
      <ol className="mt-4 space-y-4">
        {g.boards.map((b, i) => (
          <li key={i}>
            <p className="mb-1">{b.onHandId ? <Badge tone="ok">Pull from rack</Badge> : <Badge tone="neutral">Buy</Badge>}</p>
            <BoardDiagram
              board={b}
              sheet={sheet}
              unit={unit}
              cutCounts={cutCounts}
              title={`${sheet ? 'Sheet' : 'Board'} ${i + 1}${b.onHandId ? ' (from the rack)' : ''}: ${sizeLabel({ lengthIn: b.lengthIn, widthIn: sheet || hardwood ? b.widthIn : null })}`}
            />
            {cutting ? (
              <ul className="mt-2 flex flex-wrap gap-2" aria-label={`Cuts on ${sheet ? 'sheet' : 'board'} ${i + 1}`}>
                {b.pieces.map((p) => {
                  const done = (cutCounts.get(p.partId) ?? 0) > p.pieceIndex;
                  return (
                    <li key={`${p.partId}-${p.pieceIndex}`}>
                      <label className="inline-flex min-h-touch cursor-pointer items-center gap-2 rounded-md border border-ink/20 bg-white px-3 text-sm">
                        <input
                          type="checkbox"
                          className="h-5 w-5 accent-ok"
                          checked={done}
                          disabled={cutting.disabled}
                          onChange={(e) => cutting.onCut(p.partId, Math.max(0, (cutCounts.get(p.partId) ?? 0) + (e.target.checked ? 1 : -1)))}
                        />
                        <span>
                          Cut {p.name} <span className="font-mono">{fmt(p.lengthIn)}</span>
                        </span>
                      </label>
                    </li>
                  );
                })}
              </ul>
            ) : null}
          </li>
        ))}
      </ol>
      {cutsDone ? <MarkCutsDone group={g} cutsDone={cutsDone} /> : null}
    </section>
  );
}

/** The on-hand pieces a stock plan takes from the rack: free, listed before what is bought. */
function PullTable({ group: g, sizeLabel }: { group: StockPlan; sizeLabel: (p: { lengthIn: number; widthIn: number | null }) => string }) {
  return (
    <>
      <h4 className="mt-3 text-sm font-bold">Pull from rack</h4>
      <table className="mt-1 w-full text-left text-sm">
        <caption className="sr-only">Pull from rack: {g.stock.name}</caption>
        <thead>
          <tr className="border-b border-paper-edge text-xs text-ink-faint">
            <th className="py-1 pr-2">Size on hand</th>
            <th className="py-1 pr-2 text-right">Count</th>
            <th className="py-1 text-right">Cost</th>
          </tr>
        </thead>
        <tbody>
          {g.pulled.map((p) => (
            <tr key={p.onHandId} className="border-b border-paper-edge/60">
              <td className="py-1 pr-2 font-mono">{sizeLabel(p)}</td>
              <td className="py-1 pr-2 text-right font-mono">{p.count}</td>
              <td className="py-1 text-right font-mono">{money(0)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </>
  );
}
