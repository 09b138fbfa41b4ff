import type { Knex } from 'knex';
import { notFound } from '@/lib/errors';
import type { ScriptDoc } from '@/lib/scripts/schemas';
import type { Level, SegmentKind } from '@/lib/segments/schemas';
import type { Tool } from '@/lib/safety/tools';
import { isFrameRateId } from '@/lib/timecode';
import { buildSnapshot, type SnapshotClipInput, type SnapshotShotInput } from './build';
import type { HandoffSummaryDto } from './schemas';
import { hashContent, serializeSnapshot } from './snapshot';
import { listSnapshotDeliverables } from './sponsor-deliverable-queries';

// The write of one handoff version, inside the caller's transaction (the lock route and the demo seed).
// Statements per call do not grow with the episode: lock, next number, segments, shots, clips,
// (deliverables), insert.

type EpisodeLockRow = { id: string; title: string; premise: string; frame_rate: string; target_seconds: number | null; level_labels: unknown };
type SegmentRow = { id: string; kind: SegmentKind; level: number | null; title: string; script: ScriptDoc | null; word_count: number; action_seconds: number; tools: Tool[]; safety_reviewed_at: Date | null };
type ShotRow = { id: string; segment_id: string; description: string; framing: SnapshotShotInput['framing']; camera: SnapshotShotInput['camera']; state: SnapshotShotInput['state']; retake_reason: string | null };
type ClipRow = { id: string; segment_id: string; shot_id: string | null; original_name: string; mime_type: string; size_bytes: string; duration_seconds: number | null; frame_rate: number | null; sha256: string; has_poster: boolean };

const labelsOf = (v: unknown): [string, string, string] => {
  const a = Array.isArray(v) ? v : [];
  return [0, 1, 2].map((i) => (typeof a[i] === 'string' ? (a[i] as string) : ['Starter', 'Intermediate', 'Advanced'][i]!)) as [string, string, string];
};

export type InsertHandoffInput = { channelId: string; episodeId: string; wordsPerMinute: number; lockedBy: { id: string; name: string }; note: string };

export async function insertHandoffVersion(trx: Knex.Transaction, input: InsertHandoffInput): Promise<HandoffSummaryDto & { title: string }> {
  const { episodeId } = input;
  const episode: EpisodeLockRow | undefined = await trx('episodes')
    .where({ id: episodeId, channel_id: input.channelId })
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
  const base = {
    version: next.version,
    lockedAt,
    lockedBy: input.lockedBy.name,
    note: input.note,
    wordsPerMinute: input.wordsPerMinute,
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
  // Deliverables need each segment's forecast start, which the snapshot computes.
  const first = buildSnapshot({ ...base, deliverables: [] });
  const starts = new Map(first.segments.map((s) => [s.id, s.startSeconds]));
  const deliverables = await listSnapshotDeliverables(trx, episodeId, (id) => starts.get(id) ?? null);
  const snapshot = deliverables.length ? buildSnapshot({ ...base, deliverables }) : first;
  const content = serializeSnapshot(snapshot);
  const contentHash = hashContent(content);
  const [row] = await trx('handoffs')
    .insert({ episode_id: episodeId, version: next.version, content, content_hash: contentHash, note: input.note, locked_by: input.lockedBy.id, locked_at: lockedAt })
    .returning<{ id: string }[]>('id');
  return {
    id: row!.id,
    episodeId,
    version: next.version,
    contentHash,
    note: input.note,
    lockedBy: input.lockedBy.name,
    lockedAt: lockedAt.toISOString(),
    segmentCount: snapshot.segments.length,
    title: episode.title,
  };
}
