import 'server-only';
import type { Knex } from 'knex';
import { db } from '@/db/client';
import type { Membership } from '@/lib/channels/queries';
import { forbidden, invalidInput, notFound } from '@/lib/errors';
import { parseSnapshot } from '@/lib/handoffs/snapshot';
import { clipsOfAll } from '@/lib/handoffs/assembly';
import { frameRates, framesToTimecode, isFrameRateId, TimecodeError, timecodeToFrames } from '@/lib/timecode';
import type { UserDto } from '@/lib/users/schemas';
import { CLIP_NOTES_OWN_ONLY, mayReadClipNotes } from './policy';
import type { CreateNoteInput, EditNoteDto, EditStageEventDto } from './schemas';
import type { EditStage } from './stages';

/** Sets the stage and writes its history row in one transaction; the row lock orders concurrent changes. */
export async function setEditStage(member: Membership, user: UserDto, episodeId: string, stage: EditStage): Promise<{ editStage: EditStage; history: EditStageEventDto[] }> {
  await db.transaction(async (trx) => {
    const row: { edit_stage: EditStage | null } | undefined = await trx('episodes').where({ id: episodeId, channel_id: member.channel.id }).forUpdate().first('edit_stage');
    if (!row) throw notFound('That episode');
    if (row.edit_stage === stage) return;
    await trx('episodes').where({ id: episodeId }).update({ edit_stage: stage, updated_at: trx.fn.now() });
    await trx('edit_stage_events').insert({ episode_id: episodeId, from_stage: row.edit_stage, to_stage: stage, user_id: user.id });
  });
  return { editStage: stage, history: await listEditStageHistory(member.channel.id, episodeId) };
}

export async function listEditStageHistory(channelId: string, episodeId: string): Promise<EditStageEventDto[]> {
  const episode = await db('episodes').where({ id: episodeId, channel_id: channelId }).first('id');
  if (!episode) throw notFound('That episode');
  const rows: { id: string; from_stage: EditStage | null; to_stage: EditStage; name: string | null; at: Date }[] = await db('edit_stage_events as ev')
    .leftJoin('users as u', 'u.id', 'ev.user_id')
    .where('ev.episode_id', episodeId)
    .orderBy('ev.id', 'desc')
    .select('ev.id', 'ev.from_stage', 'ev.to_stage', 'u.name', 'ev.at');
  return rows.map((r) => ({ id: String(r.id), fromStage: r.from_stage, toStage: r.to_stage, by: r.name, at: r.at.toISOString() }));
}

type NoteRow = {
  id: string;
  version: number;
  parent_id: string | null;
  segment_id: string | null;
  clip_id: string | null;
  frame: number | null;
  frame_rate: string | null;
  body: string;
  author: string | null;
  created_at: Date;
  resolved_at: Date | null;
  resolver: string | null;
};

const noteColumns = ['n.id', 'h.version', 'n.parent_id', 'n.segment_id', 'n.clip_id', 'n.frame', 'n.frame_rate', 'n.body', 'a.name as author', 'n.created_at', 'n.resolved_at', 'r.name as resolver'];

const notesOfChannel = (trx: Knex | Knex.Transaction, channelId: string) =>
  trx('edit_notes as n')
    .join('handoffs as h', 'h.id', 'n.handoff_id')
    .join('episodes as e', 'e.id', 'h.episode_id')
    .leftJoin('users as a', 'a.id', 'n.author_id')
    .leftJoin('users as r', 'r.id', 'n.resolved_by')
    .where('e.channel_id', channelId);

const toNote = (r: NoteRow): EditNoteDto => ({
  id: r.id,
  version: r.version,
  parentId: r.parent_id,
  segmentId: r.segment_id,
  clipId: r.clip_id,
  frame: r.frame,
  timecode: r.frame !== null && r.frame_rate && isFrameRateId(r.frame_rate) ? framesToTimecode(r.frame, frameRates[r.frame_rate]) : null,
  body: r.body,
  author: r.author,
  createdAt: r.created_at.toISOString(),
  resolvedAt: r.resolved_at ? r.resolved_at.toISOString() : null,
  resolvedBy: r.resolved_at ? r.resolver : null,
  replies: [],
});

/** Threads (oldest first) with their replies, from rows in any order. */
function threads(rows: NoteRow[]): EditNoteDto[] {
  const notes = rows.map(toNote);
  const byId = new Map(notes.map((n) => [n.id, n]));
  const roots: EditNoteDto[] = [];
  for (const n of notes) {
    const parent = n.parentId ? byId.get(n.parentId) : undefined;
    if (parent) parent.replies.push(n);
    else if (!n.parentId) roots.push(n);
  }
  return roots;
}

