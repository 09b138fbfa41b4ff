/** Nominal and actual sizes of lumber and sheet goods, and board feet. */

export interface NominalProfile {
  nominalThickness: number;
  nominalWidth: number;
}

export interface DressedSize {
  thickness: number;
  width: number;
}

export class LumberParseError extends Error {
  readonly input: string;
  constructor(input: string, message: string) {
    super(message);
    this.name = 'LumberParseError';
    this.input = input;
  }
}

// Dry (19% moisture or less) dressed sizes in inches by nominal size.
const DRESSED_DRY: ReadonlyMap<number, number> = new Map([
  // Source: American Softwood Lumber Standard, NIST Voluntary Product Standard PS 20 (dry dressed sizes).
  [1, 0.75],
  [2, 1.5],
  [3, 2.5],
  [4, 3.5],
  [6, 5.5],
  [8, 7.25],
  [10, 9.25],
  [12, 11.25],
  // From memory: PS 20 lists 5 -> 4 1/2, 14 -> 13 1/4 and 16 -> 15 1/4 for dry widths.
  [5, 4.5],
  [14, 13.25],
  [16, 15.25],
]);

export const NOMINAL_SIZES: readonly number[] = [...DRESSED_DRY.keys()].sort((a, b) => a - b);

/** Actual dry dressed inches for one nominal dimension, or undefined when the size is not listed. */
export function dressedDimension(nominal: number): number | undefined {
  return DRESSED_DRY.get(nominal);
}

const PROFILE = /^\s*(\d+)\s*[xX×]\s*(\d+)\s*$/;

/** Reads `2x4`, `1 x 6`, `2×10` into nominal inches. */
export function parseNominalProfile(text: string): NominalProfile {
  const match = text.match(PROFILE);
  if (!match) throw new LumberParseError(text, 'Write a lumber size like 2x4 or 1x6.');
  const nominalThickness = Number(match[1]);
  const nominalWidth = Number(match[2]);
  for (const n of [nominalThickness, nominalWidth]) {
    if (!DRESSED_DRY.has(n)) {
      throw new LumberParseError(text, `${n} is not a standard nominal size (use ${NOMINAL_SIZES.join(', ')}).`);
    }
  }
  return { nominalThickness, nominalWidth };
}

/** Actual dry dressed size of a softwood profile, in inches. */
export function dressedSize(profile: NominalProfile): DressedSize {
  const thickness = DRESSED_DRY.get(profile.nominalThickness);
  const width = DRESSED_DRY.get(profile.nominalWidth);
  if (thickness === undefined || width === undefined) {
    throw new RangeError(`${profile.nominalThickness}x${profile.nominalWidth} is not a standard nominal size.`);
  }
  return { thickness, width };
}

const QUARTERS = /^\s*(\d+)\s*\/\s*4\s*$/;

/** Hardwood thickness in quarters (`8/4`) to nominal rough inches (2). */
export function parseQuarters(text: string): number {
  const match = text.match(QUARTERS);
  const quarters = match ? Number(match[1]) : 0;
  if (quarters < 1) throw new LumberParseError(text, 'Write a hardwood thickness in quarters, like 4/4 or 8/4.');
  return quarters / 4;
}

/** Board feet from inches. Source: USDA Forest Products Laboratory, Wood Handbook: 1 board foot = 144 in³. */
export function boardFeet(thicknessIn: number, widthIn: number, lengthIn: number): number {
  return (thicknessIn * widthIn * lengthIn) / 144;
}

/** Softwood is sold by board feet on nominal, not dressed, sizes. */
export function softwoodBoardFeet(profile: NominalProfile, lengthIn: number): number {
  return boardFeet(profile.nominalThickness, profile.nominalWidth, lengthIn);
}

// From memory: PS 1 (structural plywood) and common retail sizing: 1/4 -> 7/32, 1/2 -> 15/32, 3/4 -> 23/32.
const PLYWOOD_ACTUAL: ReadonlyMap<number, number> = new Map([
  [0.25, 7 / 32],
  [0.5, 15 / 32],
  [0.75, 23 / 32],
]);

/** Actual thickness of plywood sold under a nominal thickness, or undefined when not listed. */
export function plywoodActualThickness(nominal: number): number | undefined {
  for (const [n, actual] of PLYWOOD_ACTUAL) {
    if (Math.abs(n - nominal) < 1e-9) return actual;
  }
  return undefined;
}
