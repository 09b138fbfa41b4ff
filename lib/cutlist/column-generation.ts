/** The Gilmore–Gomory LP of a linear plan. */
import { SCALE, type Instance } from './instance';
import { knapsack, unitOf, type Kind } from './knapsack';

/**
 * Gilmore–Gomory LP relaxation solved by column generation (revised simplex with an explicit basis
 * inverse, big-M start), returning the duals of the demand rows. Any duals give a valid bound through
 * `dualBound`, so an early stop costs only tightness.
 */
export function columnGenerationDuals(inst: Instance, kinds: readonly Kind[], deadline: number): number[] {
  const m1 = kinds.length;
  const finite = inst.stocks.map((s, i) => (s.available === Number.POSITIVE_INFINITY ? -1 : i)).filter((i) => i >= 0);
  const rowOf = new Map<number, number>();
  finite.forEach((s, r) => rowOf.set(s, m1 + r));
  const m = m1 + finite.length;
  const sizes = kinds.map((k) => k.size);
  const unit = unitOf(sizes);
  const demand = kinds.map((k) => k.pieces.length);
  const price = inst.stocks.map((s) => s.price / SCALE);
  const bigM = 2 * Math.max(1, ...price) + 1;
  const binv: number[][] = Array.from({ length: m }, (_, r) => Array.from({ length: m }, (_, c) => (r === c ? 1 : 0)));
  const xB: number[] = [...demand, ...finite.map((s) => inst.stocks[s]?.available ?? 0)];
  const cB: number[] = [...demand.map(() => bigM), ...finite.map(() => 0)];
  // Start from the cheapest one-kind pattern of unlimited stock for each kind, where there is one,
  // so the simplex need not first drive out the artificial columns.
  for (let i = 0; i < m1; i++) {
    let bestPerPiece = Number.POSITIVE_INFINITY;
    let perBoard = 0;
    inst.stocks.forEach((s, si) => {
      if (s.available !== Number.POSITIVE_INFINITY) return;
      const fit = Math.min(demand[i] ?? 0, Math.floor(s.cap / (sizes[i] ?? 1)));
      if (fit > 0 && (price[si] ?? 0) / fit < bestPerPiece) {
        bestPerPiece = (price[si] ?? 0) / fit;
        perBoard = fit;
      }
    });
    if (perBoard === 0) continue;
    const row = binv[i];
    if (row) row[i] = 1 / perBoard;
    xB[i] = (demand[i] ?? 0) / perBoard;
    cB[i] = bestPerPiece * perBoard;
  }
  const pi = new Array<number>(m).fill(0);
  const EPS = 1e-9;
  for (let iter = 0; iter < 2000 && Date.now() < deadline; iter++) {
    for (let c = 0; c < m; c++) {
      let s = 0;
      for (let r = 0; r < m; r++) s += (cB[r] ?? 0) * (binv[r]?.[c] ?? 0);
      pi[c] = s;
    }
    const values = pi.slice(0, m1);
    let enter: { col: number[]; cost: number; rc: number } | null = null;
    const offer = (col: number[], cost: number, rc: number): void => {
      if (rc < -EPS && (!enter || rc < enter.rc)) enter = { col, cost, rc };
    };
    for (let i = 0; i < m1; i++) {
      if ((pi[i] ?? 0) < -EPS) {
        const col = new Array<number>(m).fill(0);
        col[i] = -1;
        offer(col, 0, pi[i] ?? 0);
      }
    }
    for (let r = m1; r < m; r++) {
      if ((pi[r] ?? 0) > EPS) {
        const col = new Array<number>(m).fill(0);
        col[r] = 1;
        offer(col, 0, -(pi[r] ?? 0));
      }
    }
    inst.stocks.forEach((s, si) => {
      const best = knapsack(sizes, values, demand, s.cap, unit);
      const row = rowOf.get(si);
      const rc = (price[si] ?? 0) - best.value - (row === undefined ? 0 : (pi[row] ?? 0));
      const col = [...best.counts, ...finite.map(() => 0)];
      if (row !== undefined) col[row] = 1;
      offer(col, price[si] ?? 0, rc);
    });
    const chosen = enter as { col: number[]; cost: number; rc: number } | null;
    if (!chosen) break;
    const dir = binv.map((row) => row.reduce((a, b, c) => a + b * (chosen.col[c] ?? 0), 0));
    let leave = -1;
    let ratio = Number.POSITIVE_INFINITY;
    dir.forEach((d, r) => {
      if (d > EPS) {
        const t = (xB[r] ?? 0) / d;
        if (t < ratio - 1e-12) {
          ratio = t;
          leave = r;
        }
      }
    });
    if (leave < 0) break;
    const dl = dir[leave] ?? 1;
    const pivotRow = (binv[leave] ?? []).map((x) => x / dl);
    binv[leave] = pivotRow;
    xB[leave] = ratio;
    for (let r = 0; r < m; r++) {
      if (r === leave) continue;
      const f = dir[r] ?? 0;
      if (f === 0) continue;
      const row = binv[r] ?? [];
      for (let c = 0; c < m; c++) row[c] = (row[c] ?? 0) - f * (pivotRow[c] ?? 0);
      xB[r] = (xB[r] ?? 0) - f * ratio;
    }
    cB[leave] = chosen.cost;
  }
  return pi.slice(0, m1).map((x) => x * SCALE);
}

