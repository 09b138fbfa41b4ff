import 'server-only';
import type { Knex } from 'knex';
import { db } from '@/db/client';
import type { Membership } from '@/lib/channels/queries';
import { invalidInput, notFound } from '@/lib/errors';
import { needsSafetyReview, type Tool } from './tools';
import type { PendingSafetyDto, SegmentSafetyDto, SegmentToolsInput } from './schemas';

type SafetyRow = { id: string; tools: Tool[]; other_tool: string; reviewer: string | null; safety_reviewed_at: Date | null };

const toSafetyDto = (r: SafetyRow): SegmentSafetyDto => ({
  segmentId: r.id,
  tools: r.tools,
  otherTool: r.other_tool,
  needsReview: needsSafetyReview(r.tools),
  reviewedBy: r.safety_reviewed_at ? r.reviewer : null,
  reviewedAt: r.safety_reviewed_at ? r.safety_reviewed_at.toISOString() : null,
});

async function findSafetyRow(trx: Knex | Knex.Transaction, channelId: string, segmentId: string, lock = false): Promise<SafetyRow> {
  const q = trx('segments as s')
    .join('episodes as e', 'e.id', 's.episode_id')
    .leftJoin('users as u', 'u.id', 's.safety_reviewed_by')
    .where({ 's.id': segmentId, 'e.channel_id': channelId });
  if (lock) q.forUpdate('s');
  const row: SafetyRow | undefined = await q.first('s.id', 's.tools', 's.other_tool', 'u.name as reviewer', 's.safety_reviewed_at');
  if (!row) throw notFound('That segment');
  return row;
}

export async function getSegmentSafety(channelId: string, segmentId: string): Promise<SegmentSafetyDto> {
  return toSafetyDto(await findSafetyRow(db, channelId, segmentId));
}

const sameTools = (a: readonly string[], b: readonly string[]) => a.length === b.length && a.every((t) => b.includes(t));

/** A changed tool list needs a fresh review: what was reviewed is no longer what will be used. */
export async function setSegmentTools(channelId: string, segmentId: string, input: SegmentToolsInput): Promise<SegmentSafetyDto> {
  return db.transaction(async (trx) => {
    const current = await findSafetyRow(trx, channelId, segmentId, true);
    const list = [...new Set(input.tools)];
    const otherTool = list.includes('other') ? input.otherTool : '';
    const changed = !sameTools(current.tools, list) || current.other_tool !== otherTool;
    await trx('segments')
      .where({ id: segmentId })
      .update({
        tools: JSON.stringify(list),
        other_tool: otherTool,
        ...(changed && { safety_reviewed_by: null, safety_reviewed_at: null }),
        updated_at: trx.fn.now(),
      });
    return toSafetyDto(await findSafetyRow(trx, channelId, segmentId));
  });
}

export async function setSafetyReview(member: Membership, segmentId: string, reviewed: boolean): Promise<SegmentSafetyDto> {
  return db.transaction(async (trx) => {
    const current = await findSafetyRow(trx, member.channel.id, segmentId, true);
    if (reviewed && !needsSafetyReview(current.tools)) {
      throw invalidInput({ reviewed: 'This segment lists no power tools, so there is nothing to review.' });
    }
    await trx('segments')
      .where({ id: segmentId })
      .update(reviewed ? { safety_reviewed_by: member.userId, safety_reviewed_at: trx.fn.now() } : { safety_reviewed_by: null, safety_reviewed_at: null });
    return toSafetyDto(await findSafetyRow(trx, member.channel.id, segmentId));
  });
}

/** Power-tool segments that have shots and still wait for the Host's review. */
export async function listPendingSafety(channelId: string, episodeId?: string): Promise<PendingSafetyDto[]> {
  const rows: { id: string; title: string; episode_id: string; episode_title: string; shoot_date: string | null; tools: Tool[] }[] = await db('segments as s')
    .join('episodes as e', 'e.id', 's.episode_id')
    .where('e.channel_id', channelId)
    .whereNull('e.archived_at')
    .whereNull('s.safety_reviewed_at')
    .whereExists((q) => q.select(db.raw('1')).from('shots as sh').whereRaw('sh.segment_id = s.id').whereNull('sh.deleted_at'))
    .modify((q) => {
      if (episodeId) q.where('e.id', episodeId);
    })
    .orderBy([{ column: 'e.title' }, { column: 's.position' }])
    .select('s.id', 's.title', 's.episode_id', 'e.title as episode_title', 'e.shoot_date', 's.tools');
  return rows
    .filter((r) => needsSafetyReview(r.tools))
    .map((r) => ({ segmentId: r.id, segmentTitle: r.title, episodeId: r.episode_id, episodeTitle: r.episode_title, shootDate: r.shoot_date, tools: r.tools }));
}

/** Safety of every segment of an episode, keyed by segment id, in one statement. */
export async function listEpisodeSafety(channelId: string, episodeId: string): Promise<Map<string, SegmentSafetyDto>> {
  const rows: SafetyRow[] = await db('segments as s')
    .join('episodes as e', 'e.id', 's.episode_id')
    .leftJoin('users as u', 'u.id', 's.safety_reviewed_by')
    .where({ 's.episode_id': episodeId, 'e.channel_id': channelId })
    .select('s.id', 's.tools', 's.other_tool', 'u.name as reviewer', 's.safety_reviewed_at');
  return new Map(rows.map((r) => [r.id, toSafetyDto(r)]));
}
