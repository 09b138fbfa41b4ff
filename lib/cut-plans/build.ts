/** Turns a parts list and the stock rack into a cut plan: one planner run per stock item. No I/O. */
import { planLinearCuts, planRipCuts, planSheetCuts } from '@/lib/cutlist';
import { boardFeet, parseNominalProfile, softwoodBoardFeet } from '@/lib/lumber';
import { offerSizeKey, type CutSettingsDto, type LumberOffer, type SheetOffer, type StockItemDto } from '@/lib/stock/schemas';
import type { OnHandStock } from '@/lib/on-hand/schemas';
import { lumberRackStock, onHandFor, onHandIdOf, pullsOf, sheetRackStock, type PlanPull } from './rack-pulls';
import { keepsSheetOffcut, sheetOffcut } from './sheet-offcut';

export type PlanPart = {
  id: string;
  name: string;
  quantity: number;
  lengthIn: number;
  widthIn: number | null;
  thicknessIn: number | null;
  grain: 'length' | 'any';
  stockItemId: string | null;
  cutCount?: number;
};

export type PlanPiece = { partId: string; name: string; pieceIndex: number; x: number; y: number; lengthIn: number; widthIn: number; rotated: boolean };
/** A strip ripped from a lumber board: rip it to `widthIn` at `x` across the board, then crosscut it. */
export type PlanStrip = { x: number; widthIn: number };
export type PlanBoard = {
  sizeKey: string;
  lengthIn: number;
  widthIn: number;
  pieces: PlanPiece[];
  offcutIn: number;
  /** Sheets: the offcut's width across the sheet (its length is `offcutIn`). Absent for lumber, whose offcut is full width. */
  offcutWidthIn?: number;
  keepOffcut: boolean;
  /** Lumber ripped into strips, in cut order; absent when every piece takes the board's full width. */
  strips?: PlanStrip[];
  /** Pulled from the rack: the on-hand piece this board is. Absent when the board is bought. */
  onHandId?: string;
};
export type PlanPurchase = {
  sizeKey: string;
  lengthIn: number;
  /** Sheets, and hardwood boards (bought by width and length); null for softwood, whose width is its profile. */
  widthIn: number | null;
  count: number;
  unitCents: number;
  costCents: number;
  /** Hardwood: board feet of one board of this size, as the yard tallies it. */
  boardFeetEach?: number;
};
export type PlanUnplaced = { partId: string; name: string; quantity: number; reason: string };

export type StockPlan = {
  stock: Pick<StockItemDto, 'id' | 'kind' | 'name' | 'thicknessIn' | 'widthIn'>;
  boards: PlanBoard[];
  purchase: PlanPurchase[];
  costCents: number;
  lowerBoundCents: number;
  optimal: boolean;
  /** Lumber only: board feet bought. */
  boardFeet: number | null;
  /** Sheets only: square feet bought. */
  squareFeet: number | null;
  wastePercent: number;
  unplaced: PlanUnplaced[];
  /** On-hand pieces pulled from the rack, at no cost; `purchase` lists only what is bought. */
  pulled: PlanPull[];
};

export type CutPlan = {
  groups: StockPlan[];
  /** Parts with no stock chosen yet. */
  noStock: PlanUnplaced[];
  costCents: number;
  boardFeet: number;
  optimal: boolean;
  pieceCount: number;
  /** Pieces of each part already cut, for the cut list tick-off. */
  cutCounts: Record<string, number>;
};

const EPS = 1e-6;
const sizeKey = offerSizeKey;
const round4 = (n: number) => Math.round(n * 10000) / 10000;

/** A lumber size on sale; hardwood boards carry their own width (issue 16), softwood takes its profile's. */
type BoardOffer = LumberOffer & { widthIn?: number };
const boardWidth = (stock: StockItemDto, offer: BoardOffer): number => offer.widthIn ?? stock.widthIn ?? 0;
const boardKey = (offer: BoardOffer): string => sizeKey(offer.lengthIn, offer.widthIn);

