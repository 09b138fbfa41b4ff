import { describe, expect, it } from 'vitest';
import { formatCalendarDay } from './calendar-day';

describe('formatCalendarDay', () => {
  it('writes the day as the locale does, with the weekday (issue 15)', () => {
    // Source: CLDR date formats as shipped in Node's ICU (en-GB "EEE d MMM" and "EEE, d MMM y", en-US "EEE, MMM d").
    expect(formatCalendarDay('2027-01-16', 'en-GB', 2027)).toBe('Sat 16 Jan');
    expect(formatCalendarDay('2027-01-16', 'en-US', 2027)).toBe('Sat, Jan 16');
  });
  it('adds the year only for another year, and never shifts the day by time zone', () => {
    expect(formatCalendarDay('2027-01-16', 'en-GB', 2026)).toBe('Sat, 16 Jan 2027');
    expect(formatCalendarDay('2027-01-01', 'en-GB', null)).toBe('Fri 1 Jan');
  });
});
