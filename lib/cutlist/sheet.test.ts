import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { isGuillotine, planSheetCuts, type SheetCutPlan, type SheetCutRequest } from '.';

const EPS = 1e-6;
/**
 * Limit for every call that asserts a proof, the optimum or a layout only the search finds: ends the search
 * only if it hangs, never because the machine is busy. Each such case is settled in milliseconds.
 */
const PROOF_LIMIT_MS = 20_000;

/** Checks a plan against its request independently of the planner's internals. */
function expectValidPlan(req: SheetCutRequest, plan: SheetCutPlan): void {
  const placed = new Map<string, number>();
  const sheetsPerStock = new Map<string, number>();
  for (const sheet of plan.sheets) {
    const stock = req.stock.find((s) => s.id === sheet.stockId);
    expect(stock).toBeDefined();
    if (!stock) continue;
    expect([sheet.width, sheet.length]).toEqual([stock.width, stock.length]);
    sheetsPerStock.set(stock.id, (sheetsPerStock.get(stock.id) ?? 0) + 1);
    expect(sheet.placements.length).toBeGreaterThan(0);
    let partArea = 0;
    sheet.placements.forEach((pl, k) => {
      const part = req.parts.find((p) => p.id === pl.partId);
      expect(part).toBeDefined();
      if (!part) return;
      placed.set(part.id, (placed.get(part.id) ?? 0) + 1);
      partArea += part.width * part.length;
      if (part.grain === 'length') expect(pl.rotated).toBe(false);
      expect([pl.width, pl.length]).toEqual(pl.rotated ? [part.length, part.width] : [part.width, part.length]);
      expect(pl.x).toBeGreaterThanOrEqual(-EPS);
      expect(pl.y).toBeGreaterThanOrEqual(-EPS);
      expect(pl.x + pl.width).toBeLessThanOrEqual(sheet.width + EPS);
      expect(pl.y + pl.length).toBeLessThanOrEqual(sheet.length + EPS);
      // No overlap, and at least a kerf between any two parts: one lies a kerf beyond the other on some axis.
      for (const other of sheet.placements.slice(k + 1)) {
        const apart =
          pl.x + pl.width + req.kerf <= other.x + EPS ||
          other.x + other.width + req.kerf <= pl.x + EPS ||
          pl.y + pl.length + req.kerf <= other.y + EPS ||
          other.y + other.length + req.kerf <= pl.y + EPS;
        expect(apart).toBe(true);
      }
    });
    expect(isGuillotine(sheet, req.kerf)).toBe(true);
    expect(sheet.waste).toBeCloseTo(stock.width * stock.length - partArea, 6);
  }
  for (const part of req.parts) {
    const unplaced = plan.unplaced.filter((u) => u.partId === part.id);
    expect(unplaced.length).toBeLessThanOrEqual(1);
    for (const u of unplaced) {
      expect(u.quantity).toBeGreaterThan(0);
      expect(u.reason.length).toBeGreaterThan(0);
    }
    const missing = unplaced.reduce((a, u) => a + u.quantity, 0);
    expect((placed.get(part.id) ?? 0) + missing).toBe(part.quantity);
  }
  let total = 0;
  for (const p of plan.purchase) {
    const stock = req.stock.find((s) => s.id === p.stockId);
    expect(p.count).toBe(sheetsPerStock.get(p.stockId));
    if (stock?.available !== undefined) expect(p.count).toBeLessThanOrEqual(stock.available);
    expect(p.cost).toBeCloseTo(p.count * (stock?.price ?? Number.NaN), 6);
    total += p.cost;
  }
  expect(plan.purchase.reduce((a, p) => a + p.count, 0)).toBe(plan.sheets.length);
  expect(plan.totalCost).toBeCloseTo(total, 6);
  expect(plan.lowerBound).toBeLessThanOrEqual(plan.totalCost + EPS);
  if (plan.optimal) expect(plan.lowerBound).toBeCloseTo(plan.totalCost, 6);
}

const unplacedCount = (plan: SheetCutPlan): number => plan.unplaced.reduce((a, u) => a + u.quantity, 0);

interface Item {
  w: number;
  l: number;
  rotatable: boolean;
}

/**
 * Whether `items` (sizes grown by a kerf, whole units) have a guillotine packing in a w x h region
 * (also grown). Tries every first cut: every split of the items into two sides, at every position a
 * compacted left (or lower) side can end at, which is a sum of one side of each of some of its items.
 */
