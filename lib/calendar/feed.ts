import ical, { ICalAlarmType } from 'ical-generator';

export type FeedEvent = {
  /** Stable across feeds and edits: RFC 5545 §3.8.4.7 says a UID identifies the same event forever. */
  uid: string;
  summary: string;
  /** An all-day date, 'YYYY-MM-DD'. */
  date: string;
  /** RFC 5545 §3.8.7.4: bumped on every change, so calendar apps replace their copy. */
  sequence: number;
  description?: string;
  url?: string;
  /** One VALARM per reminder setting: days before the date. */
  alarmDaysBefore: readonly number[];
};

/**
 * One iCalendar feed (RFC 5545). Dates are all-day (VALUE=DATE), DTSTAMP is the generation time in
 * UTC, and no TZID is written, so no VTIMEZONE is needed.
 */
export function buildFeed(name: string, events: readonly FeedEvent[], now: Date): string {
  const cal = ical({ name, prodId: { company: 'Kerfline', product: 'Kerfline', language: 'EN' } });
  for (const e of events) {
    const start = new Date(`${e.date}T00:00:00Z`);
    const event = cal.createEvent({
      id: e.uid,
      start,
      // Source: RFC 5545 §3.6.1: an all-day event's DTEND is the next day (non-inclusive).
      end: new Date(start.getTime() + 86_400_000),
      allDay: true,
      summary: e.summary,
      sequence: e.sequence,
      stamp: now,
      ...(e.description !== undefined && { description: e.description }),
      ...(e.url !== undefined && { url: e.url }),
    });
    for (const days of e.alarmDaysBefore) {
      // A number trigger is seconds before DTSTART (ical-generator writes TRIGGER:-P…).
      event.createAlarm({ type: ICalAlarmType.display, trigger: days * 86_400, description: e.summary });
    }
  }
  return cal.toString();
}
