/**
 * What a cut record means for later plans (issue 16). Pure, no I/O.
 *
 * A cut record is one stock item's plan as it was cut for an episode. Plans computed later plan only
 * the pieces no record has cut, so the offcuts a record kept (now on hand) are never offered back to
 * the cuts that made them, and the pieces it pulled are not counted twice.
 */
import type { StockPlan } from './build';

export type CutRecordDto = {
  id: string;
  stockItemId: string;
  /** ISO time the cuts were marked done. */
  doneAt: string;
  doneByName: string | null;
  /** The stock plan as cut: its boards, which were pulled from the rack and which were bought. */
  plan: StockPlan;
};

/** Pieces of each part a plan's boards cut. */
export function piecesCut(plan: Pick<StockPlan, 'boards'>): Map<string, number> {
  const cut = new Map<string, number>();
  for (const b of plan.boards) for (const p of b.pieces) cut.set(p.partId, (cut.get(p.partId) ?? 0) + 1);
  return cut;
}

/** Pieces of each part the records together cut. */
export function piecesCutByRecords(records: readonly { plan: Pick<StockPlan, 'boards'> }[]): Map<string, number> {
  const total = new Map<string, number>();
  for (const r of records) for (const [part, n] of piecesCut(r.plan)) total.set(part, (total.get(part) ?? 0) + n);
  return total;
}

/** The parts with only the pieces no record has cut yet; parts fully cut are left out. */
export function partsLeftToCut<T extends { id: string; quantity: number }>(parts: readonly T[], records: readonly { plan: Pick<StockPlan, 'boards'> }[]): T[] {
  const cut = piecesCutByRecords(records);
  return parts.flatMap((p) => {
    const left = p.quantity - (cut.get(p.id) ?? 0);
    return left > 0 ? [{ ...p, quantity: left }] : [];
  });
}

/**
 * The offcuts a plan keeps, one line per size, longest first: they go on hand when its cuts are done.
 * A sheet's offcut has its own width; a board's is full width (null: the stock item's width).
 */
export function keptOffcuts(plan: Pick<StockPlan, 'boards'>): { lengthIn: number; widthIn: number | null; count: number }[] {
  const bySize = new Map<string, { lengthIn: number; widthIn: number | null; count: number }>();
  for (const b of plan.boards) {
    if (!b.keepOffcut || b.offcutIn <= 0) continue;
    const widthIn = b.offcutWidthIn ?? null;
    const key = `${b.offcutIn}x${widthIn ?? ''}`;
    const seen = bySize.get(key);
    if (seen) seen.count += 1;
    else bySize.set(key, { lengthIn: b.offcutIn, widthIn, count: 1 });
  }
  return [...bySize.values()].sort((a, b) => b.lengthIn - a.lengthIn || (b.widthIn ?? 0) - (a.widthIn ?? 0));
}

/** An offcut's size as the plan shows it: length, and for a sheet also its width. */
export const offcutSize = (b: Pick<StockPlan['boards'][number], 'offcutIn' | 'offcutWidthIn'>, fmt: (inches: number) => string): string =>
  b.offcutWidthIn === undefined ? fmt(b.offcutIn) : `${fmt(b.offcutIn)} × ${fmt(b.offcutWidthIn)}`;
