/** Lower bounds on the cost of a linear plan. */
import { expiredEvery, type Deadline } from './deadline';
import { type Instance, type StockType } from './instance';
import { knapsack, unitOf, type Kind } from './knapsack';

// ---------- lower bounds ----------

/** Martello–Toth L2 bound on the number of bins of capacity `cap` for integer `sizes`. */
export function martelloTothL2(sizes: readonly number[], cap: number): number {
  if (sizes.length === 0) return 0;
  const ks = new Set<number>([0]);
  for (const w of sizes) if (2 * w <= cap) ks.add(w);
  let best = 0;
  for (const k of ks) {
    let j1 = 0;
    let j2 = 0;
    let j2Sum = 0;
    let j3Sum = 0;
    for (const w of sizes) {
      if (w > cap - k) j1++;
      else if (2 * w > cap) {
        j2++;
        j2Sum += w;
      } else if (w >= k) j3Sum += w;
    }
    const spare = j2 * cap - j2Sum;
    const extra = Math.max(0, Math.ceil((j3Sum - spare) / cap));
    best = Math.max(best, j1 + j2 + extra);
  }
  return best;
}

/** Cost of the `n` cheapest boards, respecting `available`. */
export function cheapestBoards(stocks: readonly StockType[], n: number): number {
  let left = n;
  let cost = 0;
  for (const s of [...stocks].sort((a, b) => a.price - b.price)) {
    const take = Math.min(left, s.available);
    cost += take * s.price;
    left -= take;
    if (left <= 0) break;
  }
  return cost;
}

/** Fractional cost of `space` micro-inches of board at the cheapest price per inch, respecting `available`. */
export function continuousCost(stocks: readonly StockType[], space: number, used?: readonly number[]): number {
  if (space <= 0) return 0;
  let left = space;
  let cost = 0;
  const order = [...stocks].sort((a, b) => a.price / a.cap - b.price / b.cap);
  for (const s of order) {
    const avail = s.available - (used?.[stocks.indexOf(s)] ?? 0);
    if (avail <= 0) continue;
    const take = Math.min(left, avail * s.cap);
    cost += (take * s.price) / s.cap;
    left -= take;
    if (left <= 0) break;
  }
  return cost;
}

export function lowerBound(inst: Instance, pieceIdx: readonly number[]): number {
  if (pieceIdx.length === 0) return 0;
  const sizes = pieceIdx.map((i) => inst.pieces[i]?.size ?? 0);
  const smallest = Math.min(...sizes);
  const usable = inst.stocks.filter((s) => s.cap >= smallest);
  const total = sizes.reduce((a, b) => a + b, 0);
  // Costs are whole micro-dollars, so the fractional bound may be rounded up; the margin absorbs float error.
  let lb = Math.ceil(continuousCost(usable, total) - 1e-6);
  const maxCap = Math.max(...usable.map((s) => s.cap));
  lb = Math.max(lb, cheapestBoards(usable, martelloTothL2(sizes, maxCap)));
  return lb;
}

export interface DualBound {
  y: number[]; // micro-dollars per piece of each kind
  excess: number[]; // per stock: how much its best pattern is worth above its price, paid per board still available
  value: number; // micro-dollars
}

/**
 * Lagrangian bound from the duals `y` of the demand rows: any y >= 0 gives
 * cost >= sum(d_k y_k) - sum_s available_s * max(0, v_s - price_s), with v_s the best pattern value
 * of stock s; for unlimited stock y is first scaled down until no pattern is worth more than its board.
 */
export function dualBound(inst: Instance, kinds: readonly Kind[], raw: readonly number[], deadline?: Deadline): DualBound {
  const sizes = kinds.map((k) => k.size);
  const limit = kinds.map((k) => k.pieces.length);
  let y = raw.map((v) => Math.max(0, v));
  let v = inst.stocks.map((s) => knapsack(sizes, y, limit, s.cap, unitOf(sizes), deadline).upper);
  let scale = 1;
  inst.stocks.forEach((s, i) => {
    const vs = v[i] ?? 0;
    if (s.available === Number.POSITIVE_INFINITY && vs > s.price) scale = Math.min(scale, s.price / vs);
  });
  if (scale < 1) {
    y = y.map((x) => x * scale);
    v = v.map((x) => x * scale);
  }
  const excess = inst.stocks.map((s, i) => (s.available === Number.POSITIVE_INFINITY ? 0 : Math.max(0, (v[i] ?? 0) - s.price)));
  let value = 0;
  kinds.forEach((k, i) => (value += k.pieces.length * (y[i] ?? 0)));
  inst.stocks.forEach((s, i) => {
    if ((excess[i] ?? 0) > 0) value -= s.available * (excess[i] ?? 0);
  });
  return { y, excess, value };
}

/**
 * Gilmore–Gomory LP relaxation solved by column generation (revised simplex with an explicit basis
 * inverse, big-M start), returning the duals of the demand rows. Any duals give a valid bound through
 * `dualBound`, so an early stop costs only tightness.
 */

/** The least total price of a set of boards, within `available`, that is at least `x`; `x` itself if the search is cut short. */
export function achievableCost(stocks: readonly { price: number; available: number }[], x: number, deadline?: Deadline): number {
  if (x <= 0) return 0;
  const priced = stocks.filter((s) => s.price > 0).sort((a, b) => b.price - a.price);
  let best = Number.POSITIVE_INFINITY;
  let nodes = 0;
  const dfs = (j: number, sum: number): void => {
    if (sum >= x) {
      best = Math.min(best, sum);
      return;
    }
    if (j === priced.length) return;
    if (++nodes > 200_000 || (deadline && expiredEvery(deadline))) {
      nodes = 200_001;
      return;
    }
    const s = priced[j];
    if (!s) return;
    const most = Math.min(s.available, Math.ceil((x - sum) / s.price));
    for (let c = most; c >= 0; c--) {
      if (sum + c * s.price >= best) continue;
      dfs(j + 1, sum + c * s.price);
    }
  };
  dfs(0, 0);
  return nodes > 200_000 || best === Number.POSITIVE_INFINITY ? Math.ceil(x) : best;
}
