import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { planSheetCuts, type SheetCutRequest } from '.';
import { dffSheetBound, type DffPiece, type DffSheet } from './sheet-dff';

const M = 1_000_000; // micro-inches, as the planner counts
/** Limit for a call that asserts a proof: ends the search only if it hangs, never because the machine is busy. */
const PROOF_LIMIT_MS = 20_000;
const fitsSheet = (p: DffPiece, s: DffSheet) => (p.gw <= s.gw && p.gl <= s.gl) || (p.rotatable && p.gl <= s.gw && p.gw <= s.gl);

describe('dffSheetBound: worked cases', () => {
  it('needs three sheets for five 60 x 40 pieces on 100 x 100, where area says two', () => {
    // Two fit one above the other (40 + 40 <= 100), never three, and never side by side (60 + 60 > 100).
    const pieces = Array.from({ length: 5 }, () => ({ gw: 60 * M, gl: 40 * M, rotatable: false }));
    const sheets = [{ gw: 100 * M, gl: 100 * M }];
    expect(Math.ceil((5 * 60 * 40) / (100 * 100))).toBe(2);
    expect(dffSheetBound(pieces, sheets, () => true)).toBe(3);
  });

  it('counts a piece that cannot share a sheet both ways as a whole sheet', () => {
    const pieces = Array.from({ length: 3 }, () => ({ gw: 51 * M, gl: 51 * M, rotatable: true }));
    expect(dffSheetBound(pieces, [{ gw: 100 * M, gl: 100 * M }], () => true)).toBe(3);
  });

  it('is the area bound when small pieces tile the sheet exactly', () => {
    const pieces = Array.from({ length: 8 }, () => ({ gw: 50 * M, gl: 50 * M, rotatable: true }));
    expect(dffSheetBound(pieces, [{ gw: 100 * M, gl: 100 * M }], () => true)).toBe(2);
  });

  it('is 0 with no pieces or no sheets', () => {
    expect(dffSheetBound([], [{ gw: M, gl: M }], () => true)).toBe(0);
    expect(dffSheetBound([{ gw: M, gl: M, rotatable: true }], [], () => true)).toBe(0);
  });
});

describe('planSheetCuts with the stronger bound', () => {
  it('proves eleven 60 x 40 pieces need six sheets, beyond the exact search of the largest eight', () => {
    const req: SheetCutRequest = {
      kerf: 0,
      parts: [{ id: 'door', width: 60, length: 40, quantity: 11, grain: 'length' }],
      stock: [{ id: 'ply', width: 100, length: 100, price: 10 }],
      // Proven in milliseconds; at 300 ms the proof hung on how busy the machine was.
      timeLimitMs: PROOF_LIMIT_MS,
    };
    const plan = planSheetCuts(req);
    expect(plan.sheets).toHaveLength(6);
    expect(plan.lowerBound).toBe(60);
    expect(plan.optimal).toBe(true);
  });
});

describe('dffSheetBound: properties', () => {
  const pieceArb = fc.record({ w: fc.integer({ min: 4, max: 48 }), l: fc.integer({ min: 4, max: 96 }), rotatable: fc.boolean(), q: fc.integer({ min: 1, max: 6 }) });
  const caseArb = fc.record({
    parts: fc.array(pieceArb, { minLength: 1, maxLength: 8 }),
    sheets: fc.array(fc.record({ w: fc.integer({ min: 24, max: 48 }), l: fc.integer({ min: 48, max: 96 }) }), { minLength: 1, maxLength: 2 }),
  });

  it('never exceeds the sheets of a valid plan, so never the fewest possible', () => {
    fc.assert(
      fc.property(caseArb, ({ parts, sheets }) => {
        const req: SheetCutRequest = {
          kerf: 0,
          parts: parts.map((p, i) => ({ id: `p${i}`, width: p.w, length: p.l, quantity: p.q, grain: p.rotatable ? 'any' : 'length' })),
          // Every sheet at the same price: the plan's cost counts its sheets.
          stock: sheets.map((s, j) => ({ id: `s${j}`, width: s.w, length: s.l, price: 1 })),
          timeLimitMs: 20,
        };
        const plan = planSheetCuts(req);
        const dffSheets = sheets.map((s) => ({ gw: s.w * M, gl: s.l * M }));
        // Only the pieces the plan placed: those that fit no sheet are reported, not planned.
        const placed = new Set(plan.unplaced.map((u) => u.partId));
        const pieces = parts.flatMap((p, i) =>
          placed.has(`p${i}`) ? [] : Array.from({ length: p.q }, () => ({ gw: p.w * M, gl: p.l * M, rotatable: p.rotatable })),
        );
        const bound = dffSheetBound(pieces, dffSheets, (i, j) => {
          const p = pieces[i];
          const s = dffSheets[j];
          return !!p && !!s && fitsSheet(p, s);
        });
        expect(bound).toBeLessThanOrEqual(plan.sheets.length);
        expect(plan.lowerBound).toBeLessThanOrEqual(plan.totalCost + 1e-9);
      }),
      { numRuns: 150 },
    );
  }, 60_000);
});
