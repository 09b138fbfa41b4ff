import { describe, expect, it } from 'vitest';
import { boardFeet } from '@/lib/lumber';
import { formatBoardFeet, formatBoardSize } from './board-size';

describe('formatBoardSize', () => {
  it('names a board by width and whole feet, as a yard sells it', () => {
    expect(formatBoardSize(7.25, 96, 'in')).toBe(`7 1/4" × 8'`);
    expect(formatBoardSize(4, 102, 'in')).toBe('4" × 102"');
    expect(formatBoardSize(4, 96, 'mm')).toBe('101.6 mm × 2438.4 mm');
  });
  it('says board feet to two places', () => {
    // Source: USDA FPL Wood Handbook, 1 board foot = 144 in³: 4/4 x 7 1/4" x 96" = 4.83 board feet.
    expect(formatBoardFeet(boardFeet(1, 7.25, 96))).toBe('4.83 bd ft');
  });
});
