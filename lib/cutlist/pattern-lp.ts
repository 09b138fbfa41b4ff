/**
 * The Gilmore–Gomory LP over board patterns, solved by column generation, with its primal solution
 * (which patterns, how many of each) as well as its duals. Generic over what a pattern is: the caller
 * passes a pricing function, so one LP serves plain crosscut boards (a knapsack along the length)
 * and ripped boards (strips across the width, each a knapsack along the length).
 *
 *   min sum_j price(j) x_j  s.t.  sum_j counts_kj x_j >= demand_k,  sum_{j of stock s} x_j <= available_s,  x >= 0
 *
 * Source: P. C. Gilmore and R. E. Gomory, "A linear programming approach to the cutting-stock
 * problem", Operations Research 9 (1961); revised simplex with an explicit basis inverse.
 */
import { expired, type Deadline } from './deadline';

export interface Pattern {
  stock: number;
  counts: number[]; // pieces of each kind
  /** Ripped boards: the strips side by side, each with its pieces of each kind (sum = counts). */
  strips?: { width: number; counts: number[] }[];
}

/** The pattern with at most `wanted[k]` pieces of each kind, its strips trimmed to match; empty strips dropped. */
export function clipPattern(p: Pattern, wanted: readonly number[]): Pattern {
  const counts = p.counts.map((c, k) => Math.min(c, wanted[k] ?? 0));
  if (!p.strips) return { stock: p.stock, counts };
  const left = [...counts];
  const strips = p.strips
    .map((st) => ({
      width: st.width,
      counts: st.counts.map((c, k) => {
        const take = Math.min(c, left[k] ?? 0);
        left[k] = (left[k] ?? 0) - take;
        return take;
      }),
    }))
    .filter((st) => st.counts.some((c) => c > 0));
  return { stock: p.stock, counts, strips };
}

/**
 * Lagrangian bound for any duals y >= 0: cost >= sum(d_k y_k) - sum_s available_s * max(0, v_s - price_s),
 * with v_s the best pattern value of stock s; for stock without a limit y is first scaled down until no
 * pattern is worth more than its board. Valid wherever the LP stopped. Micro-dollars.
 */
export function lagrangianBound(demand: readonly number[], stocks: readonly LpStock[], pricer: Pricer, duals: readonly number[]): number {
  let y = duals.map((v) => Math.max(0, v));
  let v = stocks.map((_, s) => pricer(s, y, demand).upper);
  let scale = 1;
  stocks.forEach((s, i) => {
    const vs = v[i] ?? 0;
    if (!Number.isFinite(s.available) && vs > s.price) scale = Math.min(scale, s.price / vs);
  });
  if (scale < 1) {
    y = y.map((x) => x * scale);
    v = v.map((x) => x * scale);
  }
  let value = 0;
  demand.forEach((d, k) => (value += d * (y[k] ?? 0)));
  stocks.forEach((s, i) => {
    if (Number.isFinite(s.available)) value -= s.available * Math.max(0, (v[i] ?? 0) - s.price);
  });
  return value;
}

export interface LpStock {
  price: number; // micro-dollars
  available: number; // boards left (Infinity when the rack has no limit)
}

/** Best pattern of one stock for piece values `y` with at most `limit[k]` pieces of kind k. */
export type Pricer = (
  stock: number,
  y: readonly number[],
  limit: readonly number[],
) => { counts: number[]; value: number; upper: number; strips?: Pattern['strips'] };

export interface LpSolution {
  /** Duals of the demand rows, micro-dollars per piece; valid for a Lagrangian bound wherever the LP stopped. */
  duals: number[];
  /** Patterns in the final basis with their (fractional) number of boards. */
  columns: { pattern: Pattern; x: number }[];
  /** Objective of the final basis, micro-dollars (an upper estimate if the LP did not converge). */
  value: number;
  converged: boolean;
  /** Demand cannot be met from the available boards even fractionally. */
  infeasible: boolean;
}

const EPS = 1e-9;
const MAX_PIVOTS = 4000;

/**
 * Solves the LP for `demand` from `stocks`, starting with the columns of `pool` and adding every
 * column the pricer finds to it (so later solves on a smaller demand start warm). Stops at the deadline.
 */
export function solvePatternLp(
  demand: readonly number[],
  stocks: readonly LpStock[],
  pricer: Pricer,
  pool: Pattern[],
  deadline: Deadline,
): LpSolution {
  // Kinds already cut in full drop out, so later solves of a dive work on fewer rows.
  const active = demand.flatMap((d, k) => (d > 0 ? [k] : []));
  return solveDense(demand, active, stocks, pricer, pool, deadline);
}

