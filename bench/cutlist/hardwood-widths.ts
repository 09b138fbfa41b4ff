// Hardwood of several widths benchmark (issue 16: boards bought by the board foot). Pure, no services:
//   nice -n 10 npx tsx bench/cutlist/hardwood-widths.ts
// Plans 30 seeded furniture-like hardwood lists against a rack of three or four widths x three lengths,
// each board priced by the board foot, and prints how many plans are proved least-cost, the median time,
// how far the unproved ones can be over their bound, and what choosing among widths saves against the
// cheapest plan that keeps to one width.
import { loadavg } from 'node:os';
import { planRipCuts, type RipCutRequest, type RipStock } from '@/lib/cutlist';
import { boardFeet } from '@/lib/lumber';
import { rng } from '@/lib/cutlist/random';

const CASES = 30;
const TIME_LIMIT_MS = 1000;
const ONE_WIDTH_LIMIT_MS = 500;
const CENTS_PER_BOARD_FOOT = 950;

const median = (xs: readonly number[]): number => {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)] ?? Number.NaN;
};

/** 4/4 boards 4", 5 1/2", 7 1/4" (every other case also 9 1/4") x 6, 8, 10 ft at $9.50 a board foot (USDA FPL Wood Handbook: 144 in³). */
function rack(c: number): RipStock[] {
  const widths = c % 2 === 1 ? [4, 5.5, 7.25, 9.25] : [4, 5.5, 7.25];
  return widths.flatMap((width) =>
    [72, 96, 120].map((length) => ({ id: `${width}x${length}`, width, length, price: Math.round(boardFeet(1, width, length) * CENTS_PER_BOARD_FOOT) / 100 })),
  );
}

/** Invented furniture lists: 3–8 part kinds (legs, rails, slats, panels), 1–6 of each, 1 1/2–7 in wide to the 1/8 in, 8–72 in long. */
function hardwoodRequest(r: () => number, c: number): RipCutRequest {
  const kinds = 3 + Math.floor(r() * 6);
  const eighth = (min: number, max: number) => Math.round((min + r() * (max - min)) * 8) / 8;
  const parts = Array.from({ length: kinds }, (_, i) => ({ id: `p${i}`, width: eighth(1.5, 7), length: eighth(8, 72), quantity: 1 + Math.floor(r() * 6) }));
  return { kerf: 0.125, jointAllowance: 1 / 16, parts, stock: rack(c), timeLimitMs: TIME_LIMIT_MS };
}

function main(): void {
  const r = rng(20261222);
  const times: number[] = [];
  const gaps: number[] = [];
  const savings: number[] = [];
  let proved = 0;
  let mixed = 0;
  let pieces = 0;
  for (let c = 0; c < CASES; c++) {
    const req = hardwoodRequest(r, c);
    const n = req.parts.reduce((a, p) => a + p.quantity, 0);
    pieces += n;
    const started = performance.now();
    const plan = planRipCuts(req);
    const ms = performance.now() - started;
    times.push(ms);
    if (plan.optimal) proved++;
    else {
      const gap = (100 * (plan.totalCost - plan.lowerBound)) / plan.lowerBound;
      gaps.push(gap);
      console.log(`  case ${c} (${n} pieces): not proven, $${plan.totalCost.toFixed(2)} against bound $${plan.lowerBound.toFixed(2)} (at most ${gap.toFixed(1)} % over), ${ms.toFixed(0)} ms`);
    }
    if (new Set(plan.purchase.map((p) => p.stockId.split('x')[0])).size > 1) mixed++;
    // The best plan that keeps to one width, for what choosing among widths saves.
    const widths = [...new Set(req.stock.map((s) => s.width))];
    const oneWidth = widths
      .map((w) => planRipCuts({ ...req, stock: req.stock.filter((s) => s.width === w), timeLimitMs: ONE_WIDTH_LIMIT_MS }))
      .filter((p) => p.unplaced.length === 0)
      .map((p) => p.totalCost);
    const best = Math.min(...oneWidth);
    if (Number.isFinite(best) && plan.unplaced.length === 0) savings.push((100 * (best - plan.totalCost)) / best);
  }
  console.log(`Hardwood lists (${CASES} cases, ${(pieces / CASES).toFixed(1)} pieces on average, 3–4 widths x 6/8/10 ft by the board foot, kerf 1/8 in, jointing 1/16 in, timeLimitMs ${TIME_LIMIT_MS}):`);
  console.log(`  proved least-cost ${proved}/${CASES}; median time ${median(times).toFixed(0)} ms; max ${Math.max(...times).toFixed(0)} ms; unproven at most ${gaps.length ? Math.max(...gaps).toFixed(1) : '0'} % over their bound`);
  console.log(
    `  plans buying more than one width: ${mixed}/${CASES}; saved against the best one-width plan: median ${median(savings).toFixed(1)} %, max ${savings.length ? Math.max(...savings).toFixed(1) : '0'} %, never worse: ${savings.every((s) => s >= -1e-9)} (load average ${loadavg()[0]?.toFixed(1)})`,
  );
}

main();
