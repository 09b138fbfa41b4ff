import 'server-only';
import type { Knex } from 'knex';
import { db } from '@/db/client';
import type { Role } from '@/lib/auth/policy';
import type { Membership } from '@/lib/channels/queries';
import { forbidden, invalidInput, notFound } from '@/lib/errors';
import { findSegment } from '@/lib/segments/queries';
import { DELETE_OWN_ONLY, FILE_OWN_ONLY, mayDeleteClip, mayFileClip } from './policy';
import type { MediaInfo } from './probe';
import type { ClipDto, DuplicateOfDto, FileClipInput, ProbeState } from './schemas';

type ClipRow = {
  id: string;
  upload_id: string;
  segment_id: string;
  shot_id: string | null;
  uploaded_by: string | null;
  uploader_name: string | null;
  original_name: string;
  mime_type: string;
  size_bytes: string;
  sha256: string;
  probe_state: ProbeState;
  probe_note: string | null;
  duration_seconds: number | null;
  width: number | null;
  height: number | null;
  frame_rate: number | null;
  codec: string | null;
  has_poster: boolean;
  created_at: Date;
  duplicate_of: DuplicateOfDto | null;
};

const clipColumns = [
  'c.id',
  'c.upload_id',
  'c.segment_id',
  'c.shot_id',
  'c.uploaded_by',
  'u.name as uploader_name',
  'c.original_name',
  'c.mime_type',
  'c.size_bytes',
  'c.sha256',
  'c.probe_state',
  'c.probe_note',
  'c.duration_seconds',
  'c.width',
  'c.height',
  'c.frame_rate',
  'c.codec',
  'c.has_poster',
  'c.created_at',
  // The channel's earliest clip with the same bytes, so the later upload warns and links it (issue 15).
  // clips_sha256_index keeps this an index lookup per clip.
  db.raw(`(
    select json_build_object('clipId', d.id, 'segmentId', d.segment_id, 'episodeId', ds.episode_id, 'segmentTitle', ds.title, 'originalName', d.original_name)
    from clips as d join segments as ds on ds.id = d.segment_id join episodes as de on de.id = ds.episode_id
    where d.sha256 = c.sha256 and de.channel_id = e.channel_id and (d.created_at, d.id) < (c.created_at, c.id)
    order by d.created_at, d.id limit 1
  ) as duplicate_of`),
];

const toClipDto = (r: ClipRow): ClipDto => ({
  id: r.id,
  segmentId: r.segment_id,
  shotId: r.shot_id,
  uploadedBy: r.uploaded_by,
  uploaderName: r.uploader_name,
  originalName: r.original_name,
  mimeType: r.mime_type,
  sizeBytes: Number(r.size_bytes),
  sha256: r.sha256,
  probeState: r.probe_state,
  probeNote: r.probe_note,
  durationSeconds: r.duration_seconds,
  width: r.width,
  height: r.height,
  frameRate: r.frame_rate,
  codec: r.codec,
  hasPoster: r.has_poster,
  createdAt: r.created_at.toISOString(),
  duplicateOf: r.duplicate_of,
});

const channelClips = (trx: Knex | Knex.Transaction, channelId: string) =>
  trx('clips as c')
    .join('segments as s', 's.id', 'c.segment_id')
    .join('episodes as e', 'e.id', 's.episode_id')
    .leftJoin('users as u', 'u.id', 'c.uploaded_by')
    .where('e.channel_id', channelId);

export type UploadTarget = { channelId: string; role: Role | null };

/** Where an upload would land, and the uploader's role there (null: not crew of that channel). */
export async function findUploadTarget(userId: string, segmentId: string, shotId?: string): Promise<(UploadTarget & { shotInSegment: boolean }) | null> {
  const seg: { channel_id: string; role: Role | null } | undefined = await db('segments as s')
    .join('episodes as e', 'e.id', 's.episode_id')
    .leftJoin('memberships as m', function () {
      this.on('m.channel_id', 'e.channel_id').andOn('m.user_id', db.raw('?', [userId]));
    })
    .where('s.id', segmentId)
    .first('e.channel_id', 'm.role');
  if (!seg) return null;
  const shotInSegment = shotId ? Boolean(await db('shots').where({ id: shotId, segment_id: segmentId }).whereNull('deleted_at').first('id')) : true;
  return { channelId: seg.channel_id, role: seg.role, shotInSegment };
}

