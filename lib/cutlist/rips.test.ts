import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { planRipCuts, type RipCutPlan, type RipCutRequest } from './rips';

const EPS = 1e-6;
/**
 * Limit for every call that asserts a proof or the optimum: ends the search only if it hangs, never because
 * the machine is busy. Each such case is proven in milliseconds, so the limit costs no time.
 */
const PROOF_LIMIT_MS = 20_000;
const ripOf = (req: RipCutRequest): number => (req.ripKerf ?? req.kerf) + req.jointAllowance;

/** Checks a rip plan against its request, independently of the planner. */
function expectValidRipPlan(req: RipCutRequest, plan: RipCutPlan): void {
  const trim = req.endTrim ?? 0;
  const placed = new Map<string, number>();
  const boardsPerStock = new Map<string, number>();
  for (const board of plan.boards) {
    const stock = req.stock.find((s) => s.id === board.stockId);
    expect(stock).toBeDefined();
    if (!stock) continue;
    expect(board.length).toBe(stock.length);
    expect(board.width).toBe(stock.width);
    boardsPerStock.set(stock.id, (boardsPerStock.get(stock.id) ?? 0) + 1);
    expect(board.strips.length).toBeGreaterThan(0);
    // Strips side by side from the reference edge, a rip (kerf + jointing) apart, inside the board.
    let edge = 0;
    board.strips.forEach((strip, i) => {
      if (i > 0) expect(strip.offset).toBeCloseTo(edge + ripOf(req), 6);
      else expect(strip.offset).toBe(0);
      edge = strip.offset + strip.width;
      expect(edge).toBeLessThanOrEqual(stock.width + EPS);
      expect(strip.cuts.length).toBeGreaterThan(0);
      let sum = 0;
      const cuts = [...strip.cuts].sort((a, b) => a.start - b.start);
      cuts.forEach((cut, k) => {
        const part = req.parts.find((p) => p.id === cut.partId);
        // Grain along the length: a part keeps its length and width, never turned.
        expect(cut.length).toBe(part?.length);
        expect(cut.width).toBe(part?.width);
        expect(cut.width).toBeLessThanOrEqual(strip.width + EPS);
        placed.set(cut.partId, (placed.get(cut.partId) ?? 0) + 1);
        sum += cut.length;
        const prev = cuts[k - 1];
        if (prev) expect(cut.start).toBeCloseTo(prev.start + prev.length + req.kerf, 6);
        else expect(cut.start).toBeCloseTo(trim, 9);
      });
      expect(sum + req.kerf * (cuts.length - 1)).toBeLessThanOrEqual(stock.length - 2 * trim + EPS);
    });
    // The full-width offcut starts a kerf past the longest strip and ends at the far end trim.
    const longest = Math.max(...board.strips.map((st) => st.cuts.reduce((a, c) => a + c.length + req.kerf, 0)));
    expect(board.offcut).toBeCloseTo(Math.max(0, stock.length - 2 * trim - longest), 6);
  }
  for (const part of req.parts) {
    const missing = plan.unplaced.filter((u) => u.partId === part.id).reduce((a, u) => a + u.quantity, 0);
    expect((placed.get(part.id) ?? 0) + missing).toBe(part.quantity);
  }
  let total = 0;
  for (const p of plan.purchase) {
    const stock = req.stock.find((s) => s.id === p.stockId);
    expect(p.count).toBe(boardsPerStock.get(p.stockId));
    if (stock?.available !== undefined) expect(p.count).toBeLessThanOrEqual(stock.available);
    total += p.cost;
  }
  expect(plan.totalCost).toBeCloseTo(total, 6);
  expect(plan.lowerBound).toBeLessThanOrEqual(plan.totalCost + EPS);
}

/** All ways to split `items` into non-empty groups. */
function* partitions<T>(items: readonly T[]): Generator<T[][]> {
  const [first, ...rest] = items;
  if (first === undefined) {
    yield [];
    return;
  }
  for (const p of partitions(rest)) {
    for (let i = 0; i < p.length; i++) yield p.map((g, j) => (j === i ? [first, ...g] : g));
    yield [[first], ...p];
  }
}

