/** Public shapes of a linear cut request and plan. Lengths in inches, prices in dollars. */

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
