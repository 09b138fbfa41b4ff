import 'server-only';
import type { Knex } from 'knex';
import { db } from '@/db/client';
import { hashPassword } from '@/lib/auth/password';
import type { Role } from '@/lib/auth/policy';
import { AppError, conflict, forbidden, notFound } from '@/lib/errors';
import type { UserDto } from '@/lib/users/schemas';
import type { CrewMemberDto, InvitationDto, InvitationLookupDto, InvitationStatus, InviteInput } from './schemas';
import { takeInvitationMail } from './mail-limit-queries';
import { generateInvitationToken, hashInvitationToken, invitationExpiry } from './tokens';

type InvitationRow = {
  id: string;
  channel_id: string;
  email: string;
  role: Role;
  token_hash: string;
  expires_at: Date;
  accepted_at: Date | null;
  revoked_at: Date | null;
  sent_at: Date | null;
};

const toInvitationDto = (row: InvitationRow, now = new Date()): InvitationDto => ({
  id: row.id,
  email: row.email,
  role: row.role,
  expiresAt: row.expires_at.toISOString(),
  sentAt: row.sent_at ? row.sent_at.toISOString() : null,
  expired: row.expires_at <= now,
});

export async function listCrew(channelId: string): Promise<CrewMemberDto[]> {
  const rows: { user_id: string; name: string; email: string; role: Role; created_at: Date }[] = await db('memberships as m')
    .join('users as u', 'u.id', 'm.user_id')
    .where('m.channel_id', channelId)
    .orderByRaw(`case m.role when 'host' then 0 when 'shop_hand' then 1 else 2 end, u.name`)
    .select('m.user_id', 'u.name', 'u.email', 'm.role', 'm.created_at');
  return rows.map((r) => ({ userId: r.user_id, name: r.name, email: r.email, role: r.role, joinedAt: r.created_at.toISOString() }));
}

export async function listOpenInvitations(channelId: string): Promise<InvitationDto[]> {
  const rows: InvitationRow[] = await db('invitations')
    .where({ channel_id: channelId })
    .whereNull('accepted_at')
    .whereNull('revoked_at')
    .orderBy('created_at', 'desc');
  return rows.map((r) => toInvitationDto(r));
}

/**
 * Crew changes of one channel take the channel row's lock first, so two concurrent demotions
 * cannot both pass the last-host check and cannot deadlock on each other's membership rows.
 */
async function lockChannelCrew(trx: Knex.Transaction, channelId: string, actorId: string): Promise<void> {
  await trx('channels').where({ id: channelId }).forUpdate().first('id');
  // The actor's role is read again under the lock: a Host demoted a moment ago may no longer act.
  const actor: { role: Role } | undefined = await trx('memberships').where({ channel_id: channelId, user_id: actorId }).first('role');
  if (actor?.role !== 'host') throw forbidden();
}

async function assertNotLastHost(trx: Knex.Transaction, channelId: string, userId: string): Promise<void> {
  const hosts: { user_id: string }[] = await trx('memberships').where({ channel_id: channelId, role: 'host' }).select('user_id');
  if (hosts.length <= 1 && hosts.some((h) => h.user_id === userId)) {
    throw conflict('A channel needs at least one Host. Make someone else Host first.');
  }
}

export async function changeRole(channelId: string, actorId: string, userId: string, role: Role): Promise<CrewMemberDto> {
  await db.transaction(async (trx) => {
    await lockChannelCrew(trx, channelId, actorId);
    const current: { role: Role } | undefined = await trx('memberships').where({ channel_id: channelId, user_id: userId }).first('role');
    if (!current) throw notFound('That crew member');
    if (current.role === 'host' && role !== 'host') await assertNotLastHost(trx, channelId, userId);
    await trx('memberships').where({ channel_id: channelId, user_id: userId }).update({ role, updated_at: trx.fn.now() });
  });
  const member = (await listCrew(channelId)).find((m) => m.userId === userId);
  if (!member) throw notFound('That crew member');
  return member;
}

