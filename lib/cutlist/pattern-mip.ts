/**
 * A quick plan finder: the integer program over the board patterns the pattern LP and the dives have
 * generated so far (plus the boards of the best plan, so it is never worse), solved by HiGHS. Small
 * (one column per pattern, one row per kind), so it takes milliseconds; it finds plans at the LP bound
 * that the dives missed. It proves nothing: better patterns may be missing from the pool.
 *
 * Source: "price and branch", the integer master over the root's columns, as in F. Vanderbeck,
 * "Computational study of a column generation algorithm for bin packing and cutting stock problems",
 * Math. Programming 86 (1999) §5, and C. Alves and J. M. Valério de Carvalho, Comput. Oper. Res. 35 (2008).
 */
import type { Deadline } from './deadline';
import type { LpStock, Pattern } from './pattern-lp';
import { gcd } from './knapsack';
import { integerModel, solveMip } from './mip';

/** The cheapest whole number of boards of each pattern (the incumbent's boards and the pool) covering `demand`, or null. */
export function solvePatternMip(
  demand: readonly number[],
  stocks: readonly LpStock[],
  pool: readonly Pattern[],
  incumbent: readonly Pattern[],
  deadline: Deadline,
): Pattern[] | null {
  const keyOf = (p: Pattern): string => `${p.stock}:${p.counts.join(',')}`;
  const seen = new Set<string>();
  const columns = [...incumbent, ...pool].filter((p) => {
    const key = keyOf(p);
    if (seen.has(key) || !stocks[p.stock] || p.counts.every((c) => c === 0)) return false;
    seen.add(key);
    return true;
  });
  if (columns.length === 0) return null;
  const K = demand.length;
  const priceUnit = stocks.reduce((g, s) => gcd(g, s.price), 0) || 1;
  const limited = stocks.map((s, i) => (Number.isFinite(s.available) ? i : -1)).filter((i) => i >= 0);
  const availRow = new Map(limited.map((s, r) => [s, K + r]));
  const numRows = K + limited.length;
  const numCols = columns.length;
  const starts = new Int32Array(numCols + 1);
  const indices: number[] = [];
  const values: number[] = [];
  const colCost = new Float64Array(numCols);
  const colUpper = new Float64Array(numCols);
  const most = demand.reduce((a, b) => a + b, 0);
  columns.forEach((p, j) => {
    p.counts.forEach((c, k) => {
      if (c > 0 && k < K) {
        indices.push(k);
        values.push(c);
      }
    });
    const row = availRow.get(p.stock);
    if (row !== undefined) {
      indices.push(row);
      values.push(1);
    }
    colCost[j] = (stocks[p.stock]?.price ?? 0) / priceUnit;
    colUpper[j] = Math.min(most, stocks[p.stock]?.available ?? most);
    starts[j + 1] = indices.length;
  });
  const rowLower = new Float64Array(numRows);
  const rowUpper = new Float64Array(numRows).fill(Number.POSITIVE_INFINITY);
  demand.forEach((d, k) => (rowLower[k] = d));
  limited.forEach((s, r) => {
    rowLower[K + r] = Number.NEGATIVE_INFINITY;
    rowUpper[K + r] = stocks[s]?.available ?? 0;
  });
  // The incumbent plan as the starting solution, so HiGHS only looks for cheaper ones.
  const column = new Map(columns.map((p, j) => [keyOf(p), j]));
  const start = new Float64Array(numCols);
  for (const p of incumbent) {
    const j = column.get(keyOf(p));
    if (j !== undefined) start[j] = (start[j] ?? 0) + 1;
  }
  const result = solveMip(
    integerModel({ colCost, colUpper, rowLower, rowUpper, starts, indices, values }),
    deadline,
    incumbent.length > 0 ? start : undefined,
  );
  if (!result?.solution) return null;
  const out: Pattern[] = [];
  result.solution.forEach((x, j) => {
    const p = columns[j];
    for (let c = 0; p && c < Math.round(x); c++) out.push(p);
  });
  return out;
}
