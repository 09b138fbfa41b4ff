import 'server-only';
import type { Knex } from 'knex';
import { formatDuration } from '@/lib/runtime';
import { plainTextOf } from '@/lib/scripts/plain-text';
import type { ScriptDoc } from '@/lib/scripts/schemas';
import type { SnapshotDeliverable } from './snapshot';

type Row = {
  id: string;
  sponsor_name: string;
  segment_id: string | null;
  talking_points: ScriptDoc | null;
  must_say: unknown;
  disclosure: string;
  placement_kind: 'starts_before' | 'within_percent' | null;
  placement_value: number | null;
};

/** The placement rule in the words the deal page uses. */
function placementRule(r: Row): string {
  if (r.placement_kind === 'starts_before' && r.placement_value !== null) return `starts before ${formatDuration(r.placement_value)}`;
  if (r.placement_kind === 'within_percent' && r.placement_value !== null) return `within the first ${r.placement_value} %`;
  return 'none';
}

/**
 * The sponsor deliverables of an episode for its handoff snapshot, in one statement inside the lock's
 * transaction: what the Editor may read (no fee or terms). Talking points become their plain lines,
 * followed by each must-say phrase; `startOf` gives a segment's forecast start in seconds.
 */
export async function listSnapshotDeliverables(
  trx: Knex.Transaction,
  episodeId: string,
  startOf: (segmentId: string) => number | null,
): Promise<SnapshotDeliverable[]> {
  const rows: Row[] = await trx('deliverables as x')
    .join('sponsor_deals as d', 'd.id', 'x.deal_id')
    .join('sponsors as sp', 'sp.id', 'd.sponsor_id')
    .where('x.episode_id', episodeId)
    .orderBy('x.created_at')
    .orderBy('x.id')
    .select('x.id', 'sp.name as sponsor_name', 'x.segment_id', 'x.talking_points', 'x.must_say', 'x.disclosure', 'x.placement_kind', 'x.placement_value');
  return rows.map((r) => {
    const points = r.talking_points ? plainTextOf(r.talking_points).split('\n').map((l) => l.trim()).filter(Boolean) : [];
    const mustSay = Array.isArray(r.must_say) ? r.must_say.filter((s): s is string => typeof s === 'string' && s.trim() !== '') : [];
    return {
      id: r.id,
      sponsorName: r.sponsor_name,
      segmentId: r.segment_id,
      talkingPoints: [...points, ...mustSay.map((s) => `Must say: “${s}”`)],
      disclosure: r.disclosure,
      placementRule: placementRule(r),
      forecastStartSeconds: r.segment_id ? startOf(r.segment_id) : null,
    };
  });
}
