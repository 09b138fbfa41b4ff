import 'server-only';
import type { Knex } from 'knex';
import { db } from '@/db/client';
import { isThrottled, recordFailure } from '@/lib/auth/throttle-queries';
import { appUrl } from '@/lib/config';
import { generateInvitationToken, hashInvitationToken } from '@/lib/crew/tokens';
import { AppError, conflict, invalidInput, notFound } from '@/lib/errors';
import { sendMail } from '@/lib/mail/mailer';
import type { ScriptDoc } from '@/lib/scripts/schemas';
import type { DeliverableKind } from '@/lib/sponsors/schemas';
import { buildApprovalMail } from './approval-mail';
import { APPROVAL_TTL_DAYS, type ApprovalDecision, type ApprovalLinkDto, type ApprovalStatus, type ApprovalViewDto, type DecideApprovalInput } from './schemas';

type LinkRow = {
  id: string;
  deliverable_id: string;
  contact_email: string;
  created_at: Date;
  expires_at: Date;
  revoked_at: Date | null;
  decision: ApprovalDecision | null;
  comment: string | null;
  script_version: number | null;
  decided_at: Date | null;
};
const linkColumns = ['l.id', 'l.deliverable_id', 'l.contact_email', 'l.created_at', 'l.expires_at', 'l.revoked_at', 'l.decision', 'l.comment', 'l.script_version', 'l.decided_at'];

const toLinkDto = (r: LinkRow, now = new Date()): ApprovalLinkDto => ({
  id: r.id,
  contactEmail: r.contact_email,
  createdAt: r.created_at.toISOString(),
  expiresAt: r.expires_at.toISOString(),
  revoked: r.revoked_at !== null,
  expired: r.expires_at <= now,
  decision: r.decision,
  comment: r.comment,
  scriptVersion: r.script_version,
  decidedAt: r.decided_at?.toISOString() ?? null,
});

const statusOf = (r: LinkRow, now = new Date()): ApprovalStatus =>
  r.revoked_at ? 'revoked' : r.decision ? 'decided' : r.expires_at <= now ? 'expired' : 'open';

/** Creates a link for the read of a deliverable and mails it to the sponsor contact. */
export async function sendApprovalLink(
  channel: { id: string; name: string },
  deliverableId: string,
  contactEmail: string,
  host: { id: string; name: string },
): Promise<{ link: ApprovalLinkDto; delivered: boolean }> {
  const target: { segment_id: string | null; sponsor_name: string; episode_title: string } | undefined = await db('deliverables as x')
    .join('sponsor_deals as d', 'd.id', 'x.deal_id')
    .join('sponsors as sp', 'sp.id', 'd.sponsor_id')
    .join('episodes as e', 'e.id', 'x.episode_id')
    .where({ 'x.id': deliverableId, 'd.channel_id': channel.id })
    .first('x.segment_id', 'sp.name as sponsor_name', 'e.title as episode_title');
  if (!target) throw notFound('That deliverable');
  if (!target.segment_id) throw invalidInput({ contactEmail: 'Pick the segment that carries the read first: the sponsor approves its script.' });
  const token = generateInvitationToken();
  const expiresAt = new Date(Date.now() + APPROVAL_TTL_DAYS * 86_400_000);
  const [row] = await db('approval_links as l')
    .insert({ deliverable_id: deliverableId, contact_email: contactEmail, token_hash: hashInvitationToken(token), expires_at: expiresAt, created_by: host.id })
    .returning<LinkRow[]>(linkColumns.map((c) => c.replace('l.', '')));
  if (!row) throw new Error('approval link insert returned no row');
  let delivered = true;
  try {
    await sendMail(
      buildApprovalMail({
        to: contactEmail,
        hostName: host.name,
        channelName: channel.name,
        sponsorName: target.sponsor_name,
        episodeTitle: target.episode_title,
        url: `${appUrl()}/approve/${token}`,
        expiresAt,
      }),
    );
  } catch (err) {
    // The link exists and can be revoked or sent again; the Host sees that the mail did not go.
    console.error('[mail] approval link not sent', err);
    delivered = false;
  }
  return { link: toLinkDto(row), delivered };
}

export async function revokeApprovalLink(channelId: string, linkId: string): Promise<void> {
  const n = await db('approval_links as l')
    .whereIn('l.deliverable_id', db('deliverables as x').join('sponsor_deals as d', 'd.id', 'x.deal_id').where('d.channel_id', channelId).select('x.id'))
    .where('l.id', linkId)
    .update({ revoked_at: db.fn.now() });
  if (n === 0) throw notFound('That approval link');
}

export async function listApprovalLinks(deliverableIds: readonly string[]): Promise<Map<string, ApprovalLinkDto[]>> {
  const out = new Map<string, ApprovalLinkDto[]>();
  if (deliverableIds.length === 0) return out;
  const rows: LinkRow[] = await db('approval_links as l').whereIn('l.deliverable_id', deliverableIds).orderBy('l.created_at', 'desc').select(linkColumns);
  for (const r of rows) out.set(r.deliverable_id, [...(out.get(r.deliverable_id) ?? []), toLinkDto(r)]);
  return out;
}

