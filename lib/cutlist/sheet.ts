/**
 * Sheet cut planning: which sheets of plywood or MDF to buy and where each part is cut from them.
 *
 * Layouts are guillotine: every part comes free by straight edge-to-edge cuts, as on a table saw or
 * track saw. A cut at p across a region of real size R leaves p and R - p - kerf; adding one kerf to
 * every part and to the sheet turns that into a cut that removes nothing (p + kerf and R - p). So
 * everything inside is packed kerf-free in these grown sizes, and a grown part starts where the real
 * part does. As in the linear planner, lengths are integer micro-inches and prices integer
 * micro-dollars so an exactly full sheet is never refused for a floating-point hair.
 *
 * x runs along the sheet width and y along its length; a part that is not rotated has its length
 * along y.
 */
import { dffSheetBound } from './sheet-dff';
import { rng } from './random';

export type SheetGrain = 'length' | 'any';

export interface SheetPart {
  id: string;
  width: number;
  length: number;
  quantity: number;
  label?: string;
  grain?: SheetGrain;
}

export interface SheetStock {
  id: string;
  width: number;
  length: number;
  price: number;
  available?: number;
}

export interface SheetCutRequest {
  kerf: number;
  parts: SheetPart[];
  stock: SheetStock[];
  timeLimitMs?: number;
}

export interface SheetPlacement {
  partId: string;
  x: number;
  y: number;
  width: number;
  length: number;
  rotated: boolean;
}

export interface SheetLayout {
  stockId: string;
  width: number;
  length: number;
  placements: SheetPlacement[];
  waste: number;
}

export interface SheetPurchase {
  stockId: string;
  count: number;
  cost: number;
}

export interface SheetUnplaced {
  partId: string;
  quantity: number;
  reason: string;
}

export interface SheetCutPlan {
  sheets: SheetLayout[];
  purchase: SheetPurchase[];
  totalCost: number;
  lowerBound: number;
  optimal: boolean;
  unplaced: SheetUnplaced[];
}

const SCALE = 1_000_000;
const toMicro = (x: number): number => Math.round(x * SCALE);
const EXACT_MAX_PIECES = 8;
const SINGLE_SHEET_EXACT_MAX_PIECES = 7;
const BOUND_NODE_LIMIT = 20_000;
const NOT_ENOUGH_STOCK = 'Not enough stock available to cut this part.';

interface Piece {
  part: number;
  w: number; // real micro-inches
  l: number;
  gw: number; // grown by one kerf
  gl: number;
  area: number; // grown area
  rotatable: boolean;
}

interface StockType {
  index: number;
  gw: number; // grown by one kerf
  gl: number;
  area: number; // grown area
  price: number; // micro-dollars
  available: number;
}

interface Rect {
  x: number;
  y: number;
  w: number;
  h: number;
}

interface Placed {
  piece: number;
  x: number;
  y: number;
  rotated: boolean;
}

/** Free rectangles are the empty leaves of the sheet's cut tree, so filling one keeps the layout guillotine. */
interface Sheet {
  stock: number;
  placed: Placed[];
  free: Rect[];
  used: number;
}

interface Score {
  unplaced: number;
  cost: number;
  sheets: number;
  leftover: number; // real area of the largest free rectangle
}

interface Solution {
  sheets: Sheet[];
  unplaced: number[];
  score: Score;
}

type FitRule = 'area' | 'short' | 'long' | 'bottomLeft';
type SplitRule = 'shorterAxis' | 'longerAxis' | 'shorterLeftover' | 'longerLeftover' | 'minArea' | 'maxArea';

interface Rules {
  fit: FitRule;
  split: SplitRule;
}

const FIT_RULES: readonly FitRule[] = ['area', 'short', 'long', 'bottomLeft'];
const SPLIT_RULES: readonly SplitRule[] = ['shorterAxis', 'longerAxis', 'shorterLeftover', 'longerLeftover', 'minArea', 'maxArea'];
const ALL_RULES: readonly Rules[] = FIT_RULES.flatMap((fit) => SPLIT_RULES.map((split) => ({ fit, split })));
const QUICK_RULES: readonly Rules[] = [
  { fit: 'area', split: 'shorterLeftover' },
  { fit: 'short', split: 'shorterLeftover' },
  { fit: 'area', split: 'minArea' },
  { fit: 'long', split: 'longerLeftover' },
  { fit: 'bottomLeft', split: 'shorterAxis' },
  { fit: 'bottomLeft', split: 'longerAxis' },
  { fit: 'short', split: 'maxArea' },
  { fit: 'area', split: 'longerAxis' },
];

const ORDER_KEYS: readonly ((p: Piece) => number)[] = [
  (p) => p.area,
  (p) => Math.max(p.gw, p.gl),
  (p) => p.gw,
  (p) => p.gl,
  (p) => p.gw + p.gl,
];

/** Lexicographic: fewer unplaced pieces, least cost, fewest sheets, largest single leftover. */
function better(a: Score, b: Score): boolean {
  if (a.unplaced !== b.unplaced) return a.unplaced < b.unplaced;
  if (a.cost !== b.cost) return a.cost < b.cost;
  if (a.sheets !== b.sheets) return a.sheets < b.sheets;
  return a.leftover > b.leftover;
}

function fitsStock(p: Piece, s: StockType): boolean {
  return (p.gw <= s.gw && p.gl <= s.gl) || (p.rotatable && p.gl <= s.gw && p.gw <= s.gl);
}

class Instance {
  readonly pieces: Piece[];
  readonly stocks: StockType[];
  readonly kerf: number;
  readonly fit: boolean[][]; // fit[piece][stock]
  readonly unfit: { part: number; reason: string }[];

