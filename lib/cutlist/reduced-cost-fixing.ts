/**
 * Reduced-cost fixing for the arc-flow graph (arc-flow.ts): an arc that only boards too dear to be in
 * a plan cheaper than `target` can use is left out before the integer program.
 *
 * Lagrangian argument, with the duals y >= 0 of the demand rows and, per stock s, `excess[s]` >= how
 * much its best pattern is worth above its price (bounds.ts `dualBound`; 0 for unlimited stock, whose
 * y is scaled down until no pattern is worth more than its board): every plan costs
 *   sum_j (price_j - y.a_j) + y.d  >=  value + (price_s + excess_s - y.a_j)
 * for any one of its boards j of stock s, where value = y.d - sum_s available_s * excess_s, since
 * every other board costs at least -excess of its stock below y.a. So a board whose pattern makes
 * that right side exceed `target` is in no plan costing at most `target`. The pattern's worth y.a_j
 * is bounded above by paths in the graph itself: the best worth reaching an arc's tail from position 0
 * (`ahead`) plus the arc plus the best worth from its head to a board end of that stock (`behind`).
 * Graph paths include every board of the model (and more: they ignore the demand limits), so the
 * bound on the worth is never too low and no arc of a cheap enough plan is dropped.
 *
 * Source: reduced-cost fixing, a standard step of integer programming; from memory: G. L. Nemhauser
 * and L. A. Wolsey, "Integer and Combinatorial Optimization", Wiley (1988), and the Lagrangian bound
 * for cutting stock from the Gilmore–Gomory duals (bounds.ts). The graph is J. M. Valério de
 * Carvalho's arc-flow model (arc-flow.ts).
 */

export interface FixingDuals {
  /** Dual value of one piece of each kind (micro-dollars), >= 0. */
  y: readonly number[];
  /** Per stock: its best pattern's worth above its price, paid per board available (0 when unlimited). */
  excess: readonly number[];
  /** The Lagrangian bound y.d - sum_s available_s * excess_s (micro-dollars). */
  value: number;
}

export interface FixingGraph {
  /** Positions 0..W in grid units. */
  W: number;
  /** Item arcs in increasing order of their tail. */
  arcFrom: ArrayLike<number>;
  arcKind: ArrayLike<number>;
  /** Grid units per kind. */
  sizes: readonly number[];
  /** Per stock: capacity in grid units and price (micro-dollars). */
  caps: readonly number[];
  prices: readonly number[];
}

export interface Fixing {
  /** keepArc[a]: item arc a may be in a plan costing at most the target. */
  keepArc: Uint8Array;
  /** Whether a board of stock s ending at position p may be in such a plan. */
  keepLoss: (p: number, s: number) => boolean;
}

/**
 * Which arcs of `g` a plan costing at most `target` (micro-dollars) can use. Floating-point sums of
 * the duals are compared with a relative margin, so rounding keeps an arc rather than drops one.
 */
export function fixByReducedCost(g: FixingGraph, duals: FixingDuals, target: number): Fixing {
  const { W, arcFrom, arcKind, sizes, caps, prices } = g;
  const n = arcFrom.length;
  const slack = target - duals.value + 1e-6 * Math.max(1, Math.abs(target), Math.abs(duals.value));
  // ahead[p]: the most worth of a path from 0 to p (arcs come in increasing order of their tail).
  const ahead = new Float64Array(W + 1).fill(Number.NEGATIVE_INFINITY);
  ahead[0] = 0;
  for (let a = 0; a < n; a++) {
    const p = arcFrom[a] ?? 0;
    const k = arcKind[a] ?? 0;
    const q = p + (sizes[k] ?? 0);
    const v = (ahead[p] ?? Number.NEGATIVE_INFINITY) + (duals.y[k] ?? 0);
    if (v > (ahead[q] ?? Number.NEGATIVE_INFINITY)) ahead[q] = v;
  }
  // Per stock, the least reduced cost of a board of that stock through each arc.
  const keepArc = new Uint8Array(n);
  const behind = new Float64Array(W + 1);
  caps.forEach((cap, s) => {
    const room = (prices[s] ?? 0) + (duals.excess[s] ?? 0) - slack;
    behind.fill(Number.NEGATIVE_INFINITY);
    for (let p = 0; p <= Math.min(cap, W); p++) behind[p] = 0;
    for (let a = n - 1; a >= 0; a--) {
      const p = arcFrom[a] ?? 0;
      const k = arcKind[a] ?? 0;
      const q = p + (sizes[k] ?? 0);
      if (q > cap) continue;
      const through = (duals.y[k] ?? 0) + (behind[q] ?? Number.NEGATIVE_INFINITY);
      if (through > (behind[p] ?? Number.NEGATIVE_INFINITY)) behind[p] = through;
      // value + price + excess - worth <= target  <=>  worth >= price + excess - (target - value)
      if ((ahead[p] ?? Number.NEGATIVE_INFINITY) + through >= room) keepArc[a] = 1;
    }
  });
  const keepLoss = (p: number, s: number): boolean =>
    p <= (caps[s] ?? -1) && (ahead[p] ?? Number.NEGATIVE_INFINITY) >= (prices[s] ?? 0) + (duals.excess[s] ?? 0) - slack;
  return { keepArc, keepLoss };
}