// Unknown tokens count against the address like failed sign-ins (lib/auth/throttle-queries.ts), so nobody can guess links.
const throttleKey = (ip: string) => `approval-ip:${ip}`;
const tooMany = () => new AppError('too_many_requests', 'Too many tries with invalid links. Wait a minute and try again.');

type ViewRow = LinkRow & {
  channel_name: string;
  sponsor_name: string;
  kind: DeliverableKind;
  episode_title: string;
  segment_title: string | null;
  script: ScriptDoc | null;
  script_version: number | null;
  segment_script_version: number | null;
  talking_points: ScriptDoc | null;
  disclosure: string;
  must_say: unknown;
};

function viewQuery(trx: Knex | Knex.Transaction, token: string) {
  return trx('approval_links as l')
    .join('deliverables as x', 'x.id', 'l.deliverable_id')
    .join('sponsor_deals as d', 'd.id', 'x.deal_id')
    .join('sponsors as sp', 'sp.id', 'd.sponsor_id')
    .join('channels as c', 'c.id', 'd.channel_id')
    .join('episodes as e', 'e.id', 'x.episode_id')
    .leftJoin('segments as s', 's.id', 'x.segment_id')
    .where('l.token_hash', hashInvitationToken(token));
}
const viewColumns = [
  ...linkColumns,
  'c.name as channel_name',
  'sp.name as sponsor_name',
  'x.kind',
  'e.title as episode_title',
  's.title as segment_title',
  's.script',
  's.script_version as segment_script_version',
  'x.talking_points',
  'x.disclosure',
  'x.must_say',
];

/** The sponsor's view of a link, or only its status when it is not open. Unknown tokens are throttled per address. */
export async function lookupApproval(token: string, ip: string): Promise<ApprovalViewDto | { status: Exclude<ApprovalStatus, 'open' | 'decided'> }> {
  if (await isThrottled([throttleKey(ip)])) throw tooMany();
  const row: ViewRow | undefined = await viewQuery(db, token).first(viewColumns);
  if (!row) {
    await recordFailure([throttleKey(ip)]);
    return { status: 'unknown' };
  }
  const status = statusOf(row);
  if (status === 'revoked' || status === 'expired') return { status };
  return {
    status,
    channelName: row.channel_name,
    sponsorName: row.sponsor_name,
    kind: row.kind,
    episodeTitle: row.episode_title,
    segmentTitle: row.segment_title,
    script: row.script,
    scriptVersion: row.segment_script_version ?? 0,
    talkingPoints: row.talking_points,
    disclosure: row.disclosure,
    mustSay: Array.isArray(row.must_say) ? row.must_say.filter((s): s is string => typeof s === 'string') : [],
    expiresAt: row.expires_at.toISOString(),
    decision: row.decision,
  };
}

const closedMessages: Record<Exclude<ApprovalStatus, 'open'>, string> = {
  unknown: 'This link is not valid.',
  revoked: 'This link was withdrawn by the channel.',
  expired: 'This link has expired. Ask the channel for a new one.',
  decided: 'This link has already been used.',
};

/**
 * Records the sponsor's decision once, on the exact script version they read. An approval marks the
 * deliverable approved at that version and its Approval due date done.
 */
export async function decideApproval(token: string, ip: string, input: DecideApprovalInput): Promise<{ decision: ApprovalDecision }> {
  if (await isThrottled([throttleKey(ip)])) throw tooMany();
  return db.transaction(async (trx) => {
    const row: (ViewRow & { segment_id: string | null }) | undefined = await viewQuery(trx, token).forUpdate('l').first([...viewColumns, 'x.segment_id']);
    if (!row) {
      await recordFailure([throttleKey(ip)]);
      throw notFound('That approval link');
    }
    const status = statusOf(row);
    if (status === 'decided') throw conflict(closedMessages.decided);
    if (status !== 'open') throw notFound(status === 'revoked' ? 'That approval link' : 'That approval link (it has expired)');
    if ((row.segment_script_version ?? 0) !== input.scriptVersion) {
      throw conflict('The script changed since you opened this page. Reload it and read it again.', { scriptVersion: 'The script has a newer version.' });
    }
    await trx('approval_links').where({ id: row.id }).update({ decision: input.decision, comment: input.comment || null, script_version: input.scriptVersion, decided_at: trx.fn.now() });
    if (input.decision === 'approved') {
      await trx('deliverables').where({ id: row.deliverable_id }).update({ approved_script_version: input.scriptVersion, approved_at: trx.fn.now() });
      const due: { id: string; due_on: string | null } | undefined = await trx('due_dates').where({ deliverable_id: row.deliverable_id, kind: 'approval_due' }).whereNull('done_at').forUpdate().first('id', 'due_on');
      if (due) {
        await trx('due_dates').where({ id: due.id }).update({ done_at: trx.fn.now(), done_by: null, revision: trx.raw('revision + 1') });
        await trx('due_date_events').insert({ due_date_id: due.id, action: 'done', due_on: due.due_on, user_id: null });
      }
    }
    return { decision: input.decision };
  });
}

export { closedMessages };
