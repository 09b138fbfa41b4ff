/**
 * Rip planning for solid wood: parts narrower than the board are ripped side by side from it, as a
 * woodworker does. Each board is planned as strips along its width (a rip between strips), and each
 * strip is then crosscut along the length, so the plan is a two-stage guillotine cutting: rips first,
 * crosscuts second. Grain runs along the length, so a part is never turned.
 *
 * Widths: a strip is as wide as its widest piece; each rip costs the rip kerf plus the jointed edge
 * the sawn strip loses (`jointAllowance`), so strips fit a board iff
 * sum(width + rip) <= boardWidth + rip, the same rule as crosscuts along the length.
 * Lengths follow planLinearCuts: sum(length + kerf) <= length - 2 * endTrim + kerf in each strip.
 *
 * Planning: the pattern LP (pattern-lp.ts) with two-stage pricing (Gilmore and Gomory, "Multistage
 * cutting stock problems of two and more dimensions", Operations Research 13, 1965): a knapsack along
 * the length for each strip width, then a knapsack across the width over those strips. LP dives give the
 * plan, the LP's Lagrangian bound the proof; a greedy strip fit is the fallback.
 */
import { achievableCost } from './bounds';
import { deadlineIn, expired, shareOf, type Deadline } from './deadline';
import { diveSearch, type DiveProblem } from './dive';
import { rng } from './random';
import { SCALE, toMicro } from './instance';
import { gcd, knapsack, unitOf } from './knapsack';
import { lagrangianBound, solvePatternLp, type Pattern } from './pattern-lp';
import type { LinearPurchase, LinearUnplaced } from './types';

export interface RipPart {
  id: string;
  length: number;
  width: number;
  quantity: number;
  label?: string;
}

export interface RipStock {
  id: string;
  length: number;
  /** Dressed width of the board. */
  width: number;
  price: number;
  available?: number;
}

export interface RipCutRequest {
  /** Crosscut kerf. */
  kerf: number;
  /** Rip kerf; the crosscut kerf when left out. */
  ripKerf?: number;
  /** Width lost to jointing the sawn edge, per rip. */
  jointAllowance: number;
  endTrim?: number;
  parts: RipPart[];
  stock: RipStock[];
  timeLimitMs?: number;
}

export interface RipCut {
  partId: string;
  /** Along the board from its end. */
  start: number;
  length: number;
  width: number;
}

export interface RipStrip {
  /** Rip to this width (the widest piece in the strip). */
  width: number;
  /** Across the board from its reference edge. */
  offset: number;
  cuts: RipCut[];
}

export interface RipBoard {
  stockId: string;
  length: number;
  width: number;
  /** In cut order: rip the strips off the reference edge one by one, then crosscut each. */
  strips: RipStrip[];
  /** Width left after the last strip's rip, if any. */
  offcutWidth: number;
  /**
   * Full-width length left past the longest strip: the board is crosscut there before it is ripped,
   * measured like a crosscut board's offcut (after both end trims and the kerf of that cut).
   */
  offcut: number;
}

export interface RipCutPlan {
  boards: RipBoard[];
  purchase: LinearPurchase[];
  totalCost: number;
  lowerBound: number;
  optimal: boolean;
  unplaced: LinearUnplaced[];
}

interface Kind {
  part: number;
  size: number; // length + kerf, micro-inches
  width: number; // micro-inches
  demand: number;
}

interface Stock {
  index: number;
  capL: number; // usable length + kerf
  capW: number; // width + rip
  price: number;
  available: number;
}

interface Model {
  kinds: Kind[];
  stocks: Stock[];
  rip: number; // rip kerf + jointing, micro-inches
  kerf: number;
  trim: number;
  unfit: { part: number; reason: string }[];
}

