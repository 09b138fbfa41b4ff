import 'server-only';
import { generateKeyBetween } from 'fractional-indexing';
import type { Knex } from 'knex';
import { db } from '@/db/client';
import type { Membership } from '@/lib/channels/queries';
import { conflict, invalidInput, notFound } from '@/lib/errors';
import type { Camera, Framing, ShotState } from './catalog';
import { findSegment } from '@/lib/segments/queries';
import { openBursts } from '@/lib/mail/assignment-queries';
import { assertMayEditShot } from './policy';
import { parseShotLines } from './quick-add';
import { needsSafetyReview, type Tool } from '@/lib/safety/tools';
import { shotNumberColumn, shotsOfChannelWithDeleted } from './shared-queries';
import type { BoardQuery, BoardShotDto, CreateShotInput, ShotDto, ShotStateInput, UpdateShotInput } from './schemas';

type Db = Knex | Knex.Transaction;

type ShotRow = {
  id: string;
  segment_id: string;
  number: number;
  position: string;
  board_position: string;
  framing: Framing;
  camera: Camera;
  description: string;
  assignee_id: string | null;
  assignee_name: string | null;
  due_date: string | null;
  notes: string;
  state: ShotState;
  retake_reason: string | null;
  state_changed_by_name: string | null;
  state_changed_at: Date | null;
  clip_count: number;
};
type BoardShotRow = ShotRow & {
  episode_id: string;
  episode_title: string;
  shoot_date: string | null;
  segment_title: string;
  segment_position: string;
  segment_number: number;
  tools: Tool[];
  safety_reviewed_at: Date | null;
};

const shotColumns = [
  'sh.id',
  'sh.segment_id',
  shotNumberColumn(),
  'sh.position',
  'sh.board_position',
  'sh.framing',
  'sh.camera',
  'sh.description',
  'sh.assignee_id',
  'au.name as assignee_name',
  'sh.due_date',
  'sh.notes',
  'sh.state',
  'sh.retake_reason',
  'cu.name as state_changed_by_name',
  'sh.state_changed_at',
  db.raw('(select count(*) from clips cl where cl.shot_id = sh.id)::int as clip_count'),
];
// The segment's place in its running order (1-based), so a shot reads as 3.2 wherever segments mix (issue 15).
const segmentNumber = db.raw('(select count(*)::int from segments as s2 where s2.episode_id = s.episode_id and s2.position <= s.position) as segment_number');
const boardColumns = [...shotColumns, 'e.id as episode_id', 'e.title as episode_title', 'e.shoot_date', 's.title as segment_title', 's.position as segment_position', segmentNumber, 's.tools', 's.safety_reviewed_at'];

const toShotDto = (r: ShotRow): ShotDto => ({
  id: r.id,
  segmentId: r.segment_id,
  number: r.number,
  position: r.position,
  boardPosition: r.board_position,
  framing: r.framing,
  camera: r.camera,
  description: r.description,
  assigneeId: r.assignee_id,
  assigneeName: r.assignee_name,
  dueDate: r.due_date,
  notes: r.notes,
  state: r.state,
  retakeReason: r.retake_reason,
  stateChangedBy: r.state_changed_by_name,
  stateChangedAt: r.state_changed_at ? r.state_changed_at.toISOString() : null,
  clipCount: r.clip_count,
});
const toBoardShotDto = (r: BoardShotRow): BoardShotDto => ({
  ...toShotDto(r),
  episodeId: r.episode_id,
  episodeTitle: r.episode_title,
  shootDate: r.shoot_date,
  segmentTitle: r.segment_title,
  segmentPosition: r.segment_position,
  segmentNumber: r.segment_number,
  tools: r.tools,
  safetyPending: needsSafetyReview(r.tools) && !r.safety_reviewed_at,
});

const shotsWithPeople = (trx: Db, channelId: string) =>
  shotsOfChannelWithDeleted(trx, channelId).leftJoin('users as au', 'au.id', 'sh.assignee_id').leftJoin('users as cu', 'cu.id', 'sh.state_changed_by');

