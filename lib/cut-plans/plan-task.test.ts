import { describe, expect, it } from 'vitest';
import { DEFAULT_CUT_SETTINGS } from '@/lib/stock/schemas';
import { LOAD_PARTS_PER_ITEM, LOAD_STOCK_ITEMS, loadParts, loadStock } from '@/tests/fixtures/cut-plan-load';
import { buildCutPlan } from './build';
import { runPlanTask } from './plan-task';

const ids = Array.from({ length: LOAD_STOCK_ITEMS }, (_, i) => `stock-${i}`);
const stock = loadStock(ids);
const parts = loadParts(ids).map((p, i) => ({ ...p, id: `part-${i}` }));

// Issue 12: 8 stock items of 9 parts each gave every stock group the full time limit, 8 s in all
// for a 1 s limit. This only tells a shared budget (about 1x) from one per group (8x, 3.2 s here); it is
// no speed check. It counts the process's CPU time (every thread's, HiGHS's too), which a busy machine
// does not stretch as it does wall time: at 2x load the wall time reached 865-1,228 ms. The bound is 4x.
// How close a plan keeps to its limit is measured by bench/cutlist/deadline.ts and bench/cut-plan-load.
const BUDGET_MS = 400;
const SLACK_MS = 3 * BUDGET_MS;

function timed<T>(run: () => T): { value: T; ms: number } {
  const started = process.cpuUsage();
  const value = run();
  const used = process.cpuUsage(started);
  return { value, ms: (used.user + used.system) / 1000 };
}

describe('one time budget per plan request', () => {
  it('shares the budget between the stock groups of one plan', () => {
    expect(parts).toHaveLength(LOAD_STOCK_ITEMS * LOAD_PARTS_PER_ITEM);
    const { value: plan, ms } = timed(() => buildCutPlan(parts, stock, DEFAULT_CUT_SETTINGS, BUDGET_MS));
    expect(plan.groups).toHaveLength(LOAD_STOCK_ITEMS);
    expect(plan.pieceCount).toBe(parts.reduce((a, p) => a + p.quantity, 0));
    expect(ms).toBeLessThan(BUDGET_MS + SLACK_MS);
  });

  it('shares it between the whole episode and each level too', () => {
    const { value, ms } = timed(() => runPlanTask({ parts, stock, settings: DEFAULT_CUT_SETTINGS, byLevel: true, budgetMs: BUDGET_MS }));
    expect(value.levels.map((l) => l.level)).toEqual([1, 2, 3]);
    for (const { level, plan } of value.levels) {
      expect(plan.pieceCount).toBe(parts.filter((p) => p.level === level).reduce((a, p) => a + p.quantity, 0));
    }
    expect(ms).toBeLessThan(BUDGET_MS + SLACK_MS);
  });

  it('plans without levels when asked for one plan', () => {
    const one = runPlanTask({ parts: parts.slice(0, 9), stock, settings: DEFAULT_CUT_SETTINGS, byLevel: false, budgetMs: 100 });
    expect(one.levels).toEqual([]);
    expect(one.whole.groups).toHaveLength(1);
  });
});