export async function roleInChannel(userId: string, channelId: string): Promise<Role | null> {
  const m: { role: Role } | undefined = await db('memberships').where({ user_id: userId, channel_id: channelId }).first('role');
  return m?.role ?? null;
}

export type NewClip = {
  uploadId: string;
  segmentId: string;
  shotId: string | null;
  uploadedBy: string;
  originalName: string;
  mimeType: string;
  sizeBytes: number;
  sha256: string;
  /** CRC-32 of the bytes, for the clip package; unknown for rows written without it. */
  crc32?: number | null;
};

/** Writes the clip row and its media job exactly once per upload, however often the finish is retried. */
export async function recordClipOnce(clip: NewClip): Promise<{ clipId: string; created: boolean }> {
  return db.transaction(async (trx) => {
    const inserted: { id: string }[] = await trx('clips')
      .insert({
        upload_id: clip.uploadId,
        segment_id: clip.segmentId,
        shot_id: clip.shotId,
        uploaded_by: clip.uploadedBy,
        original_name: clip.originalName,
        mime_type: clip.mimeType,
        size_bytes: clip.sizeBytes,
        sha256: clip.sha256,
        crc32: clip.crc32 ?? null,
      })
      .onConflict('upload_id')
      .ignore()
      .returning('id');
    const row = inserted[0];
    if (!row) {
      const existing: { id: string } = await trx('clips').where({ upload_id: clip.uploadId }).first('id');
      return { clipId: existing.id, created: false };
    }
    await trx('clip_jobs').insert({ clip_id: row.id, kind: 'probe' }).onConflict(['clip_id', 'kind']).ignore();
    return { clipId: row.id, created: true };
  });
}

export async function listSegmentClips(channelId: string, segmentId: string): Promise<ClipDto[]> {
  await findSegment(channelId, segmentId);
  const rows: ClipRow[] = await channelClips(db, channelId).where('c.segment_id', segmentId).orderBy('c.created_at', 'desc').select(clipColumns);
  return rows.map(toClipDto);
}

export async function findClip(channelId: string, clipId: string): Promise<ClipDto & { uploadId: string }> {
  const row: ClipRow | undefined = await channelClips(db, channelId).where('c.id', clipId).first(clipColumns);
  if (!row) throw notFound('That clip');
  return { ...toClipDto(row), uploadId: row.upload_id };
}

/** Host deletes any clip; a Shop hand only what they uploaded. Returns the upload id whose bytes to remove. */
export async function deleteClipRow(member: Membership, clipId: string): Promise<{ uploadId: string }> {
  return db.transaction(async (trx) => {
    const row: { upload_id: string; uploaded_by: string | null } | undefined = await channelClips(trx, member.channel.id)
      .where('c.id', clipId)
      .forUpdate('c')
      .first('c.upload_id', 'c.uploaded_by');
    if (!row) throw notFound('That clip');
    if (!mayDeleteClip(member.role, row.uploaded_by, member.userId)) throw forbidden(DELETE_OWN_ONLY);
    await trx('clips').where({ id: clipId }).delete();
    return { uploadId: row.upload_id };
  });
}

/**
 * Ties a clip to a shot of its segment, or moves it to another segment of the channel (untied unless a
 * shot of that segment is named). Host any clip, the uploader their own (mayFileClip); the row is locked
 * so a delete or another move in between is seen.
 */