  constructor(req: SheetCutRequest) {
    validate(req);
    this.kerf = toMicro(req.kerf);
    const k = this.kerf;
    const allStocks = req.stock.map((s, index) => {
      const gw = toMicro(s.width) + k;
      const gl = toMicro(s.length) + k;
      return { index, gw, gl, area: gw * gl, price: toMicro(s.price), available: s.available ?? Number.POSITIVE_INFINITY };
    });
    this.stocks = allStocks.filter((s) => s.available > 0);
    this.pieces = [];
    this.unfit = [];
    req.parts.forEach((p, part) => {
      if (p.quantity === 0) return;
      const w = toMicro(p.width);
      const l = toMicro(p.length);
      const piece = { part, w, l, gw: w + k, gl: l + k, area: (w + k) * (l + k), rotatable: (p.grain ?? 'any') !== 'length' };
      if (this.stocks.some((s) => fitsStock(piece, s))) {
        for (let q = 0; q < p.quantity; q++) this.pieces.push({ ...piece });
        return;
      }
      this.unfit.push({ part, reason: unfitReason(req, piece, allStocks) });
    });
    // Decreasing area; ties by part so equal pieces sit together.
    this.pieces.sort((a, b) => b.area - a.area || a.part - b.part);
    this.fit = this.pieces.map((p) => this.stocks.map((s) => fitsStock(p, s)));
  }

  stock(sheet: Sheet): StockType {
    const s = this.stocks[sheet.stock];
    if (!s) throw new Error('sheet of unknown stock');
    return s;
  }

  piece(i: number): Piece {
    const p = this.pieces[i];
    if (!p) throw new Error('unknown piece');
    return p;
  }

  leftoverOf(sheet: Sheet): number {
    let best = 0;
    for (const r of sheet.free) {
      const w = r.w - this.kerf;
      const h = r.h - this.kerf;
      if (w > 0 && h > 0) best = Math.max(best, w * h);
    }
    return best;
  }

  solution(sheets: Sheet[], unplaced: number[]): Solution {
    let cost = 0;
    let leftover = 0;
    for (const s of sheets) {
      cost += this.stock(s).price;
      leftover = Math.max(leftover, this.leftoverOf(s));
    }
    return { sheets, unplaced, score: { unplaced: unplaced.length, cost, sheets: sheets.length, leftover } };
  }
}

function unfitReason(req: SheetCutRequest, p: Piece, allStocks: readonly StockType[]): string {
  const part = req.parts[p.part];
  const size = part ? `${part.width} x ${part.length} in` : 'This part';
  if (allStocks.length === 0) return 'No stock sheets were given.';
  const fitsTurned = allStocks.some((s) => fitsStock({ ...p, rotatable: true }, s));
  if (!fitsTurned) {
    const sizes = [...new Set(req.stock.map((s) => `${s.width} x ${s.length} in`))].join(', ');
    return `${size} is larger than every stock sheet (${sizes}), either way round.`;
  }
  if (!allStocks.some((s) => fitsStock(p, s)) && !p.rotatable) {
    return `${size} fits a sheet only turned across the grain, and its grain must run along the sheet length.`;
  }
  return NOT_ENOUGH_STOCK;
}

function validate(req: SheetCutRequest): void {
  const finiteNonNegative = (x: number): boolean => Number.isFinite(x) && x >= 0;
  const positive = (x: number): boolean => Number.isFinite(x) && x > 0;
  if (!finiteNonNegative(req.kerf)) throw new RangeError('kerf must be a number of inches, 0 or more.');
  const ids = new Set<string>();
  for (const p of req.parts) {
    if (ids.has(p.id)) throw new RangeError(`Part id ${p.id} appears twice.`);
    ids.add(p.id);
    if (!positive(p.width) || !positive(p.length)) throw new RangeError(`Part ${p.id} needs a width and length above 0.`);
    if (!(Number.isInteger(p.quantity) && p.quantity >= 0)) throw new RangeError(`Part ${p.id} needs a whole quantity.`);
    if (p.grain !== undefined && p.grain !== 'length' && p.grain !== 'any') {
      throw new RangeError(`Part ${p.id} needs grain 'length' or 'any'.`);
    }
  }
  const stockIds = new Set<string>();
  for (const s of req.stock) {
    if (stockIds.has(s.id)) throw new RangeError(`Stock id ${s.id} appears twice.`);
    stockIds.add(s.id);
    if (!positive(s.width) || !positive(s.length)) throw new RangeError(`Stock ${s.id} needs a width and length above 0.`);
    if (!finiteNonNegative(s.price)) throw new RangeError(`Stock ${s.id} needs a price of 0 or more.`);
    if (s.available !== undefined && !(Number.isInteger(s.available) && s.available >= 0)) {
      throw new RangeError(`Stock ${s.id} needs a whole number available.`);
    }
  }
  if (req.timeLimitMs !== undefined && !finiteNonNegative(req.timeLimitMs)) {
    throw new RangeError('timeLimitMs must be 0 or more.');
  }
}

// ---------- guillotine packing into free rectangles (after Jylänki 2010, "A Thousand Ways to Pack the Bin") ----------

interface Spot {
  rect: number;
  rotated: boolean;
  s1: number;
  s2: number;
}

function footprint(p: Piece, rotated: boolean): [number, number] {
  return rotated ? [p.gl, p.gw] : [p.gw, p.gl];
}

function spotIn(sheet: Sheet, p: Piece, fit: FitRule): Spot | null {
  let best: Spot | null = null;
  for (let ri = 0; ri < sheet.free.length; ri++) {
    const r = sheet.free[ri];
    if (!r) continue;
    for (let o = 0; o < (p.rotatable ? 2 : 1); o++) {
      const rotated = o === 1;
      const [pw, ph] = footprint(p, rotated);
      if (pw > r.w || ph > r.h) continue;
      const dw = r.w - pw;
      const dh = r.h - ph;
      let s1: number;
      let s2: number;
      switch (fit) {
        case 'area':
          s1 = r.w * r.h - pw * ph;
          s2 = Math.min(dw, dh);
          break;
        case 'short':
          s1 = Math.min(dw, dh);
          s2 = Math.max(dw, dh);
          break;
        case 'long':
          s1 = Math.max(dw, dh);
          s2 = Math.min(dw, dh);
          break;
        case 'bottomLeft':
          s1 = r.y + ph;
          s2 = r.x;
          break;
      }
      if (!best || s1 < best.s1 || (s1 === best.s1 && s2 < best.s2)) best = { rect: ri, rotated, s1, s2 };
    }
  }
  return best;
}

