import 'server-only';
import type { Knex } from 'knex';
import { db } from '@/db/client';
import { invalidInput, notFound } from '@/lib/errors';
import { forecastEpisode } from '@/lib/runtime';
import type { ScriptDoc } from '@/lib/scripts/schemas';
import { listApprovalLinks } from '@/lib/approvals/queries';
import { checkDeliverable, type CheckResult } from '@/lib/sponsor-checks';
import { insertDueDates, loadDueDates, refreshPaymentDue } from './due-date-queries';
import { dealColumns, lockDeal, toSponsorDto, type DealRow } from './queries';
import {
  spokenKinds,
  type CreateDeliverableInput,
  type DealDto,
  type DeliverableDto,
  type DeliverableKind,
  type EditorDeliverableDto,
  type UpdateDeliverableInput,
} from './schemas';

type DeliverableRow = {
  id: string;
  deal_id: string;
  episode_id: string;
  episode_title: string;
  segment_id: string | null;
  segment_title: string | null;
  kind: DeliverableKind;
  talking_points: ScriptDoc | null;
  must_say: unknown;
  disclosure: string;
  tracking: string;
  read_min_seconds: number | null;
  read_max_seconds: number | null;
  placement_kind: 'starts_before' | 'within_percent' | null;
  placement_value: number | null;
  owner_id: string | null;
  sponsor_name: string;
  approved_script_version: number | null;
  approved_at: Date | null;
  segment_script_version: number | null;
};

const deliverableColumns = [
  'x.id',
  'x.deal_id',
  'x.episode_id',
  'e.title as episode_title',
  'x.segment_id',
  's.title as segment_title',
  'x.kind',
  'x.talking_points',
  'x.must_say',
  'x.disclosure',
  'x.tracking',
  'x.read_min_seconds',
  'x.read_max_seconds',
  'x.placement_kind',
  'x.placement_value',
  'x.owner_id',
  'sp.name as sponsor_name',
  'x.approved_script_version',
  'x.approved_at',
  's.script_version as segment_script_version',
];

/** Approved at one script version, and the read's script has been saved since. */
const changedSinceApproval = (r: DeliverableRow) =>
  r.approved_script_version !== null && r.segment_script_version !== null && r.segment_script_version !== r.approved_script_version;

function deliverablesQuery(channelId: string) {
  return db('deliverables as x')
    .join('sponsor_deals as d', 'd.id', 'x.deal_id')
    .join('sponsors as sp', 'sp.id', 'd.sponsor_id')
    .join('episodes as e', 'e.id', 'x.episode_id')
    .leftJoin('segments as s', 's.id', 'x.segment_id')
    .where('d.channel_id', channelId)
    .orderBy([{ column: 'e.publish_date', order: 'asc', nulls: 'last' }, { column: 'x.created_at' }]);
}

const stringsOf = (v: unknown): string[] => (Array.isArray(v) ? v.filter((s): s is string => typeof s === 'string') : []);

const placementOf = (r: DeliverableRow): DeliverableDto['placement'] =>
  r.placement_kind === 'starts_before' && r.placement_value !== null
    ? { kind: 'starts_before', seconds: r.placement_value }
    : r.placement_kind === 'within_percent' && r.placement_value !== null
      ? { kind: 'within_percent', percent: r.placement_value }
      : null;

type EpisodeForecastInfo = { totalSeconds: number; segments: Map<string, { startSeconds: number; totalSeconds: number; scriptText: string }> };

/** The same forecast the board shows (lib/runtime), for each episode named. */
async function forecastsFor(episodeIds: readonly string[], wordsPerMinute: number): Promise<Map<string, EpisodeForecastInfo>> {
  const out = new Map<string, EpisodeForecastInfo>();
  if (episodeIds.length === 0) return out;
  const rows: { id: string; episode_id: string; word_count: number; action_seconds: number; script_text: string }[] = await db('segments')
    .whereIn('episode_id', [...new Set(episodeIds)])
    .orderBy(['episode_id', 'position'])
    .select('id', 'episode_id', 'word_count', 'action_seconds', 'script_text');
  for (const episodeId of new Set(episodeIds)) {
    const mine = rows.filter((r) => r.episode_id === episodeId);
    const f = forecastEpisode(mine.map((r) => ({ id: r.id, wordCount: r.word_count, actionSeconds: r.action_seconds })), wordsPerMinute);
    const segments = new Map(f.segments.map((s, i) => [s.id, { startSeconds: s.startSeconds, totalSeconds: s.totalSeconds, scriptText: mine[i]?.script_text ?? '' }]));
    out.set(episodeId, { totalSeconds: f.totalSeconds, segments });
  }
  return out;
}

