/**
 * LP diving: solve the pattern LP, fix the boards it is sure of (every pattern at a whole number of
 * boards or more, else the largest fractional one), take them out of the demand and solve again,
 * until nothing is left. Restarts go against the LP's first choice at one depth at a time (limited
 * discrepancy search), then at random depths, so the dive explores plans near the LP optimum.
 *
 * Source: the diving heuristic of branch-and-price for cutting stock, as in F. Vanderbeck, "Computational
 * study of a column generation algorithm for bin packing and cutting stock problems", Math. Programming
 * 86 (1999), and W. D. Harvey and M. L. Ginsberg, "Limited discrepancy search", IJCAI 1995.
 */
import { expired, type Deadline } from './deadline';
import { clipPattern, solvePatternLp, type LpStock, type Pattern, type Pricer } from './pattern-lp';

export interface DiveProblem {
  demand: readonly number[];
  stocks: readonly LpStock[];
  pricer: Pricer;
  pool: Pattern[];
}

export interface DivePlan {
  patterns: Pattern[];
  cost: number; // micro-dollars
}

const WHOLE = 1 - 1e-6;

/** One dive; `choiceAt(depth)` picks which fractional pattern to fix at that depth (0 = the LP's favourite). */
export function diveOnce(problem: DiveProblem, deadline: Deadline, choiceAt: (depth: number) => number): DivePlan | null {
  const residual = [...problem.demand];
  const used = problem.stocks.map(() => 0);
  const patterns: Pattern[] = [];
  let cost = 0;
  const left = (): number => residual.reduce((a, b) => a + b, 0);
  // Fixes one board of pattern p, cutting only pieces still wanted; false when it adds nothing or the rack is out.
  const fix = (p: Pattern): boolean => {
    const st = problem.stocks[p.stock];
    if (!st || (used[p.stock] ?? 0) >= st.available) return false;
    const clipped = clipPattern(p, residual);
    if (clipped.counts.every((c) => c === 0)) return false;
    clipped.counts.forEach((c, k) => (residual[k] = (residual[k] ?? 0) - c));
    used[p.stock] = (used[p.stock] ?? 0) + 1;
    patterns.push(clipped);
    cost += st.price;
    return true;
  };
  for (let depth = 0; left() > 0; depth++) {
    if (expired(deadline) || depth > 10_000) return null;
    const stocks = problem.stocks.map((s, i) => ({ price: s.price, available: s.available - (used[i] ?? 0) }));
    const lp = solvePatternLp(residual, stocks, problem.pricer, problem.pool, deadline);
    if (lp.infeasible || lp.columns.length === 0) return null;
    const sorted = [...lp.columns].sort((a, b) => b.x - a.x);
    let progress = false;
    for (const { pattern, x } of sorted) {
      for (let c = 0; c < Math.floor(x + 1e-6) && x >= WHOLE; c++) if (fix(pattern)) progress = true;
    }
    if (!progress) {
      const frac = sorted.filter((c) => c.x < WHOLE);
      const pick = frac.length > 0 ? Math.min(choiceAt(depth), frac.length - 1) : 0;
      // Fall back to the others if the chosen one adds nothing.
      const order = [...(frac[pick] ? [frac[pick]] : []), ...sorted];
      for (const c of order) if (fix(c.pattern)) {
        progress = true;
        break;
      }
    }
    if (!progress) return null;
  }
  return { patterns, cost };
}

export interface DiveLimits {
  /** Stop after this many dives in a row that found no cheaper plan (work, not time; default: none). */
  stall?: number;
  /** The plan's cost as the caller will count it (e.g. after downgrading boards); default its pattern cost. */
  costOf?: (plan: DivePlan) => number;
}

/**
 * Dives until one reaches `target` (a proven bound), the deadline, or `limits.stall` dives in a row
 * without a cheaper plan: first the LP's own choices, then one discrepancy at each depth, then random
 * choices. Returns the cheapest plan found.
 */
export function diveSearch(
  problem: DiveProblem,
  target: number,
  deadline: Deadline,
  random: () => number,
  limits: DiveLimits = {},
): DivePlan | null {
  let best: DivePlan | null = null;
  let bestCost = Number.POSITIVE_INFINITY;
  let since = 0;
  const stall = limits.stall ?? Number.POSITIVE_INFINITY;
  // True when the search should stop: the target is reached or the dives have stalled.
  const consider = (plan: DivePlan | null): boolean => {
    since++;
    if (plan) {
      const cost = limits.costOf ? limits.costOf(plan) : plan.cost;
      if (cost < bestCost) {
        best = plan;
        bestCost = cost;
        since = 0;
      }
    }
    return bestCost <= target || since >= stall;
  };
  if (consider(diveOnce(problem, deadline, () => 0))) return best;
  const depths = best ? (best as DivePlan).patterns.length : 20;
  for (let d = 0; d < depths && !expired(deadline); d++) {
    if (consider(diveOnce(problem, deadline, (depth) => (depth === d ? 1 : 0)))) return best;
  }
  while (!expired(deadline)) {
    const rate = 0.1 + 0.3 * random();
    if (consider(diveOnce(problem, deadline, () => (random() < rate ? 1 + Math.floor(random() * 2) : 0)))) return best;
  }
  return best;
}