/** Least cost by trying every grouping into boards, every stock, and every split of a board into strips. */
function bruteForceRipCost(req: RipCutRequest): number | null {
  const pieces = req.parts.flatMap((p) => Array.from({ length: p.quantity }, () => p));
  const trim = req.endTrim ?? 0;
  const fitsBoard = (group: typeof pieces, length: number, width: number): boolean => {
    for (const strips of partitions(group)) {
      const widths = strips.map((s) => Math.max(...s.map((p) => p.width)));
      const across = widths.reduce((a, b) => a + b, 0) + ripOf(req) * (strips.length - 1);
      if (across > width + EPS) continue;
      if (strips.every((s) => s.reduce((a, p) => a + p.length, 0) + req.kerf * (s.length - 1) <= length - 2 * trim + EPS)) return true;
    }
    return false;
  };
  let best: number | null = null;
  for (const groups of partitions(pieces)) {
    const assign = (g: number, used: number[], cost: number): void => {
      if (best !== null && cost >= best) return;
      if (g === groups.length) {
        best = cost;
        return;
      }
      req.stock.forEach((s, i) => {
        if ((used[i] ?? 0) >= (s.available ?? Infinity) || !fitsBoard(groups[g] ?? [], s.length, s.width)) return;
        used[i] = (used[i] ?? 0) + 1;
        assign(g + 1, used, cost + s.price);
        used[i] = (used[i] ?? 0) - 1;
      });
    };
    assign(0, [], 0);
  }
  return best;
}

describe('planRipCuts: common practice', () => {
  it('rips four 1 1/2 in legs side by side from one 5 in board instead of buying four boards', () => {
    const req: RipCutRequest = {
      kerf: 0.125,
      jointAllowance: 1 / 16,
      parts: [{ id: 'leg', length: 28, width: 1.5, quantity: 4 }],
      stock: [{ id: '5x96', length: 96, width: 5, price: 18 }],
      timeLimitMs: PROOF_LIMIT_MS,
    };
    const plan = planRipCuts(req);
    expectValidRipPlan(req, plan);
    expect(plan.boards).toHaveLength(1);
    expect(plan.optimal).toBe(true);
    // Two strips of 1 1/2 in, each crosscut into legs; three strips would fit too (4.875 in), two suffice.
    expect(plan.boards[0]?.strips.every((s) => s.width === 1.5)).toBe(true);
    expect(plan.boards[0]?.strips.reduce((a, s) => a + s.cuts.length, 0)).toBe(4);
  });

  it('leaves the length past the longest strip as a full-width offcut: one 30 in leg from a 96 in board', () => {
    const req: RipCutRequest = {
      kerf: 0.125,
      jointAllowance: 1 / 16,
      endTrim: 0.5,
      parts: [{ id: 'leg', length: 30, width: 1.5, quantity: 1 }],
      stock: [{ id: '5x96', length: 96, width: 5, price: 18 }],
    };
    const plan = planRipCuts(req);
    expectValidRipPlan(req, plan);
    // By hand: 96 less two 1/2 in end trims, the 30 in leg and its 1/8 in kerf.
    expect(plan.boards[0]?.offcut).toBeCloseTo(64.875, 9);
  });

  it('loses a rip kerf and a jointed edge per rip: three 1 5/8 in strips do not fit a 5 in board', () => {
    // 3 x 1 5/8 + 2 x (1/8 + 1/16) = 5.25 in > 5 in, so the third strip needs a second board.
    const req: RipCutRequest = {
      kerf: 0.125,
      jointAllowance: 1 / 16,
      parts: [{ id: 'rail', length: 90, width: 1.625, quantity: 3 }],
      stock: [{ id: '5x96', length: 96, width: 5, price: 18 }],
      timeLimitMs: PROOF_LIMIT_MS,
    };
    const plan = planRipCuts(req);
    expectValidRipPlan(req, plan);
    expect(plan.boards).toHaveLength(2);
    expect(plan.optimal).toBe(true);
  });

  it('reports a part wider than every board and still plans the rest', () => {
    const req: RipCutRequest = {
      kerf: 0.125,
      jointAllowance: 1 / 16,
      parts: [
        { id: 'top', length: 30, width: 12, quantity: 1 },
        { id: 'leg', length: 28, width: 1.5, quantity: 2 },
      ],
      stock: [{ id: '5x96', length: 96, width: 5, price: 18 }],
    };
    const plan = planRipCuts(req);
    expectValidRipPlan(req, plan);
    expect(plan.unplaced).toEqual([{ partId: 'top', quantity: 1, reason: 'Wider than every board on the rack.' }]);
    expect(plan.optimal).toBe(false);
  });

  it('picks the cheaper board width when the rack offers several', () => {
    const req: RipCutRequest = {
      kerf: 0.125,
      jointAllowance: 1 / 16,
      parts: [{ id: 'slat', length: 40, width: 2, quantity: 8 }],
      stock: [
        { id: '4x96', length: 96, width: 4.25, price: 12 },
        { id: '9x96', length: 96, width: 9.25, price: 20 },
      ],
      timeLimitMs: PROOF_LIMIT_MS,
    };
    const plan = planRipCuts(req);
    expectValidRipPlan(req, plan);
    // One 9 1/4 in board holds four strips of two slats ($20); 4 1/4 in boards hold two strips each ($24).
    expect(plan.totalCost).toBe(20);
    expect(plan.optimal).toBe(true);
  });
});

