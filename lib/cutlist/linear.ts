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
const EXACT_SEARCH_MAX_PIECES = 30;

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
          if (++nodes > 20_000 || (nodes % 1024 === 0 && Date.now() > deadline)) return true;
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

// ---------- exact search ----------

/**
 * Branch and bound over pieces in decreasing size: each goes into an open board or a new board of
 * some stock. Bound: cost so far plus the continuous cost of the space the rest still needs.
 * Returns the best solution found and whether the search ran to the end.
 */
function exactSearch(inst: Instance, incumbent: Solution | null, deadline: number): { best: Solution | null; finished: boolean } {
  const n = inst.pieces.length;
  const size = inst.pieces.map((p) => p.size);
  const suffix = new Array<number>(n + 1).fill(0);
  for (let i = n - 1; i >= 0; i--) suffix[i] = (suffix[i + 1] ?? 0) + (size[i] ?? 0);
  const maxCap = Math.max(...inst.stocks.map((s) => s.cap));
  const bins: Bin[] = [];
  const used = inst.stocks.map(() => 0);
  const where = new Array<number>(n).fill(-1);
  let best = incumbent;
  let cost = 0;
  let nodes = 0;
  let timedOut = false;
  const stockOrder = inst.stocks
    .map((_, i) => i)
    .sort((a, b) => {
      const sa = inst.stocks[a];
      const sb = inst.stocks[b];
      return sa && sb ? sa.price / sa.cap - sb.price / sb.cap : 0;
    });

  const prune = (i: number): boolean => {
    if (!best) return false;
    const smallest = size[n - 1] ?? 0;
    let residual = 0;
    for (const b of bins) {
      const r = (inst.stocks[b.stock]?.cap ?? 0) - b.load;
      if (r >= smallest) residual += r;
    }
    const extra = (suffix[i] ?? 0) - residual;
    const extraCost = extra > 0 ? Math.ceil(continuousCost(inst.stocks, extra, used) - 1e-6) : 0;
    const extraBoards = extra > 0 ? Math.ceil(extra / maxCap) : 0;
    const bc = cost + extraCost;
    const s = best.score;
    if (bc !== s.cost) return bc > s.cost;
    return bins.length + extraBoards >= s.boards;
  };

  const place = (i: number): void => {
    if (timedOut) return;
    if (++nodes % 1024 === 0 && Date.now() > deadline) {
      timedOut = true;
      return;
    }
    if (i === n) {
      const sol = inst.solution(
        bins.map((b) => ({ ...b, items: [...b.items] })),
        [],
      );
      if (!best || better(sol.score, best.score)) best = sol;
      return;
    }
    if (prune(i)) return;
    const w = size[i] ?? 0;
    const sameAsPrev = i > 0 && size[i - 1] === w && inst.pieces[i - 1]?.part === inst.pieces[i]?.part;
    const minBin = sameAsPrev ? (where[i - 1] ?? 0) : 0;
    // An exact fill of an open board is always safe to take alone.
    for (let b = minBin; b < bins.length; b++) {
      const bin = bins[b];
      if (bin && (inst.stocks[bin.stock]?.cap ?? 0) - bin.load === w) {
        bin.load += w;
        bin.items.push(i);
        where[i] = b;
        place(i + 1);
        bin.items.pop();
        bin.load -= w;
        return;
      }
    }
    const tried = new Set<string>();
    const candidates: number[] = [];
    for (let b = minBin; b < bins.length; b++) {
      const bin = bins[b];
      if (!bin) continue;
      const rest = (inst.stocks[bin.stock]?.cap ?? 0) - bin.load;
      const key = `${bin.stock}:${rest}`;
      if (rest < w || tried.has(key)) continue;
      tried.add(key);
      candidates.push(b);
    }
    candidates.sort((a, b) => (bins[a]?.load ?? 0) - (bins[b]?.load ?? 0)).reverse();
    for (const b of candidates) {
      const bin = bins[b];
      if (!bin) continue;
      bin.load += w;
      bin.items.push(i);
      where[i] = b;
      place(i + 1);
      bin.items.pop();
      bin.load -= w;
      if (timedOut) return;
    }
    for (const s of stockOrder) {
      const st = inst.stocks[s];
      if (!st || st.cap < w || (used[s] ?? 0) >= st.available) continue;
      used[s] = (used[s] ?? 0) + 1;
      cost += st.price;
      bins.push({ stock: s, load: w, items: [i] });
      where[i] = bins.length - 1;
      place(i + 1);
      bins.pop();
      cost -= st.price;
      used[s] = (used[s] ?? 0) - 1;
      if (timedOut) return;
    }
  };

  place(0);
  return { best, finished: !timedOut };
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
  const lbAll = lowerBound(inst, all);

  let best = pickBest([...baselines(inst).map((s) => downgrade(inst, s)), ...baselines(inst)]);
  if (best.score.unplaced > 0 || best.score.cost > lbAll) {
    const mbs = downgrade(inst, minimumSlack(inst, deadline));
    if (better(mbs.score, best.score)) best = mbs;
  }

  let finished = false;
  if (best.score.unplaced === 0 && best.score.cost === lbAll) {
    finished = true;
  } else if (inst.pieces.length <= EXACT_SEARCH_MAX_PIECES) {
    const result = exactSearch(inst, best.score.unplaced === 0 ? best : null, deadline);
    if (result.best && better(result.best.score, best.score)) best = result.best;
    finished = result.finished;
  } else {
    best = improve(inst, best, lbAll, deadline);
  }

  if (best.score.unplaced > 0) {
    // Parts left over for want of stock: the bound covers only what was placed, and nothing is proven.
    const placed = best.bins.flatMap((b) => b.items);
    return render(req, inst, best, lowerBound(inst, placed), false);
  }
  const optimal = finished || best.score.cost === lbAll;
  // A finished search proves the cost, so the bound can be raised to it.
  return render(req, inst, best, optimal ? best.score.cost : lbAll, optimal);
}