function validate(req: RipCutRequest): void {
  const ok = (x: number | undefined): boolean => x === undefined || (Number.isFinite(x) && x >= 0);
  if (!ok(req.kerf) || !ok(req.ripKerf) || !ok(req.jointAllowance) || !ok(req.endTrim)) {
    throw new RangeError('Kerfs, joint allowance and end trim must be numbers of inches, 0 or more.');
  }
  if (!ok(req.timeLimitMs)) throw new RangeError('timeLimitMs must be 0 or more.');
  const ids = new Set<string>();
  for (const p of req.parts) {
    if (ids.has(p.id)) throw new RangeError(`Part id ${p.id} appears twice.`);
    ids.add(p.id);
    if (!(Number.isFinite(p.length) && p.length > 0 && Number.isFinite(p.width) && p.width > 0)) {
      throw new RangeError(`Part ${p.id} needs a length and a width above 0.`);
    }
    if (!(Number.isInteger(p.quantity) && p.quantity >= 0)) throw new RangeError(`Part ${p.id} needs a whole quantity.`);
  }
  const stockIds = new Set<string>();
  for (const s of req.stock) {
    if (stockIds.has(s.id)) throw new RangeError(`Stock id ${s.id} appears twice.`);
    stockIds.add(s.id);
    if (!(Number.isFinite(s.length) && s.length > 0 && Number.isFinite(s.width) && s.width > 0)) {
      throw new RangeError(`Stock ${s.id} needs a length and a width above 0.`);
    }
    if (!(Number.isFinite(s.price) && s.price >= 0)) throw new RangeError(`Stock ${s.id} needs a price of 0 or more.`);
    if (s.available !== undefined && !(Number.isInteger(s.available) && s.available >= 0)) {
      throw new RangeError(`Stock ${s.id} needs a whole number available.`);
    }
  }
}

function modelOf(req: RipCutRequest): Model {
  validate(req);
  const kerf = toMicro(req.kerf);
  const rip = toMicro(req.ripKerf ?? req.kerf) + toMicro(req.jointAllowance);
  const trim = toMicro(req.endTrim ?? 0);
  const stocks = req.stock
    .map((s, index) => ({
      index,
      capL: toMicro(s.length) - 2 * trim + kerf,
      capW: toMicro(s.width) + rip,
      price: toMicro(s.price),
      available: s.available ?? Number.POSITIVE_INFINITY,
    }))
    .filter((s) => s.capL > kerf && s.available > 0);
  const kinds: Kind[] = [];
  const unfit: { part: number; reason: string }[] = [];
  req.parts.forEach((p, part) => {
    if (p.quantity === 0) return;
    const size = toMicro(p.length) + kerf;
    const width = toMicro(p.width);
    if (stocks.length === 0) unfit.push({ part, reason: 'No stock is available for this part.' });
    else if (!stocks.some((s) => s.capW >= width + rip)) unfit.push({ part, reason: 'Wider than every board on the rack.' });
    else if (!stocks.some((s) => s.capL >= size)) unfit.push({ part, reason: 'Longer than every board on the rack, after end trim.' });
    else if (!stocks.some((s) => s.capW >= width + rip && s.capL >= size)) {
      unfit.push({ part, reason: 'No board on the rack is both long and wide enough.' });
    } else kinds.push({ part, size, width, demand: p.quantity });
  });
  return { kinds, stocks, rip, kerf, trim, unfit };
}

/** Two-stage pricing: the best strip of each width along the length, then the best set of strips across the width. */
function ripPricer(model: Model, deadline: Deadline): DiveProblem['pricer'] {
  const { kinds, stocks, rip } = model;
  const sizes = kinds.map((k) => k.size);
  const unitL = unitOf(sizes);
  const widths = [...new Set(kinds.map((k) => k.width))].sort((a, b) => a - b);
  const stripSizes = widths.map((w) => w + rip);
  const unitW = stripSizes.reduce((g, s) => gcd(g, s), 0);
  return (s, y, limit) => {
    const st = stocks[s];
    const zero = { counts: kinds.map(() => 0), value: 0, upper: 0, strips: [] };
    if (!st) return zero;
    const strips = widths.map((w) => {
      const values = kinds.map((k, i) => (k.width <= w && k.size <= st.capL ? (y[i] ?? 0) : 0));
      return knapsack(sizes, values, limit, st.capL, unitL, deadline);
    });
    const most = stripSizes.map((w) => Math.floor(st.capW / w));
    const across = knapsack(stripSizes, strips.map((x) => x.value), most, st.capW, unitW, deadline);
    const upper = knapsack(stripSizes, strips.map((x) => x.upper), most, st.capW, unitW, deadline).upper;
    const counts = kinds.map(() => 0);
    const chosen: { width: number; counts: number[] }[] = [];
    across.counts.forEach((n, c) => {
      const strip = strips[c];
      if (!strip) return;
      for (let q = 0; q < n; q++) {
        chosen.push({ width: widths[c] ?? 0, counts: [...strip.counts] });
        strip.counts.forEach((x, k) => (counts[k] = (counts[k] ?? 0) + x));
      }
    });
    return { counts, value: across.value, upper: Math.max(upper, across.value), strips: chosen };
  };
}

interface GreedyBoard {
  stock: number;
  strips: { width: number; load: number; counts: number[] }[];
  usedW: number;
}

