/**
 * The exact stage: the whole plan as an integer program over an arc-flow graph, solved by HiGHS (mip.ts).
 *
 * Nodes are positions along a board in units of the coarsest exact grid (the gcd of the piece sizes;
 * a capacity rounds down to it, which refuses nothing, since every load is a multiple of it). An arc
 * p -> p + size_k cuts one piece of kind k; kinds go in decreasing size along every path (any board's
 * pieces can be put in that order), so an arc of kind k leaves p only if some path reaches p with
 * kinds no smaller. A board of stock s ends at a node p <= its capacity by a loss arc to the sink of s,
 * priced at the board; a loss arc is left out where an unlimited stock no dearer also holds p. One
 * graph serves every stock length: flow conservation at each node, at least the demand of each kind,
 * at most the boards available of each stock.
 *
 * Source: J. M. Valério de Carvalho, "Exact solution of bin-packing problems using column generation
 * and branch-and-bound", Annals of Operations Research 86 (1999), and "LP models for bin packing and
 * cutting stock problems", EJOR 141 (2002) §4 (the variable-sized graph with several sinks).
 */
import { type Deadline } from './deadline';
import { gcd, unitOf, type Kind } from './knapsack';
import { integerModel, solveMip, type MipModel } from './mip';
import type { Bin, Instance, Solution } from './instance';
import { fixByReducedCost, type FixingDuals } from './reduced-cost-fixing';

/**
 * Larger graphs are skipped. Measured (README.md): one length of board (Falkenauer t60, about 6,700
 * columns) solves in about a second; woodworking lists on three to five lengths (3,000–15,000 columns)
 * rarely finished their root LP inside a 2 s call, and HiGHS cannot be stopped inside that LP. With
 * reduced-cost fixing the limit counts the columns left after it (0–1,000 on those lists); 6,000 for
 * several lengths proved 95, 97, 94 of 100 against 92, 96, 99 at 2,500 (interleaved, load 5–8), so it stays.
 */
export const MAX_ARC_FLOW_COLUMNS = { oneLength: 8_000, severalLengths: 2_500 };
/**
 * Item arcs built before reduced-cost fixing: building and labelling them is linear and takes a few
 * milliseconds (woodworking lists on five lengths make up to about 21,000, bench/cutlist/run.ts).
 */
const MAX_CANDIDATE_ARCS = 60_000;
/** Largest board price in objective units, so a bound within HiGHS's tolerance still rounds to the right unit. */
const MAX_PRICE_UNITS = 100_000;
/** Positions per board in grid units; beyond this the graph is not built at all. */
const MAX_POSITIONS = 200_000;

export interface ArcFlowResult {
  /** The solver's plan, checked against the instance; null if it found none in time. */
  best: Solution | null;
  /** Proven lower bound on the cost, micro-dollars (0 when the solver proved nothing). */
  lb: number;
  /** HiGHS closed the gap: no plan costs less than `best`. */
  optimal: boolean;
}

interface Graph {
  model: MipModel;
  /** Item arcs: from, kind (the target is from + size). */
  arcFrom: Int32Array;
  arcKind: Int32Array;
  /** Loss arcs after the item arcs: node position, stock. */
  lossAt: Int32Array;
  lossStock: Int32Array;
  sizes: number[]; // grid units per kind
  priceUnit: number; // micro-dollars per objective unit
}

/** Objective in whole units of the prices' gcd, so HiGHS sees an integral objective; every plan costs a multiple. */
function priceUnitOf(inst: Instance): number {
  return inst.stocks.reduce((g, s) => gcd(g, s.price), 0) || 1;
}

/** Reduced-cost fixing (reduced-cost-fixing.ts): the duals and the dearest plan still wanted. */
export interface ArcFlowFixing {
  duals: FixingDuals;
  /** Micro-dollars: arcs only plans dearer than this can use are left out. */
  target: number;
}

/**
 * The arc-flow model of `inst`, or null when it would exceed `maxColumns`. With `fixing`, arcs that no
 * plan costing at most `fixing.target` can use are left out first, and `maxColumns` counts what is left.
 */
