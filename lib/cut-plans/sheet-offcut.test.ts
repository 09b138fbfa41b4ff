import { describe, expect, it } from 'vitest';
import { keepsSheetOffcut, sheetOffcut } from './sheet-offcut';

const sheet = { lengthIn: 96, widthIn: 48 };
const at = (x: number, y: number, lengthIn: number, widthIn: number) => ({ x, y, lengthIn, widthIn });

describe('sheetOffcut (worked by hand, 1/8" kerf)', () => {
  it('cuts across past a full-width piece: 96 - 30 - 1/8 = 65 7/8" of the full 48" width', () => {
    expect(sheetOffcut(sheet, [at(0, 0, 30, 48)], 0.125)).toEqual({ lengthIn: 65.875, widthIn: 48 });
  });

  it('cuts along past a full-length piece: 48 - 20 - 1/8 = 27 7/8" wide, the whole 96" long', () => {
    expect(sheetOffcut(sheet, [at(0, 0, 96, 20)], 0.125)).toEqual({ lengthIn: 96, widthIn: 27.875 });
  });

  it('takes the larger rectangle: 35 7/8 x 48 (1,722 sq in) over 96 x 17 7/8 (1,716 sq in)', () => {
    expect(sheetOffcut(sheet, [at(0, 0, 60, 30)], 0.125)).toEqual({ lengthIn: 35.875, widthIn: 48 });
  });

  it('measures from the piece that reaches furthest, wherever it sits', () => {
    // Furthest along: 50 + 40 = 90, so 5 7/8 x 48 (282 sq in); furthest across: 10 1/8 + 12, so 96 x 25 3/4 (2,472).
    expect(sheetOffcut(sheet, [at(0, 0, 20, 10), at(10.125, 50, 40, 12)], 0.125)).toEqual({ lengthIn: 96, widthIn: 25.75 });
    // Furthest along: 70, so 25 7/8 x 48 (1,242); furthest across: 10 1/8 + 30, so 96 x 7 3/4 (744).
    expect(sheetOffcut(sheet, [at(0, 0, 20, 10), at(10.125, 0, 70, 30)], 0.125)).toEqual({ lengthIn: 25.875, widthIn: 48 });
  });

  it('has no offcut when the pieces use the sheet to its edges, or nothing is on it', () => {
    expect(sheetOffcut(sheet, [at(0, 0, 96, 48)], 0.125)).toBeNull();
    expect(sheetOffcut(sheet, [at(0, 0, 95.9, 47.9)], 0.125)).toBeNull();
    expect(sheetOffcut(sheet, [], 0.125)).toBeNull();
  });
});

describe('keepsSheetOffcut', () => {
  it('keeps a remnant only when both sides reach the minimum offcut', () => {
    expect(keepsSheetOffcut({ lengthIn: 96, widthIn: 12 }, 12)).toBe(true);
    expect(keepsSheetOffcut({ lengthIn: 96, widthIn: 11.875 }, 12)).toBe(false);
    expect(keepsSheetOffcut({ lengthIn: 11, widthIn: 48 }, 12)).toBe(false);
    expect(keepsSheetOffcut(null, 12)).toBe(false);
  });
});