function lumberUnitCents(stock: StockItemDto, lengthIn: number, offer: BoardOffer): number {
  if (stock.kind !== 'hardwood') return offer.priceCents;
  // Source: USDA FPL Wood Handbook via lib/lumber boardFeet: thickness x width x length / 144, times the price per board foot.
  return Math.round(boardFeet(stock.thicknessIn, boardWidth(stock, offer), lengthIn) * (stock.pricePerBoardFootCents ?? 0));
}

function lumberBoardFeet(stock: StockItemDto, lengthIn: number, widthIn: number): number {
  if (stock.kind === 'softwood') return softwoodBoardFeet(parseNominalProfile(stock.nominal), lengthIn);
  return boardFeet(stock.thicknessIn, widthIn, lengthIn);
}

function planLumber(stock: StockItemDto, parts: PlanPart[], settings: CutSettingsDto, timeLimitMs: number, onHand: readonly OnHandStock[] = []): StockPlan {
  const width = stock.widthIn ?? 0;
  const unplaced: PlanUnplaced[] = [];
  const fits = parts.filter((p) => {
    if (p.thicknessIn !== null && p.thicknessIn > stock.thicknessIn + EPS) {
      unplaced.push({ partId: p.id, name: p.name, quantity: p.quantity, reason: `Thicker than the ${stock.name}.` });
      return false;
    }
    if (p.widthIn !== null && p.widthIn > width + EPS) {
      unplaced.push({ partId: p.id, name: p.name, quantity: p.quantity, reason: `Wider than the ${stock.name}; glue up a panel or choose wider stock.` });
      return false;
    }
    return true;
  });
  const offers = cheapestPerSize(stock.offers as BoardOffer[]);
  // Parts narrower than the board are ripped side by side from it rather than each taking a board;
  // boards of several widths (hardwood, issue 16) always go to the rip planner, which chooses among them.
  const severalWidths = new Set(offers.map((o) => boardWidth(stock, o))).size > 1;
  if (severalWidths || fits.some((p) => p.widthIn !== null && p.widthIn < width - EPS)) return planLumberRips(stock, parts, fits, unplaced, offers, settings, timeLimitMs, onHand);
  const result = planLinearCuts({
    kerf: settings.kerfIn,
    endTrim: settings.endTrimIn,
    parts: fits.map((p) => ({ id: p.id, length: p.lengthIn, quantity: p.quantity, label: p.name })),
    stock: [...lumberRackStock(onHand, width), ...offers.map((o) => ({ id: boardKey(o), length: o.lengthIn, price: lumberUnitCents(stock, o.lengthIn, o) / 100 }))],
    timeLimitMs,
  });
  const names = new Map(parts.map((p) => [p.id, p]));
  const seen = new Map<string, number>();
  const boards: PlanBoard[] = result.boards.map((b) => ({
    sizeKey: b.stockId,
    lengthIn: b.length,
    widthIn: width,
    pieces: b.cuts.map((c) => {
      const index = seen.get(c.partId) ?? 0;
      seen.set(c.partId, index + 1);
      const part = names.get(c.partId);
      return { partId: c.partId, name: part?.name ?? '', pieceIndex: index, x: 0, y: c.start, lengthIn: c.length, widthIn: part?.widthIn ?? width, rotated: false };
    }),
    offcutIn: b.offcut,
    keepOffcut: b.offcut >= settings.minOffcutIn && b.offcut > 0,
  }));
  // Waste by length: every piece spans the board's width.
  const bought = boards.reduce((a, b) => a + b.lengthIn, 0);
  const used = boards.reduce((a, b) => a + b.pieces.reduce((s, c) => s + c.lengthIn, 0), 0);
  return lumberStockPlan(stock, offers, boards, result, unplaced, names, { bought, used });
}