export function buildArcFlow(
  inst: Instance,
  kinds: readonly Kind[],
  maxColumns = inst.stocks.length === 1 ? MAX_ARC_FLOW_COLUMNS.oneLength : MAX_ARC_FLOW_COLUMNS.severalLengths,
  fixing?: ArcFlowFixing,
): Graph | null {
  const K = kinds.length;
  const grid = unitOf(kinds.map((k) => k.size));
  if (K === 0 || grid <= 0) return null;
  const sizes = kinds.map((k) => k.size / grid);
  const demand = kinds.map((k) => k.pieces.length);
  const stocks = inst.stocks;
  // No board holds more than all the pieces: positions past their total length are never reached by a
  // plan, and leaving them out keeps short lists on long boards small (two 2 in pieces on an 89 in board
  // made 2,600 columns, more than the limit, for a plan of one board).
  const total = sizes.reduce((a, size, k) => a + size * (demand[k] ?? 0), 0);
  const caps = stocks.map((s) => Math.min(total, Math.floor(s.cap / grid)));
  const W = Math.max(0, ...caps);
  if (W > MAX_POSITIONS) return null;
  const priceUnit = priceUnitOf(inst);
  // Prices to the micro-dollar would make units too fine for a solver that works to about 1e-6.
  if (Math.max(0, ...stocks.map((s) => s.price)) / priceUnit > MAX_PRICE_UNITS) return null;

  // minLast[p]: the smallest kind index that ends a decreasing path to p (K when p is not reached).
  const minLast = new Int32Array(W + 1).fill(K);
  minLast[0] = 0;
  const candidateLimit = fixing ? MAX_CANDIDATE_ARCS : maxColumns;
  let arcFrom: number[] = [];
  let arcKind: number[] = [];
  for (let p = 0; p <= W; p++) {
    const first = minLast[p] ?? K;
    for (let k = first; k < K; k++) {
      const q = p + (sizes[k] ?? 0);
      if (q > W) continue;
      arcFrom.push(p);
      arcKind.push(k);
      if (k < (minLast[q] ?? K)) minLast[q] = k;
    }
    if (arcFrom.length > candidateLimit) return null;
  }
  // Loss arcs: a board of stock i may end at p unless an unlimited stock no dearer also holds p.
  const dominated = (p: number, i: number): boolean =>
    stocks.some((t, j) => j !== i && (caps[j] ?? 0) >= p && !Number.isFinite(t.available) && (t.price < (stocks[i]?.price ?? 0) || (t.price === stocks[i]?.price && j < i)));
  let keepLoss = (p: number, i: number): boolean => (caps[i] ?? 0) >= p;
  if (fixing) {
    const fixed = fixByReducedCost({ W, arcFrom, arcKind, sizes, caps, prices: stocks.map((s) => s.price) }, fixing.duals, fixing.target);
    const kept = pruneDeadArcs(W, arcFrom, arcKind, sizes, fixed.keepArc, (p) => stocks.some((_, i) => fixed.keepLoss(p, i)));
    arcFrom = kept.arcFrom;
    arcKind = kept.arcKind;
    keepLoss = fixed.keepLoss;
  }
  const reached = new Uint8Array(W + 1);
  arcFrom.forEach((p, a) => (reached[p + (sizes[arcKind[a] ?? 0] ?? 0)] = 1));
  const nodeRow = new Int32Array(W + 1).fill(-1);
  let nodes = 0;
  for (let p = 1; p <= W; p++) if (reached[p]) nodeRow[p] = nodes++;

  const lossAt: number[] = [];
  const lossStock: number[] = [];
  for (let p = 1; p <= W; p++) {
    if ((nodeRow[p] ?? -1) < 0) continue;
    stocks.forEach((_, i) => {
      if (keepLoss(p, i) && !dominated(p, i)) {
        lossAt.push(p);
        lossStock.push(i);
      }
    });
  }
  const numCols = arcFrom.length + lossAt.length;
  if (numCols > maxColumns) return null;

  // Rows: one per node (flow in = flow out), one per kind (demand), one per stock with a limit.
  const availRow = stocks.map(() => -1);
  let numRows = nodes + K;
  stocks.forEach((s, i) => {
    if (Number.isFinite(s.available)) availRow[i] = numRows++;
  });
  const totalPieces = demand.reduce((a, b) => a + b, 0);
  const starts = new Int32Array(numCols + 1);
  const indices: number[] = [];
  const values: number[] = [];
  const colCost = new Float64Array(numCols);
  const colUpper = new Float64Array(numCols);
  let col = 0;
  arcFrom.forEach((p, a) => {
    const k = arcKind[a] ?? 0;
    const q = p + (sizes[k] ?? 0);
    if (p > 0) {
      indices.push(nodeRow[p] ?? 0);
      values.push(-1);
    }
    indices.push(nodeRow[q] ?? 0, nodes + k);
    values.push(1, 1);
    colUpper[col] = demand[k] ?? 0;
    starts[++col] = indices.length;
  });
  lossAt.forEach((p, a) => {
    const s = lossStock[a] ?? 0;
    const stock = stocks[s];
    indices.push(nodeRow[p] ?? 0);
    values.push(-1);
    const row = availRow[s] ?? -1;
    if (row >= 0) {
      indices.push(row);
      values.push(1);
    }
    colCost[col] = (stock?.price ?? 0) / priceUnit;
    colUpper[col] = Math.min(stock?.available ?? totalPieces, totalPieces);
    starts[++col] = indices.length;
  });
  const rowLower = new Float64Array(numRows);
  const rowUpper = new Float64Array(numRows);
  for (let k = 0; k < K; k++) {
    rowLower[nodes + k] = demand[k] ?? 0;
    rowUpper[nodes + k] = Number.POSITIVE_INFINITY;
  }
  stocks.forEach((s, i) => {
    const row = availRow[i] ?? -1;
    if (row < 0) return;
    rowLower[row] = Number.NEGATIVE_INFINITY;
    rowUpper[row] = s.available;
  });
  return {
    model: integerModel({ colCost, colUpper, rowLower, rowUpper, starts, indices, values }),
    arcFrom: Int32Array.from(arcFrom),
    arcKind: Int32Array.from(arcKind),
    lossAt: Int32Array.from(lossAt),
    lossStock: Int32Array.from(lossStock),
    sizes,
    priceUnit,
  };
}

