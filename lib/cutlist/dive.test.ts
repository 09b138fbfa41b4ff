import { describe, expect, it } from 'vitest';
import { deadlineIn } from './deadline';
import { diveSearch, type DivePlan, type DiveProblem } from './dive';
import { knapsack, unitOf } from './knapsack';
import { rng } from './random';

// Five kinds of piece on two priced lengths: the first dive is not at the LP bound, so an unreachable target
// keeps the search going until its limits stop it.
const SIZES = [37, 29, 23, 17, 11];
const DEMAND = [3, 5, 4, 7, 6];
const CAPS = [96, 144];
const PRICES = [45, 81];
/**
 * Deadline for the tests of the other limits: far past the few milliseconds their dives take, so the stall
 * or the target ends the search, never a busy machine.
 */
const UNREACHED_MS = 20_000;

function problem(): DiveProblem {
  const deadline = deadlineIn(60_000);
  const unit = unitOf(SIZES);
  return {
    demand: DEMAND,
    stocks: PRICES.map((price) => ({ price, available: Number.POSITIVE_INFINITY })),
    pricer: (s, y, limit) => knapsack(SIZES, y, limit, CAPS[s] ?? 0, unit, deadline, Math.max(...CAPS)),
    pool: [],
  };
}

/** Every piece wanted is cut and no board holds more than its length. */
function expectCovers(plan: DivePlan | null): void {
  expect(plan).not.toBeNull();
  const cut = DEMAND.map(() => 0);
  for (const p of plan?.patterns ?? []) {
    const load = p.counts.reduce((a, c, k) => a + c * (SIZES[k] ?? 0), 0);
    expect(load).toBeLessThanOrEqual(CAPS[p.stock] ?? 0);
    p.counts.forEach((c, k) => (cut[k] = (cut[k] ?? 0) + c));
  }
  expect(cut).toEqual(DEMAND);
}

describe('diveSearch limits', () => {
  it('stops after `stall` dives in a row without a cheaper plan', () => {
    let dives = 0;
    // Every dive counted at the same cost: only the first is an improvement.
    const plan = diveSearch(problem(), -1, deadlineIn(UNREACHED_MS), rng(3), {
      stall: 3,
      costOf: () => {
        dives++;
        return 1;
      },
    });
    expectCovers(plan);
    expect(dives).toBe(4);
  });

  it('stops at the target as the caller counts the cost', () => {
    let dives = 0;
    const plan = diveSearch(problem(), 0, deadlineIn(UNREACHED_MS), rng(3), {
      costOf: () => {
        dives++;
        return 0;
      },
    });
    expectCovers(plan);
    expect(dives).toBe(1);
  });

  it('without limits dives until the deadline when the target is out of reach', () => {
    // The deadline, not a count, ends it: how many dives fit in 50 ms depends on the machine's load, and on a
    // loaded one not even the first may (no plan then), so the search is run again until one dive came back.
    let dives = 0;
    let elapsed = 0;
    let plan: DivePlan | null = null;
    for (let tries = 0; tries < 20 && !plan; tries++) {
      dives = 0;
      const started = Date.now();
      plan = diveSearch(problem(), -1, deadlineIn(50), rng(3), {
        costOf: (p) => {
          dives++;
          return p.cost;
        },
      });
      elapsed = Date.now() - started;
    }
    expect(plan, 'no dive finished inside 50 ms in 20 runs').not.toBeNull();
    expectCovers(plan);
    expect(dives).toBeGreaterThanOrEqual(1);
    expect(elapsed).toBeGreaterThanOrEqual(50);
  });
});
