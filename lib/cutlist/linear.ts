/**
 * Linear cut planning: which boards to buy and where each piece is cut.
 *
 * Everything inside works in integer micro-inches and micro-dollars so an exactly full board is
 * never refused for a floating-point hair. With the kerf rule of the issue (each piece is followed
 * by one kerf unless it ends at the usable end) a set of pieces fits a board iff
 * sum(length + kerf) <= usable + kerf, so each piece is packed with size `length + kerf` into a bin
 * of capacity `usable + kerf`: the plan is a bin packing with costed bin types.
 */

export interface LinearPart {
  id: string;
  length: number;
  quantity: number;
  label?: string;
}

export interface LinearStock {
  id: string;
  length: number;
  price: number;
  available?: number;
}

export interface LinearCutRequest {
  kerf: number;
  endTrim?: number;
  parts: LinearPart[];
  stock: LinearStock[];
  timeLimitMs?: number;
}

export interface LinearCut {
  partId: string;
  start: number;
  length: number;
}

export interface LinearBoard {
  stockId: string;
  length: number;
  cuts: LinearCut[];
  offcut: number;
}

export interface LinearPurchase {
  stockId: string;
  count: number;
  cost: number;
}

export interface LinearUnplaced {
  partId: string;
  quantity: number;
  reason: string;
}

export interface LinearCutPlan {
  boards: LinearBoard[];
  purchase: LinearPurchase[];
  totalCost: number;
  lowerBound: number;
  optimal: boolean;
  unplaced: LinearUnplaced[];
}

const SCALE = 1_000_000;
const toMicro = (x: number): number => Math.round(x * SCALE);

interface Piece {
  part: number;
  len: number; // micro-inches
  size: number; // len + kerf
}

interface StockType {
  index: number;
  cap: number; // usable + kerf, micro-inches
  price: number; // micro-dollars
  available: number;
}

interface Bin {
  stock: number; // index into the internal stock list
  load: number;
  items: number[]; // piece indices
}

interface Score {
  unplaced: number;
  cost: number;
  boards: number;
  longestOffcut: number;
}

interface Solution {
  bins: Bin[];
  unplaced: number[];
  score: Score;
}

/** Lexicographic: fewer unplaced pieces, least cost, fewest boards, longest single offcut. */
function better(a: Score, b: Score): boolean {
  if (a.unplaced !== b.unplaced) return a.unplaced < b.unplaced;
  if (a.cost !== b.cost) return a.cost < b.cost;
  if (a.boards !== b.boards) return a.boards < b.boards;
  return a.longestOffcut > b.longestOffcut;
}

class Instance {
  readonly pieces: Piece[];
  readonly stocks: StockType[];
  readonly kerf: number;
  readonly trim: number;
  readonly unfit: number[]; // parts too long for every stock

  constructor(req: LinearCutRequest) {
    validate(req);
    this.kerf = toMicro(req.kerf);
    this.trim = toMicro(req.endTrim ?? 0);
    this.stocks = req.stock
      .map((s, index) => ({
        index,
        cap: toMicro(s.length) - 2 * this.trim + this.kerf,
        price: toMicro(s.price),
        available: s.available ?? Number.POSITIVE_INFINITY,
      }))
      .filter((s) => s.cap > this.kerf && s.available > 0);
    const maxCap = Math.max(0, ...this.stocks.map((s) => s.cap));
    this.pieces = [];
    this.unfit = [];
    req.parts.forEach((p, part) => {
      const len = toMicro(p.length);
      if (p.quantity > 0 && len + this.kerf > maxCap) {
        this.unfit.push(part);
        return;
      }
      for (let q = 0; q < p.quantity; q++) this.pieces.push({ part, len, size: len + this.kerf });
    });
    // Decreasing size; ties by part so equal pieces sit together.
    this.pieces.sort((a, b) => b.size - a.size || a.part - b.part);
  }

  offcutOf(bin: Bin): number {
    const stock = this.stocks[bin.stock];
    if (!stock) return 0;
    // cap - load is what follows the last piece; its kerf comes out of that unless it is the usable end.
    return Math.max(0, stock.cap - bin.load - this.kerf);
  }

