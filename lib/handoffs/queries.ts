import 'server-only';
import type { Knex } from 'knex';
import { db } from '@/db/client';
import type { Membership } from '@/lib/channels/queries';
import { appUrl } from '@/lib/config';
import { notFound } from '@/lib/errors';
import { sendMail } from '@/lib/mail/mailer';
import type { UserDto } from '@/lib/users/schemas';
import { buildHandoffMail } from './mail';
import type { HandoffSummaryDto, LockHandoffInput } from './schemas';
import { insertHandoffVersion } from './lock-queries';
import { parseSnapshot, type HandoffSnapshot } from './snapshot';

export const handoffPath = (slug: string, episodeId: string, version: number) => `/c/${slug}/episodes/${episodeId}/handoff/${version}`;

type HandoffRow = { id: string; episode_id: string; version: number; content_hash: string; note: string; locked_by_name: string | null; locked_at: Date; segment_count: number };

const summaryColumns = [
  'h.id',
  'h.episode_id',
  'h.version',
  'h.content_hash',
  'h.note',
  'u.name as locked_by_name',
  'h.locked_at',
  db.raw(`json_array_length(h.content::json -> 'segments')::int as segment_count`),
];

const toSummary = (r: HandoffRow): HandoffSummaryDto => ({
  id: r.id,
  episodeId: r.episode_id,
  version: r.version,
  contentHash: r.content_hash,
  note: r.note,
  lockedBy: r.locked_by_name,
  lockedAt: r.locked_at.toISOString(),
  segmentCount: r.segment_count,
});

const channelHandoffs = (trx: Knex | Knex.Transaction, channelId: string, episodeId: string) =>
  trx('handoffs as h')
    .join('episodes as e', 'e.id', 'h.episode_id')
    .leftJoin('users as u', 'u.id', 'h.locked_by')
    .where({ 'e.channel_id': channelId, 'h.episode_id': episodeId });

/**
 * Locks the next version. The episode's row lock serialises concurrent locks, so each gets its own
 * number; the snapshot is read inside the same transaction.
 */
export async function lockHandoff(member: Membership, user: UserDto, episodeId: string, input: LockHandoffInput): Promise<HandoffSummaryDto> {
  const { title, ...dto } = await db.transaction((trx) =>
    insertHandoffVersion(trx, { channelId: member.channel.id, episodeId, wordsPerMinute: member.channel.speakingRateWpm, lockedBy: user, note: input.note }),
  );
  await mailEditors(member, episodeId, title, dto);
  return dto;
}

/** One e-mail per Editor of the channel; a failed send is logged and does not undo the lock. */
async function mailEditors(member: Membership, episodeId: string, title: string, h: HandoffSummaryDto): Promise<void> {
  const editors: { email: string }[] = await db('memberships as m')
    .join('users as u', 'u.id', 'm.user_id')
    .where({ 'm.channel_id': member.channel.id, 'm.role': 'editor' })
    .select('u.email');
  const url = `${appUrl()}${handoffPath(member.channel.slug, episodeId, h.version)}`;
  const results = await Promise.allSettled(
    editors.map((e) =>
      sendMail(buildHandoffMail({ to: e.email, channelName: member.channel.name, episodeTitle: title, version: h.version, lockedBy: h.lockedBy ?? '', note: h.note, url })),
    ),
  );
  for (const r of results) if (r.status === 'rejected') console.error('[mail] handoff mail not sent', r.reason);
}

export async function listHandoffs(channelId: string, episodeId: string): Promise<HandoffSummaryDto[]> {
  const episode = await db('episodes').where({ id: episodeId, channel_id: channelId }).first('id');
  if (!episode) throw notFound('That episode');
  const rows: HandoffRow[] = await channelHandoffs(db, channelId, episodeId).orderBy('h.version', 'desc').select(summaryColumns);
  return rows.map(toSummary);
}

export type StoredHandoff = HandoffSummaryDto & { content: string };

/** The stored text exactly as locked; byte for byte what every later read serves. */
export async function findHandoffContent(channelId: string, episodeId: string, version: number): Promise<StoredHandoff> {
  const row: (HandoffRow & { content: string }) | undefined = await channelHandoffs(db, channelId, episodeId)
    .where('h.version', version)
    .first([...summaryColumns, 'h.content']);
  if (!row) throw notFound('That version');
  return { ...toSummary(row), content: row.content };
}

export async function findHandoff(channelId: string, episodeId: string, version: number): Promise<HandoffSummaryDto & { snapshot: HandoffSnapshot }> {
  const { content, ...summary } = await findHandoffContent(channelId, episodeId, version);
  return { ...summary, snapshot: parseSnapshot(content) };
}

/** Two versions' snapshots in one statement, for the diff. */
export async function findTwoSnapshots(channelId: string, episodeId: string, from: number, to: number): Promise<[HandoffSnapshot, HandoffSnapshot]> {
  const rows: { version: number; content: string }[] = await channelHandoffs(db, channelId, episodeId).whereIn('h.version', [from, to]).select('h.version', 'h.content');
  const a = rows.find((r) => r.version === from);
  const b = rows.find((r) => r.version === to);
  if (!a || !b) throw notFound('That version');
  return [parseSnapshot(a.content), parseSnapshot(b.content)];
}

/**
 * Records that `userId` opened `version` and returns the version they had opened before (null: first
 * time), in one statement: the CTE reads the old row before the upsert changes it.
 */
export async function recordHandoffRead(episodeId: string, userId: string, version: number): Promise<number | null> {
  const result = await db.raw<{ rows: { previous: number | null }[] }>(
    `with old as (select version from handoff_reads where episode_id = ? and user_id = ?),
     up as (insert into handoff_reads (episode_id, user_id, version) values (?, ?, ?)
            on conflict (episode_id, user_id) do update set version = greatest(handoff_reads.version, excluded.version), read_at = now())
     select (select version from old) as previous`,
    [episodeId, userId, episodeId, userId, version],
  );
  return result.rows[0]?.previous ?? null;
}

/** Upload ids of the clips that still exist, by clip id, in one statement. */
export type ClipUpload = { uploadId: string; crc32: number | null };

/** Where each clip's bytes are, and their CRC-32 when ingest recorded it. */
export async function findClipUploads(channelId: string, clipIds: string[]): Promise<Map<string, ClipUpload>> {
  if (clipIds.length === 0) return new Map();
  const rows: { id: string; upload_id: string; crc32: string | number | null }[] = await db('clips as c')
    .join('segments as s', 's.id', 'c.segment_id')
    .join('episodes as e', 'e.id', 's.episode_id')
    .where('e.channel_id', channelId)
    .whereIn('c.id', clipIds)
    .select('c.id', 'c.upload_id', 'c.crc32');
  // pg returns bigint as a string.
  return new Map(rows.map((r) => [r.id, { uploadId: r.upload_id, crc32: r.crc32 === null ? null : Number(r.crc32) }]));
}