function guillotineFits(items: readonly Item[], w: number, h: number, memo = new Map<string, boolean>()): boolean {
  const key = `${items.map((i) => `${i.w},${i.l},${i.rotatable}`).join(';')}|${w}|${h}`;
  const known = memo.get(key);
  if (known !== undefined) return known;
  let result = false;
  const first = items[0];
  if (items.reduce((a, i) => a + i.w * i.l, 0) > w * h) result = false;
  else if (items.length === 1 && first) result = (first.w <= w && first.l <= h) || (first.rotatable && first.l <= w && first.w <= h);
  else {
    const n = items.length;
    for (let mask = 1; mask < 1 << n && !result; mask += 2) {
      if (mask === (1 << n) - 1) continue;
      const left = items.filter((_, k) => (mask & (1 << k)) !== 0);
      const right = items.filter((_, k) => (mask & (1 << k)) === 0);
      for (const vertical of [true, false]) {
        let ends = new Set<number>([0]);
        for (const i of left) {
          const next = new Set<number>();
          for (const e of ends) {
            next.add(e);
            next.add(e + (vertical ? i.w : i.l));
            if (i.rotatable) next.add(e + (vertical ? i.l : i.w));
          }
          ends = next;
        }
        for (const a of ends) {
          if (a === 0 || a >= (vertical ? w : h)) continue;
          const ok = vertical
            ? guillotineFits(left, a, h, memo) && guillotineFits(right, w - a, h, memo)
            : guillotineFits(left, w, a, memo) && guillotineFits(right, w, h - a, memo);
          if (ok) {
            result = true;
            break;
          }
        }
        if (result) break;
      }
    }
  }
  memo.set(key, result);
  return result;
}

/** Least cost to cut every part, by trying every grouping and every stock for each group; null if impossible. */
function bruteForceCost(req: SheetCutRequest): number | null {
  // Sizes in the tests are whole sixteenths, so these are exact integers.
  const u = (x: number): number => Math.round(x * 16);
  const k = u(req.kerf);
  const items: Item[] = req.parts.flatMap((p) =>
    Array.from({ length: p.quantity }, () => ({ w: u(p.width) + k, l: u(p.length) + k, rotatable: p.grain !== 'length' })),
  );
  const memo = new Map<string, boolean>();
  const fits = (group: Item[], s: (typeof req.stock)[number]): boolean => guillotineFits(group, u(s.width) + k, u(s.length) + k, memo);
  let best: number | null = null;
  const groups: Item[][] = [];
  const assign = (g: number, used: number[], cost: number): void => {
    if (best !== null && cost >= best) return;
    if (g === groups.length) {
      best = cost;
      return;
    }
    const group = groups[g] ?? [];
    req.stock.forEach((s, i) => {
      if ((used[i] ?? 0) >= (s.available ?? Infinity) || !fits(group, s)) return;
      used[i] = (used[i] ?? 0) + 1;
      assign(g + 1, used, cost + s.price);
      used[i] = (used[i] ?? 0) - 1;
    });
  };
  const partition = (i: number): void => {
    if (i === items.length) {
      assign(
        0,
        req.stock.map(() => 0),
        0,
      );
      return;
    }
    const item = items[i];
    if (!item) return;
    for (const g of groups) {
      g.push(item);
      partition(i + 1);
      g.pop();
    }
    groups.push([item]);
    partition(i + 1);
    groups.pop();
  };
  partition(0);
  return best;
}

// Sizes in 1/16 in so sums are exact in binary floating point; prices in cents.
const sixteenths = (min: number, max: number) => fc.integer({ min: min * 16, max: max * 16 }).map((n) => n / 16);
const requestArb = (maxParts: number, maxQty: number, maxStock: number, timeLimitMs: number): fc.Arbitrary<SheetCutRequest> =>
  fc.record({
    kerf: fc.constantFrom(0, 1 / 16, 1 / 8),
    parts: fc
      .array(
        fc.record({
          width: sixteenths(1, 40),
          length: sixteenths(1, 60),
          quantity: fc.integer({ min: 1, max: maxQty }),
          grain: fc.constantFrom<('length' | 'any' | undefined)[]>('length', 'any', undefined),
        }),
        { minLength: 1, maxLength: maxParts },
      )
      .map((ps) => ps.map((p, i) => ({ id: `p${i}`, ...p }))),
    stock: fc
      .array(
        fc.record({
          width: fc.integer({ min: 12, max: 48 }),
          length: fc.integer({ min: 24, max: 96 }),
          price: fc.integer({ min: 0, max: 8000 }).map((c) => c / 100),
          available: fc.option(fc.integer({ min: 0, max: 4 }), { nil: undefined }),
        }),
        { minLength: 1, maxLength: maxStock },
      )
      .map((ss) => ss.map((s, i) => ({ id: `s${i}`, ...s }))),
    timeLimitMs: fc.constant(timeLimitMs),
  });