/** How a greedy run orders the pieces and which stock it opens new boards on first. */
interface GreedyStart {
  /** Stock index opened for a new board whenever the piece fits it; -1 for the cheapest per area. */
  prefer: number;
  byLength: boolean;
}

/**
 * Widest pieces first (or longest first), each into the strip that fits it most snugly, else a new
 * strip, else a new board: of the preferred stock when the piece fits it, else the cheapest per area.
 */
function greedyRips(model: Model, start: GreedyStart = { prefer: -1, byLength: false }): { patterns: Pattern[]; unplaced: number[] } {
  const { kinds, stocks, rip } = model;
  const order: number[] = [];
  kinds.forEach((k, i) => {
    for (let q = 0; q < k.demand; q++) order.push(i);
  });
  const wider = (a: number, b: number) => (kinds[b]?.width ?? 0) - (kinds[a]?.width ?? 0);
  const longer = (a: number, b: number) => (kinds[b]?.size ?? 0) - (kinds[a]?.size ?? 0);
  order.sort((a, b) => (start.byLength ? longer(a, b) || wider(a, b) : wider(a, b) || longer(a, b)));
  const boards: GreedyBoard[] = [];
  const used = stocks.map(() => 0);
  const unplaced = kinds.map(() => 0);
  for (const k of order) {
    const kind = kinds[k];
    if (!kind) continue;
    let slot: { strip: GreedyBoard['strips'][number]; waste: number } | null = null;
    for (const b of boards) {
      const cap = stocks[b.stock]?.capL ?? 0;
      for (const strip of b.strips) {
        if (strip.width < kind.width || strip.load + kind.size > cap) continue;
        const waste = (strip.width - kind.width) * SCALE + (cap - strip.load - kind.size);
        if (!slot || waste < slot.waste) slot = { strip, waste };
      }
    }
    if (!slot) {
      let host: GreedyBoard | null = null;
      for (const b of boards) {
        const st = stocks[b.stock];
        if (!st || st.capL < kind.size || b.usedW + kind.width + rip > st.capW) continue;
        if (!host || b.usedW > host.usedW) host = b;
      }
      if (!host) {
        let pick = -1;
        stocks.forEach((st, i) => {
          if (st.capL < kind.size || st.capW < kind.width + rip || (used[i] ?? 0) >= st.available) return;
          const p = stocks[pick];
          // Once the preferred stock is picked it stays; with no preference (-1) the cheapest per area wins.
          if (pick >= 0 && pick === start.prefer) return;
          if (i === start.prefer || !p || st.price / (st.capL * st.capW) < p.price / (p.capL * p.capW)) pick = i;
        });
        if (pick < 0) {
          unplaced[k] = (unplaced[k] ?? 0) + 1;
          continue;
        }
        used[pick] = (used[pick] ?? 0) + 1;
        host = { stock: pick, strips: [], usedW: 0 };
        boards.push(host);
      }
      const strip = { width: kind.width, load: 0, counts: kinds.map(() => 0) };
      host.strips.push(strip);
      host.usedW += kind.width + rip;
      slot = { strip, waste: 0 };
    }
    slot.strip.load += kind.size;
    slot.strip.counts[k] = (slot.strip.counts[k] ?? 0) + 1;
  }
  const patterns = boards.map((b) => {
    const counts = kinds.map((_, k) => b.strips.reduce((a, st) => a + (st.counts[k] ?? 0), 0));
    return { stock: b.stock, counts, strips: b.strips.map((st) => ({ width: st.width, counts: st.counts })) };
  });
  return { patterns: patterns.map((p) => cheapestHolder(model, p, used)), unplaced: order.length === 0 ? [] : unplaced };
}

/** Moves a board to the cheapest stock that still holds its strips (and has one left). */
function cheapestHolder(model: Model, p: Pattern, used: number[]): Pattern {
  const { kinds, stocks, rip } = model;
  const strips = p.strips ?? [];
  const needL = Math.max(0, ...strips.map((st) => st.counts.reduce((a, c, k) => a + c * (kinds[k]?.size ?? 0), 0)));
  const needW = strips.reduce((a, st) => a + stripWidth(model, st.counts) + rip, 0);
  let best = p.stock;
  stocks.forEach((st, i) => {
    const cur = stocks[best];
    if (!cur || st.capL < needL || st.capW < needW || (i !== p.stock && (used[i] ?? 0) >= st.available)) return;
    if (st.price < cur.price) best = i;
  });
  if (best !== p.stock) {
    used[p.stock] = (used[p.stock] ?? 0) - 1;
    used[best] = (used[best] ?? 0) + 1;
  }
  return { ...p, stock: best };
}

