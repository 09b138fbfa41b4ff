import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { planSheetCuts } from '@/lib/cutlist';
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

describe('sheetOffcut on planned layouts (property)', () => {
  it('lies inside the sheet, a kerf clear of every piece the planner placed', () => {
    const sixteenths = (min: number, max: number) => fc.integer({ min: min * 16, max: max * 16 }).map((n) => n / 16);
    fc.assert(
      fc.property(
        fc.constantFrom(0, 1 / 16, 1 / 8),
        fc.array(fc.record({ width: sixteenths(1, 30), length: sixteenths(1, 50), quantity: fc.integer({ min: 1, max: 3 }) }), { minLength: 1, maxLength: 5 }),
        (kerf, parts) => {
          const plan = planSheetCuts({ kerf, parts: parts.map((p, i) => ({ id: `p${i}`, ...p, grain: 'any' })), stock: [{ id: 'ply', width: 48, length: 96, price: 52 }], timeLimitMs: 20 });
          for (const s of plan.sheets) {
            const pieces = s.placements.map((c) => ({ x: c.x, y: c.y, lengthIn: c.length, widthIn: c.width }));
            const off = sheetOffcut({ lengthIn: s.length, widthIn: s.width }, pieces, kerf);
            if (!off) continue;
            // Across the sheet it is the last offcutIn of the length; along it, the last widthIn of the width.
            const across = off.widthIn === s.width && off.lengthIn < s.length;
            const rect = across ? { x: 0, y: s.length - off.lengthIn, w: s.width, l: off.lengthIn } : { x: s.width - off.widthIn, y: 0, w: off.widthIn, l: s.length };
            expect(rect.x).toBeGreaterThanOrEqual(-1e-9);
            expect(rect.y).toBeGreaterThanOrEqual(-1e-9);
            for (const p of pieces) {
              const clear = across ? p.y + p.lengthIn + kerf <= rect.y + 1e-6 : p.x + p.widthIn + kerf <= rect.x + 1e-6;
              expect(clear).toBe(true);
            }
          }
        },
      ),
      { numRuns: 60 },
    );
  }, 60_000);
});
