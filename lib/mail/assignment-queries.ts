import 'server-only';
import type { Knex } from 'knex';
import { db } from '@/db/client';
import { appUrl, config } from '@/lib/config';
import { sendMail } from '@/lib/mail/mailer';
import { buildAssignmentMail, type MailShot } from './assignment-mail';
import type { Camera, Framing } from '@/lib/shots/catalog';
import { shotNumberColumn, shotsOfChannelWithDeleted } from '@/lib/shots/shared-queries';

/** How long a burst of assignment changes collects before its one e-mail goes. */
export const shotMailDelaySeconds = (): number => config().SHOT_MAIL_DELAY_SECONDS;

/** Opens (or keeps) one burst per person; the first change of a burst sets when it is sent. */
export async function openBursts(trx: Knex.Transaction, channelId: string, userIds: (string | null | undefined)[]): Promise<void> {
  const ids = [...new Set(userIds.filter((u): u is string => !!u))];
  if (ids.length === 0) return;
  const dueAt = trx.raw(`now() + make_interval(secs => ?)`, [shotMailDelaySeconds()]);
  await trx('shot_mail_bursts')
    .insert(ids.map((user_id) => ({ user_id, channel_id: channelId, due_at: dueAt })))
    .onConflict(['user_id', 'channel_id'])
    .ignore();
}

type MailShotRow = {
  id: string;
  number: number;
  description: string;
  framing: Framing;
  camera: Camera;
  due_date: string | null;
  episode_id: string;
  episode_title: string;
  segment_id: string;
  segment_title: string;
};

const mailShotColumns = [
  'sh.id',
  shotNumberColumn(),
  'sh.description',
  'sh.framing',
  'sh.camera',
  'sh.due_date',
  'e.id as episode_id',
  'e.title as episode_title',
  's.id as segment_id',
  's.title as segment_title',
];

/** Sends one burst: the difference between what the person was last told they hold and what they hold now. */
async function sendBurst(trx: Knex.Transaction, burst: { user_id: string; channel_id: string }): Promise<boolean> {
  const user: { email: string; name: string; email_opt_out: boolean } | undefined = await trx('users').where({ id: burst.user_id }).first('email', 'name', 'email_opt_out');
  const channel: { slug: string; name: string } | undefined = await trx('channels').where({ id: burst.channel_id }).first('slug', 'name');
  const member = await trx('memberships').where({ user_id: burst.user_id, channel_id: burst.channel_id }).first('role');
  await trx('shot_mail_bursts').where(burst).delete();
  if (!user || !channel) return false;
  // Someone who left the crew hears nothing more from the channel; what they were told is forgotten.
  if (!member) {
    await trx('shot_notices').where({ user_id: burst.user_id }).whereIn('shot_id', shotsOfChannelWithDeleted(trx, burst.channel_id).select('sh.id')).delete();
    return false;
  }
  const held: MailShotRow[] = await shotsOfChannelWithDeleted(trx, burst.channel_id)
    .where('sh.assignee_id', burst.user_id)
    .whereNull('sh.deleted_at')
    .orderBy(['e.title', 's.position', 'sh.position'])
    .select(mailShotColumns);
  const told: MailShotRow[] = await shotsOfChannelWithDeleted(trx, burst.channel_id)
    .join('shot_notices as n', 'n.shot_id', 'sh.id')
    .where('n.user_id', burst.user_id)
    .orderBy(['e.title', 's.position', 'sh.position'])
    .select(mailShotColumns);
  const toldIds = new Set(told.map((s) => s.id));
  const heldIds = new Set(held.map((s) => s.id));
  const added = held.filter((s) => !toldIds.has(s.id));
  const removed = told.filter((s) => !heldIds.has(s.id));
  // A due date moved on a shot already told is news too: it is listed again as assigned.
  const redated = await trx('shot_notices as n')
    .join('shots as sh', 'sh.id', 'n.shot_id')
    .where('n.user_id', burst.user_id)
    .whereRaw('n.due_date is distinct from sh.due_date')
    .whereIn('sh.id', [...heldIds])
    .pluck('sh.id');
  const redatedShots = held.filter((s) => redated.includes(s.id) && toldIds.has(s.id));
  const base = appUrl();
  const toMail = (s: MailShotRow): MailShot => ({
    number: s.number,
    description: s.description,
    framing: s.framing,
    camera: s.camera,
    dueDate: s.due_date,
    episodeTitle: s.episode_title,
    segmentTitle: s.segment_title,
    url: `${base}/c/${channel.slug}/episodes/${s.episode_id}/segments/${s.segment_id}#shot-${s.id}`,
  });
  if (removed.length) await trx('shot_notices').where({ user_id: burst.user_id }).whereIn('shot_id', removed.map((s) => s.id)).delete();
  const notices = [...added, ...redatedShots].map((s) => ({ shot_id: s.id, user_id: burst.user_id, due_date: s.due_date }));
  if (notices.length) await trx('shot_notices').insert(notices).onConflict(['shot_id', 'user_id']).merge(['due_date']);
  const news = [...added, ...redatedShots];
  if (user.email_opt_out || (news.length === 0 && removed.length === 0)) return false;
  await sendMail(
    buildAssignmentMail({
      to: user.email,
      name: user.name,
      channelName: channel.name,
      added: news.map(toMail),
      removed: removed.map(toMail),
      myShotsUrl: `${base}/c/${channel.slug}/shots?view=mine`,
    }),
  );
  return true;
}

/**
 * Sends every burst that is due, of one channel or all; with `now: true` every open burst of the channel
 * goes whether due or not ("Send to crew").
 * Each burst is its own transaction, so a mail server failure leaves that burst open for the next try.
 */
export async function sendShotMail(opts: { channelId?: string; now?: boolean } = {}): Promise<{ sent: number; failed: number }> {
  let sent = 0;
  let failed = 0;
  const skip = new Set<string>();
  for (;;) {
    let mailFailed = false;
    const done = await db
      .transaction(async (trx) => {
        const burst: { user_id: string; channel_id: string } | undefined = await trx('shot_mail_bursts')
          .modify((q) => {
            if (opts.channelId) q.where('channel_id', opts.channelId);
            if (!(opts.channelId && opts.now)) q.where('due_at', '<=', trx.fn.now());
            if (skip.size) q.whereRaw(`not (user_id::text || ':' || channel_id::text = any(?))`, [[...skip]]);
          })
          .orderBy('due_at')
          .forUpdate()
          .skipLocked()
          .first('user_id', 'channel_id');
        if (!burst) return 'empty' as const;
        try {
          if (await sendBurst(trx, burst)) sent += 1;
        } catch (err) {
          skip.add(`${burst.user_id}:${burst.channel_id}`);
          failed += 1;
          mailFailed = true;
          throw err;
        }
        return 'more' as const;
      })
      .catch((err: unknown) => {
        if (mailFailed) {
          console.error('assignment e-mail failed; the burst stays open for the next try', err);
          return 'more' as const;
        }
        throw err;
      });
    if (done === 'empty') break;
  }
  return { sent, failed };
}

export async function countOpenBursts(channelId: string): Promise<number> {
  const row = (await db('shot_mail_bursts').where({ channel_id: channelId }).count<{ n: string }[]>('* as n').first()) as { n: string } | undefined;
  return Number(row?.n ?? 0);
}
