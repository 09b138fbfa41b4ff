// Days are calendar days (YYYY-MM-DD); formatting them in UTC keeps the server's zone from shifting them.

/** "Saturday, 16 January 2027". */
export function longDate(day: string): string {
  return new Date(`${day}T00:00:00Z`).toLocaleDateString('en-GB', { weekday: 'long', day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' });
}

/** "1 Dec 2026" for a timestamp such as a review time. */
export function shortDate(iso: string): string {
  return new Date(iso).toLocaleDateString('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' });
}