const plywood = { id: 'ply', width: 48, length: 96, price: 52 };

describe('planSheetCuts: common practice', () => {
  it('cuts four 24 x 48 in pieces from one 4 x 8 ft sheet with no kerf', () => {
    // Common practice, no published source.
    const req = { kerf: 0, parts: [{ id: 'door', width: 24, length: 48, quantity: 4 }], stock: [plywood], timeLimitMs: PROOF_LIMIT_MS };
    const plan = planSheetCuts(req);
    expectValidPlan(req, plan);
    expect(plan.purchase).toEqual([{ stockId: 'ply', count: 1, cost: 52 }]);
    expect(plan.sheets[0]?.waste).toBe(0);
    expect(plan.optimal).toBe(true);
  });

  it('needs a second sheet for four 24 x 48 in pieces with a 1/8 in kerf', () => {
    // Common practice, no published source. Two 24 in widths side by side need 48 1/8 in; any other
    // arrangement fails too, since four pieces grown by a kerf (24 1/8 x 48 1/8 in) cover 4644.06 sq in
    // and the sheet grown by a kerf (48 1/8 x 96 1/8 in) only 4626.02.
    const req = { kerf: 1 / 8, parts: [{ id: 'door', width: 24, length: 48, quantity: 4 }], stock: [plywood], timeLimitMs: PROOF_LIMIT_MS };
    const plan = planSheetCuts(req);
    expectValidPlan(req, plan);
    expect(plan.purchase).toEqual([{ stockId: 'ply', count: 2, cost: 104 }]);
    expect(plan.lowerBound).toBe(104);
    expect(plan.optimal).toBe(true);
  });

  it('cuts two halves of a sheet that are exactly a kerf short of it together', () => {
    // Common practice, no published source: one crosscut splits a sheet into two halves less half a kerf.
    const half = (96 - 1 / 8) / 2;
    const req = { kerf: 1 / 8, parts: [{ id: 'half', width: 48, length: half, quantity: 2 }], stock: [plywood], timeLimitMs: PROOF_LIMIT_MS };
    const plan = planSheetCuts(req);
    expectValidPlan(req, plan);
    expect(plan.sheets).toHaveLength(1);
    expect(plan.sheets[0]?.waste).toBeCloseTo(48 * (1 / 8), 9);
  });

  it('cuts four quarters of a sheet exactly a kerf apart both ways', () => {
    // Common practice, no published source.
    const req = { kerf: 1 / 8, parts: [{ id: 'q', width: 23.9375, length: 47.9375, quantity: 4 }], stock: [plywood], timeLimitMs: PROOF_LIMIT_MS };
    const plan = planSheetCuts(req);
    expectValidPlan(req, plan);
    expect(plan.sheets).toHaveLength(1);
    expect(plan.sheets[0]?.placements.map((p) => [p.x, p.y]).sort()).toEqual([
      [0, 0],
      [0, 48.0625],
      [24.0625, 0],
      [24.0625, 48.0625],
    ]);
  });

  it('reports a part larger than every sheet, and still plans the rest', () => {
    // Common practice, no published source.
    const req = {
      kerf: 1 / 8,
      parts: [
        { id: 'top', width: 50, length: 100, quantity: 1 },
        { id: 'shelf', width: 11.25, length: 34.5, quantity: 3 },
      ],
      stock: [plywood],
    };
    const plan = planSheetCuts(req);
    expectValidPlan(req, plan);
    expect(plan.unplaced).toEqual([{ partId: 'top', quantity: 1, reason: expect.stringContaining('larger than every stock sheet') }]);
    expect(plan.purchase).toEqual([{ stockId: 'ply', count: 1, cost: 52 }]);
  });

  it('does not turn a part whose grain must run along the sheet length', () => {
    // Common practice, no published source: 90 in across the grain is wider than a 48 in sheet, so
    // only turned (90 in along the 96 in length) could it be cut, and the grain forbids that.
    const locked = { kerf: 1 / 8, parts: [{ id: 'panel', width: 90, length: 40, quantity: 1, grain: 'length' as const }], stock: [plywood] };
    const plan = planSheetCuts(locked);
    expectValidPlan(locked, plan);
    expect(plan.sheets).toHaveLength(0);
    expect(plan.unplaced).toEqual([{ partId: 'panel', quantity: 1, reason: expect.stringContaining('grain') }]);

    const free = { ...locked, parts: [{ id: 'panel', width: 90, length: 40, quantity: 1 }] };
    const turned = planSheetCuts(free);
    expectValidPlan(free, turned);
    expect(turned.sheets[0]?.placements).toEqual([{ partId: 'panel', x: 0, y: 0, width: 40, length: 90, rotated: true }]);
  });

  it('needs more sheets when the grain stops the parts turning', () => {
    // Common practice, no published source. Along the grain, 30 in wide parts go one across a 48 in
    // sheet and four 20 in lengths down it (80.5 in with kerfs); turned, two go across (40 1/8 in) and
    // three down (90 1/4 in), so six come from one sheet.
    const part = { id: 'side', width: 30, length: 20, quantity: 6 };
    const locked = { kerf: 1 / 8, parts: [{ ...part, grain: 'length' as const }], stock: [plywood], timeLimitMs: PROOF_LIMIT_MS };
    const free = { kerf: 1 / 8, parts: [part], stock: [plywood], timeLimitMs: PROOF_LIMIT_MS };
    const lockedPlan = planSheetCuts(locked);
    const freePlan = planSheetCuts(free);
    expectValidPlan(locked, lockedPlan);
    expectValidPlan(free, freePlan);
    expect(lockedPlan.sheets).toHaveLength(2);
    expect(lockedPlan.optimal).toBe(true);
    expect(freePlan.sheets).toHaveLength(1);
  });
});