export const liveShotsOfChannel = (trx: Db, channelId: string) => shotsWithPeople(trx, channelId).whereNull('sh.deleted_at');

async function findShotRow(trx: Db, channelId: string, shotId: string, opts: { deleted?: boolean; lock?: boolean } = {}): Promise<BoardShotRow> {
  const q = shotsWithPeople(trx, channelId).where('sh.id', shotId);
  if (opts.deleted) q.whereNotNull('sh.deleted_at');
  else q.whereNull('sh.deleted_at');
  // PostgreSQL waits for the lock, then returns the row as the last writer committed it.
  if (opts.lock) q.forUpdate('sh');
  const row: BoardShotRow | undefined = await q.first(boardColumns);
  if (!row) throw notFound('That shot');
  return row;
}

export async function findShot(channelId: string, shotId: string): Promise<BoardShotDto> {
  return toBoardShotDto(await findShotRow(db, channelId, shotId));
}

/**
 * Serialises shop-board order changes of one channel: two moves computing a key between the same
 * neighbours would get the same key (issue 12: nine parallel moves left six cards on one position).
 * An advisory lock rather than the channel row, so it never blocks writes that reference the channel.
 */
async function lockShopBoard(trx: Knex.Transaction, channelId: string): Promise<void> {
  await trx.raw('select pg_advisory_xact_lock(hashtextextended(?, 0))', [`shop-board:${channelId}`]);
}

/** Locks the segment so two writers cannot take the same list position. */
async function lockSegment(trx: Knex.Transaction, channelId: string, segmentId: string): Promise<{ episode_id: string }> {
  const seg: { episode_id: string } | undefined = await trx('segments as s')
    .join('episodes as e', 'e.id', 's.episode_id')
    .where({ 's.id': segmentId, 'e.channel_id': channelId })
    .forUpdate('s')
    .first('s.episode_id');
  if (!seg) throw notFound('That segment');
  return seg;
}

async function assigneeInCrewOr400(trx: Db, channelId: string, assigneeId: string | null | undefined): Promise<void> {
  if (!assigneeId) return;
  const m: { role: string } | undefined = await trx('memberships').where({ channel_id: channelId, user_id: assigneeId }).first('role');
  if (!m || m.role === 'editor') throw invalidInput({ assigneeId: 'Assign shots to a Host or Shop hand of this channel.' });
}

const lastPosition = async (trx: Db, segmentId: string): Promise<string | null> =>
  ((await trx('shots').where({ segment_id: segmentId }).max('position as p').first()) as { p: string | null } | undefined)?.p ?? null;

const lastBoardPosition = async (trx: Db, channelId: string): Promise<string | null> =>
  (
    (await shotsOfChannelWithDeleted(trx, channelId).max('sh.board_position as p').first()) as { p: string | null } | undefined
  )?.p ?? null;

export async function listSegmentShots(channelId: string, segmentId: string): Promise<ShotDto[]> {
  await findSegment(channelId, segmentId);
  const rows: ShotRow[] = await liveShotsOfChannel(db, channelId).where('sh.segment_id', segmentId).orderBy('sh.position').select(shotColumns);
  return rows.map(toShotDto);
}

type NewShot = { framing: Framing; camera: Camera; description: string; assigneeId: string | null; dueDate: string | null; notes: string };