function planLumberRips(
  stock: StockItemDto,
  parts: PlanPart[],
  fits: PlanPart[],
  unplaced: PlanUnplaced[],
  offers: BoardOffer[],
  settings: CutSettingsDto,
  timeLimitMs: number,
  onHand: readonly OnHandStock[] = [],
): StockPlan {
  // A part with no width takes a board's full width; with several widths on sale, the narrowest, so it fits any board.
  const fullWidth = Math.min(...offers.map((o) => boardWidth(stock, o)));
  const result = planRipCuts({
    kerf: settings.kerfIn,
    jointAllowance: settings.jointIn,
    endTrim: settings.endTrimIn,
    parts: fits.map((p) => ({ id: p.id, length: p.lengthIn, width: p.widthIn ?? fullWidth, quantity: p.quantity, label: p.name })),
    // A piece on hand records no width; with several widths on sale it counts as the narrowest, so a plan never asks more of it.
    stock: [
      ...lumberRackStock(onHand, fullWidth),
      ...offers.map((o) => ({ id: boardKey(o), length: o.lengthIn, width: boardWidth(stock, o), price: lumberUnitCents(stock, o.lengthIn, o) / 100 })),
    ],
    timeLimitMs,
  });
  const names = new Map(parts.map((p) => [p.id, p]));
  const seen = new Map<string, number>();
  const boards: PlanBoard[] = result.boards.map((b) => ({
    sizeKey: b.stockId,
    lengthIn: b.length,
    widthIn: b.width,
    pieces: b.strips.flatMap((strip) =>
      strip.cuts.map((c) => {
        const index = seen.get(c.partId) ?? 0;
        seen.set(c.partId, index + 1);
        return { partId: c.partId, name: names.get(c.partId)?.name ?? '', pieceIndex: index, x: strip.offset, y: c.start, lengthIn: c.length, widthIn: c.width, rotated: false };
      }),
    ),
    // The full-width length past the longest strip, crosscut off before ripping; the narrow strip left
    // beside the last rip stays scrap, since a piece on hand records no width.
    offcutIn: b.offcut,
    keepOffcut: b.offcut >= settings.minOffcutIn && b.offcut > 0,
    strips: b.strips.map((s) => ({ x: s.offset, widthIn: s.width })),
  }));
  // Waste by area: strips leave room across the width too.
  const bought = boards.reduce((a, b) => a + b.lengthIn * b.widthIn, 0);
  const used = boards.reduce((a, b) => a + b.pieces.reduce((s, c) => s + c.lengthIn * c.widthIn, 0), 0);
  return lumberStockPlan(stock, offers, boards, result, unplaced, names, { bought, used });
}

type LumberResult = {
  purchase: { stockId: string; count: number }[];
  lowerBound: number;
  optimal: boolean;
  unplaced: { partId: string; quantity: number; reason: string }[];
};

/** What a lumber plan buys and costs, the same whether its boards were crosscut only or ripped first. */
function lumberStockPlan(
  stock: StockItemDto,
  offers: BoardOffer[],
  boards: PlanBoard[],
  result: LumberResult,
  unplaced: PlanUnplaced[],
  names: Map<string, PlanPart>,
  waste: { bought: number; used: number },
): StockPlan {
  const purchase = result.purchase.map((p) => {
    const offer = offers.find((o) => boardKey(o) === p.stockId);
    const lengthIn = offer?.lengthIn ?? 0;
    const unitCents = offer ? lumberUnitCents(stock, lengthIn, offer) : 0;
    const widthIn = offer?.widthIn ?? null;
    const line = { sizeKey: p.stockId, lengthIn, widthIn, count: p.count, unitCents, costCents: unitCents * p.count };
    // Hardwood is bought by the board foot, so the line says how many each board is.
    return stock.kind === 'hardwood' ? { ...line, boardFeetEach: round4(lumberBoardFeet(stock, lengthIn, offer ? boardWidth(stock, offer) : 0)) } : line;
  });
  return {
    stock: pickStock(stock),
    boards,
    purchase,
    costCents: purchase.reduce((a, p) => a + p.costCents, 0),
    lowerBoundCents: Math.round(result.lowerBound * 100),
    optimal: result.optimal && unplaced.length === 0,
    boardFeet: round4(boards.reduce((a, b) => a + lumberBoardFeet(stock, b.lengthIn, b.widthIn), 0)),
    squareFeet: null,
    wastePercent: waste.bought > 0 ? round4((100 * (waste.bought - waste.used)) / waste.bought) : 0,
    pulled: [],
    unplaced: [...unplaced, ...result.unplaced.map((u) => ({ partId: u.partId, name: names.get(u.partId)?.name ?? '', quantity: u.quantity, reason: u.reason }))],
  };
}

