import { describe, expect, it } from 'vitest';
import { DEFAULT_CUT_SETTINGS, type StockItemDto } from '@/lib/stock/schemas';
import { buildCutPlan, type PlanPart } from './build';

const spf: StockItemDto = {
  id: 'spf',
  kind: 'softwood',
  name: '2x4 SPF',
  species: 'SPF',
  nominal: '2x4',
  thicknessIn: 1.5,
  widthIn: 3.5,
  pricePerBoardFootCents: null,
  offers: [{ lengthIn: 120, priceCents: 620 }],
};
const oak: StockItemDto = {
  id: 'oak',
  kind: 'hardwood',
  name: '4/4 White oak, 6" wide',
  species: 'White oak',
  nominal: '4/4',
  thicknessIn: 1,
  widthIn: 6,
  pricePerBoardFootCents: 900,
  offers: [{ lengthIn: 96, priceCents: 0 }],
};
const ply: StockItemDto = {
  id: 'ply',
  kind: 'sheet',
  name: '3/4" Birch plywood',
  species: 'Birch plywood',
  nominal: '3/4',
  thicknessIn: 23 / 32,
  widthIn: null,
  pricePerBoardFootCents: null,
  offers: [{ widthIn: 48, lengthIn: 96, priceCents: 6800 }],
};
const part = (p: Partial<PlanPart> & Pick<PlanPart, 'id' | 'lengthIn' | 'quantity' | 'stockItemId'>): PlanPart => ({
  name: p.id,
  widthIn: null,
  thicknessIn: null,
  grain: 'any',
  ...p,
});

describe('buildCutPlan', () => {
  it('buys five 10 ft 2x4s for fourteen 32" legs with a 1/8" kerf, and counts board feet on nominal size', () => {
    // Common practice, no published source: 3 pieces of 32" per 10 ft board with a 1/8" kerf.
    const plan = buildCutPlan([part({ id: 'leg', lengthIn: 32, quantity: 14, stockItemId: 'spf' })], [spf], DEFAULT_CUT_SETTINGS, 500);
    const group = plan.groups[0];
    expect(group?.purchase).toEqual([{ sizeKey: '120', lengthIn: 120, widthIn: null, count: 5, unitCents: 620, costCents: 3100 }]);
    // Source: USDA FPL Wood Handbook, board foot = 144 in³, on nominal 2x4 (softwood is tallied on nominal size).
    expect(group?.boardFeet).toBeCloseTo((5 * 2 * 4 * 120) / 144, 4);
    expect(plan.optimal).toBe(true);
    expect(plan.pieceCount).toBe(14);
    const indices = group?.boards.flatMap((b) => b.pieces.map((c) => c.pieceIndex)).sort((a, b) => a - b);
    expect(indices).toEqual([...Array(14).keys()]);
    expect(group?.wastePercent).toBeCloseTo((100 * (600 - 14 * 32)) / 600, 3);
  });

  it('prices hardwood by the board foot on its thickness in quarters', () => {
    const plan = buildCutPlan([part({ id: 'top', lengthIn: 40, quantity: 1, stockItemId: 'oak' })], [oak], DEFAULT_CUT_SETTINGS, 200);
    // 1 in x 6 in x 96 in / 144 = 4 board feet at $9.00.
    expect(plan.groups[0]?.purchase[0]).toMatchObject({ count: 1, unitCents: 3600, costCents: 3600 });
    expect(plan.boardFeet).toBeCloseTo(4, 6);
  });

  it('reports parts that cannot come from the chosen stock, and parts with no stock, instead of dropping them', () => {
    const plan = buildCutPlan(
      [
        part({ id: 'wide', lengthIn: 20, widthIn: 5, quantity: 2, stockItemId: 'spf' }),
        part({ id: 'thick', lengthIn: 20, thicknessIn: 2, quantity: 1, stockItemId: 'spf' }),
        part({ id: 'panel', lengthIn: 20, quantity: 1, stockItemId: 'ply' }),
        part({ id: 'loose', lengthIn: 20, quantity: 3, stockItemId: null }),
      ],
      [spf, ply],
      DEFAULT_CUT_SETTINGS,
      200,
    );
    const reasons = plan.groups.flatMap((g) => g.unplaced.map((u) => `${u.partId}:${u.quantity}`));
    expect(reasons.sort()).toEqual(['panel:1', 'thick:1', 'wide:2']);
    expect(plan.noStock).toEqual([{ partId: 'loose', name: 'loose', quantity: 3, reason: 'Choose stock for this part.' }]);
    expect(plan.optimal).toBe(false);
  });

  it('lays sheet parts out on the sheet and counts square feet', () => {
    const plan = buildCutPlan([part({ id: 'side', lengthIn: 30, widthIn: 16, quantity: 4, stockItemId: 'ply', grain: 'length' })], [ply], DEFAULT_CUT_SETTINGS, 300);
    const g = plan.groups[0];
    expect(g?.purchase[0]).toMatchObject({ sizeKey: '48x96', count: 1, costCents: 6800 });
    expect(g?.squareFeet).toBe(32);
    expect(g?.boards[0]?.pieces).toHaveLength(4);
    expect(g?.boards[0]?.pieces.every((p) => !p.rotated)).toBe(true);
  });

  it('rips narrow parts side by side from one hardwood board instead of one board each', () => {
    // 1 1/2" legs from a 6" board: 1.5 x 3 + 2 x (1/8" kerf + 1/16" jointing) = 4.875" <= 6", so three strips.
    const plan = buildCutPlan([part({ id: 'leg', lengthIn: 28, widthIn: 1.5, quantity: 4, stockItemId: 'oak' })], [oak], DEFAULT_CUT_SETTINGS, 300);
    const g = plan.groups[0];
    expect(g?.purchase[0]).toMatchObject({ count: 1, costCents: 3600 });
    const board = g?.boards[0];
    expect(board?.strips?.every((s) => s.widthIn === 1.5)).toBe(true);
    expect(board?.pieces).toHaveLength(4);
    // Each piece lies in its strip, never turned: its x is its strip's offset across the board.
    for (const p of board?.pieces ?? []) {
      expect(board?.strips?.some((s) => s.x === p.x)).toBe(true);
      expect(p.widthIn).toBe(1.5);
      expect(p.rotated).toBe(false);
    }
    expect(plan.optimal).toBe(true);
  });
});
