/** Exact search for a least-cost linear plan. */
import { achievableCost, continuousCost, type DualBound } from './bounds';
import type { DiveProblem } from './dive';
import { solvePatternLp } from './pattern-lp';
import { expiredEvery, type Deadline } from './deadline';
import { better, type Bin, type Instance, type Solution } from './instance';
import { gcd, type Kind } from './knapsack';

// ---------- exact search ----------

const COMPLETIONS_PER_NODE = 20_000;

/**
 * Bin completion (Korf 2003, with the Martello–Toth dominance rule): boards are filled one at a time,
 * each around the largest piece left, with a stock and a set of further pieces that no other set
 * dominates. Bound at each node: cost so far plus the dual bound of what is left, or its continuous
 * cost. Returns the best solution found and whether the search ran to the end.
 */
export function completionSearch(
  inst: Instance,
  kinds: readonly Kind[],
  dual: DualBound,
  incumbent: Solution | null,
  deadline: Deadline,
  lp?: DiveProblem & { feasibility?: boolean },
): { best: Solution | null; finished: boolean } {
  const K = kinds.length;
  const size = kinds.map((k) => k.size);
  const y = dual.y;
  const left = kinds.map((k) => k.pieces.length);
  const used = inst.stocks.map(() => 0);
  const stack: { stock: number; counts: number[] }[] = [];
  let best = incumbent;
  // Every total is a multiple of the prices' gcd, so only totals a whole step below the best are worth finding.
  const step = Math.max(1, inst.stocks.reduce((g, s) => gcd(g, s.price), 0));
  let bestCost = incumbent ? incumbent.score.cost : Number.POSITIVE_INFINITY;
  const target = (): number => bestCost - step;
  let cost = 0;
  let yLeft = kinds.reduce((a, k, i) => a + k.pieces.length * (y[i] ?? 0), 0);
  let sizeLeft = kinds.reduce((a, k) => a + k.pieces.length * k.size, 0);
  let nodes = 0;
  let timedOut = false;
  let truncated = false;
  // ratio[j]: the most value per micro-inch among kinds j.., to bound what a partial set can still gain.
  const ratio = new Array<number>(K + 1).fill(0);
  // Cheapest price per micro-inch, availability aside: a bound on what the rest costs by length.
  const rMin = Math.min(...inst.stocks.map((s) => s.price / s.cap));
  for (let j = K - 1; j >= 0; j--) ratio[j] = Math.max(ratio[j + 1] ?? 0, (y[j] ?? 0) / (size[j] ?? 1));

  const penalty = (): number => inst.stocks.reduce((a, s, i) => a + (s.available - (used[i] ?? 0)) * (dual.excess[i] ?? 0), 0);
  const bound = (): number => {
    // The boards still available must hold what is left.
    let room = 0;
    inst.stocks.forEach((s, i) => (room += (s.available - (used[i] ?? 0)) * s.cap));
    if (room < sizeLeft) return Number.POSITIVE_INFINITY;
    const byDual = Math.ceil(yLeft - penalty() - 1e-3 - 1e-9 * Math.abs(yLeft));
    const byLength = Math.ceil(continuousCost(inst.stocks, sizeLeft, used) - 1e-6);
    return cost + Math.max(byDual, byLength, 0);
  };

  // Node bound from the pattern LP of what is left (branch and price with bin-completion branching), memoised
  // by the remaining demand and boards since different orders of the same boards meet the same rest.
  const lpMemo = new Map<string, number>();
  const achievableMemo = new Map<number, number>();
  const nodeLpBound = (): number => {
    if (!lp) return Number.NEGATIVE_INFINITY;
    const key = `${left.join(',')}|${used.join(',')}`;
    let rest = lpMemo.get(key);
    if (rest === undefined) {
      // In feasibility mode every board is free, so a positive artificial at the optimum proves that the
      // boards left cannot hold the pieces left (phase one of the simplex).
      const free = lp.feasibility === true;
      const stocks = inst.stocks.map((s, i) => ({ price: free ? 0 : s.price, available: s.available - (used[i] ?? 0) }));
      const sol = solvePatternLp(left, stocks, lp.pricer, lp.pool, deadline);
      if (sol.converged && sol.infeasible && free) rest = Number.POSITIVE_INFINITY;
      if (!sol.converged || sol.infeasible) {
        if (rest === Number.POSITIVE_INFINITY) lpMemo.set(key, rest);
        return cost + (rest ?? Number.NEGATIVE_INFINITY);
      }
      if (free) {
        lpMemo.set(key, Number.NEGATIVE_INFINITY);
        return Number.NEGATIVE_INFINITY;
      }
      // Integer prices in micro-dollars: a margin of one absorbs the simplex's rounding.
      const floorValue = Math.ceil(sol.value - Math.max(1, 1e-9 * sol.value));
      rest = achievableMemo.get(floorValue);
      if (rest === undefined) {
        rest = achievableCost(inst.stocks, floorValue, deadline);
        achievableMemo.set(floorValue, rest);
      }
      lpMemo.set(key, rest);
    }
    return cost + rest;
  };

  const record = (): void => {
    const queues = kinds.map((k) => [...k.pieces]);
    const bins: Bin[] = stack.map((b) => {
      const items: number[] = [];
      let load = 0;
      b.counts.forEach((c, k) => {
        for (let q = 0; q < c; q++) {
          const i = queues[k]?.pop();
          if (i === undefined) continue;
          items.push(i);
          load += size[k] ?? 0;
        }
      });
      return { stock: b.stock, load, items };
    });
    const sol = inst.solution(bins, []);
    if (!best || better(sol.score, best.score)) {
      best = sol;
      bestCost = sol.score.cost;
    }
  };

  type Candidate = { stock: number; counts: number[]; bound: number; load: number };

  /**
   * The undominated sets that can join piece kind `k0` on a new board and still lead below bestCost,
   * best bound first; null once there would be more than `limit`.
   */
  const completions = (k0: number, limit: number): Candidate[] | null => {
    const candidates: Candidate[] = [];
    // suffix[j]: total size of the pieces of kinds j.. still free to join the board.
    const suffix = new Array<number>(K + 1).fill(0);
    for (let j = K - 1; j >= 0; j--) suffix[j] = (suffix[j + 1] ?? 0) + ((left[j] ?? 0) - (j === k0 ? 1 : 0)) * (size[j] ?? 0);
    const pen = penalty();
    let over = false;
    for (let si = 0; si < inst.stocks.length && !over; si++) {
      const st = inst.stocks[si];
      if (!st || st.cap < (size[k0] ?? 0) || (used[si] ?? 0) >= st.available) continue;
      // A child is worth visiting only if cost + price + yLeft - y(set) - its penalty <= target.
      const need = cost + st.price + yLeft - (pen - (dual.excess[si] ?? 0)) - target();
      // By length: cost + price + (sizeLeft - load) * rMin <= target needs at least this load.
      const needLoad = rMin > 0 ? sizeLeft - (target() - cost - st.price) / rMin : Number.NEGATIVE_INFINITY;
      const counts = new Array<number>(K).fill(0);
      counts[k0] = 1;
      const gen = (j: number, room: number, value: number): void => {
        if (over) return;
        if (expiredEvery(deadline)) {
          over = true;
          return;
        }
        if (value + room * (ratio[j] ?? 0) < need - 1e-3 - 1e-9 * Math.abs(need)) return;
        const load = st.cap - room;
        if (load + Math.min(room, suffix[j] ?? 0) < needLoad - 1e-3) return;
        if (j === K) {
          if (!undominated(counts, room, k0)) return;
          if (candidates.length >= limit) {
            over = true;
            return;
          }
          const byDual = cost + st.price + yLeft - value - (pen - (dual.excess[si] ?? 0));
          const byLength = cost + st.price + (sizeLeft - load) * rMin;
          candidates.push({ stock: si, counts: [...counts], bound: Math.max(byDual, byLength), load });
          return;
        }
        const fixed = j === k0 ? 1 : 0;
        const have = (left[j] ?? 0) - fixed;
        const w = size[j] ?? 1;
        for (let c = Math.min(have, Math.floor(room / w)); c >= 0; c--) {
          counts[j] = fixed + c;
          gen(j + 1, room - c * w, value + c * (y[j] ?? 0));
        }
        counts[j] = fixed;
      };
      gen(0, st.cap - (size[k0] ?? 0), y[k0] ?? 0);
    }
    if (over) return null;
    return candidates.sort((a, b) => a.bound - b.bound || b.load - a.load);
  };

  const dfs = (): void => {
    if (timedOut) return;
    if (++nodes > 0 && expiredEvery(deadline, 16)) {
      timedOut = true;
      return;
    }
    let k0 = 0;
    while (k0 < K && (left[k0] ?? 0) === 0) k0++;
    if (k0 === K) {
      record();
      return;
    }
    if (bound() > target()) return;
    if (nodeLpBound() > target()) return;
    let candidates = completions(k0, COMPLETIONS_PER_NODE);
    if (candidates === null) {
      truncated = true;
      candidates = [];
    }
    // Fail first: branch on the piece with the fewest ways to fill its board, which is what makes
    // exactly-full instances such as Falkenauer's triplets tractable.
    for (let k = k0 + 1; k < K && candidates.length > 1; k++) {
      if ((left[k] ?? 0) === 0) continue;
      const fewer = completions(k, candidates.length - 1);
      if (fewer !== null) candidates = fewer;
    }
    for (const cand of candidates) {
      const st = inst.stocks[cand.stock];
      if (!st) continue;
      let yTaken = 0;
      let sizeTaken = 0;
      cand.counts.forEach((c, k) => {
        left[k] = (left[k] ?? 0) - c;
        yTaken += c * (y[k] ?? 0);
        sizeTaken += c * (size[k] ?? 0);
      });
      used[cand.stock] = (used[cand.stock] ?? 0) + 1;
      cost += st.price;
      yLeft -= yTaken;
      sizeLeft -= sizeTaken;
      stack.push({ stock: cand.stock, counts: cand.counts });
      dfs();
      stack.pop();
      sizeLeft += sizeTaken;
      yLeft += yTaken;
      cost -= st.price;
      used[cand.stock] = (used[cand.stock] ?? 0) - 1;
      cand.counts.forEach((c, k) => (left[k] = (left[k] ?? 0) + c));
      if (timedOut) return;
    }
  };

  /**
   * Martello–Toth dominance, as far as Korf checks it: the set must be maximal, and no piece left out
   * may replace one piece, or two, of the set (other than the one the board is built around) whose
   * sizes it covers while still fitting.
   */
  const undominated = (counts: readonly number[], room: number, k0: number): boolean => {
    const excluded: number[] = [];
    for (let k = K - 1; k >= 0; k--) if ((left[k] ?? 0) > (counts[k] ?? 0)) excluded.push(size[k] ?? 0);
    // excluded is increasing; the smallest left out must not fit in what remains.
    if ((excluded[0] ?? Number.POSITIVE_INFINITY) <= room) return false;
    const smallestAtLeast = (x: number): number => {
      let lo = 0;
      let hi = excluded.length;
      while (lo < hi) {
        const mid = (lo + hi) >> 1;
        if ((excluded[mid] ?? 0) < x) lo = mid + 1;
        else hi = mid;
      }
      return excluded[lo] ?? Number.POSITIVE_INFINITY;
    };
    const free = (k: number): number => (counts[k] ?? 0) - (k === k0 ? 1 : 0);
    for (let a = 0; a < K; a++) {
      if (free(a) <= 0) continue;
      const za = size[a] ?? 0;
      if (smallestAtLeast(za + 1) <= za + room) return false;
      for (let b = a; b < K; b++) {
        if (free(b) <= 0 || (b === a && free(a) < 2)) continue;
        const z = za + (size[b] ?? 0);
        if (smallestAtLeast(z) <= z + room) return false;
      }
    }
    return true;
  };

  dfs();
  return { best, finished: !timedOut && !truncated };
}
