import type { Knex } from 'knex';
import type { SnapshotDeliverable } from './snapshot';

/**
 * The sponsor deliverables of an episode for its handoff snapshot. Sponsor deals and deliverables come
 * with issue 13 (tables sponsor_deal / deliverable); until that lands on this branch an episode has
 * none, so this answers []. At merge, replace the body with issue 13's query (one statement) and map
 * each deliverable to SnapshotDeliverable; `startOf` gives a segment's forecast start in seconds.
 */
export async function listSnapshotDeliverables(
  _trx: Knex.Transaction,
  _episodeId: string,
  _startOf: (segmentId: string) => number | null,
): Promise<SnapshotDeliverable[]> {
  return [];
}
