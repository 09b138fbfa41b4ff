/** Test support only: the least cost of a small cut list by exhaustive search, to check the planner's proofs. */
import type { LinearCutRequest } from '../types';

const EPS = 1e-6;

/** Least cost to cut every piece, by trying every grouping and every stock for each group; null if impossible. */
export function bruteForceCost(req: LinearCutRequest): number | null {
  const lengths = req.parts.flatMap((p) => Array.from({ length: p.quantity }, () => p.length));
  const trim = req.endTrim ?? 0;
  const fits = (group: number[], length: number): boolean =>
    group.reduce((a, b) => a + b, 0) + req.kerf * (group.length - 1) <= length - 2 * trim + EPS;
  let best: number | null = null;
  const groups: number[][] = [];
  const assign = (g: number, used: number[], cost: number): void => {
    if (g === groups.length) {
      if (best === null || cost < best) best = cost;
      return;
    }
    const group = groups[g] ?? [];
    req.stock.forEach((s, i) => {
      if ((used[i] ?? 0) >= (s.available ?? Infinity) || !fits(group, s.length)) return;
      used[i] = (used[i] ?? 0) + 1;
      assign(g + 1, used, cost + s.price);
      used[i] = (used[i] ?? 0) - 1;
    });
  };
  const partition = (i: number): void => {
    if (i === lengths.length) {
      assign(0, req.stock.map(() => 0), 0);
      return;
    }
    const w = lengths[i] ?? 0;
    for (const g of groups) {
      g.push(w);
      partition(i + 1);
      g.pop();
    }
    groups.push([w]);
    partition(i + 1);
    groups.pop();
  };
  partition(0);
  return best;
}