export async function removeMember(channelId: string, actorId: string, userId: string): Promise<void> {
  await db.transaction(async (trx) => {
    await lockChannelCrew(trx, channelId, actorId);
    const current: { role: Role } | undefined = await trx('memberships').where({ channel_id: channelId, user_id: userId }).first('role');
    if (!current) throw notFound('That crew member');
    if (current.role === 'host') await assertNotLastHost(trx, channelId, userId);
    await trx('memberships').where({ channel_id: channelId, user_id: userId }).delete();
  });
}

export async function createInvitation(
  channelId: string,
  invitedBy: string,
  input: InviteInput,
): Promise<{ invitation: InvitationDto; token: string }> {
  return db.transaction(async (trx) => {
    const member = await trx('memberships as m')
      .join('users as u', 'u.id', 'm.user_id')
      .where({ 'm.channel_id': channelId, 'u.email': input.email })
      .first('m.user_id');
    if (member) throw conflict('That person is already crew on this channel.', { email: 'Already crew.' });
    const open = await trx('invitations')
      .where({ channel_id: channelId, email: input.email })
      .whereNull('accepted_at')
      .whereNull('revoked_at')
      .first('id');
    if (open) throw conflict('That address already has an open invitation. Resend it instead.', { email: 'Already invited.' });
    await takeInvitationMail(trx, channelId, input.email);

    const token = generateInvitationToken();
    const [row] = await trx('invitations')
      .insert({
        channel_id: channelId,
        email: input.email,
        role: input.role,
        token_hash: hashInvitationToken(token),
        expires_at: invitationExpiry(),
        invited_by: invitedBy,
      })
      .returning<InvitationRow[]>('*');
    if (!row) throw new Error('invitation insert returned no row');
    return { invitation: toInvitationDto(row), token };
  });
}

/** A resend issues a new link and a new expiry; the old link stops working. Mail to it is rate-limited. */
export async function renewInvitation(channelId: string, invitationId: string): Promise<{ invitation: InvitationDto; token: string }> {
  return db.transaction(async (trx) => {
    const open: Pick<InvitationRow, 'email'> | undefined = await trx('invitations')
      .where({ id: invitationId, channel_id: channelId })
      .whereNull('accepted_at')
      .whereNull('revoked_at')
      .forUpdate()
      .first('email');
    if (!open) throw notFound('That open invitation');
    await takeInvitationMail(trx, channelId, open.email);
    const token = generateInvitationToken();
    const [row] = await trx('invitations')
      .where({ id: invitationId })
      .update({ token_hash: hashInvitationToken(token), expires_at: invitationExpiry(), updated_at: trx.fn.now() })
      .returning<InvitationRow[]>('*');
    if (!row) throw notFound('That open invitation');
    return { invitation: toInvitationDto(row), token };
  });
}

export async function markInvitationSent(invitationId: string): Promise<InvitationDto> {
  const [row] = await db('invitations').where({ id: invitationId }).update({ sent_at: db.fn.now() }).returning<InvitationRow[]>('*');
  if (!row) throw notFound('That invitation');
  return toInvitationDto(row);
}

export async function revokeInvitation(channelId: string, invitationId: string): Promise<void> {
  const count = await db('invitations')
    .where({ id: invitationId, channel_id: channelId })
    .whereNull('accepted_at')
    .whereNull('revoked_at')
    .update({ revoked_at: db.fn.now(), updated_at: db.fn.now() });
  if (count === 0) throw notFound('That open invitation');
}

function statusOf(row: InvitationRow, now = new Date()): InvitationStatus {
  if (row.accepted_at) return 'accepted';
  if (row.revoked_at) return 'revoked';
  if (row.expires_at <= now) return 'expired';
  return 'open';
}

