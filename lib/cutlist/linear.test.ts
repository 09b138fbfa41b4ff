import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { firstFitDecreasing, martelloTothL2, planLinearCuts, type LinearCutPlan, type LinearCutRequest } from '.';
import { bruteForceCost } from './testing/brute-force';
import { manyPiecesRequest } from './testing/hard-requests';

const EPS = 1e-6;

/** Checks a plan against its request independently of the planner's internals. */
function expectValidPlan(req: LinearCutRequest, plan: LinearCutPlan): void {
  const trim = req.endTrim ?? 0;
  const placed = new Map<string, number>();
  const boardsPerStock = new Map<string, number>();
  for (const board of plan.boards) {
    const stock = req.stock.find((s) => s.id === board.stockId);
    expect(stock).toBeDefined();
    if (!stock) continue;
    expect(board.length).toBe(stock.length);
    boardsPerStock.set(stock.id, (boardsPerStock.get(stock.id) ?? 0) + 1);
    expect(board.cuts.length).toBeGreaterThan(0);
    const usable = stock.length - 2 * trim;
    const cuts = [...board.cuts].sort((a, b) => a.start - b.start);
    let sum = 0;
    cuts.forEach((cut, k) => {
      const part = req.parts.find((p) => p.id === cut.partId);
      expect(part?.length).toBe(cut.length);
      placed.set(cut.partId, (placed.get(cut.partId) ?? 0) + 1);
      sum += cut.length;
      const prev = cuts[k - 1];
      // Pieces lie one after another from endTrim, a kerf apart: no overlap, nothing before the usable start.
      if (prev) expect(cut.start).toBeCloseTo(prev.start + prev.length + req.kerf, 6);
      else expect(cut.start).toBeCloseTo(trim, 9);
      expect(cut.start + cut.length).toBeLessThanOrEqual(stock.length - trim + EPS);
    });
    // The kerf rule of the issue.
    expect(sum + req.kerf * (cuts.length - 1)).toBeLessThanOrEqual(usable + EPS);
    expect(board.offcut).toBeCloseTo(Math.max(0, usable - sum - req.kerf * cuts.length), 6);
  }
  for (const part of req.parts) {
    const unplaced = plan.unplaced.filter((u) => u.partId === part.id);
    for (const u of unplaced) expect(u.reason.length).toBeGreaterThan(0);
    const missing = unplaced.reduce((a, u) => a + u.quantity, 0);
    expect((placed.get(part.id) ?? 0) + missing).toBe(part.quantity);
  }
  let total = 0;
  for (const p of plan.purchase) {
    const stock = req.stock.find((s) => s.id === p.stockId);
    expect(p.count).toBe(boardsPerStock.get(p.stockId));
    if (stock?.available !== undefined) expect(p.count).toBeLessThanOrEqual(stock.available);
    expect(p.cost).toBeCloseTo(p.count * (stock?.price ?? Number.NaN), 6);
    total += p.cost;
  }
  expect(plan.purchase.reduce((a, p) => a + p.count, 0)).toBe(plan.boards.length);
  expect(plan.totalCost).toBeCloseTo(total, 6);
  expect(plan.lowerBound).toBeLessThanOrEqual(plan.totalCost + EPS);
}

const unplacedCount = (plan: LinearCutPlan): number => plan.unplaced.reduce((a, u) => a + u.quantity, 0);

// Lengths in 1/16 in so sums are exact in binary floating point; prices in cents.
const sixteenths = (min: number, max: number) => fc.integer({ min: min * 16, max: max * 16 }).map((n) => n / 16);
/**
 * Limit for every call that asserts a proof or the optimum: ends the search only if it hangs, never because
 * the machine is busy. The cases are proven in milliseconds, so the limit costs no time.
 */
const PROOF_LIMIT_MS = 20_000;

const requestArb = (maxParts: number, maxQty: number, maxStock: number): fc.Arbitrary<LinearCutRequest> =>
  fc.record({
    kerf: fc.constantFrom(0, 1 / 16, 1 / 8),
    endTrim: fc.constantFrom(0, 0.5),
    parts: fc
      .array(fc.record({ length: sixteenths(1, 100), quantity: fc.integer({ min: 1, max: maxQty }) }), {
        minLength: 1,
        maxLength: maxParts,
      })
      .map((ps) => ps.map((p, i) => ({ id: `p${i}`, ...p }))),
    stock: fc
      .array(
        fc.record({
          length: fc.integer({ min: 24, max: 144 }),
          price: fc.integer({ min: 0, max: 3000 }).map((c) => c / 100),
          available: fc.option(fc.integer({ min: 0, max: 6 }), { nil: undefined }),
        }),
        { minLength: 1, maxLength: maxStock },
      )
      .map((ss) => ss.map((s, i) => ({ id: `s${i}`, ...s }))),
    timeLimitMs: fc.constant(100),
  });