describe('planSheetCuts: worked cases', () => {
  it('respects available counts and reports what it could not cut', () => {
    // One 40 x 90 in panel per 4 x 8 ft sheet: two side by side would need 80 1/8 in across.
    const req = {
      kerf: 1 / 8,
      parts: [{ id: 'panel', width: 40, length: 90, quantity: 3 }],
      stock: [{ ...plywood, available: 2 }],
      timeLimitMs: 100,
    };
    const plan = planSheetCuts(req);
    expectValidPlan(req, plan);
    expect(plan.purchase).toEqual([{ stockId: 'ply', count: 2, cost: 104 }]);
    expect(plan.unplaced).toEqual([{ partId: 'panel', quantity: 1, reason: expect.stringContaining('Not enough stock') }]);
    expect(plan.optimal).toBe(false);
  });

  it('mixes full and half sheets when that is cheaper', () => {
    // A full sheet holds four 24 x 48 in pieces with no kerf, a half sheet two: five cost least as one of each.
    const req = {
      kerf: 0,
      parts: [{ id: 'p', width: 24, length: 48, quantity: 5 }],
      stock: [
        { id: 'full', width: 48, length: 96, price: 60 },
        { id: 'half', width: 48, length: 48, price: 35 },
      ],
      timeLimitMs: PROOF_LIMIT_MS,
    };
    const plan = planSheetCuts(req);
    expectValidPlan(req, plan);
    expect(plan.totalCost).toBe(95);
    expect(plan.purchase.map((p) => p.stockId)).toEqual(['full', 'half']);
    expect(plan.optimal).toBe(true);
  });

  it('plans nothing for no parts', () => {
    const plan = planSheetCuts({ kerf: 0.125, parts: [], stock: [plywood] });
    expect(plan).toEqual({ sheets: [], purchase: [], totalCost: 0, lowerBound: 0, optimal: true, unplaced: [] });
  });

  it('refuses a request that is not a cut list', () => {
    const stock = [plywood];
    const part = { id: 'a', width: 3, length: 4, quantity: 1 };
    expect(() => planSheetCuts({ kerf: -1, parts: [], stock })).toThrow(RangeError);
    expect(() => planSheetCuts({ kerf: 0, parts: [{ ...part, width: 0 }], stock })).toThrow(RangeError);
    expect(() => planSheetCuts({ kerf: 0, parts: [{ ...part, quantity: 1.5 }], stock })).toThrow(RangeError);
    expect(() => planSheetCuts({ kerf: 0, parts: [part, part], stock })).toThrow(RangeError);
    expect(() => planSheetCuts({ kerf: 0, parts: [], stock: [{ ...plywood, price: -1 }] })).toThrow(RangeError);
    expect(() => planSheetCuts({ kerf: 0, parts: [], stock: [{ ...plywood, length: Number.NaN }] })).toThrow(RangeError);
  });
});

