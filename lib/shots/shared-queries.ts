import 'server-only';
import type { Knex } from 'knex';
import { db } from '@/db/client';
import type { ShotProgress } from './schemas';

// SQL of shots that other domains share (the running order, the assignment mail); no imports from other query modules, so none of them import in a circle.

/** A shot's number in its segment, counting live shots only, whatever filter the caller adds. */
export const shotNumberColumn = () =>
  db.raw('(select count(*) from shots x where x.segment_id = sh.segment_id and x.deleted_at is null and x.position <= sh.position)::int as number');

/** Every shot of a channel, deleted ones too, as `sh` with its segment `s` and episode `e`. */
export const shotsOfChannelWithDeleted = (trx: Knex | Knex.Transaction, channelId: string) =>
  trx('shots as sh').join('segments as s', 's.id', 'sh.segment_id').join('episodes as e', 'e.id', 's.episode_id').where('e.channel_id', channelId);

/** Captured, retake and total per segment of an episode, for the running order. */
export async function shotProgressForEpisode(episodeId: string, trx: Knex | Knex.Transaction = db): Promise<Record<string, ShotProgress>> {
  const rows: { segment_id: string; total: number; captured: number; retake: number }[] = await trx('shots as sh')
    .join('segments as s', 's.id', 'sh.segment_id')
    .where('s.episode_id', episodeId)
    .whereNull('sh.deleted_at')
    .groupBy('sh.segment_id')
    .select(
      'sh.segment_id',
      trx.raw('count(*)::int as total'),
      trx.raw(`count(*) filter (where sh.state = 'captured')::int as captured`),
      trx.raw(`count(*) filter (where sh.state = 'retake')::int as retake`),
    );
  return Object.fromEntries(rows.map((r) => [r.segment_id, { total: r.total, captured: r.captured, retake: r.retake }]));
}