describe('planLinearCuts: common practice', () => {
  it('needs five 10 ft boards for 14 pieces of 32 in with a 1/8 in kerf', () => {
    // Common practice, no published source.
    const req = { kerf: 0.125, parts: [{ id: 'rail', length: 32, quantity: 14 }], stock: [{ id: '10ft', length: 120, price: 9.5 }], timeLimitMs: PROOF_LIMIT_MS };
    const plan = planLinearCuts(req);
    expectValidPlan(req, plan);
    expect(plan.purchase).toEqual([{ stockId: '10ft', count: 5, cost: 47.5 }]);
    expect(plan.optimal).toBe(true);
    expect(plan.lowerBound).toBe(47.5);
  });

  it.each([1 / 8, 1 / 16, 0.001])('gets only two 32 in pieces from an 8 ft board with kerf %d', (kerf) => {
    // Common practice, no published source.
    const req = { kerf, parts: [{ id: 'leg', length: 32, quantity: 3 }], stock: [{ id: '8ft', length: 96, price: 5 }] };
    const plan = planLinearCuts(req);
    expectValidPlan(req, plan);
    expect(plan.boards).toHaveLength(2);
    expect(Math.max(...plan.boards.map((b) => b.cuts.length))).toBe(2);
  });

  it('gets three 32 in pieces from an 8 ft board with no kerf, leaving no offcut', () => {
    const req = { kerf: 0, parts: [{ id: 'leg', length: 32, quantity: 3 }], stock: [{ id: '8ft', length: 96, price: 5 }] };
    const plan = planLinearCuts(req);
    expectValidPlan(req, plan);
    expect(plan.boards).toEqual([
      {
        stockId: '8ft',
        length: 96,
        cuts: [
          { partId: 'leg', start: 0, length: 32 },
          { partId: 'leg', start: 32, length: 32 },
          { partId: 'leg', start: 64, length: 32 },
        ],
        offcut: 0,
      },
    ]);
  });
});

