// Sheet cut planner benchmark (issue 16: a stronger sheet lower bound). Pure, no services:
//   nice -n 10 npx tsx bench/cutlist/sheets.ts
// Plans 40 seeded cabinet-like sheet lists and prints how many plans are proved least-cost (their
// bound reaches their cost), the median time and how far the unproved ones can be over their bound.
import { loadavg } from 'node:os';
import { planSheetCuts, type SheetCutRequest } from '@/lib/cutlist';
import { rng } from '@/lib/cutlist/random';

const CASES = 40;
const TIME_LIMIT_MS = 1000;

const median = (xs: readonly number[]): number => {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)] ?? Number.NaN;
};

/**
 * Invented cabinet-like lists: 3–10 part kinds (sides, shelves, doors, backs, drawer parts), 1–6 of
 * each, 3–30 in wide and 6–48 in long to the 1/16 in, a third with grain along the length; 4 x 8 ft
 * sheets at $58, every other case also 4 x 4 ft at $34; kerf 1/8 in.
 */
function sheetRequest(r: () => number, c: number): SheetCutRequest {
  const kinds = 3 + Math.floor(r() * 8);
  const sixteenth = (min: number, max: number) => Math.round((min + r() * (max - min)) * 16) / 16;
  const parts = Array.from({ length: kinds }, (_, i) => ({
    id: `p${i}`,
    width: sixteenth(3, 30),
    length: sixteenth(6, 48),
    quantity: 1 + Math.floor(r() * 6),
    grain: r() < 1 / 3 ? ('length' as const) : ('any' as const),
  }));
  const stock = [{ id: '4x8', width: 48, length: 96, price: 58 }];
  if (c % 2 === 1) stock.push({ id: '4x4', width: 48, length: 48, price: 34 });
  return { kerf: 0.125, parts, stock, timeLimitMs: TIME_LIMIT_MS };
}

function main(): void {
  const r = rng(20261220);
  const times: number[] = [];
  const gaps: number[] = [];
  let proved = 0;
  let pieces = 0;
  for (let c = 0; c < CASES; c++) {
    const req = sheetRequest(r, c);
    const n = req.parts.reduce((a, p) => a + p.quantity, 0);
    pieces += n;
    const started = performance.now();
    const plan = planSheetCuts(req);
    const ms = performance.now() - started;
    times.push(ms);
    if (plan.optimal) proved++;
    else {
      const gap = (100 * (plan.totalCost - plan.lowerBound)) / plan.lowerBound;
      gaps.push(gap);
      console.log(`  sheet case ${c} (${n} pieces, ${req.stock.length} sizes): not proven, $${plan.totalCost.toFixed(2)} against bound $${plan.lowerBound.toFixed(2)} (at most ${gap.toFixed(1)} % over), ${ms.toFixed(0)} ms`);
    }
  }
  console.log(`Sheet lists (${CASES} cases, ${(pieces / CASES).toFixed(1)} pieces on average, 4x8 ft, half the cases also 4x4 ft, kerf 1/8 in, timeLimitMs ${TIME_LIMIT_MS}):`);
  console.log(
    `  proved least-cost ${proved}/${CASES}; median time ${median(times).toFixed(0)} ms; unproven at most ${gaps.length ? Math.max(...gaps).toFixed(1) : '0'} % over their bound (load average ${loadavg()[0]?.toFixed(1)})`,
  );
}

main();
