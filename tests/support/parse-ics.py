"""Reads an iCalendar text on stdin with Debian's python3-icalendar and prints its events as JSON.

A second, independent RFC 5545 reader beside ical.js (tests/integration/calendar-feed.test.ts): the
feed is only trusted when both read the same events from it.
"""
import datetime
import json
import sys

from icalendar import Calendar


def day_or_time(value):
    if isinstance(value, datetime.datetime):
        return {"type": "date-time", "value": value.isoformat(), "utc": value.utcoffset() == datetime.timedelta(0)}
    return {"type": "date", "value": value.isoformat()}


def main():
    cal = Calendar.from_ical(sys.stdin.read())
    events = []
    for event in cal.walk("VEVENT"):
        events.append(
            {
                "uid": str(event["UID"]),
                "summary": str(event.get("SUMMARY", "")),
                "start": day_or_time(event.decoded("DTSTART")),
                "stamp": day_or_time(event.decoded("DTSTAMP")),
                "sequence": int(event.get("SEQUENCE", 0)),
                "alarms": [int(alarm.decoded("TRIGGER").total_seconds()) for alarm in event.walk("VALARM")],
            }
        )
    json.dump({"version": str(cal.get("VERSION")), "prodid": str(cal.get("PRODID")), "events": events}, sys.stdout)


main()