function splitHorizontally(r: Rect, pw: number, ph: number, rule: SplitRule): boolean {
  const dw = r.w - pw;
  const dh = r.h - ph;
  switch (rule) {
    case 'shorterAxis':
      return r.w <= r.h;
    case 'longerAxis':
      return r.w > r.h;
    case 'shorterLeftover':
      return dw <= dh;
    case 'longerLeftover':
      return dw > dh;
    case 'minArea':
      return pw * dh > dw * ph;
    case 'maxArea':
      return pw * dh <= dw * ph;
  }
}

function placeAt(inst: Instance, sheet: Sheet, piece: number, spot: Spot, split: SplitRule): void {
  const r = sheet.free[spot.rect];
  if (!r) throw new Error('no such free rectangle');
  const p = inst.piece(piece);
  const [pw, ph] = footprint(p, spot.rotated);
  sheet.free.splice(spot.rect, 1);
  // A horizontal split cuts across the whole free rectangle at the top of the part first.
  const horizontal = splitHorizontally(r, pw, ph, split);
  const right: Rect = { x: r.x + pw, y: r.y, w: r.w - pw, h: horizontal ? ph : r.h };
  const top: Rect = { x: r.x, y: r.y + ph, w: horizontal ? r.w : pw, h: r.h - ph };
  if (right.w > 0 && right.h > 0) sheet.free.push(right);
  if (top.w > 0 && top.h > 0) sheet.free.push(top);
  sheet.placed.push({ piece, x: r.x, y: r.y, rotated: spot.rotated });
  sheet.used += p.area;
}

function newSheet(inst: Instance, stock: number): Sheet {
  const s = inst.stocks[stock];
  if (!s) throw new Error('unknown stock');
  return { stock, placed: [], free: [{ x: 0, y: 0, w: s.gw, h: s.gl }], used: 0 };
}

const cloneSheet = (s: Sheet): Sheet => ({ stock: s.stock, placed: [...s.placed], free: [...s.free], used: s.used });

type StockPolicy = 'rate' | 'large' | number;

function chooseStock(inst: Instance, piece: number, used: readonly number[], policy: StockPolicy): number {
  const fits = inst.fit[piece] ?? [];
  const open = (j: number): boolean => (fits[j] ?? false) && (used[j] ?? 0) < (inst.stocks[j]?.available ?? 0);
  if (typeof policy === 'number' && open(policy)) return policy;
  let best = -1;
  inst.stocks.forEach((s, j) => {
    if (!open(j)) return;
    const b = inst.stocks[best];
    if (!b) {
      best = j;
      return;
    }
    const rs = s.price / s.area;
    const rb = b.price / b.area;
    if (policy === 'large' ? s.area > b.area || (s.area === b.area && s.price < b.price) : rs < rb || (rs === rb && s.area > b.area)) {
      best = j;
    }
  });
  return best;
}

/** Pieces in order, each into the best (or first) free rectangle of the open sheets, else onto a new sheet. */
function packPieces(inst: Instance, order: readonly number[], rules: Rules, firstFit: boolean, policy: StockPolicy): Solution {
  const sheets: Sheet[] = [];
  const used = inst.stocks.map(() => 0);
  const unplaced: number[] = [];
  for (const i of order) {
    const p = inst.piece(i);
    let target: Sheet | undefined;
    let spot: Spot | null = null;
    for (const sheet of sheets) {
      const s = spotIn(sheet, p, rules.fit);
      if (s && (!spot || s.s1 < spot.s1 || (s.s1 === spot.s1 && s.s2 < spot.s2))) {
        spot = s;
        target = sheet;
        if (firstFit) break;
      }
    }
    if (!target || !spot) {
      const j = chooseStock(inst, i, used, policy);
      if (j < 0) {
        unplaced.push(i);
        continue;
      }
      used[j] = (used[j] ?? 0) + 1;
      target = newSheet(inst, j);
      sheets.push(target);
      spot = spotIn(target, p, rules.fit);
      if (!spot) throw new Error('piece does not fit the stock chosen for it');
    }
    placeAt(inst, target, i, spot, rules.split);
  }
  return inst.solution(sheets, unplaced);
}

/** Packs `items` in order into one sheet of `stock`, skipping those that no longer fit; returns what was placed. */
function fillSheet(inst: Instance, stock: number, items: readonly number[], rules: Rules): { sheet: Sheet; placed: Set<number> } {
  const sheet = newSheet(inst, stock);
  const placed = new Set<number>();
  const st = inst.stocks[stock];
  for (const i of items) {
    const p = inst.piece(i);
    if (!st || sheet.used + p.area > st.area) continue;
    const spot = spotIn(sheet, p, rules.fit);
    if (!spot) continue;
    placeAt(inst, sheet, i, spot, rules.split);
    placed.add(i);
  }
  return { sheet, placed };
}

/** One sheet at a time: the stock and rules that cut the most grown area per dollar from what is left. */
function packBySheet(inst: Instance, order: readonly number[], ruleSet: readonly Rules[]): Solution {
  let remaining = [...order];
  const sheets: Sheet[] = [];
  const used = inst.stocks.map(() => 0);
  while (remaining.length > 0) {
    let pick = null as { sheet: Sheet; placed: Set<number>; value: number } | null;
    inst.stocks.forEach((s, j) => {
      if ((used[j] ?? 0) >= s.available) return;
      if (!remaining.some((i) => inst.fit[i]?.[j])) return;
      for (const rules of ruleSet) {
        const cand = fillSheet(inst, j, remaining, rules);
        if (cand.placed.size === 0) continue;
        const value = s.price > 0 ? cand.sheet.used / s.price : Number.POSITIVE_INFINITY;
        if (!pick || value > pick.value || (value === pick.value && cand.sheet.used > pick.sheet.used)) {
          pick = { ...cand, value };
        }
      }
    });
    const chosen = pick;
    if (!chosen) break;
    sheets.push(chosen.sheet);
    used[chosen.sheet.stock] = (used[chosen.sheet.stock] ?? 0) + 1;
    remaining = remaining.filter((i) => !chosen.placed.has(i));
  }
  return inst.solution(sheets, remaining);
}

