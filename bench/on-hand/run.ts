// On-hand stock in the cut planner (issue 16). Pure, no services:
//   nice -n 10 npx tsx bench/on-hand/run.ts
// Plans 30 seeded furniture-like 2x4 cut lists three times: with nothing on hand, with 4 and with 16
// offcuts/boards on hand (12–96 in, 1–3 of each), each through buildCutPlan with a 1000 ms budget. Prints
// per rack: how many plans were proven least-cost, the median and slowest time, the median saving
// against buying everything, and checks that no plan pulls more than is on hand or costs more than buying.
import { loadavg } from 'node:os';
import { buildCutPlan, type PlanPart } from '@/lib/cut-plans/build';
import type { OnHandStock } from '@/lib/on-hand/schemas';
import { DEFAULT_CUT_SETTINGS, type StockItemDto } from '@/lib/stock/schemas';
import { rng } from '@/lib/cutlist/random';

const BUDGET_MS = 1000;
const CASES = 30;

// Invented prices in a home-centre range.
const spf: StockItemDto = {
  id: 'spf', kind: 'softwood', name: '2x4 SPF', species: 'SPF', nominal: '2x4', thicknessIn: 1.5, widthIn: 3.5, pricePerBoardFootCents: null,
  offers: [{ lengthIn: 96, priceCents: 450 }, { lengthIn: 120, priceCents: 620 }, { lengthIn: 144, priceCents: 810 }],
};

const sixteenth = (random: () => number, min: number, max: number) => Math.round((min + random() * (max - min)) * 16) / 16;

function parts(random: () => number): PlanPart[] {
  const kinds = 3 + Math.floor(random() * 8);
  return Array.from({ length: kinds }, (_, i) => ({
    id: `p${i}`, name: `Part ${i}`, quantity: 1 + Math.floor(random() * 8), lengthIn: sixteenth(random, 6, 60), widthIn: null, thicknessIn: null, grain: 'any' as const, stockItemId: 'spf',
  }));
}

function rack(random: () => number, n: number): OnHandStock[] {
  return Array.from({ length: n }, (_, i) => ({ id: `h${i}`, stockItemId: 'spf', lengthIn: sixteenth(random, 12, 96), widthIn: null, count: 1 + Math.floor(random() * 3) }));
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)] ?? 0;

function main() {
  const random = rng(16);
  const lists = Array.from({ length: CASES }, () => parts(random));
  const racks = [0, 4, 16].map((n) => ({ n, pieces: lists.map(() => rack(random, n)) }));
  const buying = lists.map((l) => buildCutPlan(l, [spf], DEFAULT_CUT_SETTINGS, BUDGET_MS).costCents);
  for (const { n, pieces } of racks) {
    const times: number[] = [];
    const savings: number[] = [];
    let proven = 0;
    let problems = 0;
    lists.forEach((list, i) => {
      const onHand = pieces[i] ?? [];
      const started = performance.now();
      const plan = buildCutPlan(list, [spf], DEFAULT_CUT_SETTINGS, BUDGET_MS, onHand);
      times.push(performance.now() - started);
      if (plan.optimal) proven += 1;
      const have = new Map(onHand.map((o) => [o.id, o.count]));
      for (const g of plan.groups) for (const p of g.pulled) if (p.count > (have.get(p.onHandId) ?? 0)) problems += 1;
      if (plan.costCents > (buying[i] ?? 0)) problems += 1;
      savings.push((buying[i] ?? 0) - plan.costCents);
    });
    console.log(
      `${String(n).padStart(2)} pieces on hand: ${proven}/${CASES} proven least-cost, median ${median(times).toFixed(0)} ms, slowest ${Math.max(...times).toFixed(0)} ms, ` +
        `median saving $${(median(savings) / 100).toFixed(2)}, problems ${problems}`,
    );
  }
  console.log(`budget ${BUDGET_MS} ms per plan; load average ${loadavg().map((l) => l.toFixed(2)).join(' ')}`);
}

main();
