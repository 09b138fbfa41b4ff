import 'server-only';
import { generateKeyBetween } from 'fractional-indexing';
import type { Knex } from 'knex';
import { db } from '@/db/client';
import { can } from '@/lib/auth/policy';
import type { Membership } from '@/lib/channels/queries';
import { findEpisode, lockEpisode } from '@/lib/episodes/queries';
import { threeLevelBuild } from '@/lib/episodes/starter';
import { invalidInput, notFound } from '@/lib/errors';
import { forecastEpisode } from '@/lib/runtime';
import { shotProgressForEpisode } from '@/lib/shots/shared-queries';
import { listChangedReadSegmentIds } from '@/lib/sponsors/deliverable-queries';
import type { RunningOrderDto, CreateSegmentInput, Level, SegmentDto, SegmentKind, UpdateSegmentInput } from './schemas';

type SegmentRow = {
  id: string;
  episode_id: string;
  position: string;
  kind: SegmentKind;
  level: number | null;
  title: string;
  word_count: number;
  action_seconds: number;
  script_version: number;
  has_script: boolean;
};

const segmentColumns = [
  's.id',
  's.episode_id',
  's.position',
  's.kind',
  's.level',
  's.title',
  's.word_count',
  's.action_seconds',
  's.script_version',
  db.raw('(s.script is not null and s.word_count > 0) as has_script'),
];

const toSegmentDto = (r: SegmentRow): SegmentDto => ({
  id: r.id,
  episodeId: r.episode_id,
  position: r.position,
  kind: r.kind,
  level: (r.level as Level | null) ?? null,
  title: r.title,
  hasScript: r.has_script,
  wordCount: r.word_count,
  actionSeconds: r.action_seconds,
  scriptVersion: r.script_version,
});

/** The whole running order in four statements, however many segments the episode has. */
export async function getRunningOrder(member: Membership, episodeId: string): Promise<RunningOrderDto> {
  // The episode lookup is the channel check; the other two only run once it passed.
  const episode = await findEpisode(member.channel.id, episodeId);
  const [rows, shotProgress, changed]: [SegmentRow[], RunningOrderDto['shotProgress'], string[]] = await Promise.all([
    db('segments as s').where('s.episode_id', episodeId).orderBy('s.position').select(segmentColumns),
    shotProgressForEpisode(episodeId),
    // Approval state is sponsor business: only who reads sponsor reads sees it on the cards.
    can(member.role, 'sponsors.readDisclosure') ? listChangedReadSegmentIds(member.channel.id, episodeId) : Promise.resolve([]),
  ]);
  const segments = rows.map(toSegmentDto);
  const wpm = member.channel.speakingRateWpm;
  return {
    episode,
    segments,
    forecast: forecastEpisode(segments.map((s) => ({ id: s.id, wordCount: s.wordCount, actionSeconds: s.actionSeconds })), wpm),
    speakingRateWpm: wpm,
    canEdit: can(member.role, 'episodes.edit'),
    shotProgress,
    changedSinceApproval: changed,
  };
}

async function findSegmentRow(trx: Knex | Knex.Transaction, channelId: string, segmentId: string, lock = false): Promise<SegmentRow> {
  const q = trx('segments as s').join('episodes as e', 'e.id', 's.episode_id').where({ 's.id': segmentId, 'e.channel_id': channelId });
  if (lock) q.forUpdate('s');
  const row: SegmentRow | undefined = await q.first(segmentColumns);
  if (!row) throw notFound('That segment');
  return row;
}

export async function findSegment(channelId: string, segmentId: string): Promise<SegmentDto> {
  return toSegmentDto(await findSegmentRow(db, channelId, segmentId));
}

/** The key that puts a segment just after `afterId` (or first when null), ignoring `movingId` itself. */
async function keyAfter(trx: Knex.Transaction, episodeId: string, afterId: string | null, movingId?: string): Promise<string> {
  let lower: string | null = null;
  if (afterId) {
    const after: { position: string } | undefined = await trx('segments').where({ id: afterId, episode_id: episodeId }).first('position');
    if (!after) throw invalidInput({ afterId: 'That segment is not in this episode any more; reload the running order.' });
    lower = after.position;
  }
  const next: { position: string } | undefined = await trx('segments')
    .where({ episode_id: episodeId })
    .modify((q) => {
      if (lower !== null) q.where('position', '>', lower);
      if (movingId) q.whereNot({ id: movingId });
    })
    .orderBy('position')
    .first('position');
  return generateKeyBetween(lower, next?.position ?? null);
}