// ---------- exact guillotine packing for a few pieces ----------

type BoxNode = { piece: number; rotated: boolean } | { vertical: boolean; a: Box; b: Box };

interface Box {
  w: number;
  h: number;
  node: BoxNode;
}

function addBox(list: Box[], box: Box): void {
  for (const b of list) if (b.w <= box.w && b.h <= box.h) return;
  for (let k = list.length - 1; k >= 0; k--) {
    const b = list[k];
    if (b && box.w <= b.w && box.h <= b.h) list.splice(k, 1);
  }
  list.push(box);
}

/**
 * For each subset of `items` (bit k is items[k]), the Pareto-minimal bounding boxes of its guillotine
 * packings that `keep` accepts. Every guillotine packing splits by its first cut into two guillotine
 * packings side by side or stacked, so combining the boxes of every two-way split finds them all.
 * Returns null if the deadline passes.
 */
function frontiers(inst: Instance, items: readonly number[], keep: (w: number, h: number) => boolean, deadline: number): Box[][] | null {
  const n = items.length;
  const full = (1 << n) - 1;
  const boxes: Box[][] = Array.from({ length: full + 1 }, () => []);
  items.forEach((i, k) => {
    const p = inst.piece(i);
    const list = boxes[1 << k] ?? [];
    for (let o = 0; o < (p.rotatable ? 2 : 1); o++) {
      const [w, h] = footprint(p, o === 1);
      if (keep(w, h)) addBox(list, { w, h, node: { piece: i, rotated: o === 1 } });
    }
  });
  let steps = 0;
  for (let mask = 1; mask <= full; mask++) {
    if ((mask & (mask - 1)) === 0) continue;
    const list = boxes[mask] ?? [];
    const low = mask & -mask;
    for (let sub = (mask - 1) & mask; sub > 0; sub = (sub - 1) & mask) {
      if ((sub & low) === 0) continue;
      const as = boxes[sub] ?? [];
      const bs = boxes[mask ^ sub] ?? [];
      if (as.length === 0 || bs.length === 0) continue;
      if (++steps % 32 === 0 && Date.now() > deadline) return null;
      for (const a of as) {
        for (const b of bs) {
          const vw = a.w + b.w;
          const vh = Math.max(a.h, b.h);
          if (keep(vw, vh)) addBox(list, { w: vw, h: vh, node: { vertical: true, a, b } });
          const hw = Math.max(a.w, b.w);
          const hh = a.h + b.h;
          if (keep(hw, hh)) addBox(list, { w: hw, h: hh, node: { vertical: false, a, b } });
        }
      }
    }
  }
  return boxes;
}

function layBox(box: Box, x: number, y: number, placed: Placed[], free: Rect[]): void {
  const push = (r: Rect): void => {
    if (r.w > 0 && r.h > 0) free.push(r);
  };
  const node = box.node;
  if ('piece' in node) {
    placed.push({ piece: node.piece, x, y, rotated: node.rotated });
    return;
  }
  const { a, b } = node;
  layBox(a, x, y, placed, free);
  if (node.vertical) {
    layBox(b, x + a.w, y, placed, free);
    push({ x, y: y + a.h, w: a.w, h: box.h - a.h });
    push({ x: x + a.w, y: y + b.h, w: b.w, h: box.h - b.h });
  } else {
    layBox(b, x, y + a.h, placed, free);
    push({ x: x + a.w, y, w: box.w - a.w, h: a.h });
    push({ x: x + b.w, y: y + a.h, w: box.w - b.w, h: b.h });
  }
}

function sheetFromBox(inst: Instance, stock: number, box: Box): Sheet {
  const s = inst.stocks[stock];
  if (!s) throw new Error('unknown stock');
  const placed: Placed[] = [];
  const free: Rect[] = [];
  layBox(box, 0, 0, placed, free);
  const used = placed.reduce((a, p) => a + inst.piece(p.piece).area, 0);
  // The rest of the sheet is an L; cut it whichever way leaves the larger offcut.
  const options: Rect[][] = [
    [
      { x: box.w, y: 0, w: s.gw - box.w, h: s.gl },
      { x: 0, y: box.h, w: box.w, h: s.gl - box.h },
    ],
    [
      { x: 0, y: box.h, w: s.gw, h: s.gl - box.h },
      { x: box.w, y: 0, w: s.gw - box.w, h: box.h },
    ],
  ];
  let best: Sheet | null = null;
  for (const extra of options) {
    const sheet = { stock, placed, free: [...free, ...extra.filter((r) => r.w > 0 && r.h > 0)], used };
    if (!best || inst.leftoverOf(sheet) > inst.leftoverOf(best)) best = sheet;
  }
  if (!best) throw new Error('unreachable');
  return best;
}

/**
 * Exact least cost (then fewest sheets) for a few pieces, ignoring `available`: the cheapest stock
 * for every subset that fits one sheet, then the best partition into such subsets. The cost is a
 * lower bound in any case; the solution is returned only if it also respects `available`.
 */
