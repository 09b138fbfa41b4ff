'use client';

import type { ShoppingTickDto, ShoppingTickInput } from '@/lib/cut-plans/schemas';

export type Shopping = { ticks: ShoppingTickDto[]; onTick: (t: ShoppingTickInput) => void; disabled: boolean };

type Props = { shopping: Shopping; stockItemId: string; sizeKey: string; count: number; label: string };

/** Boards of one size ticked so far, for the "Bought" column. */
export function boughtOf(shopping: Shopping, stockItemId: string, sizeKey: string, count: number): number {
  return shopping.ticks.filter((t) => t.stockItemId === stockItemId && t.sizeKey === sizeKey && t.board <= count).length;
}

/**
 * One tick per board or sheet of a size line, numbered 1..count, so each one goes on the cart as it is
 * picked; large targets for a phone in the lumber yard.
 */
export function BoardTicks({ shopping, stockItemId, sizeKey, count, label }: Props) {
  const ticked = new Set(shopping.ticks.filter((t) => t.stockItemId === stockItemId && t.sizeKey === sizeKey).map((t) => t.board));
  return (
    <ul className="flex flex-wrap gap-2" aria-label={`Boards to buy: ${label}`}>
      {Array.from({ length: count }, (_, i) => i + 1).map((board) => (
        <li key={board}>
          <label className="inline-flex min-h-touch min-w-touch cursor-pointer items-center justify-center gap-2 rounded-md border border-ink/20 bg-white px-3 font-mono text-sm">
            <input
              type="checkbox"
              className="h-5 w-5 accent-ok"
              aria-label={`Bought ${board} of ${label}`}
              checked={ticked.has(board)}
              disabled={shopping.disabled}
              onChange={(e) => shopping.onTick({ stockItemId, sizeKey, board, bought: e.target.checked })}
            />
            {board}
          </label>
        </li>
      ))}
    </ul>
  );
}