function checksFor(r: DeliverableRow, forecasts: Map<string, EpisodeForecastInfo>, wordsPerMinute: number): CheckResult[] | null {
  if (!spokenKinds.includes(r.kind)) return null;
  const f = forecasts.get(r.episode_id);
  const read = r.segment_id ? (f?.segments.get(r.segment_id) ?? null) : null;
  return checkDeliverable({
    read,
    episodeSeconds: f?.totalSeconds ?? 0,
    wordsPerMinute,
    placement: placementOf(r),
    range: { minSeconds: r.read_min_seconds, maxSeconds: r.read_max_seconds },
    mustSay: stringsOf(r.must_say),
    disclosure: r.disclosure,
  });
}

async function toDeliverableDtos(rows: DeliverableRow[], wordsPerMinute: number): Promise<DeliverableDto[]> {
  const ids = rows.map((r) => r.id);
  const [dueDates, forecasts, links] = await Promise.all([loadDueDates(ids), forecastsFor(rows.map((r) => r.episode_id), wordsPerMinute), listApprovalLinks(ids)]);
  return rows.map((r) => ({
    id: r.id,
    dealId: r.deal_id,
    episodeId: r.episode_id,
    episodeTitle: r.episode_title,
    segmentId: r.segment_id,
    segmentTitle: r.segment_title,
    kind: r.kind,
    talkingPoints: r.talking_points,
    mustSay: stringsOf(r.must_say),
    disclosure: r.disclosure,
    tracking: r.tracking,
    readMinSeconds: r.read_min_seconds,
    readMaxSeconds: r.read_max_seconds,
    placement: placementOf(r),
    ownerId: r.owner_id,
    dueDates: dueDates.get(r.id) ?? [],
    checks: checksFor(r, forecasts, wordsPerMinute),
    approval: { approvedScriptVersion: r.approved_script_version, approvedAt: r.approved_at?.toISOString() ?? null, changedSinceApproval: changedSinceApproval(r) },
    approvalLinks: links.get(r.id) ?? [],
  }));
}

export async function findDeal(channelId: string, dealId: string, wordsPerMinute: number): Promise<DealDto> {
  const row: (DealRow & { s_id: string; s_name: string; s_contacts: unknown; s_notes: string }) | undefined = await db('sponsor_deals as d')
    .join('sponsors as s', 's.id', 'd.sponsor_id')
    .where({ 'd.id': dealId, 'd.channel_id': channelId })
    .first([...dealColumns, 's.id as s_id', 's.name as s_name', 's.contacts as s_contacts', 's.notes as s_notes']);
  if (!row) throw notFound('That deal');
  const rows: DeliverableRow[] = await deliverablesQuery(channelId).where('x.deal_id', dealId).select(deliverableColumns);
  return {
    id: row.id,
    sponsor: toSponsorDto({ id: row.s_id, name: row.s_name, contacts: row.s_contacts, notes: row.s_notes }),
    title: row.title,
    feeMinor: Number(row.fee_minor),
    currency: row.currency,
    paymentTermsDays: row.payment_terms_days,
    invoiceState: row.invoice_state,
    invoiceSentOn: row.invoice_sent_on,
    paidOn: row.paid_on,
    notes: row.notes,
    deliverables: await toDeliverableDtos(rows, wordsPerMinute),
  };
}

/** The deliverables whose read is this segment, with their live checks (segment page). */
export async function listSegmentDeliverables(channelId: string, segmentId: string, wordsPerMinute: number): Promise<DeliverableDto[]> {
  const rows: DeliverableRow[] = await deliverablesQuery(channelId).where('x.segment_id', segmentId).select(deliverableColumns);
  return toDeliverableDtos(rows, wordsPerMinute);
}