function exactPlan(inst: Instance, items: readonly number[], deadline: number): { cost: number; solution: Solution | null } | null {
  const n = items.length;
  const full = (1 << n) - 1;
  const boxes = frontiers(inst, items, (w, h) => inst.stocks.some((s) => w <= s.gw && h <= s.gl), deadline);
  if (!boxes) return null;
  const single: ({ stock: number; box: Box } | null)[] = boxes.map((list) => {
    let pick: { stock: number; box: Box } | null = null;
    inst.stocks.forEach((s, j) => {
      const box = list.find((b) => b.w <= s.gw && b.h <= s.gl);
      if (!box) return;
      const cur = pick ? inst.stocks[pick.stock] : undefined;
      if (!cur || s.price < cur.price || (s.price === cur.price && s.area > cur.area)) pick = { stock: j, box };
    });
    return pick;
  });
  const cost = new Array<number>(full + 1).fill(Number.POSITIVE_INFINITY);
  const count = new Array<number>(full + 1).fill(0);
  const choice = new Array<number>(full + 1).fill(0);
  cost[0] = 0;
  for (let mask = 1; mask <= full; mask++) {
    const low = mask & -mask;
    for (let sub = mask; sub > 0; sub = (sub - 1) & mask) {
      if ((sub & low) === 0) continue;
      const one = single[sub];
      const restCost = cost[mask ^ sub] ?? Number.POSITIVE_INFINITY;
      if (!one || restCost === Number.POSITIVE_INFINITY) continue;
      const c = restCost + (inst.stocks[one.stock]?.price ?? 0);
      const k = (count[mask ^ sub] ?? 0) + 1;
      const bc = cost[mask] ?? Number.POSITIVE_INFINITY;
      if (c < bc || (c === bc && k < (count[mask] ?? 0))) {
        cost[mask] = c;
        count[mask] = k;
        choice[mask] = sub;
      }
    }
    if (Date.now() > deadline) return null;
  }
  const total = cost[full] ?? Number.POSITIVE_INFINITY;
  if (total === Number.POSITIVE_INFINITY) return null;
  const sheets: Sheet[] = [];
  const used = inst.stocks.map(() => 0);
  for (let mask = full; mask > 0; ) {
    const sub = choice[mask] ?? 0;
    const one = single[sub];
    if (!one || sub === 0) return null;
    sheets.push(sheetFromBox(inst, one.stock, one.box));
    used[one.stock] = (used[one.stock] ?? 0) + 1;
    mask ^= sub;
  }
  const withinStock = inst.stocks.every((s, j) => (used[j] ?? 0) <= s.available);
  return { cost: total, solution: withinStock ? inst.solution(sheets, []) : null };
}

// ---------- improvement ----------

function sortBy(inst: Instance, items: readonly number[], key: (p: Piece) => number): number[] {
  return [...items].sort((a, b) => key(inst.piece(b)) - key(inst.piece(a)) || inst.piece(b).area - inst.piece(a).area || a - b);
}

/** Repacks `items` into one sheet of `stock`, heuristically and then exactly when they are few. */
function repackSingle(inst: Instance, items: readonly number[], stock: number, deadline: number): Sheet | null {
  const s = inst.stocks[stock];
  if (!s || !items.every((i) => inst.fit[i]?.[stock])) return null;
  if (items.reduce((a, i) => a + inst.piece(i).area, 0) > s.area) return null;
  for (const key of ORDER_KEYS.slice(0, 3)) {
    const order = sortBy(inst, items, key);
    for (const rules of QUICK_RULES) {
      const { sheet, placed } = fillSheet(inst, stock, order, rules);
      if (placed.size === items.length) return sheet;
    }
  }
  if (items.length <= SINGLE_SHEET_EXACT_MAX_PIECES && Date.now() < deadline) {
    const boxes = frontiers(inst, items, (w, h) => w <= s.gw && h <= s.gl, deadline);
    const box = boxes?.[(1 << items.length) - 1]?.[0];
    if (box) return sheetFromBox(inst, stock, box);
  }
  return null;
}

const piecesOf = (sheet: Sheet): number[] => sheet.placed.map((p) => p.piece);

/** Moves the pieces of the emptiest sheets into the free rectangles of the others where they all go. */
function eliminate(inst: Instance, sol: Solution, fit: FitRule, split: SplitRule): Solution {
  let sheets = sol.sheets;
  let tries = 0;
  for (let changed = true; changed && sheets.length > 1 && tries < 40; ) {
    changed = false;
    const byUse = [...sheets].sort((a, b) => a.used - b.used);
    for (const victim of byUse.slice(0, 3)) {
      tries++;
      const others = sheets.filter((s) => s !== victim).map(cloneSheet);
      const free = others.reduce((a, s) => a + inst.stock(s).area - s.used, 0);
      if (free < victim.used) continue;
      let ok = true;
      for (const i of sortBy(inst, piecesOf(victim), (p) => p.area)) {
        const p = inst.piece(i);
        let target: Sheet | undefined;
        let spot: Spot | null = null;
        for (const sheet of others) {
          const s = spotIn(sheet, p, fit);
          if (s && (!spot || s.s1 < spot.s1 || (s.s1 === spot.s1 && s.s2 < spot.s2))) {
            spot = s;
            target = sheet;
          }
        }
        if (!target || !spot) {
          ok = false;
          break;
        }
        placeAt(inst, target, i, spot, split);
      }
      if (ok) {
        sheets = others;
        changed = true;
        break;
      }
    }
  }
  return inst.solution(sheets, sol.unplaced);
}

/** Moves each sheet's parts to a cheaper stock that still holds them, fullest sheets first. */
function downgrade(inst: Instance, sol: Solution, deadline: number): Solution {
  const used = inst.stocks.map(() => 0);
  for (const s of sol.sheets) used[s.stock] = (used[s.stock] ?? 0) + 1;
  const sheets = [...sol.sheets].sort((a, b) => b.used - a.used);
  const cheaper = inst.stocks.map((_, j) => j).sort((a, b) => (inst.stocks[a]?.price ?? 0) - (inst.stocks[b]?.price ?? 0));
  for (let k = 0; k < sheets.length; k++) {
    const sheet = sheets[k];
    if (!sheet) continue;
    const price = inst.stock(sheet).price;
    for (const j of cheaper) {
      const s = inst.stocks[j];
      if (!s || s.price >= price || (used[j] ?? 0) >= s.available || s.area < sheet.used) continue;
      const moved = repackSingle(inst, piecesOf(sheet), j, deadline);
      if (!moved) continue;
      used[sheet.stock] = (used[sheet.stock] ?? 0) - 1;
      used[j] = (used[j] ?? 0) + 1;
      sheets[k] = moved;
      break;
    }
  }
  return inst.solution(sheets, sol.unplaced);
}