describe('planLinearCuts: worked cases', () => {
  it('accepts an exactly full board whose float sum comes out a hair over', () => {
    // Summed largest first, as a cut list is laid out, these come to 1.0000000000000002 in doubles.
    expect(0.56 + 0.34 + 0.1).toBeGreaterThan(1);
    const req = {
      kerf: 0,
      parts: [
        { id: 'a', length: 0.1, quantity: 1 },
        { id: 'b', length: 0.34, quantity: 1 },
        { id: 'c', length: 0.56, quantity: 1 },
      ],
      stock: [{ id: 's', length: 1, price: 1 }],
    };
    const plan = planLinearCuts(req);
    expectValidPlan(req, plan);
    expect(plan.boards).toHaveLength(1);
    expect(plan.boards[0]?.offcut).toBe(0);
  });

  it('accepts a board filled exactly with kerfs between pieces and trimmed ends', () => {
    const req = {
      kerf: 0.1,
      endTrim: 0.2,
      parts: [{ id: 'a', length: 0.3, quantity: 2 }],
      stock: [{ id: 's', length: 1.1, price: 1 }],
    };
    const plan = planLinearCuts(req);
    expectValidPlan(req, plan);
    expect(plan.boards).toHaveLength(1);
    expect(plan.boards[0]?.cuts.map((c) => c.start)).toEqual([0.2, 0.6]);
  });

  it('reports a part longer than every stock, and still plans the rest', () => {
    const req = {
      kerf: 0.125,
      endTrim: 1,
      parts: [
        { id: 'beam', length: 119, quantity: 2 },
        { id: 'rail', length: 30, quantity: 2 },
      ],
      stock: [{ id: '10ft', length: 120, price: 10 }],
    };
    const plan = planLinearCuts(req);
    expectValidPlan(req, plan);
    expect(plan.unplaced).toEqual([{ partId: 'beam', quantity: 2, reason: expect.stringContaining('118 in') }]);
    expect(plan.purchase).toEqual([{ stockId: '10ft', count: 1, cost: 10 }]);
  });

  it('respects available counts and reports what it could not cut', () => {
    const req = {
      kerf: 0.125,
      parts: [{ id: 'slat', length: 40, quantity: 7 }],
      stock: [
        { id: 'cheap', length: 96, price: 4, available: 1 },
        { id: 'dear', length: 96, price: 9, available: 2 },
      ],
    };
    const plan = planLinearCuts(req);
    expectValidPlan(req, plan);
    expect(plan.purchase).toEqual([
      { stockId: 'cheap', count: 1, cost: 4 },
      { stockId: 'dear', count: 2, cost: 18 },
    ]);
    expect(plan.unplaced).toEqual([{ partId: 'slat', quantity: 1, reason: expect.stringContaining('Not enough stock') }]);
    expect(plan.optimal).toBe(false);
  });

  it('mixes stock lengths when that is cheaper', () => {
    // Seven 44 in pieces: an 8 ft board takes two (88.125 in), a 12 ft board three (132.25 in).
    const req = {
      kerf: 0.125,
      parts: [{ id: 'p', length: 44, quantity: 7 }],
      stock: [
        { id: '8ft', length: 96, price: 6 },
        { id: '12ft', length: 144, price: 10 },
      ],
      timeLimitMs: PROOF_LIMIT_MS,
    };
    const plan = planLinearCuts(req);
    expectValidPlan(req, plan);
    // 7 = 3 + 2 + 2 costs 22; 3 + 3 + 1 would cost 26; four 8 ft cost 24.
    expect(plan.totalCost).toBe(22);
    expect(plan.optimal).toBe(true);
  });

  it('plans nothing for no parts', () => {
    const plan = planLinearCuts({ kerf: 0.125, parts: [], stock: [{ id: 's', length: 96, price: 5 }] });
    expect(plan).toEqual({ boards: [], purchase: [], totalCost: 0, lowerBound: 0, optimal: true, unplaced: [] });
  });

  it('refuses a request that is not a cut list', () => {
    const stock = [{ id: 's', length: 96, price: 5 }];
    expect(() => planLinearCuts({ kerf: -1, parts: [], stock })).toThrow(RangeError);
    expect(() => planLinearCuts({ kerf: 0, parts: [{ id: 'a', length: 0, quantity: 1 }], stock })).toThrow(RangeError);
    expect(() => planLinearCuts({ kerf: 0, parts: [{ id: 'a', length: 3, quantity: 1.5 }], stock })).toThrow(RangeError);
    expect(() =>
      planLinearCuts({ kerf: 0, parts: [{ id: 'a', length: 3, quantity: 1 }, { id: 'a', length: 4, quantity: 1 }], stock }),
    ).toThrow(RangeError);
    expect(() => planLinearCuts({ kerf: 0, parts: [], stock: [{ id: 's', length: 96, price: -1 }] })).toThrow(RangeError);
  });
});

describe('martelloTothL2', () => {
  it('counts items above half the capacity one per bin', () => {
    expect(martelloTothL2([6, 6, 6], 10)).toBe(3);
    expect(martelloTothL2([8, 8, 3, 3], 10)).toBe(3);
    expect(martelloTothL2([5, 5, 5, 5], 10)).toBe(2);
    expect(martelloTothL2([], 10)).toBe(0);
  });
});

describe('planLinearCuts: properties', () => {
  it('always returns a valid plan, never worse than first-fit decreasing', () => {
    fc.assert(
      fc.property(requestArb(5, 8, 3), (req) => {
        const plan = planLinearCuts(req);
        expectValidPlan(req, plan);
        const ffd = firstFitDecreasing(req);
        expectValidPlan(req, ffd);
        expect(unplacedCount(plan)).toBeLessThanOrEqual(unplacedCount(ffd));
        if (unplacedCount(plan) === unplacedCount(ffd)) expect(plan.totalCost).toBeLessThanOrEqual(ffd.totalCost + EPS);
      }),
      { numRuns: 150 },
    );
  }, 120_000);

  it('stays valid and no worse than first-fit decreasing past the exact-search size', () => {
    fc.assert(
      fc.property(
        requestArb(8, 12, 3).map((r) => ({ ...r, timeLimitMs: 30 })),
        (req) => {
          const plan = planLinearCuts(req);
          expectValidPlan(req, plan);
          const ffd = firstFitDecreasing(req);
          expect(unplacedCount(plan)).toBeLessThanOrEqual(unplacedCount(ffd));
          if (unplacedCount(plan) === unplacedCount(ffd)) expect(plan.totalCost).toBeLessThanOrEqual(ffd.totalCost + EPS);
        },
      ),
      { numRuns: 40 },
    );
  }, 120_000);

  it('on small cases never claims optimal when brute force finds a cheaper plan, and its bound holds', () => {
    // The deadline is only a safety net here: the search proves cases this small in milliseconds, so a
    // loaded machine must not decide whether `optimal` holds (a 100 ms limit once failed under load 12).
    const small = requestArb(3, 3, 2)
      .filter((r) => r.parts.reduce((a, p) => a + p.quantity, 0) <= 7)
      .map((r) => ({ ...r, timeLimitMs: PROOF_LIMIT_MS }));
    fc.assert(
      fc.property(small, (req) => {
        const plan = planLinearCuts(req);
        expectValidPlan(req, plan);
        const best = bruteForceCost(req);
        if (best === null) return;
        if (unplacedCount(plan) === 0) {
          expect(plan.lowerBound).toBeLessThanOrEqual(best + EPS);
          if (plan.totalCost > best + EPS) expect(plan.optimal).toBe(false);
          // The exact search always finishes on cases this small.
          expect(plan.optimal).toBe(true);
          expect(plan.totalCost).toBeCloseTo(best, 6);
        }
      }),
      { numRuns: 300 },
    );
  }, 120_000);
});

