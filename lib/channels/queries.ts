import 'server-only';
import type { Knex } from 'knex';
import { db } from '@/db/client';
import type { Role } from '@/lib/auth/policy';
import { thresholdsOf } from '@/lib/reminders/plan';
import { makeChannelSlug } from './slug';
import type { ChannelDto, ChannelSettingsInput, ChannelWithRoleDto } from './schemas';

type ChannelRow = { id: string; slug: string; name: string; speaking_rate_wpm: number; reminder_days: unknown };

export const toChannelDto = (row: ChannelRow): ChannelDto => ({
  id: row.id,
  slug: row.slug,
  name: row.name,
  speakingRateWpm: row.speaking_rate_wpm,
  // The same reading the reminder worker and calendar feed use, so the screen shows what they do.
  reminderDays: thresholdsOf(row.reminder_days).sort((a, b) => b - a),
});

const returnedColumns = ['id', 'slug', 'name', 'speaking_rate_wpm', 'reminder_days'];
const channelColumns = returnedColumns.map((c) => `c.${c}`);

export async function listChannelsForUser(userId: string): Promise<ChannelWithRoleDto[]> {
  const rows: (ChannelRow & { role: Role })[] = await db('memberships as m')
    .join('channels as c', 'c.id', 'm.channel_id')
    .where('m.user_id', userId)
    .orderBy('c.name')
    .select([...channelColumns, 'm.role']);
  return rows.map((r) => ({ ...toChannelDto(r), role: r.role }));
}

export type Membership = { channel: ChannelDto; role: Role; userId: string };

export async function findMembership(slug: string, userId: string): Promise<Membership | null> {
  const row: (ChannelRow & { role: Role }) | undefined = await db('memberships as m')
    .join('channels as c', 'c.id', 'm.channel_id')
    .where({ 'c.slug': slug, 'm.user_id': userId })
    .first([...channelColumns, 'm.role']);
  return row ? { channel: toChannelDto(row), role: row.role, userId } : null;
}

export async function createChannelWithHost(trx: Knex.Transaction, name: string, hostUserId: string): Promise<ChannelDto> {
  const [row] = await trx('channels')
    .insert({ name, slug: makeChannelSlug(name) })
    .returning<ChannelRow[]>(returnedColumns);
  if (!row) throw new Error('channel insert returned no row');
  await trx('memberships').insert({ channel_id: row.id, user_id: hostUserId, role: 'host' });
  return toChannelDto(row);
}

export async function updateChannelSettings(channelId: string, input: ChannelSettingsInput): Promise<ChannelDto> {
  const [row] = await db('channels')
    .where({ id: channelId })
    .update({
      ...(input.name !== undefined ? { name: input.name } : {}),
      ...(input.speakingRateWpm !== undefined ? { speaking_rate_wpm: input.speakingRateWpm } : {}),
      ...(input.reminderDays !== undefined ? { reminder_days: JSON.stringify(input.reminderDays) } : {}),
      updated_at: db.fn.now(),
    })
    .returning<ChannelRow[]>(returnedColumns);
  if (!row) throw new Error('channel vanished during update');
  return toChannelDto(row);
}

export function createChannel(name: string, hostUserId: string): Promise<ChannelDto> {
  return db.transaction((trx) => createChannelWithHost(trx, name, hostUserId));
}
