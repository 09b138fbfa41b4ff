/**
 * On-hand pieces as planner stock (issue 16): each piece size is offered at price 0 with its count, so
 * the planners use what is on the rack before they buy. Pure, no I/O.
 */
import type { OnHandStock } from '@/lib/on-hand/schemas';

/** Planner stock ids of on-hand pieces; an offer's id is its size key, which never starts with a letter. */
const RACK = 'rack:';

export const rackStockId = (onHandId: string) => `${RACK}${onHandId}`;
/** The on-hand piece a planner stock id names, or null for stock to buy. */
export const onHandIdOf = (stockId: string): string | null => (stockId.startsWith(RACK) ? stockId.slice(RACK.length) : null);

/** One pull from the rack: `count` of on-hand piece `onHandId`. */
export type PlanPull = { onHandId: string; lengthIn: number; widthIn: number | null; count: number };

export const onHandFor = (onHand: readonly OnHandStock[], stockItemId: string) => onHand.filter((o) => o.stockItemId === stockItemId && o.count > 0);

/** Lumber pieces on hand, crosscut or ripped: the stock item's width, free, as many as there are. */
export const lumberRackStock = (onHand: readonly OnHandStock[], widthIn: number) =>
  onHand.map((o) => ({ id: rackStockId(o.id), length: o.lengthIn, width: widthIn, price: 0, available: o.count }));

/** Sheet pieces on hand: their own width and length, free. */
export const sheetRackStock = (onHand: readonly OnHandStock[]) =>
  onHand.map((o) => ({ id: rackStockId(o.id), width: o.widthIn ?? 0, length: o.lengthIn, price: 0, available: o.count }));

/** The pulls a plan's boards make, one line per on-hand piece, in the order the boards use them. */
export function pullsOf(boards: readonly { onHandId?: string | undefined; lengthIn: number; widthIn: number }[], sheet: boolean): PlanPull[] {
  const byId = new Map<string, PlanPull>();
  for (const b of boards) {
    if (!b.onHandId) continue;
    const seen = byId.get(b.onHandId);
    if (seen) seen.count += 1;
    else byId.set(b.onHandId, { onHandId: b.onHandId, lengthIn: b.lengthIn, widthIn: sheet ? b.widthIn : null, count: 1 });
  }
  return [...byId.values()];
}