export async function fileClip(member: Membership, clipId: string, input: FileClipInput): Promise<ClipDto> {
  await db.transaction(async (trx) => {
    const row: { segment_id: string; shot_id: string | null; uploaded_by: string | null } | undefined = await channelClips(trx, member.channel.id)
      .where('c.id', clipId)
      .forUpdate('c')
      .first('c.segment_id', 'c.shot_id', 'c.uploaded_by');
    if (!row) throw notFound('That clip');
    if (!mayFileClip(member.role, row.uploaded_by, member.userId)) throw forbidden(FILE_OWN_ONLY);
    const segmentId = input.segmentId ?? row.segment_id;
    if (segmentId !== row.segment_id) {
      const seg = await trx('segments as s').join('episodes as e', 'e.id', 's.episode_id').where({ 's.id': segmentId, 'e.channel_id': member.channel.id }).first('s.id');
      if (!seg) throw invalidInput({ segmentId: 'That segment is not in this channel.' });
    }
    const shotId = input.shotId !== undefined ? input.shotId : segmentId === row.segment_id ? row.shot_id : null;
    if (shotId !== null) {
      const shot = await trx('shots').where({ id: shotId, segment_id: segmentId }).whereNull('deleted_at').first('id');
      if (!shot) throw invalidInput({ shotId: 'That shot is not in this segment.' });
    }
    await trx('clips').where({ id: clipId }).update({ segment_id: segmentId, shot_id: shotId });
  });
  const { uploadId: _uploadId, ...clip } = await findClip(member.channel.id, clipId);
  return clip;
}

/** The clip a finished upload already became, if any: a retried finish must not record it twice. */
export async function findClipIdByUpload(uploadId: string): Promise<string | null> {
  const row: { id: string } | undefined = await db('clips').where({ upload_id: uploadId }).first('id');
  return row?.id ?? null;
}

export async function uploadIdsInUse(uploadIds: string[]): Promise<Set<string>> {
  if (uploadIds.length === 0) return new Set();
  const rows: { upload_id: string }[] = await db('clips').whereIn('upload_id', uploadIds).select('upload_id');
  return new Set(rows.map((r) => r.upload_id));
}

/**
 * Drops the upload marks (storage/upload-lock-queries.ts) of `uploadIds` and of every upload whose lock
 * nobody took since `before`. A process trusts what it last saw of an upload only while the mark is the
 * one it left; without a row the next PATCH asks S3 again, so dropping one is always safe.
 */
export async function removeUploadMarks(uploadIds: string[], before: Date): Promise<void> {
  await db('upload_marks').whereIn('upload_id', uploadIds).orWhere('marked_at', '<', before).delete();
}

// Media jobs: claimed with SKIP LOCKED; a claim older than STALE_CLAIM is a worker that died mid-job.
const STALE_CLAIM = "interval '10 minutes'";
export type ClipJob = { id: string; clipId: string; uploadId: string; mimeType: string; attempts: number };

export async function claimClipJob(): Promise<ClipJob | null> {
  return db.transaction(async (trx) => {
    const job: { id: string; clip_id: string; attempts: number } | undefined = await trx('clip_jobs')
      .where('run_after', '<=', trx.fn.now())
      .andWhere((q) => q.whereNull('locked_at').orWhereRaw(`locked_at < now() - ${STALE_CLAIM}`))
      .orderBy('id')
      .forUpdate()
      .skipLocked()
      .first('id', 'clip_id', 'attempts');
    if (!job) return null;
    await trx('clip_jobs').where({ id: job.id }).update({ locked_at: trx.fn.now(), attempts: job.attempts + 1 });
    const clip: { upload_id: string; mime_type: string } = await trx('clips').where({ id: job.clip_id }).first('upload_id', 'mime_type');
    return { id: String(job.id), clipId: job.clip_id, uploadId: clip.upload_id, mimeType: clip.mime_type, attempts: job.attempts + 1 };
  });
}

export async function completeClipJob(job: ClipJob, result: { state: ProbeState; note: string | null; info?: MediaInfo; poster: boolean }): Promise<void> {
  await db.transaction(async (trx) => {
    await trx('clips')
      .where({ id: job.clipId })
      .update({
        probe_state: result.state,
        probe_note: result.note?.slice(0, 300) ?? null,
        has_poster: result.poster,
        ...(result.info && {
          duration_seconds: result.info.durationSeconds,
          width: result.info.width,
          height: result.info.height,
          frame_rate: result.info.frameRate,
          codec: result.info.codec,
        }),
      });
    await trx('clip_jobs').where({ id: job.id }).delete();
  });
}

