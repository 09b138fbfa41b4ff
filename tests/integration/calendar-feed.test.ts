import { spawnSync } from 'node:child_process';
import path from 'node:path';
import ICAL from 'ical.js';
import { describe, expect, it } from 'vitest';
import * as feedRoute from '@/app/api/calendar/[token]/route';
import * as myFeedRoute from '@/app/api/profile/calendar-feed/route';
import { db } from '@/db/client';
import { updateEpisode } from '@/lib/episodes/queries';
import { createShot } from '@/lib/shots/queries';
import { updateDueDate } from '@/lib/sponsors/due-date-queries';
import type { UserDto } from '@/lib/users/schemas';
import { call, makeCrew } from './helpers';
import { makeDeal } from './sponsor-fixtures';

const tokenOf = (url: string) => url.split('/api/calendar/')[1]!;

async function feedUrl(user: UserDto) {
  const res = await call(myFeedRoute.POST, 'POST', { as: user });
  expect(res.status).toBe(201);
  return res.json.url as string;
}

async function readFeed(url: string) {
  const res = await feedRoute.GET(new (await import('next/server')).NextRequest(url), { params: Promise.resolve({ token: tokenOf(url) }) });
  return { status: res.status, type: res.headers.get('content-type'), text: await res.text() };
}

type Parsed = { uid: string; summary: string; start: string; startType: string; sequence: number; stamp: string; alarms: string[] };

/** Parses with ical.js (an independent RFC 5545 parser) into the fields the tests assert. */
function parse(text: string): Parsed[] {
  const cal = new ICAL.Component(ICAL.parse(text));
  expect(cal.name).toBe('vcalendar');
  expect(cal.getFirstPropertyValue('version')).toBe('2.0');
  return cal.getAllSubcomponents('vevent').map((v) => {
    const start = v.getFirstProperty('dtstart')!;
    const stamp = v.getFirstPropertyValue('dtstamp') as ICAL.Time;
    return {
      uid: String(v.getFirstPropertyValue('uid')),
      summary: String(v.getFirstPropertyValue('summary')),
      start: String(start.getFirstValue()),
      startType: start.type,
      sequence: Number(v.getFirstPropertyValue('sequence')),
      stamp: `${stamp.toString()}|${stamp.zone?.tzid ?? ''}`,
      alarms: v.getAllSubcomponents('valarm').map((a) => String(a.getFirstPropertyValue('trigger'))),
    };
  });
}

type PyDay = { type: 'date' | 'date-time'; value: string; utc?: boolean };
type PyEvent = { uid: string; summary: string; start: PyDay; stamp: PyDay; sequence: number; alarms: number[] };

// Debian's python3-icalendar, installed by scripts/lib/install.mjs for npm test; skipped where it is missing
// (not Debian).
// Debian's own interpreter: a python3 earlier on PATH (pyenv, a venv) does not see Debian's packages.
const PYTHON = '/usr/bin/python3';
const PARSE_ICS = path.join(__dirname, '..', 'support', 'parse-ics.py');
const hasPythonIcalendar = spawnSync(PYTHON, ['-c', 'import icalendar'], { stdio: 'ignore' }).status === 0;

/** Reads the feed with python3-icalendar, a second reader independent of ical.js. */
function parseWithPython(text: string): { version: string; prodid: string; events: PyEvent[] } {
  const run = spawnSync(PYTHON, [PARSE_ICS], { input: text, encoding: 'utf8' });
  if (run.status !== 0) throw new Error(`python3-icalendar refused the feed: ${run.stderr}`);
  return JSON.parse(run.stdout) as { version: string; prodid: string; events: PyEvent[] };
}