describe('isGuillotine', () => {
  const at = (x: number, y: number, width: number, length: number) => ({ partId: 'p', x, y, width, length, rotated: false });

  it('accepts parts split by edge-to-edge cuts a kerf wide', () => {
    const sheet = { width: 10, length: 10, placements: [at(0, 0, 4, 10), at(4.5, 0, 5.5, 3), at(4.5, 3.5, 5.5, 6.5)] };
    expect(isGuillotine(sheet, 0.5)).toBe(true);
    expect(isGuillotine(sheet, 0.6)).toBe(false);
  });

  it('refuses a pinwheel, which no straight cut divides', () => {
    const pinwheel = [at(0, 0, 2, 1), at(2, 0, 1, 2), at(1, 2, 2, 1), at(0, 1, 1, 2), at(1, 1, 1, 1)];
    expect(isGuillotine({ width: 3, length: 3, placements: pinwheel }, 0)).toBe(false);
  });

  it('refuses overlapping parts and parts off the sheet', () => {
    expect(isGuillotine({ width: 10, length: 10, placements: [at(0, 0, 5, 5), at(4, 4, 5, 5)] }, 0)).toBe(false);
    expect(isGuillotine({ width: 10, length: 10, placements: [at(6, 0, 5, 5)] }, 0)).toBe(false);
  });
});

describe('guillotineFits (test oracle)', () => {
  it('agrees with hand-checked cases', () => {
    expect(guillotineFits([{ w: 2, l: 1, rotatable: false }, { w: 2, l: 1, rotatable: false }], 2, 2)).toBe(true);
    expect(guillotineFits([{ w: 2, l: 1, rotatable: false }, { w: 2, l: 1, rotatable: false }], 3, 1)).toBe(false);
    expect(guillotineFits([{ w: 2, l: 1, rotatable: true }, { w: 1, l: 2, rotatable: true }], 4, 1)).toBe(true);
    // The pinwheel fills a 3 x 3 square, but not by guillotine cuts.
    const pinwheel = [
      { w: 2, l: 1, rotatable: false },
      { w: 1, l: 2, rotatable: false },
      { w: 2, l: 1, rotatable: false },
      { w: 1, l: 2, rotatable: false },
      { w: 1, l: 1, rotatable: false },
    ];
    expect(guillotineFits(pinwheel, 3, 3)).toBe(false);
  });
});

describe('planSheetCuts: properties', () => {
  it('always returns a valid guillotine plan that places or reports every part', () => {
    fc.assert(
      fc.property(requestArb(6, 4, 3, 15), (req) => {
        expectValidPlan(req, planSheetCuts(req));
      }),
      { numRuns: 120 },
    );
  }, 60_000);

  it('stays valid on larger cut lists', () => {
    fc.assert(
      fc.property(requestArb(14, 6, 3, 25), (req) => {
        expectValidPlan(req, planSheetCuts(req));
      }),
      { numRuns: 25 },
    );
  }, 60_000);

  it('on tiny cases never claims optimal when brute force finds a cheaper plan, and its bound holds', () => {
    // Where a proof is asserted (no stock limits), the deadline is only a safety net so a loaded machine
    // cannot decide the outcome; with limits the search may use its whole time, so it stays short.
    const tiny = requestArb(3, 2, 2, 40)
      .filter((r) => r.parts.reduce((a, p) => a + p.quantity, 0) <= 5)
      .map((r) => (r.stock.every((s) => s.available === undefined) ? { ...r, timeLimitMs: PROOF_LIMIT_MS } : r));
    fc.assert(
      fc.property(tiny, (req) => {
        let plan = planSheetCuts(req);
        expectValidPlan(req, plan);
        const best = bruteForceCost(req);
        // Whatever can be cut at all, the planner cuts, given the time to find it. Within a short limit the
        // first greedy start alone can miss it (seen at timeLimitMs 0, and at 40 ms on a loaded machine), so
        // a plan that leaves parts over is asked for again with ten times the time, up to PROOF_LIMIT_MS.
        for (let ms = req.timeLimitMs ?? 0; best !== null && unplacedCount(plan) > 0 && ms < PROOF_LIMIT_MS; ) {
          ms = Math.min(PROOF_LIMIT_MS, Math.max(1, ms) * 10);
          plan = planSheetCuts({ ...req, timeLimitMs: ms });
          expectValidPlan(req, plan);
        }
        expect(unplacedCount(plan) > 0).toBe(best === null);
        if (best === null) return;
        expect(plan.lowerBound).toBeLessThanOrEqual(best + EPS);
        expect(plan.totalCost).toBeGreaterThanOrEqual(best - EPS);
        if (plan.totalCost > best + EPS) expect(plan.optimal).toBe(false);
        // With no stock limits the exact search covers cases this small.
        if (req.stock.every((s) => s.available === undefined)) {
          expect(plan.optimal).toBe(true);
          expect(plan.totalCost).toBeCloseTo(best, 6);
        }
      }),
      { numRuns: 150 },
    );
  }, 60_000);
});
