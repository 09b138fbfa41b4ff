'use client';

import { useSyncExternalStore } from 'react';
import type { ShotState } from '@/lib/shots/catalog';
import { dueStatus } from '@/lib/shots/due';
import { Badge } from '@/components/ui/badge';

const noop = () => () => {};
const localToday = () => {
  const d = new Date();
  return `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, '0')}-${String(d.getDate()).padStart(2, '0')}`;
};

const text = { overdue: 'Overdue', today: 'Due today', tomorrow: 'Due tomorrow' } as const;

/** The attention colour for a shot due soon, by the reader's own calendar; nothing on the server's first paint. */
export function DueBadge({ dueDate, state }: { dueDate: string | null; state: ShotState }) {
  const today = useSyncExternalStore(noop, localToday, () => null);
  const status = today ? dueStatus(dueDate, state, today) : null;
  if (!status) return null;
  return <Badge tone="attentionSoft">{text[status]}</Badge>;
}