export async function lookupInvitation(token: string): Promise<InvitationLookupDto> {
  const row: (InvitationRow & { channel_name: string; channel_slug: string }) | undefined = await db('invitations as i')
    .join('channels as c', 'c.id', 'i.channel_id')
    .where('i.token_hash', hashInvitationToken(token))
    .first('i.*', 'c.name as channel_name', 'c.slug as channel_slug');
  if (!row) return { status: 'unknown' };
  const status = statusOf(row);
  if (status !== 'open') return { status, channelName: row.channel_name };
  const account = await db('users').where({ email: row.email }).first('id');
  return {
    status,
    email: row.email,
    role: row.role,
    channelName: row.channel_name,
    channelSlug: row.channel_slug,
    accountExists: Boolean(account),
  };
}

const closedMessages: Record<Exclude<InvitationStatus, 'open'>, string> = {
  accepted: 'This invitation has already been used.',
  revoked: 'This invitation was withdrawn by the channel’s Host.',
  expired: 'This invitation has expired. Ask the Host to send a new one.',
  unknown: 'This invitation link is not valid.',
};

async function lockOpenInvitation(trx: Knex.Transaction, token: string): Promise<InvitationRow & { channel_slug: string }> {
  const row: (InvitationRow & { channel_slug: string }) | undefined = await trx('invitations as i')
    .join('channels as c', 'c.id', 'i.channel_id')
    .where('i.token_hash', hashInvitationToken(token))
    .forUpdate('i')
    .first('i.*', 'c.slug as channel_slug');
  const status = row ? statusOf(row) : 'unknown';
  if (!row || status !== 'open') throw new AppError(status === 'unknown' ? 'not_found' : 'conflict', closedMessages[status as Exclude<InvitationStatus, 'open'>]);
  return row;
}

export type Accepted = { channelSlug: string; role: Role; email: string };

const accountExists = () => conflict('An account with this e-mail already exists. Sign in to accept the invitation.');

/** Token and e-mail are checked before the password is hashed, and again under the lock. */
export async function acceptInvitationAsNewUser(token: string, input: { name: string; password: string }): Promise<Accepted> {
  // A bogus or used token must cost a lookup, not a password hash (issue 12, item 2).
  const early = await db.transaction(async (trx) => lockOpenInvitation(trx, token));
  if (await db('users').where({ email: early.email }).first('id')) throw accountExists();
  const passwordHash = await hashPassword(input.password);
  return db.transaction(async (trx) => {
    const inv = await lockOpenInvitation(trx, token);
    const existing = await trx('users').where({ email: inv.email }).first('id');
    if (existing) throw accountExists();
    const [user] = await trx('users')
      .insert({ email: inv.email, name: input.name, password_hash: passwordHash })
      .returning<{ id: string }[]>('id');
    if (!user) throw new Error('user insert returned no row');
    await trx('memberships').insert({ channel_id: inv.channel_id, user_id: user.id, role: inv.role });
    await trx('invitations').where({ id: inv.id }).update({ accepted_at: trx.fn.now(), accepted_by: user.id, updated_at: trx.fn.now() });
    return { channelSlug: inv.channel_slug, role: inv.role, email: inv.email };
  });
}

export async function acceptInvitationAsUser(token: string, user: UserDto): Promise<Accepted> {
  return db.transaction(async (trx) => {
    const inv = await lockOpenInvitation(trx, token);
    if (inv.email.toLowerCase() !== user.email.toLowerCase()) {
      throw forbidden(`This invitation is for ${inv.email}. Sign out and sign in with that address.`);
    }
    // Someone already on the crew keeps their role; the invitation is used up either way.
    await trx('memberships').insert({ channel_id: inv.channel_id, user_id: user.id, role: inv.role }).onConflict(['channel_id', 'user_id']).ignore();
    await trx('invitations').where({ id: inv.id }).update({ accepted_at: trx.fn.now(), accepted_by: user.id, updated_at: trx.fn.now() });
    const membership: { role: Role } | undefined = await trx('memberships').where({ channel_id: inv.channel_id, user_id: user.id }).first('role');
    return { channelSlug: inv.channel_slug, role: membership?.role ?? inv.role, email: inv.email };
  });
}