/** A version's threads in one statement; sorted by timecode, then time written. */
export async function listVersionNotes(channelId: string, episodeId: string, version: number): Promise<EditNoteDto[]> {
  const h = await db('handoffs as h').join('episodes as e', 'e.id', 'h.episode_id').where({ 'e.channel_id': channelId, 'h.episode_id': episodeId, 'h.version': version }).first('h.id');
  if (!h) throw notFound('That version');
  const rows: NoteRow[] = await notesOfChannel(db, channelId).where('n.handoff_id', h.id).orderBy([{ column: 'n.frame' }, { column: 'n.created_at' }]).select(noteColumns);
  return threads(rows);
}

/** Threads on a clip, across versions. A Shop hand reads them only for clips they uploaded. */
export async function listClipNotes(member: Membership, clipId: string): Promise<EditNoteDto[]> {
  const clip: { uploaded_by: string | null } | undefined = await db('clips as c')
    .join('segments as s', 's.id', 'c.segment_id')
    .join('episodes as e', 'e.id', 's.episode_id')
    .where({ 'c.id': clipId, 'e.channel_id': member.channel.id })
    .first('c.uploaded_by');
  if (!clip) throw notFound('That clip');
  if (!mayReadClipNotes(member.role, clip.uploaded_by, member.userId)) throw forbidden(CLIP_NOTES_OWN_ONLY);
  const rows: NoteRow[] = await notesOfChannel(db, member.channel.id)
    .where((q) => q.where('n.clip_id', clipId).orWhereIn('n.parent_id', db('edit_notes').select('id').where('clip_id', clipId)))
    .orderBy([{ column: 'h.version' }, { column: 'n.frame' }, { column: 'n.created_at' }])
    .select(noteColumns);
  return threads(rows);
}

/** A new thread pinned to a timecode, at the episode's frame rate as locked in the version. */
export async function createNote(member: Membership, user: UserDto, episodeId: string, version: number, input: CreateNoteInput): Promise<EditNoteDto> {
  const h: { id: string; content: string } | undefined = await db('handoffs as h')
    .join('episodes as e', 'e.id', 'h.episode_id')
    .where({ 'e.channel_id': member.channel.id, 'h.episode_id': episodeId, 'h.version': version })
    .first('h.id', 'h.content');
  if (!h) throw notFound('That version');
  const snapshot = parseSnapshot(h.content);
  const rate = frameRates[snapshot.episode.frameRate];
  if (input.segmentId && !snapshot.segments.some((s) => s.id === input.segmentId)) throw invalidInput({ segmentId: 'That segment is not in this version.' });
  if (input.clipId && !clipsOfAll(snapshot).some((c) => c.id === input.clipId)) throw invalidInput({ clipId: 'That clip is not in this version.' });
  let frame: number;
  try {
    frame = timecodeToFrames(input.timecode, rate);
  } catch (err) {
    if (err instanceof TimecodeError) throw invalidInput({ timecode: `${err.message} (${rate.label})` });
    throw err;
  }
  const [row] = await db('edit_notes')
    .insert({ handoff_id: h.id, segment_id: input.segmentId ?? null, clip_id: input.clipId ?? null, frame, frame_rate: rate.id, body: input.body, author_id: user.id })
    .returning<{ id: string }[]>('id');
  return findNote(member.channel.id, row!.id);
}

async function findNote(channelId: string, noteId: string): Promise<EditNoteDto> {
  const row: NoteRow | undefined = await notesOfChannel(db, channelId).where('n.id', noteId).first(noteColumns);
  if (!row) throw notFound('That note');
  return toNote(row);
}

export async function replyToNote(member: Membership, user: UserDto, noteId: string, body: string): Promise<EditNoteDto> {
  const root: { id: string; handoff_id: string; parent_id: string | null } | undefined = await notesOfChannel(db, member.channel.id).where('n.id', noteId).first('n.id', 'n.handoff_id', 'n.parent_id');
  if (!root) throw notFound('That note');
  // Replies hang off the thread's first note, so a thread stays one level deep.
  const [row] = await db('edit_notes').insert({ handoff_id: root.handoff_id, parent_id: root.parent_id ?? root.id, body, author_id: user.id }).returning<{ id: string }[]>('id');
  return findNote(member.channel.id, row!.id);
}

/** Resolve or reopen a thread: one UPDATE, scoped to the channel. */
export async function setNoteResolved(member: Membership, user: UserDto, noteId: string, resolved: boolean): Promise<EditNoteDto> {
  const updated = await db('edit_notes as n')
    .whereIn('n.id', notesOfChannel(db, member.channel.id).where('n.id', noteId).whereNull('n.parent_id').select('n.id'))
    .update(resolved ? { resolved_at: db.fn.now(), resolved_by: user.id } : { resolved_at: null, resolved_by: null });
  if (updated === 0) throw notFound('That thread');
  return findNote(member.channel.id, noteId);
}