const toEditorDto = (r: DeliverableRow): EditorDeliverableDto => ({
  id: r.id,
  sponsorName: r.sponsor_name,
  episodeId: r.episode_id,
  episodeTitle: r.episode_title,
  segmentId: r.segment_id,
  segmentTitle: r.segment_title,
  kind: r.kind,
  talkingPoints: r.talking_points,
  disclosure: r.disclosure,
  changedSinceApproval: changedSinceApproval(r),
});

/**
 * An episode's sponsor deliverables as the Editor may read them (talking points and disclosure,
 * no fee or terms). The editor handoff reads this.
 */
export async function listEpisodeDeliverables(channelId: string, episodeId: string): Promise<EditorDeliverableDto[]> {
  const episode = await db('episodes').where({ id: episodeId, channel_id: channelId }).first('id');
  if (!episode) throw notFound('That episode');
  const rows: DeliverableRow[] = await deliverablesQuery(channelId).where('x.episode_id', episodeId).select(deliverableColumns);
  return rows.map(toEditorDto);
}

export async function listChannelDeliverablesForEditor(channelId: string): Promise<EditorDeliverableDto[]> {
  const rows: DeliverableRow[] = await deliverablesQuery(channelId).whereNull('e.archived_at').select(deliverableColumns);
  return rows.map(toEditorDto);
}

/** Episode, segment and owner must belong to the channel (and the segment to the episode). */
async function checkReferences(trx: Knex.Transaction, channelId: string, v: { episodeId: string; segmentId: string | null; ownerId: string | null }) {
  const episode = await trx('episodes').where({ id: v.episodeId, channel_id: channelId }).first('id');
  if (!episode) throw invalidInput({ episodeId: 'Choose an episode of this channel.' });
  if (v.segmentId) {
    const segment = await trx('segments').where({ id: v.segmentId, episode_id: v.episodeId }).first('id');
    if (!segment) throw invalidInput({ segmentId: 'Choose a segment of that episode.' });
  }
  if (v.ownerId) {
    const member = await trx('memberships').where({ channel_id: channelId, user_id: v.ownerId }).first('user_id');
    if (!member) throw invalidInput({ ownerId: 'Choose someone of this channel’s crew.' });
  }
}

const toColumns = (v: Partial<CreateDeliverableInput>) => ({
  ...(v.episodeId !== undefined && { episode_id: v.episodeId }),
  ...(v.segmentId !== undefined && { segment_id: v.segmentId }),
  ...(v.kind !== undefined && { kind: v.kind }),
  ...(v.talkingPoints !== undefined && { talking_points: v.talkingPoints === null ? null : JSON.stringify(v.talkingPoints) }),
  ...(v.mustSay !== undefined && { must_say: JSON.stringify(v.mustSay) }),
  ...(v.disclosure !== undefined && { disclosure: v.disclosure }),
  ...(v.tracking !== undefined && { tracking: v.tracking }),
  ...(v.readMinSeconds !== undefined && { read_min_seconds: v.readMinSeconds }),
  ...(v.readMaxSeconds !== undefined && { read_max_seconds: v.readMaxSeconds }),
  ...(v.placement !== undefined && {
    placement_kind: v.placement?.kind ?? null,
    placement_value: v.placement === null ? null : v.placement.kind === 'starts_before' ? v.placement.seconds : v.placement.percent,
  }),
  ...(v.ownerId !== undefined && { owner_id: v.ownerId }),
});

export async function createDeliverable(channelId: string, dealId: string, input: CreateDeliverableInput, userId: string): Promise<{ id: string }> {
  return db.transaction(async (trx) => {
    await lockDeal(trx, channelId, dealId);
    await checkReferences(trx, channelId, input);
    const [row] = await trx('deliverables')
      .insert({ deal_id: dealId, ...toColumns(input) })
      .returning<{ id: string }[]>(['id']);
    if (!row) throw new Error('deliverable insert returned no row');
    await insertDueDates(trx, row.id, input.dueDates, userId);
    return row;
  });
}

async function lockDeliverable(trx: Knex.Transaction, channelId: string, deliverableId: string) {
  const row: { id: string; deal_id: string; episode_id: string; segment_id: string | null; owner_id: string | null; read_min_seconds: number | null; read_max_seconds: number | null } | undefined =
    await trx('deliverables as x')
      .join('sponsor_deals as d', 'd.id', 'x.deal_id')
      .where({ 'x.id': deliverableId, 'd.channel_id': channelId })
      .forUpdate('x')
      .first('x.id', 'x.deal_id', 'x.episode_id', 'x.segment_id', 'x.owner_id', 'x.read_min_seconds', 'x.read_max_seconds');
  if (!row) throw notFound('That deliverable');
  return row;
}

