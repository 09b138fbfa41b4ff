import type { LinearCutRequest } from '../types';
import { rng } from '../random';

/**
 * 160 pieces of 46 lengths to the 1/16 in, on three board lengths: a list the exact stages cannot
 * finish in a short limit, so a call returns only because it stops at its deadline. Before the fix in
 * issue 12 one such call took 3–6 s at timeLimitMs 0. Prices invented.
 */
export function manyPiecesRequest(timeLimitMs: number): LinearCutRequest {
  const r = rng(5);
  const kinds = 5 + Math.floor(r() * 60);
  const parts = Array.from({ length: kinds }, (_, i) => ({ id: `p${i}`, length: Math.round((6 + r() * 60) * 16) / 16, quantity: 1 }));
  for (let n = kinds; n < 160; n++) {
    const p = parts[Math.floor(r() * kinds)];
    if (p) p.quantity++;
  }
  const stock = [
    { id: 's96', length: 96, price: 8 + Math.floor(r() * 4) },
    { id: 's120', length: 120, price: 11 + Math.floor(r() * 4) },
    { id: 's144', length: 144, price: 14 + Math.floor(r() * 3) },
  ];
  return { kerf: 0.125, endTrim: 0.5, parts, stock, timeLimitMs };
}

/**
 * 30 part lengths of 6–86 in to the 1/16 in, 1–10 of each, drawn by the Park–Miller generator (kept, not
 * mulberry32, so the lists the arc-flow tests were written against stay the same).
 */
export function thirtyLengths(seed: number): LinearCutRequest['parts'] {
  let s = seed;
  const random = (): number => {
    s = (s * 16807) % 2147483647;
    return s / 2147483647;
  };
  return Array.from({ length: 30 }, (_, i) => ({ id: `p${i}`, length: Math.round((6 + random() * 80) * 16) / 16, quantity: 1 + Math.floor(random() * 10) }));
}

/** Thirty lengths on three board lengths: HiGHS needs seconds on this list's arc-flow model. */
export function slowMipRequest(): LinearCutRequest {
  return {
    kerf: 0.125,
    parts: thirtyLengths(7),
    stock: [
      { id: 'a', length: 96, price: 4.5 },
      { id: 'b', length: 120, price: 6.2 },
      { id: 'c', length: 144, price: 8.1 },
    ],
  };
}