async function insertShots(trx: Knex.Transaction, channelId: string, segmentId: string, items: NewShot[], after?: string | null): Promise<ShotDto[]> {
  await lockSegment(trx, channelId, segmentId);
  const assignees = [...new Set(items.map((i) => i.assigneeId).filter((a): a is string => a !== null))];
  for (const a of assignees) await assigneeInCrewOr400(trx, channelId, a);
  let key: string | null;
  let upper: string | null = null;
  if (after !== undefined && after !== null) {
    key = after;
    const next: { position: string } | undefined = await trx('shots').where({ segment_id: segmentId }).where('position', '>', after).orderBy('position').first('position');
    upper = next?.position ?? null;
  } else key = await lastPosition(trx, segmentId);
  await lockShopBoard(trx, channelId);
  let board = await lastBoardPosition(trx, channelId);
  const rows = items.map((i) => {
    key = generateKeyBetween(key, upper);
    board = generateKeyBetween(board, null);
    return {
      segment_id: segmentId,
      position: key,
      board_position: board,
      framing: i.framing,
      camera: i.camera,
      description: i.description,
      assignee_id: i.assigneeId,
      due_date: i.dueDate,
      notes: i.notes,
    };
  });
  const inserted = await trx('shots').insert(rows).returning<{ id: string }[]>('id');
  await openBursts(trx, channelId, assignees);
  const full: ShotRow[] = await liveShotsOfChannel(trx, channelId)
    .whereIn(
      'sh.id',
      inserted.map((r) => r.id),
    )
    .orderBy('sh.position')
    .select(shotColumns);
  return full.map(toShotDto);
}

export async function createShot(channelId: string, segmentId: string, input: CreateShotInput): Promise<ShotDto> {
  const [shot] = await db.transaction((trx) => insertShots(trx, channelId, segmentId, [input]));
  if (!shot) throw new Error('shot insert returned no row');
  return shot;
}

/** Quick add: every pasted line becomes a shot, or none do. */
export async function createShotsFromText(
  channelId: string,
  segmentId: string,
  input: { text: string; assigneeId: string | null; dueDate: string | null },
): Promise<ShotDto[]> {
  const { shots, errors } = parseShotLines(input.text);
  if (errors.length > 0) {
    const message = errors.map((e) => `Line ${e.line}: ${e.message}`).join(' ');
    throw invalidInput({ text: message }, message);
  }
  if (shots.length === 0) throw invalidInput({ text: 'Paste at least one shot, one per line.' });
  if (shots.length > 100) throw invalidInput({ text: `That is ${shots.length} shots; paste at most 100 at a time.` });
  return db.transaction((trx) =>
    insertShots(
      trx,
      channelId,
      segmentId,
      shots.map((s) => ({ ...s, assigneeId: input.assigneeId, dueDate: input.dueDate, notes: '' })),
    ),
  );
}

export async function updateShot(member: Membership, shotId: string, input: UpdateShotInput): Promise<ShotDto> {
  const channelId = member.channel.id;
  return db.transaction(async (trx) => {
    const current = await findShotRow(trx, channelId, shotId, { lock: true });
    assertMayEditShot(member, { assigneeId: current.assignee_id }, input);
    await assigneeInCrewOr400(trx, channelId, input.assigneeId);
    await trx('shots')
      .where({ id: shotId })
      .update({
        ...(input.description !== undefined && { description: input.description }),
        ...(input.framing !== undefined && { framing: input.framing }),
        ...(input.camera !== undefined && { camera: input.camera }),
        ...(input.assigneeId !== undefined && { assignee_id: input.assigneeId }),
        ...(input.dueDate !== undefined && { due_date: input.dueDate }),
        ...(input.notes !== undefined && { notes: input.notes }),
        updated_at: trx.fn.now(),
      });
    // A changed due date is news to the assignee as much as a new assignment is.
    if ((input.assigneeId !== undefined && input.assigneeId !== current.assignee_id) || (input.dueDate !== undefined && input.dueDate !== current.due_date)) {
      await openBursts(trx, channelId, [current.assignee_id, input.assigneeId ?? null]);
    }
    return toShotDto(await findShotRow(trx, channelId, shotId));
  });
}

export async function deleteShot(channelId: string, shotId: string): Promise<void> {
  await db.transaction(async (trx) => {
    const current = await findShotRow(trx, channelId, shotId, { lock: true });
    await trx('shots').where({ id: shotId }).update({ deleted_at: trx.fn.now(), updated_at: trx.fn.now() });
    await openBursts(trx, channelId, [current.assignee_id]);
  });
}

