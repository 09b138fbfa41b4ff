import { formatLength } from '@/lib/units';

/**
 * How a hardwood board is named on the shopping list: width by length, a length of whole feet in feet
 * ("7 1/4" × 8'"), as yards sell hardwood. Common practice, no published source: racks are cut to whole feet.
 */
export function formatBoardSize(widthIn: number, lengthIn: number, unit: 'in' | 'mm'): string {
  const width = formatLength(widthIn, { unit });
  if (unit === 'in' && lengthIn % 12 === 0) return `${width} × ${lengthIn / 12}'`;
  return `${width} × ${formatLength(lengthIn, { unit })}`;
}

/** Board feet of one board as the line shows it: "4.83 bd ft". */
export const formatBoardFeet = (boardFeet: number): string => `${boardFeet.toFixed(2)} bd ft`;
