// A calendar day ('YYYY-MM-DD') has no time: read it in UTC so no time zone moves it a day.
const asDay = (day: string) => new Date(`${day}T00:00:00Z`);

/** "Sat 16 Jan" in en-GB, "Sat, Jan 16" in en-US: short weekday, day and month, the year only when it is not this one. */
export function formatCalendarDay(day: string, locale: string | undefined, thisYear: number | null): string {
  const date = asDay(day);
  const withYear = thisYear !== null && date.getUTCFullYear() !== thisYear;
  return new Intl.DateTimeFormat(locale, { weekday: 'short', day: 'numeric', month: 'short', ...(withYear ? { year: 'numeric' } : {}), timeZone: 'UTC' }).format(date);
}