/** Returns the deal's id, so the caller can answer with the whole deal. */
export async function updateDeliverable(channelId: string, deliverableId: string, input: UpdateDeliverableInput, userId: string): Promise<string> {
  return db.transaction(async (trx) => {
    const current = await lockDeliverable(trx, channelId, deliverableId);
    const episodeId = input.episodeId ?? current.episode_id;
    // Moving to another episode drops a segment of the old one unless a new one is named.
    const segmentId = input.segmentId !== undefined ? input.segmentId : episodeId === current.episode_id ? current.segment_id : null;
    await checkReferences(trx, channelId, { episodeId, segmentId, ownerId: input.ownerId !== undefined ? input.ownerId : null });
    const min = input.readMinSeconds !== undefined ? input.readMinSeconds : current.read_min_seconds;
    const max = input.readMaxSeconds !== undefined ? input.readMaxSeconds : current.read_max_seconds;
    if (min !== null && max !== null && min > max) throw invalidInput({ readMaxSeconds: 'The longest read is at least the shortest.' });
    await trx('deliverables')
      .where({ id: deliverableId })
      .update({ ...toColumns({ ...input, segmentId }), updated_at: trx.fn.now() });
    await refreshPaymentDue(trx, deliverableId, userId);
    return current.deal_id;
  });
}

export async function deleteDeliverable(channelId: string, deliverableId: string): Promise<void> {
  await db.transaction(async (trx) => {
    await lockDeliverable(trx, channelId, deliverableId);
    await trx('deliverables').where({ id: deliverableId }).delete();
  });
}

/** Episodes that are not archived, with their segments in running order, for the deliverable form. */
export async function listEpisodeChoices(channelId: string): Promise<{ id: string; title: string; segments: { id: string; title: string; kind: string }[] }[]> {
  const rows: { episode_id: string; episode_title: string; id: string | null; title: string | null; kind: string | null }[] = await db('episodes as e')
    .leftJoin('segments as s', 's.episode_id', 'e.id')
    .where('e.channel_id', channelId)
    .whereNull('e.archived_at')
    .orderBy([{ column: 'e.publish_date', order: 'asc', nulls: 'last' }, { column: 'e.created_at', order: 'desc' }, { column: 's.position' }])
    .select('e.id as episode_id', 'e.title as episode_title', 's.id', 's.title', 's.kind');
  const out = new Map<string, { id: string; title: string; segments: { id: string; title: string; kind: string }[] }>();
  for (const r of rows) {
    const e = out.get(r.episode_id) ?? { id: r.episode_id, title: r.episode_title, segments: [] };
    if (r.id && r.title && r.kind) e.segments.push({ id: r.id, title: r.title, kind: r.kind });
    out.set(r.episode_id, e);
  }
  return [...out.values()];
}

/** Approved at one script version, and the read's script saved since: the SQL twin of `changedSinceApproval`. */
const onlyChangedSinceApproval = (q: Knex.QueryBuilder) =>
  q.whereNotNull('x.approved_script_version').whereNotNull('x.segment_id').whereRaw('s.script_version is distinct from x.approved_script_version');

/** Deliverables whose read changed after the sponsor approved it (dashboard). */
export async function listChangedSinceApproval(channelId: string): Promise<(EditorDeliverableDto & { dealId: string })[]> {
  const rows: DeliverableRow[] = await deliverablesQuery(channelId).modify(onlyChangedSinceApproval).select(deliverableColumns);
  return rows.map((r) => ({ ...toEditorDto(r), dealId: r.deal_id }));
}

/** The segments of one episode whose sponsor read changed since approval (running order), in one statement. */
export async function listChangedReadSegmentIds(channelId: string, episodeId: string): Promise<string[]> {
  const rows: { segment_id: string }[] = await deliverablesQuery(channelId)
    .clearOrder()
    .where('x.episode_id', episodeId)
    .modify(onlyChangedSinceApproval)
    .distinct('x.segment_id');
  return rows.map((r) => r.segment_id);
}