const ripRequest = (maxPieces: number) =>
  fc
    .record({
      kerf: fc.constantFrom(0, 0.125),
      jointAllowance: fc.constantFrom(0, 1 / 16),
      endTrim: fc.constantFrom(0, 0.5),
      parts: fc.array(
        fc.record({ length: fc.integer({ min: 4, max: 100 }), width: fc.constantFrom(0.75, 1.5, 2.5, 3.5, 5.5), quantity: fc.integer({ min: 0, max: 3 }) }),
        { minLength: 1, maxLength: 4 },
      ),
      stock: fc.array(
        fc.record({
          length: fc.constantFrom(48, 72, 96),
          width: fc.constantFrom(3.5, 5.5, 7.25),
          price: fc.integer({ min: 1, max: 40 }),
          available: fc.option(fc.integer({ min: 0, max: 3 }), { nil: undefined }),
        }),
        { minLength: 1, maxLength: 3 },
      ),
    })
    .map(({ parts, stock, ...rest }): RipCutRequest => {
      let left = maxPieces;
      return {
        ...rest,
        parts: parts.map((p, i) => {
          const quantity = Math.min(p.quantity, left);
          left -= quantity;
          return { id: `p${i}`, length: p.length, width: p.width, quantity };
        }),
        stock: stock.map((s, i) => ({ id: `s${i}`, ...s, ...(s.available === undefined ? {} : { available: s.available }) })),
        timeLimitMs: 300,
      };
    });

describe('planRipCuts: properties', () => {
  it('always returns a valid plan that places or reports every part, with a bound at or below its cost', () => {
    fc.assert(
      fc.property(ripRequest(14), (req) => {
        expectValidRipPlan(req, planRipCuts(req));
      }),
      { numRuns: 60 },
    );
  });

  it('on tiny cases never claims optimal when brute force finds a cheaper plan, and its bound holds', () => {
    fc.assert(
      fc.property(ripRequest(5), (req) => {
        const plan = planRipCuts(req);
        expectValidRipPlan(req, plan);
        const best = bruteForceRipCost(req);
        if (best === null) return;
        if (plan.unplaced.length === 0) {
          expect(plan.totalCost).toBeGreaterThanOrEqual(best - EPS);
          if (plan.optimal) expect(plan.totalCost).toBeCloseTo(best, 6);
          expect(plan.lowerBound).toBeLessThanOrEqual(best + EPS);
        }
      }),
      { numRuns: 80 },
    );
  });
});

/**
 * Issue 16: a hardwood rack where every width x length is a board type priced by the board foot.
 * Source: USDA FPL Wood Handbook, 1 board foot = 144 in³; price = thickness x width x length / 144 x price per board foot.
 */
