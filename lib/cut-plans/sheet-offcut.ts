/**
 * The remnant of a cut sheet worth putting back on the rack (issue 16: a plan's keep-offcuts go on
 * hand). Pure, no I/O.
 *
 * One straight cut right through the sheet past every piece frees a whole rectangle, whatever order the
 * guillotine cuts inside the layout take: across the sheet past the piece that reaches furthest along
 * its length, or along the sheet past the piece that reaches furthest across it. The larger of the two
 * is the offcut. Lengths run along the sheet (its grain), widths across, as in the plan's pieces.
 */

type Placed = { x: number; y: number; lengthIn: number; widthIn: number };

export type SheetOffcut = { lengthIn: number; widthIn: number };

const round4 = (n: number) => Math.round(n * 10_000) / 10_000;

export function sheetOffcut(sheet: { lengthIn: number; widthIn: number }, pieces: readonly Placed[], kerfIn: number): SheetOffcut | null {
  if (pieces.length === 0) return null;
  const along = Math.max(...pieces.map((p) => p.y + p.lengthIn));
  const across = Math.max(...pieces.map((p) => p.x + p.widthIn));
  // The saw takes a kerf at the cut; a remnant thinner than that is only dust.
  const end = { lengthIn: round4(sheet.lengthIn - along - kerfIn), widthIn: sheet.widthIn };
  const side = { lengthIn: sheet.lengthIn, widthIn: round4(sheet.widthIn - across - kerfIn) };
  const area = (o: SheetOffcut) => (o.lengthIn > 0 && o.widthIn > 0 ? o.lengthIn * o.widthIn : 0);
  const best = area(end) >= area(side) ? end : side;
  return area(best) > 0 ? best : null;
}

/**
 * A remnant is kept when both its sides reach the channel's minimum offcut.
 * Common practice, no published source: a strip narrower than a shop keeps in either direction is scrap.
 */
export const keepsSheetOffcut = (offcut: SheetOffcut | null, minOffcutIn: number): boolean =>
  offcut !== null && offcut.lengthIn >= minOffcutIn && offcut.widthIn >= minOffcutIn;
