/** Fast plans: greedy fits, minimum slack, and ruin-and-recreate improvement. */
import { rng } from './random';
import { expired, expiredEvery, type Deadline } from './deadline';
import { type Bin, type Instance, type Solution, better } from './instance';

// ---------- heuristics ----------

export type Chooser = (size: number, used: readonly number[]) => number;

export function chooserFor(inst: Instance, preferred: number | null): Chooser {
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

export function greedy(inst: Instance, order: readonly number[], bestFit: boolean, choose: Chooser): Solution {
  const bins: Bin[] = [];
  const unplaced = fillBins(inst, order, bestFit, choose, bins, inst.stocks.map(() => 0));
  return inst.solution(bins, unplaced);
}

/**
 * Places pieces in `order` into `bins` (first fit, or best fit: the least room left), opening a bin of
 * the chosen stock when none has room; `used` counts the bins of each stock and is updated. Returns
 * the pieces no stock can take.
 */
function fillBins(inst: Instance, order: readonly number[], bestFit: boolean, choose: Chooser, bins: Bin[], used: number[]): number[] {
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
  return unplaced;
}

/** Moves each board to the cheapest stock that still holds its pieces, fullest boards first. */
export function downgrade(inst: Instance, sol: Solution): Solution {
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
export function minimumSlack(inst: Instance, deadline: Deadline): Solution {
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
          if (++nodes > 20_000 || expiredEvery(deadline)) return true;
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

/** Ruin and recreate: empty a few boards, refill them best-fit into the rest, keep the result if not worse. */
export function improve(inst: Instance, start: Solution, lb: number, deadline: Deadline): Solution {
  let best = start;
  let current = start;
  const random = rng(12345);
  const choose = chooserFor(inst, null);
  let iter = 0;
  while (best.score.cost > lb && !expired(deadline)) {
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
    const unplaced = fillBins(inst, freed, true, choose, kept, used);
    const candidate = downgrade(inst, inst.solution(kept, unplaced));
    const c = candidate.score;
    const cur = current.score;
    if (c.unplaced < cur.unplaced || (c.unplaced === cur.unplaced && c.cost <= cur.cost)) current = candidate;
    if (better(current.score, best.score)) best = current;
    if (iter % 2000 === 0) current = best;
  }
  return best;
}