const boardFootRequest = (maxPieces: number) =>
  fc
    .record({
      kerf: fc.constantFrom(0, 0.125),
      jointAllowance: fc.constantFrom(0, 1 / 16),
      endTrim: fc.constantFrom(0, 0.5),
      quarters: fc.constantFrom(4, 5, 8),
      centsPerBoardFoot: fc.integer({ min: 400, max: 1400 }),
      widths: fc.uniqueArray(fc.constantFrom(3.5, 4, 5.5, 7.25, 9.25), { minLength: 2, maxLength: 3 }),
      lengths: fc.uniqueArray(fc.constantFrom(48, 72, 96, 120), { minLength: 1, maxLength: 2 }),
      parts: fc.array(
        fc.record({ length: fc.integer({ min: 6, max: 110 }), width: fc.constantFrom(1.5, 2, 2.5, 3.5, 5, 6.5), quantity: fc.integer({ min: 0, max: 3 }) }),
        { minLength: 1, maxLength: 4 },
      ),
    })
    .map(({ quarters, centsPerBoardFoot, widths, lengths, parts, ...rest }): RipCutRequest => {
      let left = maxPieces;
      return {
        ...rest,
        parts: parts.map((p, i) => {
          const quantity = Math.min(p.quantity, left);
          left -= quantity;
          return { id: `p${i}`, length: p.length, width: p.width, quantity };
        }),
        stock: widths.flatMap((width) =>
          lengths.map((length) => ({ id: `${width}x${length}`, length, width, price: Math.round(((quarters / 4) * width * length * centsPerBoardFoot) / 144) / 100 })),
        ),
        timeLimitMs: 300,
      };
    });

