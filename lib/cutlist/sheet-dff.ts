/**
 * A sheet-count lower bound stronger than area: dual feasible functions (DFFs) applied to each
 * dimension. A DFF f maps piece sizes (as fractions of the sheet side) so that any set of pieces that
 * fits side by side still sums to at most 1; for a rectangle packing, the product f(w/W) * g(l/L) of
 * two DFFs is then a "transformed area" whose sum over one sheet's pieces is at most 1, for any
 * packing (so for guillotine ones too). A big piece counts as a whole sheet in a dimension where two
 * of it cannot sit side by side, and small pieces count as nothing where they only fill gaps.
 *
 * Source: S. P. Fekete and J. Schepers, "New classes of fast lower bounds for bin packing problems",
 * Math. Program. 91 (2001) 11–31 (the functions u^(k) and U^(ε)), and "A general framework for bounds
 * for higher-dimensional orthogonal packing problems", Math. Methods Oper. Res. 60 (2004) 311–329
 * (products of DFFs per dimension bound the number of bins).
 *
 * Integers throughout where a comparison decides a value, so no rounding can make a bound too high.
 */

export interface DffPiece {
  gw: number; // grown width, integer micro-inches
  gl: number; // grown length
  rotatable: boolean;
}

export interface DffSheet {
  gw: number;
  gl: number;
}

/** One DFF of a dimension: the transformed size of `size` on a side of `side` (integers), in [0, 1]. */
type Dff = (size: number, side: number) => number;

/** The denominator of ε: ε = e / EPS_DENOM, so its comparisons stay in safe integers (sizes < 1e9). */
const EPS_DENOM = 1_000_000;
/** u^(k) for k = 1..MAX_K and this many ε values per dimension: enough on real lists, cheap to sum. */
const MAX_K = 3;
const MAX_EPS = 8;

const identity: Dff = (size, side) => size / side;

/** u^(k)(x) = x when (k+1)x is whole, else floor((k+1)x) / k. */
function uK(k: number): Dff {
  return (size, side) => (((k + 1) * size) % side === 0 ? size / side : Math.floor(((k + 1) * size) / side) / k);
}

/** U^(ε)(x) = 1 above 1 - ε, 0 below ε, x between; valid for ε <= 1/2. */
function uEps(e: number): Dff {
  return (size, side) => {
    if (size * EPS_DENOM > (EPS_DENOM - e) * side) return 1;
    if (size * EPS_DENOM < e * side) return 0;
    return size / side;
  };
}

/** ε values at the sizes of the pieces (as fractions of `side`), at most 1/2, spread over their range. */
function epsCandidates(sizes: readonly number[], side: number): number[] {
  const es = [...new Set(sizes.map((s) => Math.ceil((s * EPS_DENOM) / side)).filter((e) => e > 0 && 2 * e <= EPS_DENOM))].sort((a, b) => a - b);
  if (es.length <= MAX_EPS) return es;
  return Array.from({ length: MAX_EPS }, (_, i) => es[Math.floor((i * (es.length - 1)) / (MAX_EPS - 1))] ?? 0);
}

function dffsFor(sizes: readonly number[], side: number): Dff[] {
  return [identity, ...Array.from({ length: MAX_K }, (_, i) => uK(i + 1)), ...epsCandidates(sizes, side).map(uEps)];
}

/**
 * Fewest sheets that can hold `pieces`, when each piece may go on any of the sheets it fits
 * (`fits(i, j)`): for each pair of DFFs, every piece counts its least transformed area over the sheets
 * and orientations open to it; the largest rounded-up total is the bound. 0 when nothing fits anywhere.
 */
export function dffSheetBound(pieces: readonly DffPiece[], sheets: readonly DffSheet[], fits: (i: number, j: number) => boolean): number {
  const first = sheets[0];
  if (!first || pieces.length === 0) return 0;
  // The ε candidates come from the first sheet's sides; any ε <= 1/2 is valid on every sheet.
  const fw = dffsFor(
    pieces.flatMap((p) => (p.rotatable ? [p.gw, p.gl] : [p.gw])),
    first.gw,
  );
  const fl = dffsFor(
    pieces.flatMap((p) => (p.rotatable ? [p.gw, p.gl] : [p.gl])),
    first.gl,
  );
  let best = 0;
  for (const f of fw) {
    for (const g of fl) {
      let total = 0;
      pieces.forEach((p, i) => {
        let least = Number.POSITIVE_INFINITY;
        sheets.forEach((s, j) => {
          if (!fits(i, j)) return;
          if (p.gw <= s.gw && p.gl <= s.gl) least = Math.min(least, f(p.gw, s.gw) * g(p.gl, s.gl));
          if (p.rotatable && p.gl <= s.gw && p.gw <= s.gl) least = Math.min(least, f(p.gl, s.gw) * g(p.gw, s.gl));
        });
        if (Number.isFinite(least)) total += least;
      });
      // The slack absorbs float error in the sum, so a total that is exactly whole is never rounded up.
      best = Math.max(best, Math.ceil(total - 1e-7));
    }
  }
  return best;
}