async function lastKey(trx: Knex.Transaction, episodeId: string): Promise<string | null> {
  const last: { position: string } | undefined = await trx('segments').where({ episode_id: episodeId }).orderBy('position', 'desc').first('position');
  return last?.position ?? null;
}

export async function insertSegments(
  trx: Knex.Transaction,
  episodeId: string,
  items: { title: string; kind: SegmentKind; level: Level | null; actionSeconds?: number }[],
): Promise<SegmentDto[]> {
  let key = await lastKey(trx, episodeId);
  const rows = items.map((item) => {
    key = generateKeyBetween(key, null);
    return { episode_id: episodeId, position: key, title: item.title, kind: item.kind, level: item.level, action_seconds: item.actionSeconds ?? 0 };
  });
  if (rows.length === 0) return [];
  const inserted = await trx('segments').insert(rows).returning<{ id: string }[]>('id');
  const ids = inserted.map((r) => r.id);
  const full: SegmentRow[] = await trx('segments as s').whereIn('s.id', ids).orderBy('s.position').select(segmentColumns);
  return full.map(toSegmentDto);
}

export async function createSegment(channelId: string, episodeId: string, input: CreateSegmentInput): Promise<SegmentDto> {
  return db.transaction(async (trx) => {
    await lockEpisode(trx, channelId, episodeId);
    if (input.afterId === undefined) {
      const [segment] = await insertSegments(trx, episodeId, [{ title: input.title, kind: input.kind, level: input.level }]);
      if (!segment) throw new Error('segment insert returned no row');
      return segment;
    }
    const position = await keyAfter(trx, episodeId, input.afterId);
    const [row] = await trx('segments')
      .insert({ episode_id: episodeId, position, title: input.title, kind: input.kind, level: input.level })
      .returning<{ id: string }[]>('id');
    if (!row) throw new Error('segment insert returned no row');
    return toSegmentDto(await findSegmentRow(trx, channelId, row.id));
  });
}

export async function updateSegment(channelId: string, segmentId: string, input: UpdateSegmentInput): Promise<SegmentDto> {
  return db.transaction(async (trx) => {
    // Kind and level are written from what was read, so the row is locked first (issue 12).
    const current = await findSegmentRow(trx, channelId, segmentId, true);
    const kind = input.kind ?? current.kind;
    // Leaving Build drops the level; giving a level to anything else is a mistake worth saying.
    let level = input.level !== undefined ? input.level : kind === 'build' ? current.level : null;
    if (kind !== 'build' && input.level != null) throw invalidInput({ level: 'Only a Build segment has a level.' });
    if (kind !== 'build') level = null;
    await trx('segments')
      .where({ id: segmentId })
      .update({
        ...(input.title !== undefined && { title: input.title }),
        ...(input.actionSeconds !== undefined && { action_seconds: input.actionSeconds }),
        kind,
        level,
        updated_at: trx.fn.now(),
      });
    return toSegmentDto(await findSegmentRow(trx, channelId, segmentId));
  });
}

export async function deleteSegment(channelId: string, segmentId: string): Promise<void> {
  const segment = await findSegmentRow(db, channelId, segmentId);
  await db('segments').where({ id: segment.id }).delete();
}

/** Writes exactly one row: the moved segment gets a key between its new neighbours. */
export async function moveSegment(channelId: string, segmentId: string, afterId: string | null): Promise<SegmentDto> {
  if (afterId === segmentId) throw invalidInput({ afterId: 'A segment cannot follow itself.' });
  return db.transaction(async (trx) => {
    const segment = await findSegmentRow(trx, channelId, segmentId);
    await lockEpisode(trx, channelId, segment.episode_id);
    const position = await keyAfter(trx, segment.episode_id, afterId, segmentId);
    const count = await trx('segments').where({ id: segmentId }).update({ position, updated_at: trx.fn.now() });
    if (count === 0) throw notFound('That segment');
    return toSegmentDto({ ...segment, position });
  });
}

export async function addThreeLevelBuild(channelId: string, episodeId: string): Promise<SegmentDto[]> {
  return db.transaction(async (trx) => {
    await lockEpisode(trx, channelId, episodeId);
    const episode = await findEpisode(channelId, episodeId, trx);
    return insertSegments(trx, episodeId, threeLevelBuild(episode.levelLabels));
  });
}
