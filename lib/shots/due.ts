import type { ShotState } from './catalog';

export type DueStatus = 'overdue' | 'today' | 'tomorrow' | null;

const addDays = (day: string, n: number) => {
  const d = new Date(`${day}T00:00:00Z`);
  d.setUTCDate(d.getUTCDate() + n);
  return d.toISOString().slice(0, 10);
};

/** How pressing a shot's due date is on `today` (both 'YYYY-MM-DD'); a captured shot is never due. */
export function dueStatus(dueDate: string | null, state: ShotState, today: string): DueStatus {
  if (!dueDate || state === 'captured') return null;
  if (dueDate < today) return 'overdue';
  if (dueDate === today) return 'today';
  if (dueDate === addDays(today, 1)) return 'tomorrow';
  return null;
}