/**
 * The arcs on some path from position 0 to a board end: `keep` marks the candidates, `canEnd(p)` whether
 * a board may end at p. Arcs come in increasing order of their tail, and so do the ones returned.
 */
function pruneDeadArcs(
  W: number,
  arcFrom: readonly number[],
  arcKind: readonly number[],
  sizes: readonly number[],
  keep: Uint8Array,
  canEnd: (p: number) => boolean,
): { arcFrom: number[]; arcKind: number[] } {
  const head = (a: number): number => (arcFrom[a] ?? 0) + (sizes[arcKind[a] ?? 0] ?? 0);
  const alive = new Uint8Array(W + 1);
  for (let p = 1; p <= W; p++) if (canEnd(p)) alive[p] = 1;
  for (let a = arcFrom.length - 1; a >= 0; a--) if (keep[a] && alive[head(a)]) alive[arcFrom[a] ?? 0] = 1;
  const reach = new Uint8Array(W + 1);
  reach[0] = 1;
  const out = { arcFrom: [] as number[], arcKind: [] as number[] };
  arcFrom.forEach((p, a) => {
    if (!keep[a] || !reach[p] || !alive[head(a)]) return;
    reach[head(a)] = 1;
    out.arcFrom.push(p);
    out.arcKind.push(arcKind[a] ?? 0);
  });
  return out;
}

/** The column values of `sol` in graph `g` (every board a decreasing path), or undefined if one has no arc. */
function startOf(g: Graph, inst: Instance, kinds: readonly Kind[], sol: Solution): Float64Array | undefined {
  const kindOf = new Map<number, number>();
  kinds.forEach((k, idx) => k.pieces.forEach((i) => kindOf.set(i, idx)));
  const K = kinds.length;
  const itemCol = new Map<number, number>();
  g.arcFrom.forEach((p, a) => itemCol.set(p * K + (g.arcKind[a] ?? 0), a));
  const lossCol = new Map<number, number>();
  const S = inst.stocks.length;
  g.lossAt.forEach((p, a) => lossCol.set(p * S + (g.lossStock[a] ?? 0), g.arcFrom.length + a));
  const x = new Float64Array(g.model.numCols);
  for (const bin of sol.bins) {
    const ks = bin.items.map((i) => kindOf.get(i) ?? -1).sort((a, b) => a - b);
    let p = 0;
    for (const k of ks) {
      const a = itemCol.get(p * K + k);
      if (a === undefined) return undefined;
      x[a] = (x[a] ?? 0) + 1;
      p += g.sizes[k] ?? 0;
    }
    const l = lossCol.get(p * S + bin.stock);
    if (l === undefined) return undefined;
    x[l] = (x[l] ?? 0) + 1;
  }
  return x;
}

/** Whether every board of `sol` is a path of graph `g` (after reduced-cost fixing, for tests). */
export function graphHolds(g: Graph, inst: Instance, kinds: readonly Kind[], sol: Solution): boolean {
  return startOf(g, inst, kinds, sol) !== undefined;
}

