import { daysBetween } from '@/lib/sponsors/dates';

/** -1 stands for "overdue". */
export const OVERDUE = -1;

/**
 * Which reminder a due date is at on `today`: overdue once past, otherwise the tightest threshold
 * whose window it is in (3 and 1 give "3" from three days before, "1" from one day before), or null.
 * Only the tightest goes, so a date first seen one day ahead sends one mail, not two.
 */
export function reminderStage(dueOn: string, today: string, thresholds: readonly number[]): number | null {
  const days = daysBetween(today, dueOn);
  if (days < 0) return OVERDUE;
  const fitting = thresholds.filter((t) => Number.isInteger(t) && t >= 0 && days <= t);
  return fitting.length ? Math.min(...fitting) : null;
}

/** A channel's thresholds from its stored setting, defaulting to 3 and 1 days. */
export function thresholdsOf(value: unknown): number[] {
  const list = Array.isArray(value) ? value.filter((v): v is number => Number.isInteger(v) && v >= 0 && v <= 60) : [];
  return list.length ? [...new Set(list)] : [3, 1];
}