  score(bins: Bin[], unplaced: number): Score {
    let cost = 0;
    let longestOffcut = 0;
    for (const b of bins) {
      cost += this.stocks[b.stock]?.price ?? 0;
      longestOffcut = Math.max(longestOffcut, this.offcutOf(b));
    }
    return { unplaced, cost, boards: bins.length, longestOffcut };
  }

  solution(bins: Bin[], unplaced: number[]): Solution {
    return { bins, unplaced, score: this.score(bins, unplaced.length) };
  }
}

function validate(req: LinearCutRequest): void {
  const finiteNonNegative = (x: number): boolean => Number.isFinite(x) && x >= 0;
  if (!finiteNonNegative(req.kerf)) throw new RangeError('kerf must be a number of inches, 0 or more.');
  if (req.endTrim !== undefined && !finiteNonNegative(req.endTrim)) {
    throw new RangeError('endTrim must be a number of inches, 0 or more.');
  }
  const ids = new Set<string>();
  for (const p of req.parts) {
    if (ids.has(p.id)) throw new RangeError(`Part id ${p.id} appears twice.`);
    ids.add(p.id);
    if (!(Number.isFinite(p.length) && p.length > 0)) throw new RangeError(`Part ${p.id} needs a length above 0.`);
    if (!(Number.isInteger(p.quantity) && p.quantity >= 0)) throw new RangeError(`Part ${p.id} needs a whole quantity.`);
  }
  const stockIds = new Set<string>();
  for (const s of req.stock) {
    if (stockIds.has(s.id)) throw new RangeError(`Stock id ${s.id} appears twice.`);
    stockIds.add(s.id);
    if (!(Number.isFinite(s.length) && s.length > 0)) throw new RangeError(`Stock ${s.id} needs a length above 0.`);
    if (!finiteNonNegative(s.price)) throw new RangeError(`Stock ${s.id} needs a price of 0 or more.`);
    if (s.available !== undefined && !(Number.isInteger(s.available) && s.available >= 0)) {
      throw new RangeError(`Stock ${s.id} needs a whole number available.`);
    }
  }
  if (req.timeLimitMs !== undefined && !finiteNonNegative(req.timeLimitMs)) {
    throw new RangeError('timeLimitMs must be 0 or more.');
  }
}

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
function cheapestBoards(stocks: readonly StockType[], n: number): number {
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
function continuousCost(stocks: readonly StockType[], space: number, used?: readonly number[]): number {
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

function lowerBound(inst: Instance, pieceIdx: readonly number[]): number {
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

// ---------- heuristics ----------

type Chooser = (size: number, used: readonly number[]) => number;

function chooserFor(inst: Instance, preferred: number | null): Chooser {
  const byValue = inst.stocks.map((_, i) => i).sort((a, b) => {
    const sa = inst.stocks[a];
    const sb = inst.stocks[b];
    if (!sa || !sb) return 0;
    return sa.price / sa.cap - sb.price / sb.cap || sb.cap - sa.cap;
  });
  return (size, used) => {
    if (preferred !== null) {
      const s = inst.stocks[preferred];
      if (s && s.cap >= size && (used[preferred] ?? 0) < s.available) return preferred;
    }
    for (const i of byValue) {
      const s = inst.stocks[i];
      if (s && s.cap >= size && (used[i] ?? 0) < s.available) return i;
    }
    return -1;
  };
}

function greedy(inst: Instance, order: readonly number[], bestFit: boolean, choose: Chooser): Solution {
  const bins: Bin[] = [];
  const used = inst.stocks.map(() => 0);
  const unplaced: number[] = [];
  for (const i of order) {
    const size = inst.pieces[i]?.size ?? 0;
    let target: Bin | undefined;
    let targetRest = Number.POSITIVE_INFINITY;
    for (const b of bins) {
      const rest = (inst.stocks[b.stock]?.cap ?? 0) - b.load - size;
      if (rest < 0) continue;
      if (!bestFit) {
        target = b;
        break;
      }
      if (rest < targetRest) {
        target = b;
        targetRest = rest;
      }
    }
    if (!target) {
      const s = choose(size, used);
      if (s < 0) {
        unplaced.push(i);
        continue;
      }
      used[s] = (used[s] ?? 0) + 1;
      target = { stock: s, load: 0, items: [] };
      bins.push(target);
    }
    target.load += size;
    target.items.push(i);
  }
  return inst.solution(bins, unplaced);
}

/** Moves each board to the cheapest stock that still holds its pieces, fullest boards first. */
function downgrade(inst: Instance, sol: Solution): Solution {
  const used = inst.stocks.map(() => 0);
  const bins = [...sol.bins].sort((a, b) => b.load - a.load).map((b) => ({ ...b, items: [...b.items] }));
  for (const b of bins) used[b.stock] = (used[b.stock] ?? 0) + 1;
  for (const b of bins) {
    const current = inst.stocks[b.stock];
    if (!current) continue;
    let bestIdx = b.stock;
    let bestPrice = current.price;
    let bestCap = current.cap;
    inst.stocks.forEach((s, i) => {
      if (i === b.stock || s.cap < b.load || (used[i] ?? 0) >= s.available) return;
      if (s.price < bestPrice || (s.price === bestPrice && s.cap > bestCap)) {
        bestIdx = i;
        bestPrice = s.price;
        bestCap = s.cap;
      }
    });
    if (bestIdx !== b.stock) {
      used[b.stock] = (used[b.stock] ?? 0) - 1;
      used[bestIdx] = (used[bestIdx] ?? 0) + 1;
      b.stock = bestIdx;
    }
  }
  return inst.solution(bins, sol.unplaced);
}

/**
 * Minimum bin slack with the largest piece fixed (after Gupta and Ho 1999; Fleszar and Hindi 2002):
 * each new board gets the subset of the remaining pieces that leaves the least slack.
 */
function minimumSlack(inst: Instance, deadline: number): Solution {
  const remaining = inst.pieces.map((_, i) => i);
  const bins: Bin[] = [];
  const used = inst.stocks.map(() => 0);
  const unplaced: number[] = [];
  const size = (i: number): number => inst.pieces[i]?.size ?? 0;
  while (remaining.length > 0) {
    const first = remaining[0];
    if (first === undefined) break;
    const pick: { bin: Bin | null; rate: number } = { bin: null, rate: Number.POSITIVE_INFINITY };
    inst.stocks.forEach((s, si) => {
      if (s.cap < size(first) || (used[si] ?? 0) >= s.available) return;
      const chosen = [first];
      let bestSet = [first];
      let bestLoad = size(first);
      let nodes = 0;
      const search = (from: number, load: number): boolean => {
        if (load > bestLoad) {
          bestLoad = load;
          bestSet = [...chosen];
          if (bestLoad === s.cap) return true;
        }
        for (let k = from; k < remaining.length; k++) {
          const i = remaining[k];
          if (i === undefined) continue;
          // Equal sizes: only take the first of a run at each depth.
          if (k > from && size(remaining[k - 1] ?? -1) === size(i)) continue;
          if (load + size(i) > s.cap) continue;
          if (++nodes > 20_000 || (nodes % DEADLINE_CHECK_EVERY === 0 && Date.now() > deadline)) return true;
          chosen.push(i);
          if (search(k + 1, load + size(i))) return true;
          chosen.pop();
        }
        return false;
      };
      search(1, size(first));
      const rate = s.price / bestLoad;
      if (rate < pick.rate || (rate === pick.rate && pick.bin !== null && bestLoad > pick.bin.load)) {
        pick.rate = rate;
        pick.bin = { stock: si, load: bestLoad, items: bestSet };
      }
    });
    const bin = pick.bin;
    if (bin === null) {
      unplaced.push(first);
      remaining.shift();
      continue;
    }
    used[bin.stock] = (used[bin.stock] ?? 0) + 1;
    bins.push(bin);
    const taken = new Set(bin.items);
    for (let k = remaining.length - 1; k >= 0; k--) if (taken.has(remaining[k] ?? -1)) remaining.splice(k, 1);
  }
  return inst.solution(bins, unplaced);
}

/** Small deterministic PRNG (mulberry32) so plans are reproducible. */
function rng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Ruin and recreate: empty a few boards, refill them best-fit into the rest, keep the result if not worse. */
function improve(inst: Instance, start: Solution, lb: number, deadline: number): Solution {
  let best = start;
  let current = start;
  const random = rng(12345);
  const choose = chooserFor(inst, null);
  let iter = 0;
  while (best.score.cost > lb && Date.now() < deadline) {
    iter++;
    const bins = current.bins.map((b) => ({ ...b, items: [...b.items] }));
    if (bins.length === 0) break;
    // Prefer emptying the least full boards.
    bins.sort((a, b) => a.load / (inst.stocks[a.stock]?.cap ?? 1) - b.load / (inst.stocks[b.stock]?.cap ?? 1));
    const k = 1 + Math.floor(random() * Math.min(3, bins.length));
    const freed: number[] = [...current.unplaced];
    const removed = new Set<number>();
    for (let r = 0; r < k; r++) {
      const pick = Math.floor(Math.pow(random(), 2) * bins.length);
      if (!removed.has(pick)) removed.add(pick);
    }
    // Also shake one random fuller board so the refill has room to move.
    removed.add(Math.floor(random() * bins.length));
    const kept: Bin[] = [];
    bins.forEach((b, i) => {
      if (removed.has(i)) freed.push(...b.items);
      else kept.push(b);
    });
    freed.sort((a, b) => (inst.pieces[b]?.size ?? 0) - (inst.pieces[a]?.size ?? 0) || random() - 0.5);
    const used = inst.stocks.map(() => 0);
    for (const b of kept) used[b.stock] = (used[b.stock] ?? 0) + 1;
    const unplaced: number[] = [];
    for (const i of freed) {
      const size = inst.pieces[i]?.size ?? 0;
      let target: Bin | undefined;
      let targetRest = Number.POSITIVE_INFINITY;
      for (const b of kept) {
        const rest = (inst.stocks[b.stock]?.cap ?? 0) - b.load - size;
        if (rest >= 0 && rest < targetRest) {
          target = b;
          targetRest = rest;
        }
      }
      if (!target) {
        const s = choose(size, used);
        if (s < 0) {
          unplaced.push(i);
          continue;
        }
        used[s] = (used[s] ?? 0) + 1;
        target = { stock: s, load: 0, items: [] };
        kept.push(target);
      }
      target.load += size;
      target.items.push(i);
    }
    const candidate = downgrade(inst, inst.solution(kept, unplaced));
    const c = candidate.score;
    const cur = current.score;
    if (c.unplaced < cur.unplaced || (c.unplaced === cur.unplaced && c.cost <= cur.cost)) current = candidate;
    if (better(current.score, best.score)) best = current;
    if (iter % 2000 === 0) current = best;
  }
  return best;
}

// ---------- column-generation bound ----------

/** Pieces of one size, interchangeable for packing whatever part they belong to. */
interface Kind {
  size: number;
  pieces: number[];
}

function kindsOf(inst: Instance): Kind[] {
  const kinds: Kind[] = [];
  inst.pieces.forEach((p, i) => {
    const last = kinds[kinds.length - 1];
    if (last && last.size === p.size) last.pieces.push(i);
    else kinds.push({ size: p.size, pieces: [i] });
  });
  return kinds;
}

const gcd = (a: number, b: number): number => (b === 0 ? a : gcd(b, a % b));
/** The largest length dividing every size: lengths in 1/16 in or tenths keep it coarse enough for a table. */
const unitOf = (sizes: readonly number[]): number => sizes.reduce((g, s) => gcd(g, s), 0);

const KNAPSACK_NODES = 200_000;
const KNAPSACK_DP_CELLS = 4_000_000;

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
): { value: number; upper: number; counts: number[] } | null {
  const W = Math.floor(cap / unit);
  const items: { kind: number; copies: number; units: number; value: number }[] = [];
  sizes.forEach((s, k) => {
    const v = values[k] ?? 0;
    const u = s / unit;
    if (v <= 0 || u > W) return;
    let rest = Math.min(limit[k] ?? 0, Math.floor(W / u));
    for (let c = 1; rest > 0; c *= 2) {
      const take = Math.min(c, rest);
      items.push({ kind: k, copies: take, units: take * u, value: take * v });
      rest -= take;
    }
  });
  if (items.length * (W + 1) > KNAPSACK_DP_CELLS) return null;
  const dp = new Float64Array(W + 1);
  const took = new Uint8Array(items.length * (W + 1));
  items.forEach((it, idx) => {
    for (let c = W; c >= it.units; c--) {
      const v = (dp[c - it.units] ?? 0) + it.value;
      if (v > (dp[c] ?? 0)) {
        dp[c] = v;
        took[idx * (W + 1) + c] = 1;
      }
    }
  });
  const counts = sizes.map(() => 0);
  let c = W;
  for (let idx = items.length - 1; idx >= 0; idx--) {
    const it = items[idx];
    if (it && took[idx * (W + 1) + c] === 1) {
      counts[it.kind] = (counts[it.kind] ?? 0) + it.copies;
      c -= it.units;
    }
  }
  const value = dp[W] ?? 0;
  return { value, upper: value, counts };
}


/**
 * Bounded knapsack by depth-first branch and bound with the Dantzig bound: the largest total value of
 * kinds (at most `limit[k]` of each) that fits in `cap`. Returns the best pattern found and an upper
 * bound on the true maximum, which equals the best value unless the node limit was hit.
 */
function knapsack(
  sizes: readonly number[],
  values: readonly number[],
  limit: readonly number[],
  cap: number,
  unit = 0,
): { value: number; upper: number; counts: number[] } {
  if (unit > 0) {
    const dp = knapsackDp(sizes, values, limit, cap, unit);
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
    if (j === order.length || ++nodes > KNAPSACK_NODES) return;
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

interface DualBound {
  y: number[]; // micro-dollars per piece of each kind
  excess: number[]; // per stock: how much its best pattern is worth above its price, paid per board still available
  value: number; // micro-dollars
}

/**
 * Lagrangian bound from the duals `y` of the demand rows: any y >= 0 gives
 * cost >= sum(d_k y_k) - sum_s available_s * max(0, v_s - price_s), with v_s the best pattern value
 * of stock s; for unlimited stock y is first scaled down until no pattern is worth more than its board.
 */
function dualBound(inst: Instance, kinds: readonly Kind[], raw: readonly number[]): DualBound {
  const sizes = kinds.map((k) => k.size);
  const limit = kinds.map((k) => k.pieces.length);
  let y = raw.map((v) => Math.max(0, v));
  let v = inst.stocks.map((s) => knapsack(sizes, y, limit, s.cap, unitOf(sizes)).upper);
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
function columnGenerationDuals(inst: Instance, kinds: readonly Kind[], deadline: number): number[] {
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

/** The least total price of a set of boards, within `available`, that is at least `x`; `x` itself if the search is cut short. */
function achievableCost(stocks: readonly StockType[], x: number): number {
  if (x <= 0) return 0;
  const priced = stocks.filter((s) => s.price > 0).sort((a, b) => b.price - a.price);
  let best = Number.POSITIVE_INFINITY;
  let nodes = 0;
  const dfs = (j: number, sum: number): void => {
    if (sum >= x) {
      best = Math.min(best, sum);
      return;
    }
    if (j === priced.length || ++nodes > 200_000) return;
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

// ---------- exact search ----------

const COMPLETIONS_PER_NODE = 20_000;
/** Search steps between two looks at the clock: a Date.now() every few microseconds of work. */
const DEADLINE_CHECK_EVERY = 128;

/**
 * Bin completion (Korf 2003, with the Martello–Toth dominance rule): boards are filled one at a time,
 * each around the largest piece left, with a stock and a set of further pieces that no other set
 * dominates. Bound at each node: cost so far plus the dual bound of what is left, or its continuous
 * cost. Returns the best solution found and whether the search ran to the end.
 */
function completionSearch(
  inst: Instance,
  kinds: readonly Kind[],
  dual: DualBound,
  incumbent: Solution | null,
  deadline: number,
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
  let ticks = 0;
  let timedOut = false;
  let truncated = false;
  // One counter for search nodes and the completion enumeration inside each node: a single node can
  // enumerate millions of sets, so checking per node alone overran timeLimitMs 0 by seconds (issue 12).
  const pastDeadline = (): boolean => {
    if (!timedOut && ++ticks % DEADLINE_CHECK_EVERY === 0 && Date.now() > deadline) timedOut = true;
    return timedOut;
  };
  // ratio[j]: the most value per micro-inch among kinds j.., to bound what a partial set can still gain.
  const ratio = new Array<number>(K + 1).fill(0);
  // Cheapest price per micro-inch, availability aside: a bound on what the rest costs by length.
  const rMin = Math.min(...inst.stocks.map((s) => s.price / s.cap));
  for (let j = K - 1; j >= 0; j--) ratio[j] = Math.max(ratio[j + 1] ?? 0, (y[j] ?? 0) / (size[j] ?? 1));

  const penalty = (): number => inst.stocks.reduce((a, s, i) => a + (s.available - (used[i] ?? 0)) * (dual.excess[i] ?? 0), 0);
  const bound = (): number => {
    const byDual = Math.ceil(yLeft - penalty() - 1e-3 - 1e-9 * Math.abs(yLeft));
    const byLength = Math.ceil(continuousCost(inst.stocks, sizeLeft, used) - 1e-6);
    return cost + Math.max(byDual, byLength, 0);
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
        if (over || pastDeadline()) return;
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
    if (over || timedOut) return null;
    return candidates.sort((a, b) => a.bound - b.bound || b.load - a.load);
  };

  const dfs = (): void => {
    if (pastDeadline()) return;
    let k0 = 0;
    while (k0 < K && (left[k0] ?? 0) === 0) k0++;
    if (k0 === K) {
      record();
      return;
    }
    if (bound() > target()) return;
    let candidates = completions(k0, COMPLETIONS_PER_NODE);
    if (timedOut) return;
    if (candidates === null) {
      truncated = true;
      candidates = [];
    }
    // Fail first: branch on the piece with the fewest ways to fill its board, which is what makes
    // exactly-full instances such as Falkenauer's triplets tractable.
    for (let k = k0 + 1; k < K && candidates.length > 1; k++) {
      if ((left[k] ?? 0) === 0) continue;
      const fewer = completions(k, candidates.length - 1);
      if (timedOut) return;
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

// ---------- entry points ----------

function baselines(inst: Instance): Solution[] {
  const order = inst.pieces.map((_, i) => i);
  const out: Solution[] = [];
  const choosers: (number | null)[] = [null, ...inst.stocks.map((_, i) => i)];
  for (const pref of choosers) {
    for (const bestFit of [false, true]) out.push(greedy(inst, order, bestFit, chooserFor(inst, pref)));
  }
  return out;
}

function pickBest(sols: readonly Solution[]): Solution {
  let best = sols[0];
  if (!best) throw new Error('no solutions');
  for (const s of sols) if (better(s.score, best.score)) best = s;
  return best;
}

function render(req: LinearCutRequest, inst: Instance, sol: Solution, lb: number, optimal: boolean): LinearCutPlan {
  const boards: LinearBoard[] = [];
  const sorted = [...sol.bins].sort(
    (a, b) => (inst.stocks[a.stock]?.index ?? 0) - (inst.stocks[b.stock]?.index ?? 0) || b.load - a.load,
  );
  const counts = new Map<number, number>();
  for (const bin of sorted) {
    const st = inst.stocks[bin.stock];
    const stock = st ? req.stock[st.index] : undefined;
    if (!st || !stock) continue;
    counts.set(st.index, (counts.get(st.index) ?? 0) + 1);
    const items = [...bin.items].sort((a, b) => (inst.pieces[b]?.len ?? 0) - (inst.pieces[a]?.len ?? 0));
    let at = inst.trim;
    const cuts: LinearCut[] = [];
    for (const i of items) {
      const piece = inst.pieces[i];
      const part = piece ? req.parts[piece.part] : undefined;
      if (!piece || !part) continue;
      cuts.push({ partId: part.id, start: at / SCALE, length: part.length });
      at += piece.size;
    }
    boards.push({ stockId: stock.id, length: stock.length, cuts, offcut: inst.offcutOf(bin) / SCALE });
  }
  const purchase: LinearPurchase[] = [];
  req.stock.forEach((s, index) => {
    const count = counts.get(index) ?? 0;
    if (count > 0) purchase.push({ stockId: s.id, count, cost: (count * toMicro(s.price)) / SCALE });
  });

  const unplacedCounts = new Map<number, { quantity: number; reason: string }>();
  const maxUsable = Math.max(0, ...inst.stocks.map((s) => s.cap - inst.kerf));
  for (const part of inst.unfit) {
    const p = req.parts[part];
    if (!p) continue;
    unplacedCounts.set(part, {
      quantity: p.quantity,
      reason:
        inst.stocks.length === 0
          ? 'No stock is available for this profile.'
          : `Longer than the longest usable stock (${maxUsable / SCALE} in after end trim).`,
    });
  }
  for (const i of sol.unplaced) {
    const part = inst.pieces[i]?.part;
    if (part === undefined) continue;
    const entry = unplacedCounts.get(part) ?? { quantity: 0, reason: 'Not enough stock available to cut this part.' };
    entry.quantity++;
    unplacedCounts.set(part, entry);
  }
  const unplaced = [...unplacedCounts.entries()]
    .sort((a, b) => a[0] - b[0])
    .map(([part, e]) => ({ partId: req.parts[part]?.id ?? '', quantity: e.quantity, reason: e.reason }));

  return { boards, purchase, totalCost: sol.score.cost / SCALE, lowerBound: lb / SCALE, optimal, unplaced };
}

/** First-fit decreasing with each new board taken from the cheapest stock per inch that holds the piece. */
export function firstFitDecreasing(req: LinearCutRequest): LinearCutPlan {
  const inst = new Instance(req);
  const sol = greedy(
    inst,
    inst.pieces.map((_, i) => i),
    false,
    chooserFor(inst, null),
  );
  const placed = sol.bins.flatMap((b) => b.items);
  return render(req, inst, sol, lowerBound(inst, placed), false);
}

export function planLinearCuts(req: LinearCutRequest): LinearCutPlan {
  const started = Date.now();
  const deadline = started + (req.timeLimitMs ?? 2000);
  const inst = new Instance(req);
  const all = inst.pieces.map((_, i) => i);
  let lb = lowerBound(inst, all);

  let best = pickBest([...baselines(inst).map((s) => downgrade(inst, s)), ...baselines(inst)]);
  if (best.score.unplaced > 0 || best.score.cost > lb) {
    const mbs = downgrade(inst, minimumSlack(inst, deadline));
    if (better(mbs.score, best.score)) best = mbs;
  }

  let finished = best.score.unplaced === 0 && best.score.cost <= lb;
  if (!finished) {
    const kinds = kindsOf(inst);
    // The LP gets a share of the time; its duals are a valid bound wherever it stops.
    const lpDeadline = Math.min(deadline, started + Math.max(1, (req.timeLimitMs ?? 2000) / 4));
    const dual = dualBound(inst, kinds, columnGenerationDuals(inst, kinds, lpDeadline));
    lb = Math.max(lb, achievableCost(inst.stocks, Math.ceil(dual.value - 1e-3 - 1e-9 * Math.abs(dual.value))));
    finished = best.score.unplaced === 0 && best.score.cost <= lb;
    if (!finished) {
      // A depth-first search that has not closed the gap by then is usually stuck deep in the tree, where
      // ruin and recreate still finds better plans (u120_00 in bench/cutlist), so it gets the rest.
      const searchDeadline = Date.now() + 0.6 * Math.max(0, deadline - Date.now());
      const result = completionSearch(inst, kinds, dual, best.score.unplaced === 0 ? best : null, searchDeadline);
      if (result.best && better(result.best.score, best.score)) best = result.best;
      finished = result.finished || (best.score.unplaced === 0 && best.score.cost <= lb);
      if (!finished && best.score.unplaced === 0) {
        best = improve(inst, best, lb, deadline);
        finished = best.score.cost <= lb;
      }
    }
  }

  if (best.score.unplaced > 0) {
    // Parts left over for want of stock: the bound covers only what was placed, and nothing is proven.
    const placed = best.bins.flatMap((b) => b.items);
    return render(req, inst, best, lowerBound(inst, placed), false);
  }
  // A finished search proves the cost, so the bound can be raised to it.
  return render(req, inst, best, finished ? best.score.cost : lb, finished);
}
