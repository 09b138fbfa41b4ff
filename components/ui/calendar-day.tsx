'use client';

import { useSyncExternalStore } from 'react';
import { formatCalendarDay } from '@/lib/dates/calendar-day';

const noop = () => () => {};

/**
 * A day written the way the reader's browser locale writes it, never wrapped. The server (and the first
 * paint) write it in en-GB without a year, so hydration matches; the reader's locale follows at once.
 */
export function CalendarDay({ day, className = '' }: { day: string; className?: string }) {
  const reader = useSyncExternalStore(
    noop,
    () => true,
    () => false,
  );
  const text = reader ? formatCalendarDay(day, navigator.language, new Date().getFullYear()) : formatCalendarDay(day, 'en-GB', null);
  return (
    <time dateTime={day} className={`whitespace-nowrap ${className}`}>
      {text}
    </time>
  );
}