describe('calendar feed', () => {
  it('needs a session to make a feed URL', async () => {
    expect((await call(myFeedRoute.POST, 'POST')).status).toBe(401);
    expect((await call(myFeedRoute.DELETE, 'DELETE')).status).toBe(401);
  });

  it('gives the Host due dates, shoot and publish dates as all-day events with stable UIDs, UTC stamps and one alarm per reminder setting', async () => {
    const c = await makeCrew();
    const { episode, deliverable } = await makeDeal(c);
    await updateEpisode(c.channel.id, episode.id, { shootDate: '2027-02-10', publishDate: '2027-03-20' });
    const url = await feedUrl(c.host);
    const res = await readFeed(url);
    expect(res.status).toBe(200);
    expect(res.type).toBe('text/calendar; charset=utf-8');
    // Whole words only: a UID (a UUID) may hold "fee" as hex digits.
    expect(res.text).not.toMatch(/250000|2,500|\bUSD\b|\bfees?\b/i);
    // Source: RFC 5545 §3.8.7.2: DTSTAMP in UTC; ical.js accepts a missing one, so the text is checked too.
    expect(res.text.match(/^DTSTAMP:\d{8}T\d{6}Z\r?$/gm)?.length).toBe(parse(res.text).length);
    expect(res.text).not.toContain('TZID');
    const events = parse(res.text);
    const byUid = Object.fromEntries(events.map((e) => [e.uid, e]));
    const due: { id: string; kind: string }[] = await db('due_dates').where({ deliverable_id: deliverable.id }).select('id', 'kind');
    const dueId = (k: string) => due.find((d) => d.kind === k)!.id;
    expect(byUid[`shoot-${episode.id}@kerfline`]).toMatchObject({ summary: 'Shoot: Walnut step stool', start: '2027-02-10', startType: 'date', alarms: ['-P3D', '-P1D'] });
    expect(byUid[`publish-${episode.id}@kerfline`]).toMatchObject({ start: '2027-03-20', startType: 'date' });
    expect(byUid[`due-${dueId('script_due')}@kerfline`]).toMatchObject({ summary: 'Script due: Bramblewick Abrasives (Walnut step stool)', start: '2027-03-01', startType: 'date' });
    expect(byUid[`due-${dueId('payment_due')}@kerfline`]!.start).toBe('2027-04-19');
    expect(byUid[`due-${dueId('script_due')}@kerfline`]!.stamp).toMatch(/Z\|UTC$/);
    // A due date without a date is no event.
    expect(byUid[`due-${dueId('report_due')}@kerfline`]).toBeUndefined();

    // Moving a date keeps its UID and bumps its SEQUENCE; done dates leave the feed.
    const before = byUid[`due-${dueId('script_due')}@kerfline`]!.sequence;
    await updateDueDate(c.channel.id, deliverable.id, 'script_due', { dueOn: '2027-03-03' }, c.host.id);
    const moved = Object.fromEntries(parse((await readFeed(url)).text).map((e) => [e.uid, e]));
    expect(moved[`due-${dueId('script_due')}@kerfline`]).toMatchObject({ start: '2027-03-03' });
    expect(moved[`due-${dueId('script_due')}@kerfline`]!.sequence).toBeGreaterThan(before);
    await updateDueDate(c.channel.id, deliverable.id, 'script_due', { done: true }, c.host.id);
    expect(parse((await readFeed(url)).text).some((e) => e.uid === `due-${dueId('script_due')}@kerfline`)).toBe(false);
  });

  it('filters by role: the Shop hand gets shoot dates and their shots, the Editor no sponsor dates', async () => {
    const c = await makeCrew();
    const { episode, segments } = await makeDeal(c);
    await updateEpisode(c.channel.id, episode.id, { shootDate: '2027-02-10', publishDate: '2027-03-20' });
    const build = segments.find((s) => s.kind === 'build')!;
    const shot = await createShot(c.channel.id, build.id, { description: 'Glue-up overhead', framing: 'overhead', camera: 'top_cam', assigneeId: c.shopHand.id, dueDate: '2027-02-09', notes: '' });
    await db('channels').where({ id: c.channel.id }).update({ reminder_days: JSON.stringify([2]) });

    const shop = parse((await readFeed(await feedUrl(c.shopHand))).text);
    expect(shop.map((e) => e.uid).sort()).toEqual([`shoot-${episode.id}@kerfline`, `shot-${shot.id}@kerfline`].sort());
    expect(shop.find((e) => e.uid.startsWith('shot-'))).toMatchObject({ summary: 'Shot due: Glue-up overhead (Walnut step stool)', start: '2027-02-09', alarms: ['-P2D'] });

    const editor = parse((await readFeed(await feedUrl(c.editor))).text);
    expect(editor.map((e) => e.uid).sort()).toEqual([`publish-${episode.id}@kerfline`, `shoot-${episode.id}@kerfline`].sort());
  });

  it('stops answering a revoked or replaced URL', async () => {
    const c = await makeCrew();
    const first = await feedUrl(c.host);
    const second = await feedUrl(c.host);
    expect((await readFeed(first)).status).toBe(404);
    expect((await readFeed(second)).status).toBe(200);
    expect((await call(myFeedRoute.DELETE, 'DELETE', { as: c.host })).status).toBe(204);
    expect((await readFeed(second)).status).toBe(404);
  });

  it.skipIf(!hasPythonIcalendar)('reads the same events with python3-icalendar as with ical.js: all-day dates, UTC stamps, alarms', async () => {
    const c = await makeCrew();
    const { episode, deliverable } = await makeDeal(c);
    await updateEpisode(c.channel.id, episode.id, { shootDate: '2027-02-10', publishDate: '2027-03-20' });
    await updateDueDate(c.channel.id, deliverable.id, 'script_due', { dueOn: '2027-03-03' }, c.host.id);
    const { text } = await readFeed(await feedUrl(c.host));
    const py = parseWithPython(text);
    expect(py.version).toBe('2.0');
    const fromIcalJs = parse(text);
    expect(py.events.map((e) => e.uid).sort()).toEqual(fromIcalJs.map((e) => e.uid).sort());
    const due: { id: string }[] = await db('due_dates').where({ deliverable_id: deliverable.id, kind: 'script_due' }).select('id');
    const script = py.events.find((e) => e.uid === `due-${due[0]!.id}@kerfline`)!;
    // Source: RFC 5545 §3.3.4 (VALUE=DATE) and §3.8.7.2 (DTSTAMP in UTC).
    expect(script).toMatchObject({ summary: 'Script due: Bramblewick Abrasives (Walnut step stool)', start: { type: 'date', value: '2027-03-03' } });
    expect(script.sequence).toBe(fromIcalJs.find((e) => e.uid === script.uid)!.sequence);
    for (const e of py.events) {
      expect(e.stamp, e.uid).toMatchObject({ type: 'date-time', utc: true });
      expect(e.start.type, e.uid).toBe('date');
      // The channel's default reminder days, 3 and 1, as alarms that many days before.
      expect(e.alarms, e.uid).toEqual([-3 * 86_400, -1 * 86_400]);
    }
    expect(py.events.find((e) => e.uid === `shoot-${episode.id}@kerfline`)).toMatchObject({ start: { type: 'date', value: '2027-02-10' } });
  });
});