/** Tries again later with back-off; after the last attempt the clip says the details could not be read. */
export async function retryClipJob(job: ClipJob, error: string, maxAttempts = 3): Promise<void> {
  if (job.attempts >= maxAttempts) {
    await completeClipJob(job, { state: 'failed', note: error, poster: false });
    return;
  }
  await db('clip_jobs')
    .where({ id: job.id })
    .update({ locked_at: null, last_error: error.slice(0, 500), run_after: db.raw(`now() + make_interval(secs => ?)`, [30 * job.attempts]) });
}

// Byte removals: queued by a trigger whenever a clip row goes (migration 20261212000001); taken with
// SKIP LOCKED so several app processes share the queue; a failed removal is retried later.
export type ByteRemoval = { id: string; uploadId: string; clipId: string };

/** Runs `remove` for up to `limit` due removals, each in its own transaction; returns how many were done. */
export async function takeByteRemovals(limit: number, remove: (job: ByteRemoval) => Promise<void>): Promise<number> {
  let done = 0;
  for (let i = 0; i < limit; i++) {
    const more = await db.transaction(async (trx) => {
      const row: { id: string; upload_id: string; clip_id: string } | undefined = await trx('byte_removals')
        .where('run_after', '<=', trx.fn.now())
        .orderBy('id')
        .forUpdate()
        .skipLocked()
        .first('id', 'upload_id', 'clip_id');
      if (!row) return false;
      try {
        await remove({ id: row.id, uploadId: row.upload_id, clipId: row.clip_id });
        await trx('byte_removals').where({ id: row.id }).delete();
        done++;
      } catch (err) {
        await trx('byte_removals')
          .where({ id: row.id })
          .update({ attempts: trx.raw('attempts + 1'), run_after: trx.raw("now() + interval '5 minutes'"), last_error: String(err).slice(0, 500) });
      }
      return true;
    });
    if (!more) break;
  }
  return done;
}

/** Upload ids (of those given) whose clip was deleted and whose bytes wait for removal: never ingest them again. */
export async function uploadIdsBeingRemoved(uploadIds: string[]): Promise<Set<string>> {
  if (uploadIds.length === 0) return new Set();
  const rows: { upload_id: string }[] = await db('byte_removals').whereIn('upload_id', uploadIds).select('upload_id');
  return new Set(rows.map((r) => r.upload_id));
}

/** Segment ids (of those given) that still exist. */
export async function existingSegmentIds(segmentIds: string[]): Promise<Set<string>> {
  if (segmentIds.length === 0) return new Set();
  const rows: { id: string }[] = await db('segments').whereIn('id', segmentIds).select('id');
  return new Set(rows.map((r) => r.id));
}

/** Clip ids (of those given) that still have a row. */
export async function existingClipIds(clipIds: string[]): Promise<Set<string>> {
  if (clipIds.length === 0) return new Set();
  const rows: { id: string }[] = await db('clips').whereIn('id', clipIds).select('id');
  return new Set(rows.map((r) => r.id));
}

export type StoredClip = { id: string; uploadId: string; sha256: string; sizeBytes: number; hasPoster: boolean };

/** Clips in id order, a page at a time, of one channel or all: what a storage move walks through. */
export async function listStoredClips(opts: { channelId?: string; afterId?: string; limit: number }): Promise<StoredClip[]> {
  const q = db('clips as c').orderBy('c.id').limit(opts.limit).select('c.id', 'c.upload_id', 'c.sha256', 'c.size_bytes', 'c.has_poster');
  if (opts.channelId) q.join('segments as s', 's.id', 'c.segment_id').join('episodes as e', 'e.id', 's.episode_id').where('e.channel_id', opts.channelId);
  if (opts.afterId) q.where('c.id', '>', opts.afterId);
  const rows: { id: string; upload_id: string; sha256: string; size_bytes: string; has_poster: boolean }[] = await q;
  return rows.map((r) => ({ id: r.id, uploadId: r.upload_id, sha256: r.sha256, sizeBytes: Number(r.size_bytes), hasPoster: r.has_poster }));
}