/** Replaces two sheets by one sheet of a stock that costs no more than the pair. */
function mergePairs(inst: Instance, sol: Solution, deadline: number): Solution {
  let sheets = [...sol.sheets];
  if (sheets.length > 40) return sol;
  const used = inst.stocks.map(() => 0);
  for (const s of sheets) used[s.stock] = (used[s.stock] ?? 0) + 1;
  for (let a = 0; a < sheets.length; a++) {
    for (let b = a + 1; b < sheets.length; b++) {
      if (Date.now() > deadline) return inst.solution(sheets, sol.unplaced);
      const sa = sheets[a];
      const sb = sheets[b];
      if (!sa || !sb) continue;
      const pair = inst.stock(sa).price + inst.stock(sb).price;
      const items = [...piecesOf(sa), ...piecesOf(sb)];
      const area = sa.used + sb.used;
      for (let j = 0; j < inst.stocks.length; j++) {
        const s = inst.stocks[j];
        const freed = (sa.stock === j ? 1 : 0) + (sb.stock === j ? 1 : 0);
        if (!s || s.price > pair || s.area < area || (used[j] ?? 0) - freed >= s.available) continue;
        const merged = repackSingle(inst, items, j, deadline);
        if (!merged) continue;
        used[sa.stock] = (used[sa.stock] ?? 0) - 1;
        used[sb.stock] = (used[sb.stock] ?? 0) - 1;
        used[j] = (used[j] ?? 0) + 1;
        sheets = sheets.filter((_, k) => k !== a && k !== b);
        sheets.push(merged);
        a = -1;
        break;
      }
      if (a < 0) break;
    }
  }
  return inst.solution(sheets, sol.unplaced);
}

function polish(inst: Instance, sol: Solution, rules: Rules, deadline: number): Solution {
  let s = eliminate(inst, sol, rules.fit, rules.split);
  s = downgrade(inst, s, deadline);
  return mergePairs(inst, s, deadline);
}

// ---------- lower bounds ----------

function canShare(inst: Instance, a: number, b: number): boolean {
  const pa = inst.piece(a);
  const pb = inst.piece(b);
  return inst.stocks.some((s, j) => {
    if (!inst.fit[a]?.[j] || !inst.fit[b]?.[j]) return false;
    for (let oa = 0; oa < (pa.rotatable ? 2 : 1); oa++) {
      for (let ob = 0; ob < (pb.rotatable ? 2 : 1); ob++) {
        const [wa, ha] = footprint(pa, oa === 1);
        const [wb, hb] = footprint(pb, ob === 1);
        // Two disjoint rectangles are always split by one straight line, so any two that fit are guillotine.
        if ((wa + wb <= s.gw && Math.max(ha, hb) <= s.gl) || (Math.max(wa, wb) <= s.gw && ha + hb <= s.gl)) return true;
      }
    }
    return false;
  });
}

/** Pieces no two of which share any sheet, largest first. */
function greedyClique(inst: Instance, items: readonly number[]): Set<number> {
  const clique: number[] = [];
  for (const i of sortBy(inst, items, (p) => p.area)) {
    if (clique.every((c) => !canShare(inst, c, i))) clique.push(i);
  }
  return new Set(clique);
}

/** Sheets of the stocks in `q` needed for the pieces of `items` that fit only those stocks. */
function dffBoundOver(inst: Instance, items: readonly number[], q: number, maskOf: (i: number) => number): number {
  const stocks = inst.stocks.flatMap((s, j) => (q === -1 || (q & (1 << j)) !== 0 ? [{ s, j }] : []));
  const own = items.filter((i) => (maskOf(i) & ~q) === 0);
  return dffSheetBound(
    own.map((i) => inst.piece(i)),
    stocks.map(({ s }) => s),
    (k, t) => inst.fit[own[k] ?? -1]?.[stocks[t]?.j ?? -1] === true,
  );
}

interface Cover {
  coef: bigint[]; // per stock
  rhs: bigint;
}

/**
 * Least cost (or, with `unit`, fewest sheets) of a stock purchase that passes necessary conditions:
 * for every set Q of stock types, the sheets bought from Q hold the grown area of the pieces that fit
 * only stock in Q, and are at least as many as the pieces of a clique (no two can share a sheet) that
 * fit only stock in Q. Solved exactly by branch and bound; past the node limit, its LP bound.
 */