export async function restoreShot(channelId: string, shotId: string): Promise<ShotDto> {
  return db.transaction(async (trx) => {
    const current = await findShotRow(trx, channelId, shotId, { deleted: true, lock: true });
    await trx('shots').where({ id: shotId }).update({ deleted_at: null, updated_at: trx.fn.now() });
    await openBursts(trx, channelId, [current.assignee_id]);
    return toShotDto(await findShotRow(trx, channelId, shotId));
  });
}

/** A copy placed right after the original, back in Planned. */
export async function duplicateShot(channelId: string, shotId: string): Promise<ShotDto> {
  return db.transaction(async (trx) => {
    const s = await findShotRow(trx, channelId, shotId);
    const [copy] = await insertShots(
      trx,
      channelId,
      s.segment_id,
      [{ framing: s.framing, camera: s.camera, description: s.description, assigneeId: s.assignee_id, dueDate: s.due_date, notes: s.notes }],
      s.position,
    );
    if (!copy) throw new Error('shot insert returned no row');
    return copy;
  });
}

/** Writes one row: the moved shot takes a key between its new neighbours in the segment. */
export async function moveShot(channelId: string, shotId: string, afterId: string | null): Promise<ShotDto> {
  if (afterId === shotId) throw invalidInput({ afterId: 'A shot cannot follow itself.' });
  return db.transaction(async (trx) => {
    const s = await findShotRow(trx, channelId, shotId);
    await lockSegment(trx, channelId, s.segment_id);
    let lower: string | null = null;
    if (afterId) {
      const after: { position: string } | undefined = await trx('shots').where({ id: afterId, segment_id: s.segment_id }).whereNull('deleted_at').first('position');
      if (!after) throw invalidInput({ afterId: 'That shot is not in this segment any more; reload the list.' });
      lower = after.position;
    }
    const next: { position: string } | undefined = await trx('shots')
      .where({ segment_id: s.segment_id })
      .whereNot({ id: shotId })
      .modify((q) => {
        if (lower !== null) q.where('position', '>', lower);
      })
      .orderBy('position')
      .first('position');
    await trx('shots').where({ id: shotId }).update({ position: generateKeyBetween(lower, next?.position ?? null), updated_at: trx.fn.now() });
    return toShotDto(await findShotRow(trx, channelId, shotId));
  });
}

async function boardKeyAfter(trx: Knex.Transaction, channelId: string, afterId: string | null, movingId: string): Promise<string> {
  let lower: string | null = null;
  if (afterId) {
    const after: { board_position: string } | undefined = await liveShotsOfChannel(trx, channelId).where('sh.id', afterId).first('sh.board_position');
    if (!after) throw invalidInput({ afterId: 'That card is not on the board any more; reload the board.' });
    lower = after.board_position;
  }
  const next: { board_position: string } | undefined = await liveShotsOfChannel(trx, channelId)
    .whereNot('sh.id', movingId)
    .modify((q) => {
      if (lower !== null) q.where('sh.board_position', '>', lower);
    })
    .orderBy('sh.board_position')
    .first('sh.board_position');
  return generateKeyBetween(lower, next?.board_position ?? null);
}

/** The safety gate reads the segment under a share lock, so a review withdrawn meanwhile is seen or waited for. */
async function awaitsSafetyReview(trx: Knex.Transaction, segmentId: string): Promise<boolean> {
  const seg: { tools: Tool[]; safety_reviewed_at: Date | null } | undefined = await trx('segments').where({ id: segmentId }).forShare().first('tools', 'safety_reviewed_at');
  return Boolean(seg && needsSafetyReview(seg.tools) && !seg.safety_reviewed_at);
}

