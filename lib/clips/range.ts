import parseRange from 'range-parser';

export type RangeAnswer = { status: 200 } | { status: 206; start: number; end: number } | { status: 416 };

/**
 * What to send for a Range header (RFC 9110 §14): one satisfiable range -> 206; none satisfiable -> 416;
 * no header, a malformed one, or several ranges -> the whole file (a server may ignore Range).
 */
export function answerRange(header: string | null, size: number): RangeAnswer {
  if (!header) return { status: 200 };
  const ranges = parseRange(size, header, { combine: true });
  if (ranges === -1) return { status: 416 };
  if (ranges === -2 || ranges.type !== 'bytes' || ranges.length !== 1) return { status: 200 };
  const [only] = ranges;
  return only ? { status: 206, start: only.start, end: only.end } : { status: 200 };
}
