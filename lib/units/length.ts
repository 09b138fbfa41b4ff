/** Lengths are decimal inches inside the code; these turn them into and out of shop notation. */

// Source: NIST, international yard and pound agreement (1959): 1 inch = 25.4 mm exactly.
export const MM_PER_INCH = 25.4;

export class LengthParseError extends Error {
  readonly input: string;
  constructor(input: string) {
    super('Write a length like 32 1/2, 2\' 8", or 813mm.');
    this.name = 'LengthParseError';
    this.input = input;
  }
}

const NUMBER = String.raw`(?:\d+(?:\.\d+)?|\.\d+)`;
// A whole number and a proper fraction, or a fraction alone, or a decimal; `1-1/2` is how many
// plans print a mixed number, so the hyphen is accepted too.
const AMOUNT = String.raw`(?:(\d+)(?:\s+|-)(\d+)\s*/\s*(\d+)|(\d+)\s*/\s*(\d+)|(${NUMBER}))`;
const FEET_MARK = String.raw`(?:'|’|′|ft\.?|foot|feet)`;
const INCH_MARK = String.raw`(?:"|”|″|''|in\.?|inch|inches)`;

const METRIC = new RegExp(String.raw`^(${NUMBER})\s*(mm|cm|m)$`, 'i');
const FEET_AND_INCHES = new RegExp(
  String.raw`^(${NUMBER})\s*${FEET_MARK}(?:\s*${AMOUNT}\s*${INCH_MARK}?)?$`,
  'i',
);
const INCHES = new RegExp(String.raw`^${AMOUNT}\s*${INCH_MARK}?$`, 'i');

const METRIC_TO_MM: Record<string, number> = { mm: 1, cm: 10, m: 1000 };

/** Reads the amount groups of AMOUNT (six consecutive captures starting at `at`). */
function amountFrom(match: RegExpMatchArray, at: number, input: string): number {
  const [whole, num, den, loneNum, loneDen, decimal] = match.slice(at, at + 6);
  if (whole !== undefined && num !== undefined && den !== undefined) {
    const n = Number(num);
    const d = Number(den);
    // `32 3/2` is a typo, not a length.
    if (d === 0 || n >= d) throw new LengthParseError(input);
    return Number(whole) + n / d;
  }
  if (loneNum !== undefined && loneDen !== undefined) {
    const d = Number(loneDen);
    if (d === 0) throw new LengthParseError(input);
    return Number(loneNum) / d;
  }
  if (decimal !== undefined) return Number(decimal);
  throw new LengthParseError(input);
}

/** Parses a length as a woodworker writes it and returns decimal inches. */
export function parseLength(text: string): number {
  const s = text.trim();
  if (s === '') throw new LengthParseError(text);

  const metric = s.match(METRIC);
  if (metric) {
    const [, value, unit] = metric;
    const factor = METRIC_TO_MM[(unit ?? '').toLowerCase()];
    if (value === undefined || factor === undefined) throw new LengthParseError(text);
    return (Number(value) * factor) / MM_PER_INCH;
  }

  const feet = s.match(FEET_AND_INCHES);
  if (feet) {
    const ft = Number(feet[1]);
    const hasInches = feet.slice(2, 8).some((g) => g !== undefined);
    return ft * 12 + (hasInches ? amountFrom(feet, 2, text) : 0);
  }

  const inches = s.match(INCHES);
  if (inches) return amountFrom(inches, 1, text);

  throw new LengthParseError(text);
}

export interface FormatLengthOptions {
  unit: 'in' | 'mm';
  /** Inch mode rounds to the nearest 1/denominator inch; default 16. */
  denominator?: number;
}

function gcd(a: number, b: number): number {
  return b === 0 ? a : gcd(b, a % b);
}

/** Prints decimal inches as `32 1/2"`, `3/4"`, `96"` or `813 mm`. */
export function formatLength(inches: number, options: FormatLengthOptions): string {
  if (!Number.isFinite(inches)) throw new RangeError('A length must be a finite number.');
  const sign = inches < 0 ? '-' : '';
  const magnitude = Math.abs(inches);

  if (options.unit === 'mm') {
    const tenths = Math.round(magnitude * MM_PER_INCH * 10);
    if (tenths === 0) return '0 mm';
    const text = tenths % 10 === 0 ? String(tenths / 10) : (tenths / 10).toFixed(1);
    return `${sign}${text} mm`;
  }

  const denominator = options.denominator ?? 16;
  if (!Number.isInteger(denominator) || denominator < 1) {
    throw new RangeError('The denominator must be a positive whole number.');
  }
  const steps = Math.round(magnitude * denominator);
  if (steps === 0) return '0"';
  const whole = Math.floor(steps / denominator);
  const rest = steps % denominator;
  if (rest === 0) return `${sign}${whole}"`;
  const g = gcd(rest, denominator);
  const fraction = `${rest / g}/${denominator / g}`;
  return whole === 0 ? `${sign}${fraction}"` : `${sign}${whole} ${fraction}"`;
}