function coverBound(inst: Instance, items: readonly number[], unit: boolean): number {
  const m = inst.stocks.length;
  if (items.length === 0 || m === 0) return 0;
  const price = inst.stocks.map((s) => (unit ? 1 : s.price));
  // Bitmasks need m <= 30; past that every piece is taken to fit every stock, which only weakens the bound.
  const maskOf = (i: number): number => (m > 30 ? -1 : (inst.fit[i] ?? []).reduce((a, f, j) => (f ? a | (1 << j) : a), 0));
  const clique = greedyClique(inst, items);
  const groups = new Map<number, { area: bigint; clique: bigint }>();
  for (const i of items) {
    const key = maskOf(i);
    const g = groups.get(key) ?? { area: 0n, clique: 0n };
    g.area += BigInt(inst.piece(i).area);
    if (clique.has(i)) g.clique += 1n;
    groups.set(key, g);
  }
  const allMask = m > 30 ? -1 : (1 << m) - 1;
  const qs = m <= 10 ? Array.from({ length: allMask }, (_, q) => q + 1) : [...new Set([...groups.keys(), allMask])];
  const covers: Cover[] = [];
  for (const q of qs) {
    let area = 0n;
    let count = 0n;
    let union = 0;
    for (const [key, g] of groups) {
      if ((key & ~q) !== 0) continue;
      area += g.area;
      count += g.clique;
      union |= key;
    }
    // The same needs over fewer stock types are a stronger condition, so only unions of fit sets count.
    if (union !== q) continue;
    const inQ = (j: number): boolean => q === -1 || (q & (1 << j)) !== 0;
    if (area > 0n) covers.push({ coef: inst.stocks.map((s, j) => (inQ(j) ? BigInt(s.area) : 0n)), rhs: area });
    // Sheets from Q: at least the clique, and at least the dual-feasible-function bound (sheet-dff.ts).
    const dff = BigInt(dffBoundOver(inst, items, q, maskOf));
    if (count > 0n || dff > 0n) covers.push({ coef: inst.stocks.map((_, j) => (inQ(j) ? 1n : 0n)), rhs: count > dff ? count : dff });
  }
  const rate = (j: number): number => (price[j] ?? 0) / (inst.stocks[j]?.area ?? 1);
  const order = inst.stocks.map((_, j) => j).sort((a, b) => rate(a) - rate(b));
  const position = new Array<number>(m).fill(0);
  order.forEach((j, k) => (position[j] = k));
  const byRate = covers.map((c) =>
    inst.stocks
      .map((_, j) => j)
      .filter((j) => (c.coef[j] ?? 0n) > 0n)
      .sort((a, b) => (price[a] ?? 0) / Number(c.coef[a] ?? 1n) - (price[b] ?? 0) / Number(c.coef[b] ?? 1n)),
  );
  const lhs = covers.map(() => 0n);

  // Fractional cover of every deficit by the stocks not yet decided; a valid bound on what they add.
  const fractional = (k: number): number => {
    let bound = 0;
    covers.forEach((c, ci) => {
      const deficit = c.rhs - (lhs[ci] ?? 0n);
      if (deficit <= 0n) return;
      let need = Number(deficit);
      let cost = 0;
      for (const j of byRate[ci] ?? []) {
        if ((position[j] ?? 0) < k) continue;
        const coef = Number(c.coef[j] ?? 0n);
        const take = Math.min(need, (inst.stocks[j]?.available ?? 0) * coef);
        cost += (take * (price[j] ?? 0)) / coef;
        need -= take;
        if (need <= 0) break;
      }
      bound = Math.max(bound, need > 0 ? Number.POSITIVE_INFINITY : cost);
    });
    return bound;
  };

  let best = Number.POSITIVE_INFINITY;
  let nodes = 0;
  let aborted = false;
  const search = (k: number, cost: number): void => {
    if (aborted) return;
    if (++nodes > BOUND_NODE_LIMIT) {
      aborted = true;
      return;
    }
    if (covers.every((c, ci) => (lhs[ci] ?? 0n) >= c.rhs)) {
      best = Math.min(best, cost);
      return;
    }
    if (k === m) return;
    // Costs are whole units, so a node that could beat `best` could reach best - 1; the half absorbs float error.
    if (cost + fractional(k) >= best - 0.5) return;
    const j = order[k] ?? 0;
    let needed = 0n;
    covers.forEach((c, ci) => {
      const coef = c.coef[j] ?? 0n;
      const deficit = c.rhs - (lhs[ci] ?? 0n);
      if (coef > 0n && deficit > 0n) needed = [needed, (deficit + coef - 1n) / coef].reduce((a, b) => (a > b ? a : b));
    });
    const hi = Math.min(inst.stocks[j]?.available ?? 0, Number(needed));
    for (let x = hi; x >= 0; x--) {
      const bx = BigInt(x);
      covers.forEach((c, ci) => (lhs[ci] = (lhs[ci] ?? 0n) + bx * (c.coef[j] ?? 0n)));
      search(k + 1, cost + x * (price[j] ?? 0));
      covers.forEach((c, ci) => (lhs[ci] = (lhs[ci] ?? 0n) - bx * (c.coef[j] ?? 0n)));
      if (aborted) return;
    }
  };
  const root = fractional(0);
  search(0, 0);
  if (!aborted && best < Number.POSITIVE_INFINITY) return best;
  return Number.isFinite(root) ? Math.max(0, Math.ceil(root - 1e-6)) : 0;
}

// ---------- entry points ----------

function render(req: SheetCutRequest, inst: Instance, sol: Solution, lb: number, optimal: boolean): SheetCutPlan {
  const k = inst.kerf;
  const sorted = [...sol.sheets].sort((a, b) => inst.stock(a).index - inst.stock(b).index || b.used - a.used);
  const counts = new Map<number, number>();
  const sheets: SheetLayout[] = [];
  for (const sheet of sorted) {
    const st = inst.stock(sheet);
    const stock = req.stock[st.index];
    if (!stock) continue;
    counts.set(st.index, (counts.get(st.index) ?? 0) + 1);
    let waste = BigInt(st.gw - k) * BigInt(st.gl - k);
    const placements: SheetPlacement[] = [...sheet.placed]
      .sort((a, b) => a.y - b.y || a.x - b.x)
      .map((pl) => {
        const p = inst.piece(pl.piece);
        const part = req.parts[p.part];
        waste -= BigInt(p.w) * BigInt(p.l);
        const width = part?.width ?? 0;
        const length = part?.length ?? 0;
        return {
          partId: part?.id ?? '',
          x: pl.x / SCALE,
          y: pl.y / SCALE,
          width: pl.rotated ? length : width,
          length: pl.rotated ? width : length,
          rotated: pl.rotated,
        };
      });
    sheets.push({ stockId: stock.id, width: stock.width, length: stock.length, placements, waste: Number(waste) / (SCALE * SCALE) });
  }
  const purchase: SheetPurchase[] = [];
  req.stock.forEach((s, index) => {
    const count = counts.get(index) ?? 0;
    if (count > 0) purchase.push({ stockId: s.id, count, cost: (count * toMicro(s.price)) / SCALE });
  });

  const unplacedCounts = new Map<number, { quantity: number; reason: string }>();
  for (const u of inst.unfit) unplacedCounts.set(u.part, { quantity: req.parts[u.part]?.quantity ?? 0, reason: u.reason });
  for (const i of sol.unplaced) {
    const part = inst.piece(i).part;
    const entry = unplacedCounts.get(part) ?? { quantity: 0, reason: NOT_ENOUGH_STOCK };
    entry.quantity++;
    unplacedCounts.set(part, entry);
  }
  const unplaced = [...unplacedCounts.entries()]
    .sort((a, b) => a[0] - b[0])
    .map(([part, e]) => ({ partId: req.parts[part]?.id ?? '', quantity: e.quantity, reason: e.reason }));

  return { sheets, purchase, totalCost: sol.score.cost / SCALE, lowerBound: lb / SCALE, optimal, unplaced };
}