function planSheets(stock: StockItemDto, parts: PlanPart[], settings: CutSettingsDto, timeLimitMs: number, onHand: readonly OnHandStock[] = []): StockPlan {
  const unplaced: PlanUnplaced[] = [];
  const fits = parts.filter((p) => {
    if (p.widthIn === null) {
      unplaced.push({ partId: p.id, name: p.name, quantity: p.quantity, reason: 'Needs a width to be cut from sheet goods.' });
      return false;
    }
    if (p.thicknessIn !== null && p.thicknessIn > stock.thicknessIn + EPS) {
      unplaced.push({ partId: p.id, name: p.name, quantity: p.quantity, reason: `Thicker than the ${stock.name}.` });
      return false;
    }
    return true;
  });
  const offers = cheapestPerSize(stock.offers as SheetOffer[]);
  const result = planSheetCuts({
    kerf: settings.kerfIn,
    parts: fits.map((p) => ({ id: p.id, width: p.widthIn ?? 0, length: p.lengthIn, quantity: p.quantity, label: p.name, grain: p.grain })),
    stock: [...sheetRackStock(onHand), ...offers.map((o) => ({ id: sizeKey(o.lengthIn, o.widthIn), width: o.widthIn, length: o.lengthIn, price: o.priceCents / 100 }))],
    timeLimitMs,
  });
  const names = new Map(parts.map((p) => [p.id, p]));
  const seen = new Map<string, number>();
  const boards: PlanBoard[] = result.sheets.map((s) => {
    const pieces = s.placements.map((c) => {
      const index = seen.get(c.partId) ?? 0;
      seen.set(c.partId, index + 1);
      return { partId: c.partId, name: names.get(c.partId)?.name ?? '', pieceIndex: index, x: c.x, y: c.y, lengthIn: c.length, widthIn: c.width, rotated: c.rotated };
    });
    const offcut = sheetOffcut({ lengthIn: s.length, widthIn: s.width }, pieces, settings.kerfIn);
    return {
      sizeKey: s.stockId,
      lengthIn: s.length,
      widthIn: s.width,
      pieces,
      offcutIn: offcut?.lengthIn ?? 0,
      ...(offcut ? { offcutWidthIn: offcut.widthIn } : {}),
      keepOffcut: keepsSheetOffcut(offcut, settings.minOffcutIn),
    };
  });
  const purchase = result.purchase.map((p) => {
    const offer = offers.find((o) => sizeKey(o.lengthIn, o.widthIn) === p.stockId);
    const unitCents = offer?.priceCents ?? 0;
    return { sizeKey: p.stockId, lengthIn: offer?.lengthIn ?? 0, widthIn: offer?.widthIn ?? null, count: p.count, unitCents, costCents: unitCents * p.count };
  });
  const bought = boards.reduce((a, b) => a + b.lengthIn * b.widthIn, 0);
  const used = boards.reduce((a, b) => a + b.pieces.reduce((s, c) => s + c.lengthIn * c.widthIn, 0), 0);
  return {
    stock: pickStock(stock),
    boards,
    purchase,
    costCents: purchase.reduce((a, p) => a + p.costCents, 0),
    lowerBoundCents: Math.round(result.lowerBound * 100),
    optimal: result.optimal && unplaced.length === 0,
    boardFeet: null,
    squareFeet: round4(bought / 144),
    wastePercent: bought > 0 ? round4((100 * (bought - used)) / bought) : 0,
    pulled: [],
    unplaced: [...unplaced, ...result.unplaced.map((u) => ({ partId: u.partId, name: names.get(u.partId)?.name ?? '', quantity: u.quantity, reason: u.reason }))],
  };
}

