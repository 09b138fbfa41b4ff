/**
 * What one cut-plan request computes, as one task for the planner worker (plan-worker.mjs).
 * Pure: no I/O, plain data in and out, so it crosses the thread boundary by structured clone.
 */
import type { OnHandStock } from '@/lib/on-hand/schemas';
import type { CutSettingsDto, StockItemDto } from '@/lib/stock/schemas';
import { buildCutPlan, type CutPlan, type PlanPart } from './build';

export type PlanTask = {
  parts: (PlanPart & { level?: number | null })[];
  stock: StockItemDto[];
  settings: CutSettingsDto;
  /** Boards and offcuts on the rack, used before buying (issue 16). */
  onHand?: OnHandStock[];
  /** Also plan each skill level on its own (the episode view). */
  byLevel: boolean;
  /** The whole request's time budget, shared by every plan in it. */
  budgetMs: number;
};

export type PlanTaskResult = { whole: CutPlan; levels: { level: number; plan: CutPlan }[] };

/** With levels, the whole episode gets half the budget and the levels share the other half. */
export function runPlanTask(task: PlanTask): PlanTaskResult {
  const deadline = Date.now() + task.budgetMs;
  const levelNumbers = task.byLevel
    ? [...new Set(task.parts.map((p) => p.level).filter((l): l is number => typeof l === 'number'))].sort((a, b) => a - b)
    : [];
  const wholeMs = levelNumbers.length > 0 ? task.budgetMs / 2 : task.budgetMs;
  const whole = buildCutPlan(task.parts, task.stock, task.settings, wholeMs, task.onHand);
  const levels = levelNumbers.map((level, i) => {
    const share = Math.max(0, deadline - Date.now()) / (levelNumbers.length - i);
    return { level, plan: buildCutPlan(task.parts.filter((p) => p.level === level), task.stock, task.settings, share, task.onHand) };
  });
  return { whole, levels };
}