describe('planLinearCuts: time limit (issue 12)', () => {
  it('returns a complete plan of 160 pieces soon after timeLimitMs 0', () => {
    const req = manyPiecesRequest(0);
    expect(req.parts.reduce((a, p) => a + p.quantity, 0)).toBe(160);
    planLinearCuts(req); // warm-up: the first call also pays for compiling the planner
    const started = performance.now();
    const plan = planLinearCuts(req);
    const elapsed = performance.now() - started;
    expectValidPlan(req, plan);
    expect(plan.unplaced).toEqual([]);
    expect(plan.boards.reduce((a, b) => a + b.cuts.length, 0)).toBe(160);
    // Only tells a search that stops from the 3–6 s one before the fix; how close calls keep to their
    // limit (goal timeLimitMs + 50 ms) is measured by bench/cutlist/deadline.ts, not asserted here.
    expect(elapsed).toBeLessThan(2_000);
  });
});

describe('planLinearCuts: on-hand boards (issue 16)', () => {
  // On-hand stock reaches the planner as stock at price 0 with a count (`available`): offcuts kept
  // from earlier plans and boards added by hand, used before anything is bought.
  const onHandArb = fc.record({
    kerf: fc.constantFrom(0, 1 / 8),
    endTrim: fc.constantFrom(0, 0.5),
    parts: fc
      .array(fc.record({ length: sixteenths(4, 60), quantity: fc.integer({ min: 1, max: 3 }) }), { minLength: 1, maxLength: 3 })
      .map((ps) => ps.map((p, i) => ({ id: `p${i}`, ...p }))),
    onHand: fc.array(fc.record({ length: fc.integer({ min: 12, max: 96 }), available: fc.integer({ min: 1, max: 3 }) }), { minLength: 1, maxLength: 2 }),
    bought: fc.array(fc.record({ length: fc.integer({ min: 72, max: 144 }), price: fc.integer({ min: 100, max: 3000 }).map((c) => c / 100) }), { minLength: 1, maxLength: 2 }),
  });
  const small = onHandArb.filter((r) => r.parts.reduce((a, p) => a + p.quantity, 0) <= 6);

  it('uses boards on hand at no cost, proves the least cost, and never costs more than buying everything', () => {
    fc.assert(
      fc.property(small, ({ kerf, endTrim, parts, onHand, bought }) => {
        const buyOnly = bought.map((s, i) => ({ id: `buy${i}`, ...s }));
        const req: LinearCutRequest = {
          kerf,
          endTrim,
          parts,
          stock: [...onHand.map((s, i) => ({ id: `hand${i}`, length: s.length, price: 0, available: s.available })), ...buyOnly],
          timeLimitMs: PROOF_LIMIT_MS,
        };
        const plan = planLinearCuts(req);
        expectValidPlan(req, plan);
        const best = bruteForceCost(req);
        const bestBuying = bruteForceCost({ ...req, stock: buyOnly });
        if (best === null) return;
        if (bestBuying !== null) expect(best).toBeLessThanOrEqual(bestBuying + EPS);
        if (unplacedCount(plan) > 0) return;
        expect(plan.lowerBound).toBeLessThanOrEqual(best + EPS);
        if (plan.totalCost > best + EPS) expect(plan.optimal).toBe(false);
        expect(plan.optimal).toBe(true);
        expect(plan.totalCost).toBeCloseTo(best, 6);
        // What is paid for is only what is bought: on-hand boards never appear at a cost.
        for (const p of plan.purchase) if (p.stockId.startsWith('hand')) expect(p.cost).toBe(0);
        const paid = plan.purchase.filter((p) => p.stockId.startsWith('buy')).reduce((a, p) => a + p.cost, 0);
        expect(paid).toBeCloseTo(plan.totalCost, 6);
      }),
      { numRuns: 150 },
    );
  }, 120_000);
});
