import 'server-only';
import { db } from '@/db/client';
import { appUrl } from '@/lib/config';
import { sendMail } from '@/lib/mail/mailer';
import { addDays, dayOf } from '@/lib/sponsors/dates';
import type { DueDateKind } from '@/lib/sponsors/schemas';
import { reminderStage, thresholdsOf } from './plan';
import { buildReminderMail } from './reminder-mail';

type Candidate = {
  due_date_id: string;
  kind: DueDateKind;
  due_on: string;
  owner_id: string | null;
  deal_id: string;
  channel_id: string;
  channel_slug: string;
  channel_name: string;
  reminder_days: unknown;
  sponsor_name: string;
  episode_title: string;
};

class Stale extends Error {}

/**
 * Sends every reminder that is due at `at`: for each open due date, to the channel's Hosts and the
 * deliverable's owner, at most once per due date, person, threshold and date. The claim row and the
 * mail share one transaction: a second process blocks on the claim's unique key and then skips it,
 * and a failed mail rolls the claim back so the next poll tries again.
 */
export async function sendDueReminders(at: Date, opts: { channelId?: string } = {}): Promise<{ sent: number; failed: number }> {
  const today = dayOf(at);
  const candidates: Candidate[] = await db('due_dates as g')
    .join('deliverables as x', 'x.id', 'g.deliverable_id')
    .join('sponsor_deals as d', 'd.id', 'x.deal_id')
    .join('sponsors as sp', 'sp.id', 'd.sponsor_id')
    .join('episodes as e', 'e.id', 'x.episode_id')
    .join('channels as c', 'c.id', 'd.channel_id')
    .whereNull('g.done_at')
    .whereNotNull('g.due_on')
    // Thresholds are capped at 60 days (thresholdsOf), so nothing further ahead can be due a reminder.
    .where('g.due_on', '<=', addDays(today, 60))
    .modify((q) => {
      if (opts.channelId) q.where('d.channel_id', opts.channelId);
    })
    .orderBy('g.due_on')
    .select(
      'g.id as due_date_id',
      'g.kind',
      'g.due_on',
      'x.owner_id',
      'd.id as deal_id',
      'd.channel_id',
      'c.slug as channel_slug',
      'c.name as channel_name',
      'c.reminder_days',
      'sp.name as sponsor_name',
      'e.title as episode_title',
    );
  let sent = 0;
  let failed = 0;
  for (const c of candidates) {
    const stage = reminderStage(c.due_on, today, thresholdsOf(c.reminder_days));
    if (stage === null) continue;
    const people: { id: string; email: string; name: string }[] = await db('memberships as m')
      .join('users as u', 'u.id', 'm.user_id')
      .where('m.channel_id', c.channel_id)
      .where((q) => {
        q.where('m.role', 'host');
        if (c.owner_id) q.orWhere('m.user_id', c.owner_id);
      })
      .select('u.id', 'u.email', 'u.name');
    for (const person of people) {
      try {
        const didSend = await db.transaction(async (trx) => {
          const claimed = await trx('reminder_sends')
            .insert({ due_date_id: c.due_date_id, user_id: person.id, threshold: stage, due_on: c.due_on })
            .onConflict(['due_date_id', 'user_id', 'threshold', 'due_on'])
            .ignore()
            .returning('id');
          if (claimed.length === 0) return false;
          // Still open and still on that date, now that the claim is ours: a date moved or done since
          // the candidates were read is not reminded.
          const still = await trx('due_dates').where({ id: c.due_date_id, due_on: c.due_on }).whereNull('done_at').forShare().first('id');
          if (!still) throw new Stale();
          await sendMail(
            buildReminderMail({
              to: person.email,
              name: person.name,
              channelName: c.channel_name,
              sponsorName: c.sponsor_name,
              episodeTitle: c.episode_title,
              kind: c.kind,
              dueOn: c.due_on,
              threshold: stage,
              dealUrl: `${appUrl()}/c/${c.channel_slug}/sponsors/${c.deal_id}`,
            }),
          );
          return true;
        });
        if (didSend) sent += 1;
      } catch (err) {
        if (err instanceof Stale) continue;
        failed += 1;
        console.error('reminder e-mail failed; it is tried again on the next poll', err);
      }
    }
  }
  return { sent, failed };
}
