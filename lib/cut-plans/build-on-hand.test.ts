import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { OnHandStock } from '@/lib/on-hand/schemas';
import { DEFAULT_CUT_SETTINGS, type StockItemDto } from '@/lib/stock/schemas';
import { buildCutPlan, type PlanPart, type StockPlan } from './build';
import { keptOffcuts, partsLeftToCut } from './cut-records';

// Issue 16: boards and offcuts on hand reach the planners at price 0 with their counts.
const spf: StockItemDto = { id: 'spf', kind: 'softwood', name: '2x4 SPF', species: 'SPF', nominal: '2x4', thicknessIn: 1.5, widthIn: 3.5, pricePerBoardFootCents: null, offers: [{ lengthIn: 96, priceCents: 448 }, { lengthIn: 120, priceCents: 620 }] };
const oak: StockItemDto = { id: 'oak', kind: 'hardwood', name: '4/4 White oak', species: 'White oak', nominal: '4/4', thicknessIn: 1, widthIn: 6, pricePerBoardFootCents: 900, offers: [{ lengthIn: 96, priceCents: 0 }] };
const ply: StockItemDto = { id: 'ply', kind: 'sheet', name: '3/4" Birch plywood', species: 'Birch plywood', nominal: '3/4', thicknessIn: 0.71875, widthIn: null, pricePerBoardFootCents: null, offers: [{ widthIn: 48, lengthIn: 96, priceCents: 6800 }] };
/**
 * Budget for every plan whose pulls or cost are the optimum: ends the search only if it hangs, never because
 * the machine is busy. Each such plan is settled in milliseconds.
 */
const PROOF_LIMIT_MS = 20_000;
const part = (p: Partial<PlanPart> & Pick<PlanPart, 'id' | 'lengthIn' | 'quantity' | 'stockItemId'>): PlanPart => ({ name: p.id, widthIn: null, thicknessIn: null, grain: 'any', ...p });

/** The properties every plan with stock on hand keeps, whatever the planner (crosscut, rips, sheets). */
function expectPullsValid(group: StockPlan, onHand: OnHandStock[]) {
  const have = new Map(onHand.map((o) => [o.id, o]));
  const used = new Map<string, number>();
  for (const b of group.boards) {
    if (!b.onHandId) continue;
    const piece = have.get(b.onHandId);
    expect(piece, 'a pulled board names a piece on hand').toBeDefined();
    expect(b.lengthIn).toBeCloseTo(piece?.lengthIn ?? -1, 6);
    used.set(b.onHandId, (used.get(b.onHandId) ?? 0) + 1);
  }
  // Never more of a piece than the rack holds, and the pull list says exactly what the boards use.
  for (const [id, n] of used) expect(n).toBeLessThanOrEqual(have.get(id)?.count ?? 0);
  expect(Object.fromEntries(group.pulled.map((p) => [p.onHandId, p.count]))).toEqual(Object.fromEntries(used));
  // On-hand pieces cost nothing: the shopping list holds only boards bought, and the cost is theirs.
  const bought = group.boards.filter((b) => !b.onHandId);
  expect(group.purchase.reduce((a, p) => a + p.count, 0)).toBe(bought.length);
  expect(group.costCents).toBe(group.purchase.reduce((a, p) => a + p.costCents, 0));
  for (const p of group.purchase) expect(p.sizeKey).not.toMatch(/rack/);
}

const lengths = (min: number, max: number) => fc.integer({ min: min * 8, max: max * 8 }).map((n) => n / 8);

