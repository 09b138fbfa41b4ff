/** The integer model of a linear request: pieces, stock types, boards (bins) and how plans are compared. */
import type { LinearCutRequest } from './types';

export const SCALE = 1_000_000;
export const toMicro = (x: number): number => Math.round(x * SCALE);

export interface Piece {
  part: number;
  len: number; // micro-inches
  size: number; // len + kerf
}

export interface StockType {
  index: number;
  cap: number; // usable + kerf, micro-inches
  price: number; // micro-dollars
  available: number;
}

export interface Bin {
  stock: number; // index into the internal stock list
  load: number;
  items: number[]; // piece indices
}

export interface Score {
  unplaced: number;
  cost: number;
  boards: number;
  longestOffcut: number;
}

export interface Solution {
  bins: Bin[];
  unplaced: number[];
  score: Score;
}

/** Lexicographic: fewer unplaced pieces, least cost, fewest boards, longest single offcut. */
export function better(a: Score, b: Score): boolean {
  if (a.unplaced !== b.unplaced) return a.unplaced < b.unplaced;
  if (a.cost !== b.cost) return a.cost < b.cost;
  if (a.boards !== b.boards) return a.boards < b.boards;
  return a.longestOffcut > b.longestOffcut;
}

export class Instance {
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

  /** The same instance with at most `counts[s]` boards of each stock (same stock positions). */
  withAvailable(counts: readonly number[]): Instance {
    const copy = Object.create(Instance.prototype) as Instance;
    const stocks = this.stocks.map((s, i) => ({ ...s, available: Math.min(s.available, counts[i] ?? 0) }));
    Object.assign(copy, { ...this, stocks });
    return copy;
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

export function validate(req: LinearCutRequest): void {
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