/** Records who changed the state and when; Captured waits for the safety review of a power-tool segment. */
export async function changeShotState(member: Membership, shotId: string, input: ShotStateInput): Promise<BoardShotDto> {
  const channelId = member.channel.id;
  if (input.afterId === shotId) throw invalidInput({ afterId: 'A card cannot follow itself.' });
  return db.transaction(async (trx) => {
    // Lock first, then read: reading before the lock let 17 of 60 parallel changes vanish (issue 12).
    const s = await findShotRow(trx, channelId, shotId, { lock: true });
    const changing = s.state !== input.state || (input.state === 'retake' && input.reason !== s.retake_reason);
    if (input.state === 'captured' && s.state !== 'captured' && (await awaitsSafetyReview(trx, s.segment_id))) {
      throw conflict(`“${s.segment_title}” uses power tools and waits for a Host’s safety review before its shots can be marked Captured.`);
    }
    const update: Record<string, unknown> = {};
    if (changing) {
      Object.assign(update, {
        state: input.state,
        retake_reason: input.state === 'retake' ? input.reason : null,
        state_changed_by: member.userId,
        state_changed_at: trx.fn.now(),
      });
      await trx('shot_events').insert({ shot_id: shotId, from_state: s.state, to_state: input.state, reason: input.state === 'retake' ? input.reason : null, user_id: member.userId });
    }
    if (input.afterId !== undefined) {
      await lockShopBoard(trx, channelId);
      update.board_position = await boardKeyAfter(trx, channelId, input.afterId, shotId);
    }
    if (Object.keys(update).length > 0) await trx('shots').where({ id: shotId }).update({ ...update, updated_at: trx.fn.now() });
    return toBoardShotDto(await findShotRow(trx, channelId, shotId));
  });
}

export async function listShotEvents(channelId: string, shotId: string) {
  await findShotRow(db, channelId, shotId);
  const rows: { from_state: ShotState; to_state: ShotState; reason: string | null; name: string | null; at: Date }[] = await db('shot_events as ev')
    .leftJoin('users as u', 'u.id', 'ev.user_id')
    .where('ev.shot_id', shotId)
    .orderBy('ev.id')
    .select('ev.from_state', 'ev.to_state', 'ev.reason', 'u.name', 'ev.at');
  return rows.map((r) => ({ from: r.from_state, to: r.to_state, reason: r.reason, by: r.name, at: r.at.toISOString() }));
}

/** The shop board: live shots of the channel (or one episode), in the board's own order. */
export async function listBoardShots(channelId: string, query: BoardQuery): Promise<BoardShotDto[]> {
  const rows: BoardShotRow[] = await liveShotsOfChannel(db, channelId)
    .whereNull('e.archived_at')
    .modify((q) => {
      if (query.episodeId) q.where('e.id', query.episodeId);
      if (query.segmentId) q.where('s.id', query.segmentId);
      if (query.camera) q.where('sh.camera', query.camera);
      if (query.assigneeId === 'none') q.whereNull('sh.assignee_id');
      else if (query.assigneeId) q.where('sh.assignee_id', query.assigneeId);
    })
    .orderBy([{ column: 'sh.board_position' }, { column: 'sh.id' }])
    .select(boardColumns);
  return rows.map(toBoardShotDto);
}

/** Everything assigned to one person, by shoot date (undated last), episode, running order and shot number. */
export async function listMyShots(channelId: string, userId: string): Promise<BoardShotDto[]> {
  const rows: BoardShotRow[] = await liveShotsOfChannel(db, channelId)
    .where('sh.assignee_id', userId)
    .whereNull('e.archived_at')
    .orderByRaw('coalesce(sh.due_date, e.shoot_date) asc nulls last, e.title, e.id, s.position, sh.position')
    .select(boardColumns);
  return rows.map(toBoardShotDto);
}

/** Live shots of one episode in running order, archived or not (the shoot-day sheet prints either). */
export async function listEpisodeShots(channelId: string, episodeId: string): Promise<ShotDto[]> {
  const rows: ShotRow[] = await liveShotsOfChannel(db, channelId)
    .where('e.id', episodeId)
    .orderBy([{ column: 's.position' }, { column: 'sh.position' }])
    .select(shotColumns);
  return rows.map(toShotDto);
}