describe('buildCutPlan with stock on hand', () => {
  it('pulls a board on hand instead of buying one, and its shopping list counts only what is bought', () => {
    const onHand: OnHandStock[] = [{ id: 'a', stockItemId: 'spf', lengthIn: 70, widthIn: null, count: 1 }];
    const plan = buildCutPlan([part({ id: 'leg', lengthIn: 30, quantity: 4, stockItemId: 'spf' })], [spf], DEFAULT_CUT_SETTINGS, PROOF_LIMIT_MS, onHand);
    const group = plan.groups[0]!;
    expectPullsValid(group, onHand);
    // Two legs from the 70" piece on hand, two from one 8 ft board bought.
    expect(group.pulled).toEqual([{ onHandId: 'a', lengthIn: 70, widthIn: null, count: 1 }]);
    expect(group.purchase).toEqual([{ sizeKey: '96', lengthIn: 96, widthIn: null, count: 1, unitCents: 448, costCents: 448 }]);
    expect(plan.costCents).toBe(448);
    // Board feet are what is bought: one nominal 2x4 of 8 ft.
    expect(group.boardFeet).toBeCloseTo((2 * 4 * 96) / 144, 4);
    const pulled = group.boards.find((b) => b.onHandId === 'a');
    expect(pulled?.sizeKey).toBe('70');
  });

  it('with hardwood sold in several widths, a piece on hand counts as the narrowest width and costs nothing', () => {
    const walnut: StockItemDto = {
      ...oak,
      id: 'walnut',
      widthIn: 7.25,
      offers: [
        { widthIn: 4, lengthIn: 96, priceCents: 0 },
        { widthIn: 7.25, lengthIn: 96, priceCents: 0 },
      ],
    };
    const onHand: OnHandStock[] = [{ id: 'w', stockItemId: 'walnut', lengthIn: 48, widthIn: null, count: 1 }];
    const parts = [part({ id: 'slat', lengthIn: 40, widthIn: 3, quantity: 2, stockItemId: 'walnut' }), part({ id: 'top', lengthIn: 40, widthIn: 6, quantity: 1, stockItemId: 'walnut' })];
    const plan = buildCutPlan(parts, [walnut], DEFAULT_CUT_SETTINGS, PROOF_LIMIT_MS, onHand);
    const group = plan.groups[0]!;
    expect(group.unplaced).toEqual([]);
    expectPullsValid(group, onHand);
    expect(group.pulled.map((p) => p.onHandId)).toEqual(['w']);
    // Nothing wider than the narrowest board on sale is asked of the piece on hand.
    for (const b of group.boards.filter((x) => x.onHandId)) {
      expect(b.widthIn).toBe(4);
      for (const c of b.pieces) expect(c.widthIn).toBeLessThanOrEqual(4);
    }
  });

  it('ignores pieces of other stock items and pieces used up', () => {
    const onHand: OnHandStock[] = [
      { id: 'other', stockItemId: 'oak', lengthIn: 96, widthIn: null, count: 3 },
      { id: 'gone', stockItemId: 'spf', lengthIn: 96, widthIn: null, count: 0 },
    ];
    const plan = buildCutPlan([part({ id: 'leg', lengthIn: 30, quantity: 3, stockItemId: 'spf' })], [spf], DEFAULT_CUT_SETTINGS, PROOF_LIMIT_MS, onHand);
    expect(plan.groups[0]?.pulled).toEqual([]);
    expect(plan.costCents).toBe(448);
  });

  it('pulls a sheet piece on hand and rips a hardwood board on hand', () => {
    const sheetHand: OnHandStock[] = [{ id: 's', stockItemId: 'ply', lengthIn: 40, widthIn: 30, count: 1 }];
    const sheets = buildCutPlan([part({ id: 'side', lengthIn: 30, widthIn: 20, quantity: 1, stockItemId: 'ply' })], [ply], DEFAULT_CUT_SETTINGS, PROOF_LIMIT_MS, sheetHand);
    expectPullsValid(sheets.groups[0]!, sheetHand);
    expect(sheets.groups[0]?.pulled).toEqual([{ onHandId: 's', lengthIn: 40, widthIn: 30, count: 1 }]);
    expect(sheets.costCents).toBe(0);
    expect(sheets.groups[0]?.squareFeet).toBe(0);
    const oakHand: OnHandStock[] = [{ id: 'o', stockItemId: 'oak', lengthIn: 40, widthIn: null, count: 1 }];
    const rips = buildCutPlan([part({ id: 'slat', lengthIn: 36, widthIn: 2, quantity: 2, stockItemId: 'oak' })], [oak], DEFAULT_CUT_SETTINGS, PROOF_LIMIT_MS, oakHand);
    expectPullsValid(rips.groups[0]!, oakHand);
    expect(rips.costCents).toBe(0);
    expect(rips.groups[0]?.boards[0]?.strips?.length).toBe(2);
  });

  const lumberCase = fc.record({
    parts: fc.array(fc.record({ lengthIn: lengths(4, 60), quantity: fc.integer({ min: 1, max: 3 }) }), { minLength: 1, maxLength: 3 }),
    onHand: fc.array(fc.record({ lengthIn: lengths(6, 120), count: fc.integer({ min: 1, max: 3 }) }), { minLength: 0, maxLength: 3 }),
    stockId: fc.constantFrom('spf', 'oak'),
    ripWidth: fc.option(fc.constantFrom(1.5, 2.75), { nil: null }),
  });

  it('property (lumber, crosscut and rips): never pulls more than is on hand, pulls cost nothing, never costs more than buying all', () => {
    fc.assert(
      fc.property(lumberCase, ({ parts, onHand, stockId, ripWidth }) => {
        const stock = stockId === 'spf' ? spf : oak;
        const planParts = parts.map((p, i) => part({ id: `p${i}`, ...p, widthIn: ripWidth, stockItemId: stockId }));
        const rack: OnHandStock[] = onHand.map((o, i) => ({ id: `h${i}`, stockItemId: stockId, widthIn: null, ...o }));
        const withRack = buildCutPlan(planParts, [stock], DEFAULT_CUT_SETTINGS, 150, rack);
        const buying = buildCutPlan(planParts, [stock], DEFAULT_CUT_SETTINGS, 150);
        const group = withRack.groups[0]!;
        expectPullsValid(group, rack);
        expect(group.unplaced).toEqual([]);
        // Any plan that buys everything is also a plan with the rack, so the proof can never sit above it.
        expect(group.lowerBoundCents).toBeLessThanOrEqual(buying.costCents);
        if (group.optimal) expect(withRack.costCents).toBeLessThanOrEqual(buying.costCents);
        expect(group.lowerBoundCents).toBeLessThanOrEqual(withRack.costCents);
      }),
      { numRuns: 60 },
    );
  }, 60_000);

  it('property (sheets): never pulls more than is on hand, pulls cost nothing, never costs more than buying all', () => {
    const sheetCase = fc.record({
      parts: fc.array(fc.record({ lengthIn: lengths(6, 40), widthIn: lengths(4, 30), quantity: fc.integer({ min: 1, max: 2 }) }), { minLength: 1, maxLength: 3 }),
      onHand: fc.array(fc.record({ lengthIn: lengths(12, 96), widthIn: lengths(8, 48), count: fc.integer({ min: 1, max: 2 }) }), { minLength: 0, maxLength: 2 }),
    });
    fc.assert(
      fc.property(sheetCase, ({ parts, onHand }) => {
        const planParts = parts.map((p, i) => part({ id: `p${i}`, ...p, stockItemId: 'ply' }));
        const rack: OnHandStock[] = onHand.map((o, i) => ({ id: `h${i}`, stockItemId: 'ply', ...o }));
        const withRack = buildCutPlan(planParts, [ply], DEFAULT_CUT_SETTINGS, 150, rack);
        const buying = buildCutPlan(planParts, [ply], DEFAULT_CUT_SETTINGS, 150);
        const group = withRack.groups[0]!;
        expectPullsValid(group, rack);
        expect(group.lowerBoundCents).toBeLessThanOrEqual(buying.costCents);
        if (group.optimal) expect(withRack.costCents).toBeLessThanOrEqual(buying.costCents);
      }),
      { numRuns: 40 },
    );
  }, 60_000);
});

