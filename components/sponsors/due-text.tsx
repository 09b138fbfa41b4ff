import { daysBetween } from '@/lib/sponsors/dates';

/** A due date in monospace, in the attention colour when overdue or within the next 14 days. */
export function DueText({ dueOn, today, done = false }: { dueOn: string; today: string; done?: boolean }) {
  const days = daysBetween(today, dueOn);
  const note = done ? 'done' : days < 0 ? `overdue ${-days} d` : days === 0 ? 'today' : days <= 14 ? `in ${days} d` : '';
  const attention = !done && days <= 14;
  return (
    <span className={`font-mono ${attention ? 'font-bold text-attention-ink' : ''}`}>
      {dueOn}
      {note ? <span className="ml-2 font-sans text-xs">({note})</span> : null}
    </span>
  );
}
