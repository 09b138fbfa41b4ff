import type { StockItemDto } from '@/lib/stock/schemas';
import { formatLength } from '@/lib/units';

/**
 * The rack form takes sizes on sale as text, one per line or separated by ";":
 * lumber `8ft 4.50`, hardwood `8ft`, sheets `48 x 96 68.00`. Lengths stay text for the server to parse.
 */
export function parseOffersText(kind: StockItemDto['kind'], text: string): { offers: Record<string, string>[]; error?: string } {
  const lines = text
    .split(/[;\n]/)
    .map((l) => l.trim())
    .filter(Boolean);
  if (lines.length === 0) return { offers: [], error: 'List at least one size on sale.' };
  const offers: Record<string, string>[] = [];
  for (const line of lines) {
    if (kind === 'hardwood') {
      offers.push({ lengthIn: line });
      continue;
    }
    const m = line.match(/^(.*?)\s*(?:@\s*)?\$?(\d+(?:\.\d{1,2})?)$/);
    if (!m || !m[1]) return { offers, error: `“${line}”: write a size then a price, like ${kind === 'sheet' ? '48 x 96 68.00' : '8ft 4.50'}.` };
    if (kind === 'sheet') {
      const [w, l] = m[1].split(/\s*[x×]\s*/i);
      if (!w || !l) return { offers, error: `“${line}”: write the sheet as width x length, like 48 x 96.` };
      offers.push({ widthIn: w, lengthIn: l, price: m[2] ?? '' });
    } else {
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
      if ('widthIn' in o) return `${f(o.widthIn)} x ${f(o.lengthIn)} ${price}`;
      return item.kind === 'hardwood' ? `${f(o.lengthIn)}` : `${f(o.lengthIn)} ${price}`;
    })
    .join('; ');
}
