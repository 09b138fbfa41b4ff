import 'server-only';
import type { Knex } from 'knex';
import { db } from '@/db/client';
import type { EditStage } from '@/lib/edit/stages';
import { invalidInput, notFound } from '@/lib/errors';
import { isFrameRateId } from '@/lib/timecode';
import { DEFAULT_LEVEL_LABELS, type CreateEpisodeInput, type EpisodeDto, type EpisodeStage, type EpisodeSummaryDto, type UpdateEpisodeInput } from './schemas';

export type EpisodeRow = {
  id: string;
  channel_id: string;
  title: string;
  premise: string;
  stage: EpisodeStage;
  target_seconds: number | null;
  shoot_date: string | null;
  publish_date: string | null;
  level_labels: unknown;
  archived_at: Date | null;
  updated_at: Date;
  frame_rate: string;
  edit_stage: EditStage | null;
};

const episodeColumns = ['e.id', 'e.channel_id', 'e.title', 'e.premise', 'e.stage', 'e.target_seconds', 'e.shoot_date', 'e.publish_date', 'e.level_labels', 'e.archived_at', 'e.updated_at', 'e.frame_rate', 'e.edit_stage'];

function levelLabelsOf(value: unknown): [string, string, string] {
  const v = Array.isArray(value) ? value : [];
  return [0, 1, 2].map((i) => (typeof v[i] === 'string' ? (v[i] as string) : DEFAULT_LEVEL_LABELS[i]!)) as [string, string, string];
}

export const toEpisodeDto = (r: EpisodeRow): EpisodeDto => ({
  id: r.id,
  title: r.title,
  premise: r.premise,
  stage: r.stage,
  targetSeconds: r.target_seconds,
  shootDate: r.shoot_date,
  publishDate: r.publish_date,
  levelLabels: levelLabelsOf(r.level_labels),
  archived: r.archived_at !== null,
  updatedAt: r.updated_at.toISOString(),
  frameRate: isFrameRateId(r.frame_rate) ? r.frame_rate : '29.97df',
  editStage: r.edit_stage,
});

export async function listEpisodes(
  channelId: string,
  wordsPerMinute: number,
  filter: { stage?: EpisodeStage; archived?: boolean } = {},
): Promise<EpisodeSummaryDto[]> {
  // Spoken seconds are rounded per segment, as lib/runtime does, so the list and the board agree.
  const rows: (EpisodeRow & { segment_count: string; forecast_seconds: string | null })[] = await db('episodes as e')
    .leftJoin('segments as s', 's.episode_id', 'e.id')
    .where('e.channel_id', channelId)
    .modify((q) => {
      if (filter.stage) q.where('e.stage', filter.stage);
      if (filter.archived === true) q.whereNotNull('e.archived_at');
      if (filter.archived === false) q.whereNull('e.archived_at');
    })
    .groupBy('e.id')
    .orderBy([{ column: 'e.publish_date', order: 'asc', nulls: 'last' }, { column: 'e.created_at', order: 'desc' }])
    .select([
      ...episodeColumns,
      db.raw('count(s.id) as segment_count'),
      db.raw('coalesce(sum(round(s.word_count * 60.0 / ?) + s.action_seconds), 0) as forecast_seconds', [wordsPerMinute]),
    ]);
  return rows.map((r) => ({ ...toEpisodeDto(r), segmentCount: Number(r.segment_count), forecastSeconds: Number(r.forecast_seconds ?? 0) }));
}

export async function findEpisode(channelId: string, episodeId: string, trx: Knex | Knex.Transaction = db): Promise<EpisodeDto> {
  const row: EpisodeRow | undefined = await trx('episodes as e').where({ 'e.id': episodeId, 'e.channel_id': channelId }).first(episodeColumns);
  if (!row) throw notFound('That episode');
  return toEpisodeDto(row);
}

/** Takes the episode's row lock: every change to its running order goes through here, one at a time. */
export async function lockEpisode(trx: Knex.Transaction, channelId: string, episodeId: string): Promise<void> {
  const row = await trx('episodes').where({ id: episodeId, channel_id: channelId }).forUpdate().first('id');
  if (!row) throw notFound('That episode');
}

const toColumns = (input: Partial<UpdateEpisodeInput>) => ({
  ...(input.title !== undefined && { title: input.title }),
  ...(input.premise !== undefined && { premise: input.premise }),
  ...(input.stage !== undefined && { stage: input.stage }),
  ...(input.targetSeconds !== undefined && { target_seconds: input.targetSeconds }),
  ...(input.shootDate !== undefined && { shoot_date: input.shootDate }),
  ...(input.publishDate !== undefined && { publish_date: input.publishDate }),
  ...(input.levelLabels !== undefined && { level_labels: JSON.stringify(input.levelLabels) }),
  ...(input.archived !== undefined && { archived_at: input.archived ? db.fn.now() : null }),
  ...(input.frameRate !== undefined && { frame_rate: input.frameRate }),
});

export async function createEpisode(channelId: string, input: CreateEpisodeInput): Promise<EpisodeDto> {
  const [row] = await db('episodes')
    .insert({ channel_id: channelId, ...toColumns(input) })
    .returning<EpisodeRow[]>('*');
  if (!row) throw new Error('episode insert returned no row');
  return toEpisodeDto(row);
}

export async function updateEpisode(channelId: string, episodeId: string, input: UpdateEpisodeInput): Promise<EpisodeDto> {
  return db.transaction(async (trx) => {
    // Locked before reading, so a parallel edit of the other date is seen (the CHECK constraint
    // episodes_shoot_not_after_publish holds the same rule in the database).
    await lockEpisode(trx, channelId, episodeId);
    const current = await findEpisode(channelId, episodeId, trx);
    const shoot = input.shootDate !== undefined ? input.shootDate : current.shootDate;
    const publish = input.publishDate !== undefined ? input.publishDate : current.publishDate;
    if (shoot && publish && shoot > publish) {
      throw invalidInput({ publishDate: 'The publish date comes after the shoot date.' });
    }
    const [row] = await trx('episodes')
      .where({ id: episodeId, channel_id: channelId })
      .update({ ...toColumns(input), updated_at: trx.fn.now() })
      .returning<EpisodeRow[]>('*');
    if (!row) throw notFound('That episode');
    return toEpisodeDto(row);
  });
}

export async function deleteEpisode(channelId: string, episodeId: string): Promise<void> {
  await db.transaction(async (trx) => {
    await lockEpisode(trx, channelId, episodeId);
    await trx('segments').where({ episode_id: episodeId }).delete();
    await trx('episodes').where({ id: episodeId, channel_id: channelId }).delete();
  });
}