export function planSheetCuts(req: SheetCutRequest): SheetCutPlan {
  const deadline = Date.now() + (req.timeLimitMs ?? 2000);
  const inst = new Instance(req);
  const all = inst.pieces.map((_, i) => i);
  if (all.length === 0) return render(req, inst, inst.solution([], []), 0, true);

  let lbCost = coverBound(inst, all, false);
  const lbSheets = coverBound(inst, all, true);
  let best = null as Solution | null;
  let proven = false;
  const consider = (s: Solution): void => {
    if (!best || better(s.score, best.score)) best = s;
  };
  const settled = (): boolean => {
    if (proven) return true;
    return best !== null && best.score.unplaced === 0 && best.score.cost <= lbCost && best.score.sheets <= lbSheets;
  };

  if (all.length <= EXACT_MAX_PIECES) {
    const exact = exactPlan(inst, all, deadline);
    if (exact) {
      lbCost = Math.max(lbCost, exact.cost);
      if (exact.solution) {
        consider(exact.solution);
        proven = true; // least cost, then fewest sheets
      }
    }
  } else {
    // Cutting some of the pieces costs no more than cutting them all, so the largest few give a bound.
    const boundDeadline = Math.min(deadline, Date.now() + (req.timeLimitMs ?? 2000) / 4);
    for (const key of ORDER_KEYS.slice(0, 2)) {
      const exact = exactPlan(inst, sortBy(inst, all, key).slice(0, EXACT_MAX_PIECES), boundDeadline);
      if (exact) lbCost = Math.max(lbCost, exact.cost);
    }
  }

  const policies: StockPolicy[] = ['rate', 'large', ...(inst.stocks.length > 1 ? inst.stocks.map((_, j) => j) : [])];
  const baseOrders = ORDER_KEYS.map((key) => sortBy(inst, all, key));
  const runs: (() => Solution)[] = [];
  for (const order of baseOrders.slice(0, 2)) {
    for (const rules of ALL_RULES) runs.push(() => polish(inst, packPieces(inst, order, rules, false, 'rate'), rules, deadline));
  }
  for (const order of baseOrders) {
    const rules: Rules = { fit: 'area', split: 'shorterLeftover' };
    runs.push(() => polish(inst, packBySheet(inst, order, QUICK_RULES.slice(0, 4)), rules, deadline));
    for (const policy of policies) {
      for (const r of QUICK_RULES.slice(0, 3)) runs.push(() => polish(inst, packPieces(inst, order, r, true, policy), r, deadline));
    }
  }
  for (const [n, run] of runs.entries()) {
    // Always finish a first baseline so some plan comes back even with no time.
    if (n > 0 && (settled() || Date.now() > deadline)) break;
    consider(run());
  }

  const random = rng(0x5eed);
  for (let iter = 0; !settled() && Date.now() < deadline; iter++) {
    const key = ORDER_KEYS[Math.floor(random() * ORDER_KEYS.length)] ?? ((p: Piece) => p.area);
    const noise = 0.05 + 0.4 * random();
    const noisy = new Map(all.map((i) => [i, key(inst.piece(i)) * (1 + noise * (random() - 0.5))]));
    const order = [...all].sort((a, b) => (noisy.get(b) ?? 0) - (noisy.get(a) ?? 0));
    const rules = ALL_RULES[Math.floor(random() * ALL_RULES.length)] ?? { fit: 'area', split: 'shorterLeftover' };
    const sol =
      iter % 4 === 3
        ? packBySheet(inst, order, [rules])
        : packPieces(inst, order, rules, random() < 0.3, policies[Math.floor(random() * policies.length)] ?? 'rate');
    consider(polish(inst, sol, rules, deadline));
  }

  const plan = best;
  if (!plan) throw new Error('no plan');
  if (plan.score.unplaced > 0) {
    // Parts left over for want of stock: the bound covers only what was placed, and nothing is proven.
    const placed = plan.sheets.flatMap(piecesOf);
    return render(req, inst, plan, coverBound(inst, placed, false), false);
  }
  const optimal = proven || plan.score.cost <= lbCost;
  // Parts that fit no sheet are outside every plan, so optimality is over the parts that can be cut.
  return render(req, inst, plan, optimal ? plan.score.cost : lbCost, optimal);
}

/**
 * True when the placements lie on the sheet and come free by straight edge-to-edge cuts, each
 * leaving at least `kerf` between the parts on either side. Any cut that crosses no part can be
 * taken first: both sides of it stay guillotine if the whole was, so a greedy search decides it.
 */
export function isGuillotine(
  sheet: { width: number; length: number; placements: readonly SheetPlacement[] },
  kerf: number,
  tolerance = 1e-6, // the planner works on a micro-inch grid
): boolean {
  const items = sheet.placements;
  const onSheet = items.every(
    (p) =>
      p.width > 0 &&
      p.length > 0 &&
      p.x >= -tolerance &&
      p.y >= -tolerance &&
      p.x + p.width <= sheet.width + tolerance &&
      p.y + p.length <= sheet.length + tolerance,
  );
  if (!onSheet) return false;
  const separable = (group: readonly SheetPlacement[]): boolean => {
    if (group.length <= 1) return true;
    for (const alongX of [true, false]) {
      const start = (p: SheetPlacement): number => (alongX ? p.x : p.y);
      const end = (p: SheetPlacement): number => (alongX ? p.x + p.width : p.y + p.length);
      const sorted = [...group].sort((a, b) => start(a) - start(b));
      let reach = Number.NEGATIVE_INFINITY;
      for (let i = 0; i + 1 < sorted.length; i++) {
        const cur = sorted[i];
        const next = sorted[i + 1];
        if (!cur || !next) continue;
        reach = Math.max(reach, end(cur));
        if (reach + kerf <= start(next) + tolerance) return separable(sorted.slice(0, i + 1)) && separable(sorted.slice(i + 1));
      }
    }
    return false;
  };
  return separable(items);
}
