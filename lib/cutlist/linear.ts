/**
 * Linear cut planning: which boards to buy and where each piece is cut. See README.md for the pipeline.
 *
 * Everything inside works in integer micro-inches and micro-dollars so an exactly full board is
 * never refused for a floating-point hair. With the kerf rule of the issue (each piece is followed
 * by one kerf unless it ends at the usable end) a set of pieces fits a board iff
 * sum(length + kerf) <= usable + kerf, so each piece is packed with size `length + kerf` into a bin
 * of capacity `usable + kerf`: the plan is a bin packing with costed bin types.
 */
import { arcFlowSearch } from './arc-flow';
import { achievableCost, dualBound, lowerBound, type DualBound } from './bounds';
import { deadlineIn, shareOf, type Deadline } from './deadline';
import { diveSearch, type DivePlan, type DiveProblem } from './dive';
import { searchCostLevels } from './cost-levels';
import { completionSearch } from './exact-search';
import { chooserFor, downgrade, greedy, improve, minimumSlack } from './heuristics';
import { rng } from './random';
import { better, Instance, SCALE, toMicro, type Bin, type Solution } from './instance';
import { kindsOf, knapsack, unitOf, type Kind } from './knapsack';
import { mipAvailable, warmUpMipSolver } from './mip';
import { solvePatternMip } from './pattern-mip';
import { solvePatternLp, type Pattern } from './pattern-lp';
import { startStageClock } from './trace';
import type { LinearBoard, LinearCut, LinearCutPlan, LinearCutRequest, LinearPurchase } from './types';

export { martelloTothL2 } from './bounds';
export type * from './types';
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

/** The LP pieces of a linear instance: kinds of equal size, their demand, stocks and a knapsack pricer. */
function lpProblem(inst: Instance, kinds: readonly Kind[], deadline: Deadline): DiveProblem {
  const sizes = kinds.map((k) => k.size);
  const unit = unitOf(sizes);
  const maxCap = Math.max(0, ...inst.stocks.map((s) => s.cap));
  return {
    demand: kinds.map((k) => k.pieces.length),
    stocks: inst.stocks.map((s) => ({ price: s.price, available: s.available })),
    pricer: (s, y, limit) => knapsack(sizes, y, limit, inst.stocks[s]?.cap ?? 0, unit, deadline, maxCap),
    pool: [],
  };
}

/** Boards of a dive's patterns, with the pieces of each kind handed out in order. */
function solutionOf(inst: Instance, kinds: readonly Kind[], patterns: readonly Pattern[]): Solution {
  const queues = kinds.map((k) => [...k.pieces]);
  const bins: Bin[] = patterns.map((p) => {
    const items: number[] = [];
    let load = 0;
    p.counts.forEach((c, k) => {
      for (let q = 0; q < c; q++) {
        const i = queues[k]?.pop();
        if (i === undefined) continue;
        items.push(i);
        load += kinds[k]?.size ?? 0;
      }
    });
    return { stock: p.stock, load, items };
  });
  // A pattern cut only for pieces already handed out buys nothing.
  return inst.solution(
    bins.filter((b) => b.items.length > 0),
    [],
  );
}

/** The boards of a plan as patterns (pieces of each kind per board). */
function patternsOf(inst: Instance, kinds: readonly Kind[], sol: Solution): Pattern[] {
  const kindOf = new Map<number, number>();
  kinds.forEach((k, idx) => k.pieces.forEach((i) => kindOf.set(i, idx)));
  return sol.bins.map((b) => {
    const counts = kinds.map(() => 0);
    for (const i of b.items) {
      const k = kindOf.get(i);
      if (k !== undefined) counts[k] = (counts[k] ?? 0) + 1;
    }
    return { stock: b.stock, counts };
  });
}

/** Share of the time left that the LP dives get on a rack of several lengths (see the call). */
const DIVE_SHARE_SEVERAL_LENGTHS = 0.1;

/**
 * On a rack of several lengths the dives stop after this many in a row without a cheaper plan. Traced on
 * bench/cutlist/run.ts: every dive round that proved a plan did so with its first dive or (once) its
 * 16th counted at downgraded cost; the rest ran their whole share (about 200 ms) for a plan a few
 * dollars over the bound. Back to back at load 11-13: median CPU time per call 157/163 ms -> 102/89 ms
 * (8) and 98 ms (4), median wall time 472/351 -> 271/249 ms, proofs 79/85 -> 77/81 (82 with 4), the
 * proof count moving as much between two base runs. Again at load 5-6, interleaved: median wall time
 * 295/278 -> 102/104 ms, CPU 186/170 -> 66/60 ms, proofs 87/89 -> 88/89.
 */
const DIVE_STALL = 8;

interface Stage {
  best: Solution;
  lb: number;
  finished: boolean;
}

/**
 * The integer-programming stages (HiGHS, mip.ts), when the searches so far have not closed the gap: first
 * the integer program over the patterns generated so far (milliseconds; finds plans at the bound the
 * dives missed), then the exact arc-flow model (arc-flow.ts), whose optimum is a proof and whose dual
 * bound raises the bound when it stops early. Each keeps the better plan and the higher bound.
 */
