import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { PlanBoard, StockPlan } from './build';
import { cutCountsAfterTakeBack, newestRecordIds, offcutsNotAsKept, takeBackSummary } from './take-back';

const piece = (partId: string, pieceIndex: number) => ({ partId, name: partId, pieceIndex, x: 0, y: 0, lengthIn: 30, widthIn: 3.5, rotated: false });
const board = (over: Partial<PlanBoard>): PlanBoard => ({ sizeKey: '120', lengthIn: 120, widthIn: 3.5, pieces: [], offcutIn: 0, keepOffcut: false, ...over });

// Two boards pulled from the rack (one piece twice), one bought; two offcuts of 17 5/8" kept, one scrap.
const plan: Pick<StockPlan, 'boards' | 'pulled'> = {
  boards: [
    board({ onHandId: 'a', lengthIn: 108, pieces: [piece('leg', 0), piece('leg', 1), piece('leg', 2)], offcutIn: 17.625, keepOffcut: true }),
    board({ onHandId: 'a', lengthIn: 108, pieces: [piece('leg', 3), piece('rail', 0), piece('rail', 1)], offcutIn: 17.625, keepOffcut: true }),
    board({ pieces: [piece('rail', 2)], offcutIn: 4, keepOffcut: false }),
  ],
  pulled: [{ onHandId: 'a', lengthIn: 108, widthIn: null, count: 2 }],
};

describe('newestRecordIds', () => {
  it('is the last record of each stock item, in the list’s oldest-first order', () => {
    const records = [
      { id: '1', stockItemId: 'spf' },
      { id: '2', stockItemId: 'ply' },
      { id: '3', stockItemId: 'spf' },
    ];
    expect([...newestRecordIds(records)].sort()).toEqual(['2', '3']);
    expect(newestRecordIds([]).size).toBe(0);
  });
});

describe('takeBackSummary', () => {
  it('counts the pieces that go back, the offcuts that leave and the pieces unticked', () => {
    expect(takeBackSummary(plan)).toEqual({ piecesBack: 2, offcutsRemoved: 2, piecesUnticked: 7 });
  });
});

describe('offcutsNotAsKept', () => {
  it('accepts the kept offcuts on hand as kept, in one row or several', () => {
    expect(offcutsNotAsKept(plan, [{ lengthIn: 17.625, widthIn: null, count: 2 }])).toEqual([]);
    expect(
      offcutsNotAsKept(plan, [
        { lengthIn: 17.625, widthIn: null, count: 1 },
        { lengthIn: 17.625, widthIn: null, count: 1 },
      ]),
    ).toEqual([]);
  });
  it('names an offcut used up, lowered, raised, or a row of a size never kept', () => {
    expect(offcutsNotAsKept(plan, [])).toEqual([{ lengthIn: 17.625, widthIn: null, kept: 2, onHand: 0 }]);
    expect(offcutsNotAsKept(plan, [{ lengthIn: 17.625, widthIn: null, count: 1 }])).toEqual([{ lengthIn: 17.625, widthIn: null, kept: 2, onHand: 1 }]);
    expect(offcutsNotAsKept(plan, [{ lengthIn: 17.625, widthIn: null, count: 3 }])).toEqual([{ lengthIn: 17.625, widthIn: null, kept: 2, onHand: 3 }]);
    expect(
      offcutsNotAsKept(plan, [
        { lengthIn: 17.625, widthIn: null, count: 2 },
        { lengthIn: 12, widthIn: null, count: 1 },
      ]),
    ).toEqual([{ lengthIn: 12, widthIn: null, kept: 0, onHand: 1 }]);
  });
  it('tells a sheet offcut by its width too', () => {
    const sheet = { boards: [board({ lengthIn: 96, widthIn: 48, offcutIn: 65.875, offcutWidthIn: 48, keepOffcut: true })] };
    expect(offcutsNotAsKept(sheet, [{ lengthIn: 65.875, widthIn: 48, count: 1 }])).toEqual([]);
    expect(offcutsNotAsKept(sheet, [{ lengthIn: 65.875, widthIn: 24, count: 1 }])).toHaveLength(2);
    expect(offcutsNotAsKept(sheet, [{ lengthIn: 65.875, widthIn: null, count: 1 }])).toHaveLength(2);
  });
  it('asks nothing of a record that kept no offcut', () => {
    expect(offcutsNotAsKept({ boards: [board({ offcutIn: 4 })] }, [])).toEqual([]);
  });
});

describe('cutCountsAfterTakeBack', () => {
  it('lowers each part by what the record cut', () => {
    const parts = [
      { id: 'leg', quantity: 4, cutCount: 4 },
      { id: 'rail', quantity: 3, cutCount: 3 },
      { id: 'other', quantity: 2, cutCount: 2 },
    ];
    expect(cutCountsAfterTakeBack(parts, plan, new Map())).toEqual([
      { id: 'leg', cutCount: 0 },
      { id: 'rail', cutCount: 0 },
    ]);
  });
  it('never below what the remaining records cut, nor below 0, nor above the quantity', () => {
    expect(cutCountsAfterTakeBack([{ id: 'leg', quantity: 8, cutCount: 8 }], plan, new Map([['leg', 6]]))).toEqual([{ id: 'leg', cutCount: 6 }]);
    // Ticked by hand beyond the records: only this record's pieces come off.
    expect(cutCountsAfterTakeBack([{ id: 'leg', quantity: 10, cutCount: 9 }], plan, new Map([['leg', 4]]))).toEqual([{ id: 'leg', cutCount: 5 }]);
    // Unticked by hand before: 0, not negative.
    expect(cutCountsAfterTakeBack([{ id: 'leg', quantity: 4, cutCount: 2 }], plan, new Map())).toEqual([{ id: 'leg', cutCount: 0 }]);
    // The quantity was lowered since: within 0..quantity.
    expect(cutCountsAfterTakeBack([{ id: 'rail', quantity: 1, cutCount: 1 }], plan, new Map([['rail', 5]]))).toEqual([]);
  });
  it('always lands within max(0, remaining)..quantity and never moves a part the record did not cut', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 500 }), fc.integer({ min: 0, max: 500 }), fc.integer({ min: 0, max: 500 }), (quantity, cut, remaining) => {
        const cutCount = Math.min(cut, quantity);
        const [change] = cutCountsAfterTakeBack([{ id: 'leg', quantity, cutCount }], plan, new Map([['leg', remaining]]));
        const next = change?.cutCount ?? cutCount;
        expect(next).toBeGreaterThanOrEqual(0);
        expect(next).toBeLessThanOrEqual(quantity);
        expect(next).toBe(Math.min(quantity, Math.max(remaining, cutCount - 4)));
        expect(cutCountsAfterTakeBack([{ id: 'shelf', quantity, cutCount }], plan, new Map())).toEqual([]);
      }),
    );
  });
});