/** Rows saved before the rack refused sizes a hair apart may hold two offers of one size key; the planner needs one. */
function cheapestPerSize<T extends { lengthIn: number; widthIn?: number; priceCents: number }>(offers: T[]): T[] {
  const byKey = new Map<string, T>();
  for (const o of offers) {
    const key = sizeKey(o.lengthIn, o.widthIn);
    const seen = byKey.get(key);
    if (!seen || o.priceCents < seen.priceCents) byKey.set(key, o);
  }
  return [...byKey.values()];
}

/**
 * Boards the planner took from the rack (planner stock ids of on-hand pieces) become pulls: they keep
 * their size key, name their on-hand piece, leave the shopping list, and count in no board or square feet bought.
 */
function separatePulls(stock: StockItemDto, plan: StockPlan): StockPlan {
  const sheet = stock.kind === 'sheet';
  const boards = plan.boards.map((b) => {
    const onHandId = onHandIdOf(b.sizeKey);
    return onHandId ? { ...b, sizeKey: sheet ? sizeKey(b.lengthIn, b.widthIn) : sizeKey(b.lengthIn), onHandId } : b;
  });
  const purchase = plan.purchase.filter((p) => onHandIdOf(p.sizeKey) === null);
  const bought = boards.filter((b) => !b.onHandId);
  return {
    ...plan,
    boards,
    purchase,
    costCents: purchase.reduce((a, p) => a + p.costCents, 0),
    boardFeet: sheet ? null : round4(bought.reduce((a, b) => a + lumberBoardFeet(stock, b.lengthIn, b.widthIn), 0)),
    squareFeet: sheet ? round4(bought.reduce((a, b) => a + b.lengthIn * b.widthIn, 0) / 144) : null,
    pulled: pullsOf(boards, sheet),
  };
}

const pickStock = (s: StockItemDto): StockPlan['stock'] => ({ id: s.id, kind: s.kind, name: s.name, thicknessIn: s.thicknessIn, widthIn: s.widthIn });

/**
 * One plan per stock item used; parts without stock are listed, not guessed. `timeLimitMs` is the
 * budget of the whole plan: each stock group gets an equal share of what is left when it starts.
 */
export function buildCutPlan(parts: PlanPart[], stock: StockItemDto[], settings: CutSettingsDto, timeLimitMs = 1000, onHand: readonly OnHandStock[] = []): CutPlan {
  const deadline = Date.now() + timeLimitMs;
  const byStock = new Map<string, PlanPart[]>();
  const noStock: PlanUnplaced[] = [];
  const rack = new Map(stock.map((s) => [s.id, s]));
  for (const p of parts) {
    if (!p.stockItemId || !rack.has(p.stockItemId)) {
      noStock.push({ partId: p.id, name: p.name, quantity: p.quantity, reason: 'Choose stock for this part.' });
      continue;
    }
    byStock.set(p.stockItemId, [...(byStock.get(p.stockItemId) ?? []), p]);
  }
  const groups: StockPlan[] = [];
  const used = stock.filter((s) => byStock.has(s.id));
  used.forEach((s, i) => {
    const group = byStock.get(s.id) ?? [];
    const share = Math.max(0, deadline - Date.now()) / (used.length - i);
    const rack = onHandFor(onHand, s.id);
    groups.push(separatePulls(s, s.kind === 'sheet' ? planSheets(s, group, settings, share, rack) : planLumber(s, group, settings, share, rack)));
  });
  return {
    groups,
    noStock,
    costCents: groups.reduce((a, g) => a + g.costCents, 0),
    boardFeet: round4(groups.reduce((a, g) => a + (g.boardFeet ?? 0), 0)),
    optimal: groups.every((g) => g.optimal) && noStock.length === 0,
    pieceCount: groups.reduce((a, g) => a + g.boards.reduce((s, b) => s + b.pieces.length, 0), 0),
    cutCounts: Object.fromEntries(parts.map((p) => [p.id, p.cutCount ?? 0])),
  };
}