describe('planRipCuts: hardwood of several widths priced by the board foot (issue 16)', () => {
  it('places every piece on a board at least as wide as its strip, grain along the length, bound at or below cost', () => {
    fc.assert(
      fc.property(boardFootRequest(14), (req) => {
        const plan = planRipCuts(req);
        expectValidRipPlan(req, plan);
        for (const board of plan.boards) {
          for (const strip of board.strips) expect(strip.offset + strip.width).toBeLessThanOrEqual(board.width + EPS);
        }
      }),
      { numRuns: 60 },
    );
  });

  it('never claims optimal when brute force over every width and length finds cheaper', () => {
    fc.assert(
      fc.property(boardFootRequest(5), (req) => {
        const plan = planRipCuts(req);
        expectValidRipPlan(req, plan);
        const best = bruteForceRipCost(req);
        if (best === null || plan.unplaced.length > 0) return;
        expect(plan.totalCost).toBeGreaterThanOrEqual(best - EPS);
        if (plan.optimal) expect(plan.totalCost).toBeCloseTo(best, 6);
        expect(plan.lowerBound).toBeLessThanOrEqual(best + EPS);
      }),
      { numRuns: 80 },
    );
  });

  it('chooses a wider board when it is cheaper per part: one 7 1/4" board for six 2" slats, not three 4" boards', () => {
    // At $10.00 a board foot, 4/4: 4" x 96" = 2.667 bd ft = $26.67, one 2" strip (two strips need 4.1875"), two slats;
    // 7 1/4" x 96" = 4.833 bd ft = $48.33, three strips (6.375"), six slats. Three narrow boards would be $80.01.
    const req: RipCutRequest = {
      kerf: 0.125,
      jointAllowance: 1 / 16,
      parts: [{ id: 'slat', length: 40, width: 2, quantity: 6 }],
      stock: [
        { id: '4x96', length: 96, width: 4, price: 26.67 },
        { id: '7.25x96', length: 96, width: 7.25, price: 48.33 },
      ],
      timeLimitMs: PROOF_LIMIT_MS,
    };
    const plan = planRipCuts(req);
    expectValidRipPlan(req, plan);
    expect(plan.purchase).toEqual([{ stockId: '7.25x96', count: 1, cost: 48.33 }]);
    expect(plan.optimal).toBe(true);
  });

  it('mixes widths and lengths when that is least cost: a 5" panel piece and narrow rails', () => {
    // $10.00 a board foot, 4/4. Boards: 4" x 48" $13.33, 4" x 96" $26.67, 5 1/2" x 48" $18.33, 5 1/2" x 96" $36.67.
    // A 5" x 40" panel needs a 5 1/2" board (48" is enough: $18.33). Three 3" x 30" rails: one 3" strip of a
    // 4" x 96" board ($26.67) holds all three (3 x 30 1/8" <= 96 1/8"); a 4" x 48" holds one (three: $39.99).
    // Panel and rails side by side need 5 + 3 + 3/16 > 5 1/2"; a 5 1/2" x 96" holds the panel and one rail
    // in one strip ($36.67) but leaves two rails ($26.66 more). Least cost: $18.33 + $26.67 = $45.00.
    const req: RipCutRequest = {
      kerf: 0.125,
      jointAllowance: 1 / 16,
      parts: [
        { id: 'panel', length: 40, width: 5, quantity: 1 },
        { id: 'rail', length: 30, width: 3, quantity: 3 },
      ],
      stock: [
        { id: '4x48', length: 48, width: 4, price: 13.33 },
        { id: '4x96', length: 96, width: 4, price: 26.67 },
        { id: '5.5x48', length: 48, width: 5.5, price: 18.33 },
        { id: '5.5x96', length: 96, width: 5.5, price: 36.67 },
      ],
      timeLimitMs: PROOF_LIMIT_MS,
    };
    const plan = planRipCuts(req);
    expectValidRipPlan(req, plan);
    expect(plan.totalCost).toBeCloseTo(45, 6);
    expect(plan.purchase.map((p) => p.stockId).sort()).toEqual(['4x96', '5.5x48']);
    expect(plan.optimal).toBe(true);
    expect(bruteForceRipCost(req)).toBeCloseTo(45, 6);
  });

  it('puts a narrow strip beside a wide part on a wider board rather than buying a third board', () => {
    // 4/4 at $9.50 a board foot (USDA FPL Wood Handbook, 144 in³): 4" x 72" $19.00, 5 1/2" x 72" $26.13,
    // 7 1/4" x 72" $34.44. The 5 1/2" and 4 1/4" parts cannot share a board (5 1/2 + 3/16 + 4 1/4 > 7 1/4)
    // nor a strip (59 1/4 + 64 1/4 > 72 1/8). On two 5 1/2" boards only one short part fits (beside the
    // 59 1/8" part), so two more need a third board ($71.26). A 7 1/4" board takes the 4 1/4" part and a
    // 2 3/8" strip of the other two beside it (4 1/4 + 3/16 + 2 3/8 = 6 13/16 <= 7 1/4): $26.13 + $34.44 = $60.57.
    // 72" boards only: with 96" ones on the rack too the planner found this plan at once but its bound stayed
    // below it, so the call ran to its limit and its answer hung on how busy the machine was; here the plan
    // is proven in milliseconds.
    const price = (w: number, l: number) => Math.round(((w * l) / 144) * 950) / 100;
    const req: RipCutRequest = {
      kerf: 0.125,
      jointAllowance: 1 / 16,
      parts: [
        { id: 'side', length: 59.125, width: 5.5, quantity: 1 },
        { id: 'short', length: 9.25, width: 2.375, quantity: 3 },
        { id: 'rail', length: 64.125, width: 4.25, quantity: 1 },
      ],
      stock: [4, 5.5, 7.25].map((w) => ({ id: `${w}x72`, length: 72, width: w, price: price(w, 72) })),
      timeLimitMs: PROOF_LIMIT_MS,
    };
    const plan = planRipCuts(req);
    expectValidRipPlan(req, plan);
    expect(bruteForceRipCost(req)).toBeCloseTo(60.57, 6);
    expect(plan.totalCost).toBeCloseTo(60.57, 6);
    expect(plan.purchase.map((p) => p.stockId).sort()).toEqual(['5.5x72', '7.25x72']);
    expect(plan.optimal).toBe(true);
  });
});

describe('planRipCuts: an exhausted time limit still gives a whole plan', () => {
  it('places every piece at timeLimitMs 0 (the first greedy start once opened no board at all, so a loaded machine got an empty plan)', () => {
    const req: RipCutRequest = {
      kerf: 0.125,
      jointAllowance: 0.0625,
      endTrim: 0.5,
      parts: [
        { id: 'slat', length: 30, width: 1.5, quantity: 6 },
        { id: 'rail', length: 20, width: 2.5, quantity: 3 },
      ],
      stock: [
        { id: '96', length: 96, width: 5.5, price: 10 },
        { id: '120', length: 120, width: 5.5, price: 13 },
      ],
      timeLimitMs: 0,
    };
    const plan = planRipCuts(req);
    expect(plan.unplaced).toEqual([]);
    expect(plan.boards.reduce((a, b) => a + b.strips.reduce((s, st) => s + st.cuts.length, 0), 0)).toBe(9);
    expect(plan.lowerBound).toBeLessThanOrEqual(plan.totalCost);
  });
});
