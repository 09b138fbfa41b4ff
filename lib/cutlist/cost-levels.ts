/**
 * Exact search by cost level, for racks with several priced lengths: list every mix of boards (how
 * many of each stock) that costs at least the bound and less than the best plan, cheapest first, and
 * decide for each whether the pieces fit those boards. The first mix that fits is the least-cost plan;
 * every mix shown not to fit raises the proven bound to the next one. A mix is refused at once when its
 * length falls short, else by the phase-one LP over its patterns, else by bin completion limited to it.
 *
 * Source: the enumeration of bin-type multisets for variable-sized bin packing, as in J. Kang and
 * S. Park, "Algorithms for the variable sized bin packing problem", EJOR 147 (2003); the feasibility
 * LP is the Gilmore–Gomory LP with free boards.
 */
import { expired, expiredEvery, shareOf, type Deadline } from './deadline';
import type { DiveProblem } from './dive';
import { completionSearch } from './exact-search';
import type { Instance, Solution } from './instance';
import type { Kind } from './knapsack';
import { solvePatternLp } from './pattern-lp';

const MAX_MIXES = 20_000;

interface Mix {
  counts: number[];
  cost: number;
  room: number;
}

/** Mixes with lb <= cost < below, cheapest first (then most room); null if there are too many to list. */
function listMixes(inst: Instance, lb: number, below: number, need: number, deadline: Deadline): Mix[] | null {
  const stocks = inst.stocks;
  const out: Mix[] = [];
  const counts = stocks.map(() => 0);
  let tooMany = false;
  // bestRate[s]: the most room per micro-dollar among stocks s.., to drop prefixes that cannot hold the pieces.
  const bestRate = new Array<number>(stocks.length + 1).fill(0);
  for (let s = stocks.length - 1; s >= 0; s--) {
    const st = stocks[s];
    const rate = !st ? 0 : st.price > 0 ? st.cap / st.price : Number.POSITIVE_INFINITY;
    bestRate[s] = Math.max(bestRate[s + 1] ?? 0, rate);
  }
  const walk = (s: number, cost: number, room: number): void => {
    if (tooMany) return;
    if (expiredEvery(deadline)) {
      tooMany = true;
      return;
    }
    if (room < need && room + (below - 1 - cost) * (bestRate[s] ?? 0) < need) return;
    const st = stocks[s];
    if (!st) {
      if (cost >= lb && room >= need) {
        if (out.length >= MAX_MIXES) tooMany = true;
        else out.push({ counts: [...counts], cost, room });
      }
      return;
    }
    // Free boards cost nothing, so the most that could help is enough to hold everything.
    const byPrice = st.price > 0 ? Math.floor((below - 1 - cost) / st.price) : Math.ceil(need / st.cap);
    const most = Math.min(st.available, byPrice, Math.ceil(need / st.cap));
    for (let c = 0; c <= most; c++) {
      counts[s] = c;
      walk(s + 1, cost + c * st.price, room + c * st.cap);
    }
    counts[s] = 0;
  };
  walk(0, 0, 0);
  if (tooMany) return null;
  return out.sort((a, b) => a.cost - b.cost || b.room - a.room);
}

export interface LevelResult {
  best: Solution;
  lb: number;
  finished: boolean;
}

export function searchCostLevels(
  inst: Instance,
  kinds: readonly Kind[],
  problem: DiveProblem,
  best: Solution,
  lb: number,
  deadline: Deadline,
): LevelResult {
  const need = kinds.reduce((a, k) => a + k.size * k.pieces.length, 0);
  const mixes = listMixes(inst, lb, best.score.cost, need, deadline);
  if (mixes === null) return { best, lb, finished: false };
  const demand = kinds.map((k) => k.pieces.length);
  for (let i = 0; i < mixes.length; i++) {
    const mix = mixes[i];
    if (!mix) continue;
    if (expired(deadline)) return { best, lb: Math.max(lb, mix.cost), finished: false };
    const free = inst.stocks.map((_, s) => ({ price: 0, available: mix.counts[s] ?? 0 }));
    const lp = solvePatternLp(demand, free, problem.pricer, problem.pool, deadline);
    if (lp.converged && lp.infeasible) continue;
    // Later mixes get the rest of the time shared out, so one hard mix cannot take it all.
    const sub = inst.withAvailable(mix.counts);
    const zero = { y: kinds.map(() => 0), excess: inst.stocks.map(() => 0), value: 0 };
    const found = completionSearch(sub, kinds, zero, null, shareOf(deadline, 0.5), { ...problem, feasibility: true });
    if (found.best && found.best.score.unplaced === 0) {
      return { best: found.best, lb: found.best.score.cost, finished: true };
    }
    if (!found.finished) return { best, lb: Math.max(lb, mix.cost), finished: false };
  }
  // No cheaper mix holds the pieces: the best plan is the least cost.
  return { best, lb: best.score.cost, finished: true };
}
