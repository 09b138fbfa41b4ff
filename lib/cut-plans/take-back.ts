/**
 * Taking back a cut record ("Take back"): what it may undo and what undoing it changes. Pure, no I/O;
 * lib/cut-plans/take-back-queries.ts applies it under the locks "Mark these cuts done" takes.
 *
 * The rules, as the product states them:
 * 1. Only the newest record of an episode's stock item can be taken back. Each record was planned from
 *    what the ones before it left (the pieces still to cut, the rack as it was), so taking back an older
 *    one would leave every later one planned from a state that no longer holds.
 * 2. A record whose kept offcut is no longer on hand as it kept it (a later plan pulled it, someone changed
 *    its count or removed it) cannot be taken back: the offcut is not there to take off the rack again.
 * 3. Otherwise taking it back removes its kept offcuts, puts every piece it pulled back on the rack, unticks
 *    the pieces it cut (never below what the remaining records cut) and deletes the record.
 */
import type { StockPlan } from './build';
import { keptOffcuts, piecesCut } from './cut-records';

// Lengths are stored as doubles; the same number written and read back compares equal, the margin is
// only against a size that went through arithmetic. Common practice, no published source.
const SAME_LENGTH_IN = 1e-6;

/** The ids of the records that may be taken back: the newest of each stock item. `records` oldest first. */
export function newestRecordIds(records: readonly { id: string; stockItemId: string }[]): Set<string> {
  const newest = new Map<string, string>();
  for (const r of records) newest.set(r.stockItemId, r.id);
  return new Set(newest.values());
}

/** What taking a record back changes, in the numbers the confirmation shows. */
export type TakeBackSummary = {
  /** Boards or sheets that go back on the rack (the pieces the record pulled). */
  piecesBack: number;
  /** Offcuts the record kept that leave the on-hand list. */
  offcutsRemoved: number;
  /** Pieces of the parts list the record ticked as cut. */
  piecesUnticked: number;
};

export function takeBackSummary(plan: Pick<StockPlan, 'boards' | 'pulled'>): TakeBackSummary {
  return {
    piecesBack: plan.pulled.reduce((a, p) => a + p.count, 0),
    offcutsRemoved: keptOffcuts(plan).reduce((a, k) => a + k.count, 0),
    piecesUnticked: plan.boards.reduce((a, b) => a + b.pieces.length, 0),
  };
}

type Size = { lengthIn: number; widthIn: number | null };
const sameSize = (a: Size, b: Size) =>
  Math.abs(a.lengthIn - b.lengthIn) < SAME_LENGTH_IN && (a.widthIn === null ? b.widthIn === null : b.widthIn !== null && Math.abs(a.widthIn - b.widthIn) < SAME_LENGTH_IN);

/** A kept offcut that is not on hand as the record kept it: `onHand` of the `kept` are left (0: none). */
export type OffcutNotAsKept = Size & { kept: number; onHand: number };

/**
 * Rule 2: compares the offcuts a record kept with the on-hand rows that still carry its id. Each size
 * must be on hand in exactly the count kept; fewer means a later plan pulled it or someone removed or
 * lowered it, more means someone changed it. Rows of a size the record never kept count as changed too.
 */
export function offcutsNotAsKept(plan: Pick<StockPlan, 'boards'>, rows: readonly (Size & { count: number })[]): OffcutNotAsKept[] {
  const kept = keptOffcuts(plan);
  const wrong: OffcutNotAsKept[] = [];
  for (const k of kept) {
    const onHand = rows.filter((r) => sameSize(r, k)).reduce((a, r) => a + r.count, 0);
    if (onHand !== k.count) wrong.push({ lengthIn: k.lengthIn, widthIn: k.widthIn, kept: k.count, onHand });
  }
  for (const r of rows) {
    if (!kept.some((k) => sameSize(r, k))) wrong.push({ lengthIn: r.lengthIn, widthIn: r.widthIn, kept: 0, onHand: r.count });
  }
  return wrong;
}

/** One part as it is now, for unticking. */
export type PartCount = { id: string; quantity: number; cutCount: number };

/**
 * Rule 3, the cut list: each part the record cut goes down by what it cut, but never below what the
 * remaining records of the episode cut (their pieces stay cut), and stays within 0..quantity.
 * Returns only the parts whose count changes.
 */
export function cutCountsAfterTakeBack(
  parts: readonly PartCount[],
  plan: Pick<StockPlan, 'boards'>,
  cutByRemaining: ReadonlyMap<string, number>,
): { id: string; cutCount: number }[] {
  const cutByThis = piecesCut(plan);
  return parts.flatMap((p) => {
    const n = cutByThis.get(p.id) ?? 0;
    if (n === 0) return [];
    const next = Math.min(p.quantity, Math.max(0, cutByRemaining.get(p.id) ?? 0, p.cutCount - n));
    return next === p.cutCount ? [] : [{ id: p.id, cutCount: next }];
  });
}
