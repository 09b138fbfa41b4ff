import { describe, expect, it } from 'vitest';
import { cautionsFor, needsSafetyReview, SAFETY_DEFERENCE, toolInfo, tools } from './tools';

describe('shop safety', () => {
  it('needs a review for any power tool, and for an unnamed "other" tool', () => {
    expect(needsSafetyReview([])).toBe(false);
    expect(needsSafetyReview(['chisels', 'finishes'])).toBe(false);
    expect(needsSafetyReview(['chisels', 'table_saw'])).toBe(true);
    expect(needsSafetyReview(['other'])).toBe(true);
  });

  it('gives every tool at least one caution and lists each caution once', () => {
    for (const t of tools) expect(toolInfo[t].cautions.length).toBeGreaterThan(0);
    const all = cautionsFor(['table_saw', 'router', 'jointer']).flatMap((g) => g.cautions);
    expect(new Set(all).size).toBe(all.length);
  });

  // Common practice, no published source: oily-rag fire risk is printed on most oil finish labels.
  it('warns of rags catching fire for finishes, and defers to the maker and local codes', () => {
    expect(cautionsFor(['finishes'])[0]?.cautions.join(' ')).toMatch(/catch fire/);
    expect(SAFETY_DEFERENCE).toMatch(/manual, local codes and licensed practice come first/);
  });
});