describe('cut records', () => {
  const board = (pieces: string[], offcutIn: number, keepOffcut: boolean) => ({
    sizeKey: '96',
    lengthIn: 96,
    widthIn: 3.5,
    offcutIn,
    keepOffcut,
    pieces: pieces.map((partId, pieceIndex) => ({ partId, name: partId, pieceIndex, x: 0, y: 0, lengthIn: 30, widthIn: 3.5, rotated: false })),
  });

  it('leaves out the pieces records have cut, and parts fully cut', () => {
    const records = [{ plan: { boards: [board(['leg', 'leg', 'rail'], 5, false)] } }, { plan: { boards: [board(['leg'], 60, true)] } }];
    const parts = [
      { id: 'leg', quantity: 4 },
      { id: 'rail', quantity: 1 },
      { id: 'top', quantity: 2 },
    ];
    expect(partsLeftToCut(parts, records)).toEqual([
      { id: 'leg', quantity: 1 },
      { id: 'top', quantity: 2 },
    ]);
    // A part whose quantity dropped below what was cut has nothing left, not a negative count.
    expect(partsLeftToCut([{ id: 'leg', quantity: 2 }], records)).toEqual([]);
  });

  it('keeps only the offcuts the plan marks worth keeping, grouped by length', () => {
    const plan = { boards: [board(['a'], 20, true), board(['b'], 20, true), board(['c'], 8, false), board(['d'], 40.5, true)] };
    expect(keptOffcuts(plan)).toEqual([
      { lengthIn: 40.5, widthIn: null, count: 1 },
      { lengthIn: 20, widthIn: null, count: 2 },
    ]);
  });

  it('keeps a sheet offcut with its own width, grouped by length and width', () => {
    const sheet = (offcutIn: number, offcutWidthIn: number) => ({ ...board(['p'], offcutIn, true), widthIn: 48, offcutWidthIn });
    expect(keptOffcuts({ boards: [sheet(30, 48), sheet(30, 20), sheet(30, 48)] })).toEqual([
      { lengthIn: 30, widthIn: 48, count: 2 },
      { lengthIn: 30, widthIn: 20, count: 1 },
    ]);
  });
});
