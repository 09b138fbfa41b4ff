import type { StockItemDto } from '@/lib/stock/schemas';
import { formatLength, parseLength } from '@/lib/units';

/**
 * Splits what people type as a list: one per line, or separated by ";" or ",". A comma between two
 * digits is kept (a decimal comma in a price, "4,50"), so only list commas split.
 * Common practice, no published source: the ways a crew wrote sizes in issue 15 ("8 ft, 10 ft", "8', 10'").
 */
export function splitOffersList(text: string): string[] {
  return text
    .split(/[;\n\r]|(?<!\d),|,(?!\d)/)
    .map((l) => l.trim())
    .filter(Boolean);
}

const lengthExamples = `like 8 ft, 8' or 96"`;

/** Null when the text reads as a length; otherwise a message that quotes what was not understood. */
function lengthProblem(part: string, line: string, what = 'a length'): string | null {
  try {
    parseLength(part);
    return null;
  } catch {
    const where = part === line ? '' : ` in “${line}”`;
    return `Could not read “${part}” as ${what}${where}: write lengths ${lengthExamples}.`;
  }
}

const hardwoodExample = `6" x 8'`;

/**
 * Hardwood boards as `width x length` (issue 16). A length alone takes the width before it, so
 * `6" x 8', 10'` is two boards 6" wide; the first entry must name its width.
 */
function parseHardwoodEntry(line: string, width: string | undefined): { offer: Record<string, string> } | { error: string } {
  const [w, l, extra] = line.split(/\s*[x×]\s*/i);
  if (extra !== undefined || (l === undefined && width === undefined) || !w) {
    return { error: `“${line}”: write the board as width x length, like ${hardwoodExample}.` };
  }
  if (l === undefined) {
    const problem = lengthProblem(w, line);
    return problem ? { error: problem } : { offer: { widthIn: width ?? '', lengthIn: w } };
  }
  const problem = lengthProblem(w, line, 'a width') ?? lengthProblem(l, line);
  return problem ? { error: problem } : { offer: { widthIn: w, lengthIn: l } };
}

/**
 * The rack form takes sizes on sale as text: lumber `8ft 4.50`, hardwood `6" x 8ft`, sheets
 * `48 x 96 68.00`, several separated as splitOffersList reads them. Each length is checked here so the
 * error can name the one not understood; the server parses them again.
 */
export function parseOffersText(kind: StockItemDto['kind'], text: string): { offers: Record<string, string>[]; error?: string } {
  const lines = splitOffersList(text);
  if (lines.length === 0) return { offers: [], error: 'List at least one size on sale.' };
  const offers: Record<string, string>[] = [];
  for (const line of lines) {
    if (kind === 'hardwood') {
      const entry = parseHardwoodEntry(line, offers[offers.length - 1]?.widthIn);
      if ('error' in entry) return { offers, error: entry.error };
      offers.push(entry.offer);
      continue;
    }
    const m = line.match(/^(.*?)\s*(?:@\s*)?\$?(\d+(?:\.\d{1,2})?)$/);
    if (!m || !m[1]) return { offers, error: `“${line}”: write a size then a price, like ${kind === 'sheet' ? '48 x 96 68.00' : '8 ft 4.50'}.` };
    if (kind === 'sheet') {
      const [w, l] = m[1].split(/\s*[x×]\s*/i);
      if (!w || !l) return { offers, error: `“${line}”: write the sheet as width x length, like 48 x 96.` };
      const problem = lengthProblem(w, line, 'a width') ?? lengthProblem(l, line);
      if (problem) return { offers, error: problem };
      offers.push({ widthIn: w, lengthIn: l, price: m[2] ?? '' });
    } else {
      const problem = lengthProblem(m[1], line);
      if (problem) return { offers, error: problem };
      offers.push({ lengthIn: m[1], price: m[2] ?? '' });
    }
  }
  return { offers };
}

export function offersToText(item: StockItemDto): string {
  const f = (n: number) => formatLength(n, { unit: 'in' }).replace('"', '');
  return item.offers
    .map((o) => {
      const price = (o.priceCents / 100).toFixed(2);
      // Hardwood: width x length, no price (it is priced by the board foot).
      if (item.kind === 'hardwood') return 'widthIn' in o ? `${f(o.widthIn)} x ${f(o.lengthIn)}` : f(o.lengthIn);
      if ('widthIn' in o) return `${f(o.widthIn)} x ${f(o.lengthIn)} ${price}`;
      return `${f(o.lengthIn)} ${price}`;
    })
    .join('\n');
}
