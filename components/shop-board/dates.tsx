'use client';

import { useSyncExternalStore } from 'react';

// Dates without a time ('YYYY-MM-DD') are calendar days: read in UTC so no time zone shifts them a day.
const shortDay = new Intl.DateTimeFormat('en', { dateStyle: 'medium', timeZone: 'UTC' });
const longDay = new Intl.DateTimeFormat('en', { dateStyle: 'full', timeZone: 'UTC' });

const asDay = (day: string) => new Date(`${day}T00:00:00Z`);
export const formatDay = (day: string) => shortDay.format(asDay(day));
export const formatLongDay = (day: string) => longDay.format(asDay(day));

const noop = () => () => {};

/** A moment in the reader's own time zone; the server (and the first paint) show the UTC day so hydration matches. */
export function LocalTime({ iso }: { iso: string }) {
  const local = useSyncExternalStore(
    noop,
    () => true,
    () => false,
  );
  const date = new Date(iso);
  const text = local ? date.toLocaleString('en', { month: 'short', day: 'numeric', hour: 'numeric', minute: '2-digit' }) : shortDay.format(date);
  return <time dateTime={iso}>{text}</time>;
}