/**
 * Greedy from several starts: each stock preferred in turn for new boards, pieces widest or longest
 * first; boards then move to the cheapest stock that holds them. With boards of several widths and
 * lengths priced by the board foot, every stock costs the same per area, so the plain greedy cannot
 * tell them apart; the starts try each. Returns the cheapest plan that places the most, and every
 * board seen (columns for the LP).
 */
function multiStartGreedy(model: Model, deadline: Deadline): { best: { patterns: Pattern[]; unplaced: number[] }; seen: Pattern[] } {
  let best = greedyRips(model);
  const seen = [...best.patterns];
  const missing = (u: readonly number[]) => u.reduce((a, b) => a + b, 0);
  for (const byLength of [false, true]) {
    for (let prefer = byLength ? -1 : 0; prefer < model.stocks.length; prefer++) {
      if (expired(deadline)) return { best, seen };
      const run = greedyRips(model, { prefer, byLength });
      seen.push(...run.patterns);
      const better = missing(run.unplaced) - missing(best.unplaced) || costOf(model, run.patterns) - costOf(model, best.patterns);
      if (better < 0) best = run;
    }
  }
  return { best, seen };
}

/**
 * Ruin and recreate: take two or three boards out of the plan at random, plan their pieces again from
 * scratch with the greedy starts, and keep the result when the whole plan costs less. Pieces of
 * poorly filled boards end up together, often on one board of another width or length.
 * Source: G. Schrimpf et al., "Record breaking optimization results using the ruin and recreate
 * principle", J. Computational Physics 159 (2000).
 */
function ruinAndRecreate(model: Model, patterns: Pattern[], deadline: Deadline, random: () => number): Pattern[] {
  let best = patterns;
  let bestCost = costOf(model, best);
  for (let round = 0; round < 100_000 && best.length >= 2 && !expired(deadline); round++) {
    const take = new Set<number>();
    const want = Math.min(best.length, 2 + (random() < 0.3 ? 1 : 0));
    while (take.size < want) take.add(Math.floor(random() * best.length));
    const kept = best.filter((_, i) => !take.has(i));
    const removed = best.filter((_, i) => take.has(i));
    const used = model.stocks.map(() => 0);
    kept.forEach((p) => (used[p.stock] = (used[p.stock] ?? 0) + 1));
    const sub: Model = {
      ...model,
      kinds: model.kinds.map((k, j) => ({ ...k, demand: removed.reduce((a, p) => a + (p.counts[j] ?? 0), 0) })),
      stocks: model.stocks.map((st, i) => ({ ...st, available: st.available - (used[i] ?? 0) })),
    };
    const again = multiStartGreedy(sub, deadline).best;
    if (again.unplaced.some((n) => n > 0)) continue;
    const cost = costOf(model, kept) + costOf(model, again.patterns);
    if (cost < bestCost) {
      best = [...kept, ...again.patterns];
      bestCost = cost;
    }
  }
  return best;
}

const stripWidth = (model: Model, counts: readonly number[]): number =>
  Math.max(0, ...counts.map((c, k) => (c > 0 ? (model.kinds[k]?.width ?? 0) : 0)));

const costOf = (model: Model, patterns: readonly Pattern[]): number => patterns.reduce((a, p) => a + (model.stocks[p.stock]?.price ?? 0), 0);