function mipStages(
  inst: Instance,
  kinds: readonly Kind[],
  problem: DiveProblem,
  dual: DualBound,
  start: Stage,
  deadline: Deadline,
  lap: (stage: string, proven: boolean) => void,
): Stage {
  let { best, lb } = start;
  const proven = (): boolean => best.score.unplaced === 0 && best.score.cost <= lb;
  const picked = solvePatternMip(problem.demand, problem.stocks, problem.pool, patternsOf(inst, kinds, best), shareOf(deadline, 0.15));
  if (picked) {
    const sol = downgrade(inst, solutionOf(inst, kinds, picked));
    if (sol.score.unplaced === 0 && better(sol.score, best.score)) best = sol;
  }
  lap('pattern-mip', proven());
  if (!proven()) {
    const exact = arcFlowSearch(inst, kinds, best, shareOf(deadline, 0.7), dual);
    if (exact) {
      if (exact.best) {
        const sol = downgrade(inst, exact.best);
        if (better(sol.score, best.score)) best = sol;
      }
      lb = Math.max(lb, achievableCost(inst.stocks, exact.lb, deadline));
    }
    lap(exact ? 'arc-flow' : 'arc-flow-skipped', proven());
  }
  return { best, lb, finished: proven() };
}

/**
 * Pipeline (README.md): greedy fits and minimum slack; the pattern LP for a bound; LP dives for a plan
 * near that bound; bin completion to prove it or find better; ruin and recreate with what time is left.
 * Each stage stops at its share of `timeLimitMs`, and every loop inside checks the deadline.
 */
export function planLinearCuts(req: LinearCutRequest): LinearCutPlan {
  const deadline = deadlineIn(req.timeLimitMs ?? 2000);
  const lap = startStageClock();
  const inst = new Instance(req);
  const all = inst.pieces.map((_, i) => i);
  let lb = lowerBound(inst, all);

  let best = pickBest([...baselines(inst).map((s) => downgrade(inst, s)), ...baselines(inst)]);
  const proven = (): boolean => best.score.unplaced === 0 && best.score.cost <= lb;
  if (!proven()) {
    const mbs = downgrade(inst, minimumSlack(inst, deadline));
    if (better(mbs.score, best.score)) best = mbs;
  }
  lap('greedy', proven());

  let finished = proven();
  if (!finished) {
    warmUpMipSolver();
    const kinds = kindsOf(inst);
    const problem = lpProblem(inst, kinds, deadline);
    // The LP gets a share of the time; its duals are a valid bound wherever it stops.
    const root = solvePatternLp(problem.demand, problem.stocks, problem.pricer, problem.pool, shareOf(deadline, 0.25));
    const dual = dualBound(inst, kinds, root.duals, deadline);
    lb = Math.max(lb, achievableCost(inst.stocks, Math.ceil(dual.value - 1e-3 - 1e-9 * Math.abs(dual.value)), deadline));
    finished = proven();
    lap('root-lp', finished);
    const single = inst.stocks.length === 1;
    if (!finished && single) {
      // One length (Falkenauer's sets): bin completion on the root duals is quick on exactly-full instances
      // (t60's triplets), so it goes first; LP dives then find what it misses (u120).
      const result = completionSearch(inst, kinds, dual, best.score.unplaced === 0 ? best : null, shareOf(deadline, 0.3));
      if (result.best && better(result.best.score, best.score)) best = result.best;
      finished = result.finished || proven();
      lap('completion-1', finished);
    }
    if (!finished && best.score.unplaced === 0) {
      // Several lengths: a tenth of the time. Dives prove a plan early or not at all; the rest of a larger
      // share only delayed the cost levels and the arc-flow, which prove most of these lists (measured with
      // bench/cutlist/run.ts --trace: 0.3 -> 0.1 took the median from 850-950 ms to 410-450 ms and proofs
      // from 71-73 to 77 of 100, back to back at load 8-10; 0.05 proved no more).
      // Several lengths: the dives also stop after DIVE_STALL in a row without a cheaper plan, and count a
      // plan at its cost after downgrading boards, as it is kept below.
      const limits = single
        ? {}
        : { stall: DIVE_STALL, costOf: (plan: DivePlan) => downgrade(inst, solutionOf(inst, kinds, plan.patterns)).score.cost };
      const dived = diveSearch(problem, lb, shareOf(deadline, single ? 0.6 : DIVE_SHARE_SEVERAL_LENGTHS), rng(7), limits);
      if (dived) {
        const sol = downgrade(inst, solutionOf(inst, kinds, dived.patterns));
        if (better(sol.score, best.score)) best = sol;
      }
      finished = proven();
      lap('dives', finished);
    }
    // After the dives, which often close the gap alone in a few milliseconds on a quiet machine.
    if (!finished && best.score.unplaced === 0 && mipAvailable()) {
      ({ best, lb, finished } = mipStages(inst, kinds, problem, dual, { best, lb, finished }, shareOf(deadline, 0.6), lap));
    }
    // Several priced lengths: the gap is in the mix of lengths, so list mixes by cost (cost-levels.ts), then
    // bin completion with the pattern LP of what is left as its node bound.
    if (!finished && !single && best.score.unplaced === 0) {
      const levels = searchCostLevels(inst, kinds, problem, best, lb, shareOf(deadline, 0.7));
      best = levels.best;
      lb = Math.max(lb, levels.lb);
      finished = levels.finished || proven();
      lap('cost-levels', finished);
    }
    if (!finished && !single) {
      const result = completionSearch(inst, kinds, dual, best.score.unplaced === 0 ? best : null, shareOf(deadline, 0.6), problem);
      if (result.best && better(result.best.score, best.score)) best = result.best;
      finished = result.finished || proven();
      lap('completion', finished);
    }
    // A depth-first search that has not closed the gap is usually stuck deep in the tree, where ruin and
    // recreate still finds better plans, so it gets what time is left.
    if (!finished && best.score.unplaced === 0) {
      best = improve(inst, best, lb, deadline);
      finished = proven();
      lap('improve', finished);
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
