'use client';

import { useState } from 'react';
import { Button } from '@/components/ui/button';
import type { StockPlan } from '@/lib/cut-plans/build';
import { countOf } from '@/lib/text/count-of';

export type CutsDone = { onDone: (stockItemId: string) => void; pendingStockId: string | null };

/**
 * "Mark these cuts done" for one stock item's plan, asked twice because it moves stock: the pieces the
 * plan pulls leave the rack and its keep-offcuts go on hand. Pressing it again later changes nothing.
 */
export function MarkCutsDone({ group: g, cutsDone }: { group: StockPlan; cutsDone: CutsDone }) {
  const [asking, setAsking] = useState(false);
  const pending = cutsDone.pendingStockId === g.stock.id;
  const pieces = g.boards.reduce((a, b) => a + b.pieces.length, 0);
  const pulled = g.pulled.reduce((a, p) => a + p.count, 0);
  const kept = g.boards.filter((b) => b.keepOffcut).length;
  if (pieces === 0) return null;
  if (!asking) {
    return (
      <div className="mt-4 print:hidden">
        <Button variant="secondary" disabled={pending} onClick={() => setAsking(true)}>
          {pending ? 'Recording…' : 'Mark these cuts done'}
        </Button>
      </div>
    );
  }
  return (
    <div role="group" aria-label={`Mark the cuts of ${g.stock.name} done`} className="mt-4 rounded-md border border-ink/20 bg-paper-deep/60 p-3 text-sm print:hidden">
      <p>
        All {countOf(pieces, 'piece', 'pieces')} of {g.stock.name} cut?{' '}
        {pulled > 0 ? `${countOf(pulled, 'piece leaves', 'pieces leave')} the rack. ` : ''}
        {kept > 0 ? `${countOf(kept, 'offcut goes', 'offcuts go')} on hand.` : 'No offcut is long enough to keep.'}
      </p>
      <div className="mt-2 flex flex-wrap gap-2">
        <Button
          onClick={() => {
            setAsking(false);
            cutsDone.onDone(g.stock.id);
          }}
        >
          Yes, cuts done
        </Button>
        <Button variant="quiet" onClick={() => setAsking(false)}>
          Cancel
        </Button>
      </div>
    </div>
  );
}