function render(req: RipCutRequest, model: Model, patterns: readonly Pattern[], unplacedKinds: readonly number[], lb: number, optimal: boolean): RipCutPlan {
  const boards: RipBoard[] = [];
  const counts = new Map<number, number>();
  const ripIn = (req.ripKerf ?? req.kerf) + req.jointAllowance;
  const sorted = [...patterns].sort((a, b) => (model.stocks[a.stock]?.index ?? 0) - (model.stocks[b.stock]?.index ?? 0));
  for (const p of sorted) {
    const st = model.stocks[p.stock];
    const stock = st ? req.stock[st.index] : undefined;
    if (!st || !stock) continue;
    counts.set(st.index, (counts.get(st.index) ?? 0) + 1);
    // Widest strip first, off the board's straight reference edge.
    const strips = [...(p.strips ?? [])].sort((a, b) => stripWidth(model, b.counts) - stripWidth(model, a.counts));
    let offset = 0;
    let longest = 0;
    const out: RipStrip[] = [];
    for (const s of strips) {
      const pieces: { part: RipPart; size: number }[] = [];
      s.counts.forEach((c, k) => {
        const kind = model.kinds[k];
        const part = kind ? req.parts[kind.part] : undefined;
        if (!kind || !part) return;
        for (let q = 0; q < c; q++) pieces.push({ part, size: kind.size });
      });
      if (pieces.length === 0) continue;
      pieces.sort((a, b) => b.part.length - a.part.length || b.part.width - a.part.width);
      let at = model.trim;
      const cuts: RipCut[] = pieces.map(({ part, size }) => {
        const cut = { partId: part.id, start: at / SCALE, length: part.length, width: part.width };
        at += size;
        return cut;
      });
      const width = Math.max(...pieces.map((x) => x.part.width));
      longest = Math.max(longest, at - model.trim);
      out.push({ width, offset, cuts });
      offset += width + ripIn;
    }
    // As a crosscut board's offcut (instance.ts offcutOf): capacity less the longest strip's load less the kerf.
    const offcut = Math.max(0, st.capL - longest - model.kerf) / SCALE;
    boards.push({ stockId: stock.id, length: stock.length, width: stock.width, strips: out, offcutWidth: Math.max(0, stock.width - offset), offcut });
  }
  const purchase: LinearPurchase[] = [];
  req.stock.forEach((s, index) => {
    const count = counts.get(index) ?? 0;
    if (count > 0) purchase.push({ stockId: s.id, count, cost: (count * toMicro(s.price)) / SCALE });
  });
  const unplaced: LinearUnplaced[] = model.unfit.map((u) => ({
    partId: req.parts[u.part]?.id ?? '',
    quantity: req.parts[u.part]?.quantity ?? 0,
    reason: u.reason,
  }));
  unplacedKinds.forEach((n, k) => {
    const part = req.parts[model.kinds[k]?.part ?? -1];
    if (n > 0 && part) unplaced.push({ partId: part.id, quantity: n, reason: 'Not enough stock available to cut this part.' });
  });
  return { boards, purchase, totalCost: costOf(model, patterns) / SCALE, lowerBound: lb / SCALE, optimal, unplaced };
}

/**
 * Plans rips and crosscuts: which boards to buy and, on each, the strips to rip and where to crosscut
 * them. Same contract as planLinearCuts: valid plan, bound <= cost, `optimal` only when proven.
 */
export function planRipCuts(req: RipCutRequest): RipCutPlan {
  const deadline = deadlineIn(req.timeLimitMs ?? 2000);
  const model = modelOf(req);
  const { best: greedy, seen } = multiStartGreedy(model, shareOf(deadline, 0.1));
  if (greedy.unplaced.some((n) => n > 0) || model.kinds.length === 0) {
    // Not everything fits the rack: plan what does, prove nothing.
    return render(req, model, greedy.patterns, greedy.unplaced, 0, model.kinds.length === 0 && model.unfit.length === 0);
  }
  const problem: DiveProblem = {
    demand: model.kinds.map((k) => k.demand),
    stocks: model.stocks.map((s) => ({ price: s.price, available: s.available })),
    pricer: ripPricer(model, deadline),
    pool: [...new Map(seen.map((p) => [`${p.stock}:${p.counts.join(',')}`, p])).values()],
  };
  let best = greedy.patterns;
  let bestCost = costOf(model, best);
  const root = solvePatternLp(problem.demand, problem.stocks, problem.pricer, problem.pool, shareOf(deadline, 0.4));
  let lb = 0;
  if (!expired(deadline)) {
    const value = lagrangianBound(problem.demand, problem.stocks, problem.pricer, root.duals);
    lb = achievableCost(problem.stocks, Math.ceil(value - Math.max(1, 1e-9 * Math.abs(value))), deadline);
  }
  if (bestCost > lb) {
    const dived = diveSearch(problem, lb, shareOf(deadline, 0.6), rng(11));
    if (dived && dived.cost < bestCost) {
      const used = model.stocks.map(() => 0);
      dived.patterns.forEach((p) => (used[p.stock] = (used[p.stock] ?? 0) + 1));
      best = dived.patterns.map((p) => cheapestHolder(model, p, used));
      bestCost = costOf(model, best);
    }
    if (bestCost > lb) {
      best = ruinAndRecreate(model, best, deadline, rng(7));
      bestCost = costOf(model, best);
    }
  }
  const optimal = bestCost <= lb && model.unfit.length === 0;
  return render(req, model, best, model.kinds.map(() => 0), optimal ? bestCost : Math.min(lb, bestCost), optimal);
}