/** Boards from the flow: paths from position 0 to a sink, pieces handed out by kind; null if not a full plan. */
export function decodeArcFlow(g: Graph, inst: Instance, kinds: readonly Kind[], x: Float64Array): Solution | null {
  const flow = Int32Array.from(x, (v) => Math.round(v));
  const out = new Map<number, number[]>(); // position -> columns leaving it
  const add = (p: number, c: number): void => {
    const list = out.get(p);
    if (list) list.push(c);
    else out.set(p, [c]);
  };
  g.arcFrom.forEach((p, a) => add(p, a));
  g.lossAt.forEach((p, a) => add(p, g.arcFrom.length + a));
  const queues = kinds.map((k) => [...k.pieces]);
  const bins: Bin[] = [];
  const used = inst.stocks.map(() => 0);
  for (let guard = 0; guard <= inst.pieces.length; guard++) {
    let p = 0;
    const items: number[] = [];
    let load = 0;
    let stock = -1;
    for (;;) {
      const c = (out.get(p) ?? []).find((col) => (flow[col] ?? 0) > 0);
      if (c === undefined) break;
      flow[c] = (flow[c] ?? 0) - 1;
      if (c >= g.arcFrom.length) {
        stock = g.lossStock[c - g.arcFrom.length] ?? -1;
        break;
      }
      const k = g.arcKind[c] ?? 0;
      p += g.sizes[k] ?? 0;
      // More pieces than wanted of a kind (the demand rows are ">="): the extra is simply not cut.
      const i = queues[k]?.pop();
      if (i === undefined) continue;
      items.push(i);
      load += inst.pieces[i]?.size ?? 0;
    }
    if (p === 0) break; // no flow left at the start
    const st = inst.stocks[stock];
    if (!st || load > st.cap || (used[stock] ?? 0) >= st.available) return null;
    used[stock] = (used[stock] ?? 0) + 1;
    if (items.length > 0) bins.push({ stock, load, items });
  }
  if (queues.some((q) => q.length > 0)) return null;
  return inst.solution(bins, []);
}

/**
 * Solves the arc-flow model until `deadline`, starting from `incumbent`. The plan is decoded and checked;
 * the bound is HiGHS's dual bound rounded up to a whole price unit (the objective is integral).
 *
 * With `duals` (bounds.ts `dualBound`) and an incumbent, the model is only asked for a cheaper plan:
 * arcs that only plans costing at least the incumbent can use are left out (reduced-cost-fixing.ts),
 * which on woodworking lists of five lengths leaves a fraction of the graph. Then a model with no plan
 * proves the incumbent least-cost, and HiGHS's bound holds only up to the incumbent's cost.
 */
export function arcFlowSearch(
  inst: Instance,
  kinds: readonly Kind[],
  incumbent: Solution | null,
  deadline: Deadline,
  duals?: FixingDuals,
): ArcFlowResult | null {
  const fixTo = duals && incumbent && incumbent.score.unplaced === 0 ? incumbent.score.cost - priceUnitOf(inst) : null;
  const g = buildArcFlow(inst, kinds, undefined, duals && fixTo !== null ? { duals, target: fixTo } : undefined);
  if (!g) return null;
  const ceiling = fixTo !== null && incumbent ? incumbent.score.cost : Number.POSITIVE_INFINITY;
  // A kind no arc cuts any more: no plan cheaper than the incumbent exists.
  const cut = new Uint8Array(kinds.length);
  g.arcKind.forEach((k) => (cut[k] = 1));
  if (fixTo !== null && cut.includes(0)) return { best: null, lb: ceiling, optimal: true };
  const start = incumbent && fixTo === null ? startOf(g, inst, kinds, incumbent) : undefined;
  const result = solveMip(g.model, deadline, start);
  if (!result) return null;
  if (result.infeasible) {
    // With fixing, no plan below the incumbent; without, no plan at all (too few boards available).
    return fixTo !== null ? { best: null, lb: ceiling, optimal: true } : { best: null, lb: 0, optimal: false };
  }
  const best = result.solution ? decodeArcFlow(g, inst, kinds, result.solution) : null;
  const dual = result.dualBound;
  // HiGHS works to tolerances near 1e-7, so a bound a hair above a whole unit is not rounded up past it;
  // mip-worker.mjs stops at a gap of 0.99 units, well inside what this rounding still closes.
  const units = dual !== null && Number.isFinite(dual) ? Math.ceil(dual - 1e-3) : 0;
  const bound = Math.max(0, units * g.priceUnit);
  // Paths of the fixed graph may still make plans dearer than the target (its path worths ignore the
  // demand limits): a bound at the incumbent's cost or above still proves that nothing is cheaper.
  if (bound >= ceiling) return { best: null, lb: ceiling, optimal: true };
  const cheaper = best && best.score.cost < ceiling ? best : null;
  const lb = Math.min(ceiling, bound);
  const optimal = result.optimal && cheaper !== null && cheaper.score.cost <= lb;
  return { best: cheaper, lb: optimal ? (cheaper?.score.cost ?? lb) : lb, optimal };
}
