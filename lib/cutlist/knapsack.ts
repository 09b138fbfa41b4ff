/** Piece kinds and the knapsack that prices a board pattern. */
import { expiredEvery, type Deadline } from './deadline';
import type { Instance } from './instance';

/** Pieces of one size, interchangeable for packing whatever part they belong to. */
export interface Kind {
  size: number;
  pieces: number[];
}

export function kindsOf(inst: Instance): Kind[] {
  const kinds: Kind[] = [];
  inst.pieces.forEach((p, i) => {
    const last = kinds[kinds.length - 1];
    if (last && last.size === p.size) last.pieces.push(i);
    else kinds.push({ size: p.size, pieces: [i] });
  });
  return kinds;
}

export const gcd = (a: number, b: number): number => (b === 0 ? a : gcd(b, a % b));
/** The largest length dividing every size: lengths in 1/16 in or tenths keep it coarse enough for a table. */
export const unitOf = (sizes: readonly number[]): number => sizes.reduce((g, s) => gcd(g, s), 0);

const KNAPSACK_NODES = 200_000;
const KNAPSACK_DP_CELLS = 4_000_000;
let tookBuffer = new Uint8Array(1 << 16);

/**
 * The same knapsack by dynamic programming over capacity in units of `unit` (a common divisor of the
 * sizes), with each kind's copies split in powers of two; null when the table would be too large.
 */
function knapsackDp(
  sizes: readonly number[],
  values: readonly number[],
  limit: readonly number[],
  cap: number,
  unit: number,
  tableCap: number,
): { value: number; upper: number; counts: number[] } | null {
  // dp[c] is the best value within c units, so one table up to the largest board serves every board
  // priced with the same values (the LP prices all stocks for one set of duals in a row).
  const last = lastTable;
  if (last && last.sizes === sizes && last.values === values && last.limit === limit && last.unit === unit && cap <= last.W * unit) {
    return readTable(last, sizes, Math.floor(cap / unit));
  }
  const itemsFor = (W: number): { kind: number; copies: number; units: number; value: number }[] => {
    const out: { kind: number; copies: number; units: number; value: number }[] = [];
    sizes.forEach((s, k) => {
      const v = values[k] ?? 0;
      const u = s / unit;
      if (v <= 0 || u > W) return;
      let rest = Math.min(limit[k] ?? 0, Math.floor(W / u));
      for (let c = 1; rest > 0; c *= 2) {
        const take = Math.min(c, rest);
        out.push({ kind: k, copies: take, units: take * u, value: take * v });
        rest -= take;
      }
    });
    return out;
  };
  let W = Math.floor(Math.max(cap, tableCap) / unit);
  let items = itemsFor(W);
  if (items.length * (W + 1) > KNAPSACK_DP_CELLS && tableCap > cap) {
    W = Math.floor(cap / unit);
    items = itemsFor(W);
  }
  if (items.length * (W + 1) > KNAPSACK_DP_CELLS) return null;
  const dp = new Float64Array(W + 1);
  // The choice table is reused between calls: the LP prices thousands of patterns.
  if (tookBuffer.length < items.length * (W + 1)) tookBuffer = new Uint8Array(Math.max(items.length * (W + 1), 2 * tookBuffer.length));
  const took = tookBuffer;
  took.fill(0, 0, items.length * (W + 1));
  items.forEach((it, idx) => {
    for (let c = W; c >= it.units; c--) {
      const v = (dp[c - it.units] ?? 0) + it.value;
      if (v > (dp[c] ?? 0)) {
        dp[c] = v;
        took[idx * (W + 1) + c] = 1;
      }
    }
  });
  lastTable = { sizes, values, limit, unit, W, items, dp, took };
  return readTable(lastTable, sizes, Math.floor(cap / unit));
}

interface DpTable {
  sizes: readonly number[];
  values: readonly number[];
  limit: readonly number[];
  unit: number;
  W: number;
  items: { kind: number; copies: number; units: number; value: number }[];
  dp: Float64Array;
  took: Uint8Array;
}
// The table of the last DP; its choice bits live in tookBuffer, so only the last one can be read back.
let lastTable: DpTable | null = null;

function readTable(t: DpTable, sizes: readonly number[], w: number): { value: number; upper: number; counts: number[] } {
  const counts = sizes.map(() => 0);
  let c = w;
  for (let idx = t.items.length - 1; idx >= 0; idx--) {
    const it = t.items[idx];
    if (it && t.took[idx * (t.W + 1) + c] === 1) {
      counts[it.kind] = (counts[it.kind] ?? 0) + it.copies;
      c -= it.units;
    }
  }
  const value = t.dp[w] ?? 0;
  return { value, upper: value, counts };
}


/**
 * Bounded knapsack by depth-first branch and bound with the Dantzig bound: the largest total value of
 * kinds (at most `limit[k]` of each) that fits in `cap`. Returns the best pattern found and an upper
 * bound on the true maximum, which equals the best value unless the node limit was hit.
 */
export function knapsack(
  sizes: readonly number[],
  values: readonly number[],
  limit: readonly number[],
  cap: number,
  unit = 0,
  deadline?: Deadline,
  tableCap = 0,
): { value: number; upper: number; counts: number[] } {
  if (unit > 0) {
    const dp = knapsackDp(sizes, values, limit, cap, unit, tableCap);
    if (dp) return dp;
  }
  const order = sizes
    .map((_, k) => k)
    .filter((k) => (values[k] ?? 0) > 0 && (sizes[k] ?? 0) <= cap && (limit[k] ?? 0) > 0)
    .sort((a, b) => (values[b] ?? 0) / (sizes[b] ?? 1) - (values[a] ?? 0) / (sizes[a] ?? 1));
  const counts = sizes.map(() => 0);
  let best = 0;
  let bestCounts = [...counts];
  let nodes = 0;
  const dantzig = (from: number, room: number): number => {
    let v = 0;
    for (let j = from; j < order.length && room > 0; j++) {
      const k = order[j] ?? 0;
      const w = sizes[k] ?? 1;
      const take = Math.min(limit[k] ?? 0, room / w);
      v += take * (values[k] ?? 0);
      room -= take * w;
    }
    return v;
  };
  const rootUpper = dantzig(0, cap);
  const dfs = (j: number, room: number, value: number): void => {
    if (value > best) {
      best = value;
      bestCounts = [...counts];
    }
    if (j === order.length || ++nodes > KNAPSACK_NODES || (deadline && expiredEvery(deadline))) {
      if (j !== order.length) nodes = KNAPSACK_NODES + 1;
      return;
    }
    if (value + dantzig(j, room) <= best * (1 + 1e-12)) return;
    const k = order[j] ?? 0;
    const w = sizes[k] ?? 1;
    for (let c = Math.min(limit[k] ?? 0, Math.floor(room / w)); c >= 0; c--) {
      counts[k] = c;
      dfs(j + 1, room - c * w, value + c * (values[k] ?? 0));
    }
    counts[k] = 0;
  };
  dfs(0, cap, 0);
  return { value: best, upper: nodes > KNAPSACK_NODES ? Math.max(best, rootUpper) : best, counts: bestCounts };
}
