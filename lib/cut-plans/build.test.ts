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
  offers: [{ widthIn: 6, lengthIn: 96, priceCents: 0 }],
};
/** Issue 16: one hardwood item sold in several widths and lengths, $10.00 a board foot. */
const ash: StockItemDto = {
  id: 'ash',
  kind: 'hardwood',
  name: '4/4 Ash, 4" to 7 1/4" wide',
  species: 'Ash',
  nominal: '4/4',
  thicknessIn: 1,
  widthIn: 7.25,
  pricePerBoardFootCents: 1000,
  offers: [
    { widthIn: 4, lengthIn: 72, priceCents: 0 },
    { widthIn: 4, lengthIn: 96, priceCents: 0 },
    { widthIn: 7.25, lengthIn: 96, priceCents: 0 },
  ],
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
/**
 * Budget for every plan that asserts a proof, the optimum or a layout only the search finds: ends the search
 * only if it hangs, never because the machine is busy. Each such plan is settled in milliseconds.
 */
const PROOF_LIMIT_MS = 20_000;

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
    const plan = buildCutPlan([part({ id: 'leg', lengthIn: 32, quantity: 14, stockItemId: 'spf' })], [spf], DEFAULT_CUT_SETTINGS, PROOF_LIMIT_MS);
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
    // 1 in x 6 in x 96 in / 144 = 4 board feet at $9.00; the board is named by width and length.
    expect(plan.groups[0]?.purchase[0]).toEqual({ sizeKey: '6x96', lengthIn: 96, widthIn: 6, count: 1, unitCents: 3600, costCents: 3600, boardFeetEach: 4 });
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
    const plan = buildCutPlan([part({ id: 'side', lengthIn: 30, widthIn: 16, quantity: 4, stockItemId: 'ply', grain: 'length' })], [ply], DEFAULT_CUT_SETTINGS, PROOF_LIMIT_MS);
    const g = plan.groups[0];
    expect(g?.purchase[0]).toMatchObject({ sizeKey: '48x96', count: 1, costCents: 6800 });
    expect(g?.squareFeet).toBe(32);
    expect(g?.boards[0]?.pieces).toHaveLength(4);
    expect(g?.boards[0]?.pieces.every((p) => !p.rotated)).toBe(true);
  });

  it('keeps the rest of a sheet past its last piece, with its width, so marking the cuts done puts it on hand', () => {
    // A 30" x 48" panel from a 48" x 96" sheet: 96 - 30 - 1/8" kerf = 65 7/8" of the whole width is left.
    const plan = buildCutPlan([part({ id: 'top', lengthIn: 30, widthIn: 48, quantity: 1, stockItemId: 'ply', grain: 'length' })], [ply], DEFAULT_CUT_SETTINGS, 300);
    expect(plan.groups[0]?.boards[0]).toMatchObject({ offcutIn: 65.875, offcutWidthIn: 48, keepOffcut: true });
  });

  it('rips narrow parts side by side from one hardwood board instead of one board each', () => {
    // 1 1/2" legs from a 6" board: 1.5 x 3 + 2 x (1/8" kerf + 1/16" jointing) = 4.875" <= 6", so three strips.
    const plan = buildCutPlan([part({ id: 'leg', lengthIn: 28, widthIn: 1.5, quantity: 4, stockItemId: 'oak' })], [oak], DEFAULT_CUT_SETTINGS, PROOF_LIMIT_MS);
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

  it('keeps the full-width length past the longest strip of a ripped board, so marking the cuts done puts it on hand', () => {
    // One 30" x 1 1/2" leg ripped from a 6" x 8' board: 96 - 30 - 1/8" kerf = 65 7/8" left at full width,
    // over the 12" minimum offcut; a 90" leg leaves 5 7/8", scrap.
    const kept = buildCutPlan([part({ id: 'leg', lengthIn: 30, widthIn: 1.5, quantity: 1, stockItemId: 'oak' })], [oak], DEFAULT_CUT_SETTINGS, 300);
    expect(kept.groups[0]?.boards[0]).toMatchObject({ offcutIn: 65.875, keepOffcut: true });
    const scrap = buildCutPlan([part({ id: 'leg', lengthIn: 90, widthIn: 1.5, quantity: 1, stockItemId: 'oak' })], [oak], DEFAULT_CUT_SETTINGS, 300);
    expect(scrap.groups[0]?.boards[0]).toMatchObject({ offcutIn: 5.875, keepOffcut: false });
  });

  describe('hardwood in several widths (issue 16)', () => {
    it('buys one 7 1/4" board for six 2" slats where 4" boards would cost more per slat', () => {
      // Source: USDA FPL Wood Handbook, 1 board foot = 144 in³. At $10.00 a board foot:
      // 4" x 8' = 1 x 4 x 96 / 144 = 2.667 bd ft = $26.67; two 2" strips need 2 + 1/8 + 1/16 + 2 = 4.1875" > 4",
      // so it holds one strip of two 40" slats: three boards, $80.01, $13.34 a slat.
      // 7 1/4" x 8' = 4.833 bd ft = $48.33; three strips take 6.375" <= 7 1/4": six slats on one board, $8.06 a slat.
      const plan = buildCutPlan([part({ id: 'slat', lengthIn: 40, widthIn: 2, quantity: 6, stockItemId: 'ash' })], [ash], DEFAULT_CUT_SETTINGS, PROOF_LIMIT_MS);
      const g = plan.groups[0];
      expect(g?.purchase).toEqual([{ sizeKey: '7.25x96', lengthIn: 96, widthIn: 7.25, count: 1, unitCents: 4833, costCents: 4833, boardFeetEach: 4.8333 }]);
      expect(g?.boards).toHaveLength(1);
      expect(g?.boards[0]?.widthIn).toBe(7.25);
      expect(g?.boards[0]?.strips?.map((s) => s.widthIn)).toEqual([2, 2, 2]);
      expect(g?.boardFeet).toBeCloseTo(4.8333, 4);
      expect(plan.optimal).toBe(true);
    });

    it('buys the narrow short board when that is cheapest', () => {
      // Two 30" x 3" rails: one 3" strip of a 4" x 6' board (2 bd ft, $20.00) holds both (2 x 30 1/8" <= 72 1/8").
      const plan = buildCutPlan([part({ id: 'rail', lengthIn: 30, widthIn: 3, quantity: 2, stockItemId: 'ash' })], [ash], DEFAULT_CUT_SETTINGS, PROOF_LIMIT_MS);
      expect(plan.groups[0]?.purchase).toEqual([{ sizeKey: '4x72', lengthIn: 72, widthIn: 4, count: 1, unitCents: 2000, costCents: 2000, boardFeetEach: 2 }]);
      expect(plan.optimal).toBe(true);
    });

    it('puts a part wider than the narrow boards on a wide one, and reports one wider than every board', () => {
      const plan = buildCutPlan(
        [part({ id: 'panel', lengthIn: 20, widthIn: 6, quantity: 1, stockItemId: 'ash' }), part({ id: 'top', lengthIn: 20, widthIn: 9, quantity: 1, stockItemId: 'ash' })],
        [ash],
        DEFAULT_CUT_SETTINGS,
        500,
      );
      const g = plan.groups[0];
      expect(g?.purchase.map((p) => p.sizeKey)).toEqual(['7.25x96']);
      expect(g?.boards[0]?.pieces.map((p) => p.partId)).toEqual(['panel']);
      expect(g?.unplaced.map((u) => u.partId)).toEqual(['top']);
      expect(plan.optimal).toBe(false);
    });

    it('gives a part with no width the narrowest board width, so it fits any board', () => {
      const plan = buildCutPlan([part({ id: 'cleat', lengthIn: 60, quantity: 1, stockItemId: 'ash' })], [ash], DEFAULT_CUT_SETTINGS, PROOF_LIMIT_MS);
      expect(plan.groups[0]?.purchase.map((p) => p.sizeKey)).toEqual(['4x72']);
      expect(plan.groups[0]?.boards[0]?.pieces[0]?.widthIn).toBe(4);
    });
  });
});