// The most pieces of one kind a board holds, per pricer: asked once, not on every LP solve of a dive.
const singleKind = new WeakMap<Pricer, Map<string, Pattern>>();
function singleKindPattern(pricer: Pricer, stock: number, kind: number, kinds: number): Pattern {
  let cache = singleKind.get(pricer);
  if (!cache) {
    cache = new Map();
    singleKind.set(pricer, cache);
  }
  const key = `${stock}:${kind}`;
  let p = cache.get(key);
  if (!p) {
    const y = new Array<number>(kinds).fill(0);
    y[kind] = 1;
    const r = pricer(stock, y, new Array<number>(kinds).fill(Number.MAX_SAFE_INTEGER));
    p = { stock, counts: r.counts, ...(r.strips ? { strips: r.strips } : {}) };
    cache.set(key, p);
  }
  return p;
}

/** Rows for the kinds in `active` only; patterns, duals and the pricer stay in full kind order. */
function solveDense(
  full: readonly number[],
  active: readonly number[],
  stocks: readonly LpStock[],
  pricer: Pricer,
  pool: Pattern[],
  deadline: Deadline,
): LpSolution {
  const K = active.length;
  const N = full.length;
  const demand = active.map((k) => full[k] ?? 0);
  const demandOne = (k: number): number[] => full.map((d, j) => (j === active[k] ? d : 0));
  const finite = stocks.map((s, i) => (Number.isFinite(s.available) ? i : -1)).filter((i) => i >= 0);
  const rowOf = new Map<number, number>();
  finite.forEach((s, r) => rowOf.set(s, K + r));
  const m = K + finite.length;
  // Prices in dollars keep the simplex's numbers near 1.
  const price = stocks.map((s) => s.price / 1e6);
  const bigM = 4 * Math.max(1, ...price) + 1;

  // Basis: artificial columns (cost bigM) on demand rows, slacks on availability rows.
  // Row-major m x m basis inverse.
  const binv = new Float64Array(m * m);
  for (let r = 0; r < m; r++) binv[r * m + r] = 1;
  const xB: number[] = [...demand, ...finite.map((s) => Math.max(0, stocks[s]?.available ?? 0))];
  const cB: number[] = [...demand.map(() => bigM), ...finite.map(() => 0)];
  const basis: (Pattern | null)[] = new Array<Pattern | null>(m).fill(null);
  const artificial: boolean[] = [...demand.map(() => true), ...finite.map(() => false)];
  // Crash basis: each demand row starts on the cheapest one-kind pattern of a stock without a limit, so
  // the simplex need not first drive out the artificial columns.
  for (let k = 0; k < K; k++) {
    let best: { perPiece: number; fit: number; stock: number; pattern: Pattern } | null = null;
    for (let s = 0; s < stocks.length; s++) {
      if (rowOf.has(s) || expired(deadline)) continue;
      const pattern = clipPattern(singleKindPattern(pricer, s, active[k] ?? 0, N), demandOne(k));
      const fit = pattern.counts[active[k] ?? 0] ?? 0;
      if (fit > 0 && (!best || (price[s] ?? 0) / fit < best.perPiece)) best = { perPiece: (price[s] ?? 0) / fit, fit, stock: s, pattern };
    }
    if (!best) continue;
    const p = best.pattern;
    binv[k * m + k] = 1 / best.fit;
    xB[k] = (demand[k] ?? 0) / best.fit;
    cB[k] = price[best.stock] ?? 0;
    basis[k] = p;
    artificial[k] = false;
  }
  const pi = new Float64Array(m);
  const colBuf = new Float64Array(m);
  const dirBuf = new Float64Array(m);
  const nz = new Int32Array(m);
  let converged = false;

  for (let iter = 0; iter < MAX_PIVOTS; iter++) {
    if (expired(deadline)) break;
    pi.fill(0);
    for (let r = 0; r < m; r++) {
      const cr = cB[r] ?? 0;
      if (cr === 0) continue;
      const base = r * m;
      for (let c = 0; c < m; c++) pi[c] = (pi[c] ?? 0) + cr * (binv[base + c] ?? 0);
    }
    // Entering column: a pattern, or a surplus (-1 on demand row `unit`) or slack (+1 on availability row `unit`).
    let enterRc = -1e-9;
    let enterPattern: Pattern | null = null;
    let enterUnit = -1;
    let enterCost = 0;
    const offer = (rc: number, pattern: Pattern | null, unitRow: number, cost: number): void => {
      if (rc < enterRc) {
        enterRc = rc;
        enterPattern = pattern;
        enterUnit = unitRow;
        enterCost = cost;
      }
    };
    for (let k = 0; k < K; k++) if ((pi[k] ?? 0) < -EPS) offer(pi[k] ?? 0, null, k, 0);
    for (let r = K; r < m; r++) if ((pi[r] ?? 0) > EPS) offer(-(pi[r] ?? 0), null, r, 0);
    // Columns already known are cheaper to price than a new knapsack.
    for (const p of pool) {
      let v = 0;
      for (let k = 0; k < K; k++) v += (p.counts[active[k] ?? 0] ?? 0) * (pi[k] ?? 0);
      const r = rowOf.get(p.stock);
      const rc = (price[p.stock] ?? 0) - v - (r === undefined ? 0 : (pi[r] ?? 0));
      if (rc < -1e-7) offer(rc, p, -1, price[p.stock] ?? 0);
    }
    if (enterUnit < 0 && enterPattern === null) {
      const y = new Array<number>(N).fill(0);
      for (let k = 0; k < K; k++) y[active[k] ?? 0] = Math.max(0, pi[k] ?? 0);
      for (let s = 0; s < stocks.length; s++) {
        if (expired(deadline)) break;
        const r = rowOf.get(s);
        const best = pricer(s, y, full);
        const rc = (price[s] ?? 0) - best.value - (r === undefined ? 0 : (pi[r] ?? 0));
        if (rc < -1e-7) {
          const p: Pattern = { stock: s, counts: best.counts, ...(best.strips ? { strips: best.strips } : {}) };
          pool.push(p);
          offer(rc, p, -1, price[s] ?? 0);
        }
      }
    }
    if (enterUnit < 0 && enterPattern === null) {
      converged = !expired(deadline);
      break;
    }
    const chosenPattern = enterPattern as Pattern | null;
    const col = colBuf.fill(0);
    if (chosenPattern) {
      for (let k = 0; k < K; k++) col[k] = chosenPattern.counts[active[k] ?? 0] ?? 0;
      const r = rowOf.get(chosenPattern.stock);
      if (r !== undefined) col[r] = 1;
    } else col[enterUnit] = enterUnit < K ? -1 : 1;
    const chosen = { col, cost: enterCost, pattern: chosenPattern };
    let nzCount = 0;
    for (let c = 0; c < m; c++) if ((chosen.col[c] ?? 0) !== 0) nz[nzCount++] = c;
    const dir = dirBuf;
    for (let r = 0; r < m; r++) {
      let s = 0;
      const base = r * m;
      for (let q = 0; q < nzCount; q++) {
        const c = nz[q] ?? 0;
        s += (binv[base + c] ?? 0) * (chosen.col[c] ?? 0);
      }
      dir[r] = s;
    }
    let leave = -1;
    let ratio = Number.POSITIVE_INFINITY;
    for (let r = 0; r < m; r++) {
      const d = dir[r] ?? 0;
      if (d > EPS) {
        const t = (xB[r] ?? 0) / d;
        if (t < ratio - 1e-12 || (Math.abs(t - ratio) <= 1e-12 && artificial[r])) {
          ratio = t;
          leave = r;
        }
      }
    }
    if (leave < 0) break; // unbounded cannot happen with nonnegative prices; stop rather than loop
    const dl = dir[leave] ?? 1;
    const lb = leave * m;
    for (let c = 0; c < m; c++) binv[lb + c] = (binv[lb + c] ?? 0) / dl;
    xB[leave] = ratio;
    for (let r = 0; r < m; r++) {
      if (r === leave) continue;
      const f = dir[r] ?? 0;
      if (f === 0) continue;
      const base = r * m;
      for (let c = 0; c < m; c++) binv[base + c] = (binv[base + c] ?? 0) - f * (binv[lb + c] ?? 0);
      xB[r] = Math.max(0, (xB[r] ?? 0) - f * ratio);
    }
    cB[leave] = chosen.cost;
    basis[leave] = chosen.pattern;
    artificial[leave] = false;
  }

  let value = 0;
  let infeasible = false;
  const columns: { pattern: Pattern; x: number }[] = [];
  for (let r = 0; r < m; r++) {
    const x = xB[r] ?? 0;
    const p = basis[r];
    if (artificial[r] && x > 1e-6 && converged) infeasible = true;
    if (p && x > 1e-9) {
      columns.push({ pattern: p, x });
      value += x * (price[p.stock] ?? 0);
    }
  }
  const duals = new Array<number>(N).fill(0);
  for (let k = 0; k < K; k++) duals[active[k] ?? 0] = Math.max(0, pi[k] ?? 0) * 1e6;
  return { duals, columns, value: value * 1e6, converged, infeasible };
}
