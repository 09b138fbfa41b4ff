import 'server-only';
import type { Knex } from 'knex';
import { db } from '@/db/client';
import type { Membership } from '@/lib/channels/queries';
import { appUrl } from '@/lib/config';
import { notFound } from '@/lib/errors';
import { sendMail } from '@/lib/mail/mailer';
import type { ScriptDoc } from '@/lib/scripts/schemas';
import type { Level, SegmentKind } from '@/lib/segments/schemas';
import type { Tool } from '@/lib/shots/safety';
import { isFrameRateId } from '@/lib/timecode';
import type { UserDto } from '@/lib/users/schemas';
import { buildSnapshot, type SnapshotClipInput, type SnapshotShotInput } from './build';
import { buildHandoffMail } from './mail';
import type { HandoffSummaryDto, LockHandoffInput } from './schemas';
import { hashContent, parseSnapshot, serializeSnapshot, type HandoffSnapshot } from './snapshot';
import { listSnapshotDeliverables } from './sponsor-deliverables';

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

type EpisodeLockRow = { id: string; title: string; premise: string; frame_rate: string; target_seconds: number | null; level_labels: unknown };
type SegmentRow = { id: string; kind: SegmentKind; level: number | null; title: string; script: ScriptDoc | null; word_count: number; action_seconds: number; tools: Tool[]; safety_reviewed_at: Date | null };
type ShotRow = { id: string; segment_id: string; description: string; framing: SnapshotShotInput['framing']; camera: SnapshotShotInput['camera']; state: SnapshotShotInput['state']; retake_reason: string | null };
type ClipRow = { id: string; segment_id: string; shot_id: string | null; original_name: string; mime_type: string; size_bytes: string; duration_seconds: number | null; frame_rate: number | null; sha256: string; has_poster: boolean };

const labelsOf = (v: unknown): [string, string, string] => {
  const a = Array.isArray(v) ? v : [];
  return [0, 1, 2].map((i) => (typeof a[i] === 'string' ? (a[i] as string) : ['Starter', 'Intermediate', 'Advanced'][i]!)) as [string, string, string];
};

/**
 * Locks the next version. The episode's row lock serialises concurrent locks, so each gets its own
 * number; the snapshot is read inside the same transaction. Statements per call do not grow with the
 * episode: lock, next number, segments, shots, clips, (deliverables), insert.
 */
export async function lockHandoff(member: Membership, user: UserDto, episodeId: string, input: LockHandoffInput): Promise<HandoffSummaryDto> {
  const summary = await db.transaction(async (trx) => {
    const episode: EpisodeLockRow | undefined = await trx('episodes')
      .where({ id: episodeId, channel_id: member.channel.id })
      .forUpdate()
      .first('id', 'title', 'premise', 'frame_rate', 'target_seconds', 'level_labels');
    if (!episode) throw notFound('That episode');
    const next: { version: number } = await trx('handoffs').where({ episode_id: episodeId }).first(trx.raw('coalesce(max(version), 0)::int + 1 as version'));
    const segments: SegmentRow[] = await trx('segments')
      .where({ episode_id: episodeId })
      .orderBy('position')
      .select('id', 'kind', 'level', 'title', 'script', 'word_count', 'action_seconds', 'tools', 'safety_reviewed_at');
    const shots: ShotRow[] = await trx('shots as sh')
      .join('segments as s', 's.id', 'sh.segment_id')
      .where('s.episode_id', episodeId)
      .whereNull('sh.deleted_at')
      .orderBy([{ column: 's.position' }, { column: 'sh.position' }])
      .select('sh.id', 'sh.segment_id', 'sh.description', 'sh.framing', 'sh.camera', 'sh.state', 'sh.retake_reason');
    const clips: ClipRow[] = await trx('clips as c')
      .join('segments as s', 's.id', 'c.segment_id')
      .where('s.episode_id', episodeId)
      .orderBy([{ column: 'c.created_at' }, { column: 'c.id' }])
      .select('c.id', 'c.segment_id', 'c.shot_id', 'c.original_name', 'c.mime_type', 'c.size_bytes', 'c.duration_seconds', 'c.frame_rate', 'c.sha256', 'c.has_poster');
    const lockedAt = new Date();
    const snapshotBase = {
      version: next.version,
      lockedAt,
      lockedBy: user.name,
      note: input.note,
      wordsPerMinute: member.channel.speakingRateWpm,
      episode: {
        id: episode.id,
        title: episode.title,
        premise: episode.premise,
        frameRate: isFrameRateId(episode.frame_rate) ? episode.frame_rate : '29.97df',
        targetSeconds: episode.target_seconds,
        levelLabels: labelsOf(episode.level_labels),
      },
      segments: segments.map((s) => ({
        id: s.id,
        kind: s.kind,
        level: s.level as Level | null,
        title: s.title,
        script: s.script,
        wordCount: s.word_count,
        actionSeconds: s.action_seconds,
        tools: s.tools,
        safetyReviewed: s.safety_reviewed_at !== null,
      })),
      shots: shots.map((s) => ({ id: s.id, segmentId: s.segment_id, description: s.description, framing: s.framing, camera: s.camera, state: s.state, retakeReason: s.retake_reason })),
      clips: clips.map(
        (c): SnapshotClipInput => ({
          id: c.id,
          segmentId: c.segment_id,
          shotId: c.shot_id,
          name: c.original_name,
          mimeType: c.mime_type,
          sizeBytes: Number(c.size_bytes),
          durationSeconds: c.duration_seconds,
          frameRate: c.frame_rate,
          sha256: c.sha256,
          hasPoster: c.has_poster,
        }),
      ),
    };
    const forecastStart = new Map<string, number>();
    const probe = buildSnapshot({ ...snapshotBase, deliverables: [] });
    for (const s of probe.segments) forecastStart.set(s.id, s.startSeconds);
    const deliverables = await listSnapshotDeliverables(trx, episodeId, (id) => forecastStart.get(id) ?? null);
    const snapshot = deliverables.length ? buildSnapshot({ ...snapshotBase, deliverables }) : probe;
    const content = serializeSnapshot(snapshot);
    const [row] = await trx('handoffs')
      .insert({ episode_id: episodeId, version: next.version, content, content_hash: hashContent(content), note: input.note, locked_by: user.id, locked_at: lockedAt })
      .returning<{ id: string }[]>('id');
    return {
      id: row!.id,
      episodeId,
      version: next.version,
      contentHash: hashContent(content),
      note: input.note,
      lockedBy: user.name,
      lockedAt: lockedAt.toISOString(),
      segmentCount: snapshot.segments.length,
      title: episode.title,
    };
  });
  const { title, ...dto } = summary;
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
export async function findClipUploads(channelId: string, clipIds: string[]): Promise<Map<string, string>> {
  if (clipIds.length === 0) return new Map();
  const rows: { id: string; upload_id: string }[] = await db('clips as c')
    .join('segments as s', 's.id', 'c.segment_id')
    .join('episodes as e', 'e.id', 's.episode_id')
    .where('e.channel_id', channelId)
    .whereIn('c.id', clipIds)
    .select('c.id', 'c.upload_id');
  return new Map(rows.map((r) => [r.id, r.upload_id]));
}
