import 'server-only';
import { db } from '@/db/client';
import { isThrottled, recordFailure } from '@/lib/auth/throttle-queries';
import type { Role } from '@/lib/auth/policy';
import { appUrl } from '@/lib/config';
import { generateInvitationToken, hashInvitationToken } from '@/lib/crew/tokens';
import { AppError, notFound } from '@/lib/errors';
import { thresholdsOf } from '@/lib/reminders/plan';
import { dueDateLabels, type DueDateKind } from '@/lib/sponsors/schemas';
import { buildFeed, type FeedEvent } from './feed';

/** A new secret feed URL for the user; any earlier one stops working. The URL is shown once. */
export async function createCalendarFeed(userId: string): Promise<{ url: string }> {
  const token = generateInvitationToken();
  await db.transaction(async (trx) => {
    await trx('calendar_feeds').where({ user_id: userId }).whereNull('revoked_at').update({ revoked_at: trx.fn.now() });
    await trx('calendar_feeds').insert({ user_id: userId, token_hash: hashInvitationToken(token) });
  });
  return { url: `${appUrl()}/api/calendar/${token}` };
}

export async function revokeCalendarFeed(userId: string): Promise<void> {
  await db('calendar_feeds').where({ user_id: userId }).whereNull('revoked_at').update({ revoked_at: db.fn.now() });
}

export async function hasCalendarFeed(userId: string): Promise<boolean> {
  return Boolean(await db('calendar_feeds').where({ user_id: userId }).whereNull('revoked_at').first('id'));
}

// SEQUENCE for rows without a revision counter: whole seconds since 2026-01-01 of their last change,
// which only grows when the row changes (RFC 5545 §3.8.7.4 asks for a number that increases).
const EPOCH = Date.UTC(2026, 0, 1);
const sequenceOf = (updatedAt: Date) => Math.max(0, Math.floor((updatedAt.getTime() - EPOCH) / 1000));

const throttleKey = (ip: string) => `calendar-ip:${ip}`;

/** The feed behind a secret URL: due dates, shoot and publish dates of the user's channels, by role. */
export async function renderCalendarFeed(token: string, ip: string, now: Date): Promise<string> {
  if (await isThrottled([throttleKey(ip)])) throw new AppError('too_many_requests', 'Too many tries with invalid feed addresses. Wait a minute and try again.');
  const feed: { user_id: string } | undefined = await db('calendar_feeds').where({ token_hash: hashInvitationToken(token) }).whereNull('revoked_at').first('user_id');
  if (!feed) {
    await recordFailure([throttleKey(ip)]);
    throw notFound('That calendar feed');
  }
  const events = await feedEvents(feed.user_id);
  return buildFeed('Kerfline', events, now);
}

async function feedEvents(userId: string): Promise<FeedEvent[]> {
  const memberships: { channel_id: string; slug: string; name: string; role: Role; reminder_days: unknown }[] = await db('memberships as m')
    .join('channels as c', 'c.id', 'm.channel_id')
    .where('m.user_id', userId)
    .select('m.channel_id', 'c.slug', 'c.name', 'm.role', 'c.reminder_days');
  const base = appUrl();
  const events: FeedEvent[] = [];
  for (const m of memberships) {
    const alarms = thresholdsOf(m.reminder_days);
    const episodes: { id: string; title: string; shoot_date: string | null; publish_date: string | null; updated_at: Date }[] = await db('episodes')
      .where({ channel_id: m.channel_id })
      .whereNull('archived_at')
      .select('id', 'title', 'shoot_date', 'publish_date', 'updated_at');
    for (const e of episodes) {
      const url = `${base}/c/${m.slug}/episodes/${e.id}`;
      if (e.shoot_date) events.push({ uid: `shoot-${e.id}@kerfline`, summary: `Shoot: ${e.title}`, date: e.shoot_date, sequence: sequenceOf(e.updated_at), url, description: m.name, alarmDaysBefore: alarms });
      // The Shop hand's feed holds shoot days and their own shots, nothing of publishing or sponsors.
      if (e.publish_date && m.role !== 'shop_hand') {
        events.push({ uid: `publish-${e.id}@kerfline`, summary: `Publish: ${e.title}`, date: e.publish_date, sequence: sequenceOf(e.updated_at), url, description: m.name, alarmDaysBefore: alarms });
      }
    }
    if (m.role === 'host') {
      const due: { id: string; kind: DueDateKind; due_on: string; revision: number; sponsor_name: string; episode_title: string; deal_id: string }[] = await db('due_dates as g')
        .join('deliverables as x', 'x.id', 'g.deliverable_id')
        .join('sponsor_deals as d', 'd.id', 'x.deal_id')
        .join('sponsors as sp', 'sp.id', 'd.sponsor_id')
        .join('episodes as e', 'e.id', 'x.episode_id')
        .where('d.channel_id', m.channel_id)
        .whereNotNull('g.due_on')
        .whereNull('g.done_at')
        .select('g.id', 'g.kind', 'g.due_on', 'g.revision', 'sp.name as sponsor_name', 'e.title as episode_title', 'd.id as deal_id');
      for (const g of due) {
        events.push({
          uid: `due-${g.id}@kerfline`,
          summary: `${dueDateLabels[g.kind]}: ${g.sponsor_name} (${g.episode_title})`,
          date: g.due_on,
          sequence: g.revision,
          url: `${base}/c/${m.slug}/sponsors/${g.deal_id}`,
          description: m.name,
          alarmDaysBefore: alarms,
        });
      }
    }
    if (m.role !== 'editor') {
      const shots: { id: string; description: string; due_date: string; updated_at: Date; episode_title: string; episode_id: string; segment_id: string }[] = await db('shots as sh')
        .join('segments as s', 's.id', 'sh.segment_id')
        .join('episodes as e', 'e.id', 's.episode_id')
        .where({ 'e.channel_id': m.channel_id, 'sh.assignee_id': userId })
        .whereNull('sh.deleted_at')
        .whereNotNull('sh.due_date')
        .whereNot('sh.state', 'captured')
        .select('sh.id', 'sh.description', 'sh.due_date', 'sh.updated_at', 'e.title as episode_title', 'e.id as episode_id', 's.id as segment_id');
      for (const s of shots) {
        events.push({
          uid: `shot-${s.id}@kerfline`,
          summary: `Shot due: ${s.description} (${s.episode_title})`,
          date: s.due_date,
          sequence: sequenceOf(s.updated_at),
          url: `${base}/c/${m.slug}/episodes/${s.episode_id}/segments/${s.segment_id}#shot-${s.id}`,
          description: m.name,
          alarmDaysBefore: alarms,
        });
      }
    }
  }
  return events;
}
