import 'server-only';
import type { Knex } from 'knex';
import { db } from '@/db/client';
import { conflict, invalidInput, notFound } from '@/lib/errors';
import { dayOf } from './dates';
import { refreshPaymentDue } from './due-date-queries';
import { pipelineByMonth, type PipelineMonth } from './pipeline';
import {
  invoiceProblem,
  type CreateDealInput,
  type CreateSponsorInput,
  type DealListQuery,
  type DealRowDto,
  type DueDateKind,
  type InvoiceState,
  type SponsorContact,
  type SponsorDto,
  type SponsorWithDealsDto,
  type UpdateDealInput,
  type UpdateSponsorInput,
} from './schemas';

type SponsorRow = { id: string; name: string; contacts: unknown; notes: string };

const contactsOf = (value: unknown): SponsorContact[] =>
  Array.isArray(value) ? value.filter((c): c is SponsorContact => typeof c?.name === 'string' && typeof c?.email === 'string') : [];

export const toSponsorDto = (r: SponsorRow): SponsorDto => ({ id: r.id, name: r.name, contacts: contactsOf(r.contacts), notes: r.notes });

export async function listSponsors(channelId: string): Promise<SponsorDto[]> {
  const rows: SponsorRow[] = await db('sponsors').where({ channel_id: channelId }).orderBy('name').select('id', 'name', 'contacts', 'notes');
  return rows.map(toSponsorDto);
}

/** The channel's sponsors with how many deals each holds (a sponsor with none may be deleted). */
export async function listSponsorsWithDeals(channelId: string): Promise<SponsorWithDealsDto[]> {
  const rows: (SponsorRow & { deal_count: number })[] = await db('sponsors as s')
    .where({ 's.channel_id': channelId })
    .orderBy('s.name')
    .select('s.id', 's.name', 's.contacts', 's.notes', db.raw('(select count(*)::int from sponsor_deals d where d.sponsor_id = s.id) as deal_count'));
  return rows.map((r) => ({ ...toSponsorDto(r), dealCount: r.deal_count }));
}

const HAS_DEALS = 'This sponsor still has deals. Delete its deals first.';

/**
 * Deletes a sponsor that holds no deals. The row lock keeps a deal from being booked between the check
 * and the delete; the foreign key (no cascade, migration 20261217000000) refuses if one slipped in anyway.
 */
export async function deleteSponsor(channelId: string, sponsorId: string): Promise<void> {
  try {
    await db.transaction(async (trx) => {
      const row = await trx('sponsors').where({ id: sponsorId, channel_id: channelId }).forUpdate().first('id');
      if (!row) throw notFound('That sponsor');
      const deal = await trx('sponsor_deals').where({ sponsor_id: sponsorId }).first('id');
      if (deal) throw conflict(HAS_DEALS);
      await trx('sponsors').where({ id: sponsorId }).delete();
    });
  } catch (err) {
    // Source: PostgreSQL error codes, 23503 foreign_key_violation.
    if ((err as { code?: string }).code === '23503') throw conflict(HAS_DEALS);
    throw err;
  }
}

export async function findSponsor(channelId: string, sponsorId: string, trx: Knex | Knex.Transaction = db): Promise<SponsorDto> {
  const row: SponsorRow | undefined = await trx('sponsors').where({ id: sponsorId, channel_id: channelId }).first('id', 'name', 'contacts', 'notes');
  if (!row) throw notFound('That sponsor');
  return toSponsorDto(row);
}

export async function createSponsor(channelId: string, input: CreateSponsorInput): Promise<SponsorDto> {
  const [row] = await db('sponsors')
    .insert({ channel_id: channelId, name: input.name, contacts: JSON.stringify(input.contacts), notes: input.notes })
    .onConflict(['channel_id', 'name'])
    .ignore()
    .returning<SponsorRow[]>(['id', 'name', 'contacts', 'notes']);
  if (!row) throw invalidInput({ name: 'This channel already has a sponsor with that name.' });
  return toSponsorDto(row);
}

export async function updateSponsor(channelId: string, sponsorId: string, input: UpdateSponsorInput): Promise<SponsorDto> {
  try {
    const [row] = await db('sponsors')
      .where({ id: sponsorId, channel_id: channelId })
      .update({
        ...(input.name !== undefined && { name: input.name }),
        ...(input.contacts !== undefined && { contacts: JSON.stringify(input.contacts) }),
        ...(input.notes !== undefined && { notes: input.notes }),
        updated_at: db.fn.now(),
      })
      .returning<SponsorRow[]>(['id', 'name', 'contacts', 'notes']);
    if (!row) throw notFound('That sponsor');
    return toSponsorDto(row);
  } catch (err) {
    if ((err as { code?: string }).code === '23505') throw invalidInput({ name: 'This channel already has a sponsor with that name.' });
    throw err;
  }
}

export type DealRow = {
  id: string;
  sponsor_id: string;
  title: string;
  fee_minor: string;
  currency: string;
  payment_terms_days: number;
  invoice_state: InvoiceState;
  invoice_sent_on: string | null;
  paid_on: string | null;
  notes: string;
  created_at: Date;
};
export const dealColumns = ['d.id', 'd.sponsor_id', 'd.title', 'd.fee_minor', 'd.currency', 'd.payment_terms_days', 'd.invoice_state', 'd.invoice_sent_on', 'd.paid_on', 'd.notes', 'd.created_at'];

export async function createDeal(channelId: string, input: CreateDealInput): Promise<{ id: string }> {
  const sponsor = await db('sponsors').where({ id: input.sponsorId, channel_id: channelId }).first('id');
  if (!sponsor) throw invalidInput({ sponsorId: 'Choose a sponsor of this channel.' });
  const [row] = await insertDealOrRefuse({
      channel_id: channelId,
      sponsor_id: input.sponsorId,
      title: input.title,
      fee_minor: input.feeMinor,
      currency: input.currency,
      payment_terms_days: input.paymentTermsDays,
      invoice_state: input.invoiceState,
      invoice_sent_on: input.invoiceSentOn,
      paid_on: input.paidOn,
      notes: input.notes,
  });
  if (!row) throw new Error('deal insert returned no row');
  return row;
}

/** A sponsor deleted since the check above makes the foreign key refuse: that is the user's 400, not a 500. */
async function insertDealOrRefuse(values: Record<string, unknown>): Promise<{ id: string }[]> {
  try {
    return await db('sponsor_deals').insert(values).returning<{ id: string }[]>(['id']);
  } catch (err) {
    // Source: PostgreSQL error codes, 23503 foreign_key_violation.
    if ((err as { code?: string }).code === '23503') throw invalidInput({ sponsorId: 'Choose a sponsor of this channel.' });
    throw err;
  }
}

/** Locks the deal row: every change to a deal's terms goes through here, one at a time. */
export async function lockDeal(trx: Knex.Transaction, channelId: string, dealId: string): Promise<DealRow> {
  const row: DealRow | undefined = await trx('sponsor_deals as d').where({ 'd.id': dealId, 'd.channel_id': channelId }).forUpdate().first(dealColumns);
  if (!row) throw notFound('That deal');
  return row;
}

export async function updateDeal(channelId: string, dealId: string, input: UpdateDealInput, userId: string): Promise<void> {
  await db.transaction(async (trx) => {
    const current = await lockDeal(trx, channelId, dealId);
    const merged = {
      invoiceState: input.invoiceState ?? current.invoice_state,
      invoiceSentOn: input.invoiceSentOn !== undefined ? input.invoiceSentOn : current.invoice_sent_on,
      paidOn: input.paidOn !== undefined ? input.paidOn : current.paid_on,
    };
    const problem = invoiceProblem(merged);
    if (problem) throw invalidInput({ [problem.field]: problem.message });
    await trx('sponsor_deals')
      .where({ id: dealId })
      .update({
        ...(input.title !== undefined && { title: input.title }),
        ...(input.feeMinor !== undefined && { fee_minor: input.feeMinor }),
        ...(input.currency !== undefined && { currency: input.currency }),
        ...(input.paymentTermsDays !== undefined && { payment_terms_days: input.paymentTermsDays }),
        invoice_state: merged.invoiceState,
        invoice_sent_on: merged.invoiceSentOn,
        paid_on: merged.paidOn,
        ...(input.notes !== undefined && { notes: input.notes }),
        updated_at: trx.fn.now(),
      });
    const deliverables: { id: string }[] = await trx('deliverables').where({ deal_id: dealId }).select('id');
    for (const d of deliverables) await refreshPaymentDue(trx, d.id, userId);
  });
}

export async function deleteDeal(channelId: string, dealId: string): Promise<void> {
  const n = await db('sponsor_deals').where({ id: dealId, channel_id: channelId }).delete();
  if (n === 0) throw notFound('That deal');
}

type DealListRow = DealRow & {
  sponsor_name: string;
  episodes: { id: string; title: string }[] | null;
  next_kind: DueDateKind | null;
  next_due_on: string | null;
  next_deliverable_id: string | null;
  go_live: string | null;
};

/** The deals table: one statement, the next open due date of each deal beside it. */
export async function listDeals(channelId: string, filter: DealListQuery = {}): Promise<DealRowDto[]> {
  const rows = await dealListRows(channelId, filter);
  return rows.map((r) => ({
    id: r.id,
    title: r.title,
    sponsorId: r.sponsor_id,
    sponsorName: r.sponsor_name,
    episodes: r.episodes ?? [],
    feeMinor: Number(r.fee_minor),
    currency: r.currency,
    invoiceState: r.invoice_state,
    invoiceSentOn: r.invoice_sent_on,
    paidOn: r.paid_on,
    nextDue: r.next_kind && r.next_due_on && r.next_deliverable_id ? { kind: r.next_kind, dueOn: r.next_due_on, deliverableId: r.next_deliverable_id } : null,
  }));
}

function dealListRows(channelId: string, filter: DealListQuery): Promise<DealListRow[]> {
  return db('sponsor_deals as d')
    .join('sponsors as s', 's.id', 'd.sponsor_id')
    .where('d.channel_id', channelId)
    .modify((q) => {
      if (filter.sponsorId) q.where('d.sponsor_id', filter.sponsorId);
      if (filter.invoiceState) q.where('d.invoice_state', filter.invoiceState);
      if (filter.episodeId) q.whereExists(db('deliverables as x').whereRaw('x.deal_id = d.id').where('x.episode_id', filter.episodeId));
    })
    .orderBy([{ column: 's.name' }, { column: 'd.created_at' }])
    .select([
      ...dealColumns,
      's.name as sponsor_name',
      db.raw(`(select json_agg(distinct jsonb_build_object('id', e.id, 'title', e.title))
                 from deliverables x join episodes e on e.id = x.episode_id where x.deal_id = d.id) as episodes`),
      db.raw(`nd.kind as next_kind, nd.due_on as next_due_on, nd.deliverable_id as next_deliverable_id`),
      db.raw(`(select min(g.due_on) from due_dates g join deliverables x on x.id = g.deliverable_id
                 where x.deal_id = d.id and g.kind = 'go_live') as go_live`),
    ])
    .joinRaw(
      `left join lateral (select g.kind, g.due_on, g.deliverable_id from due_dates g join deliverables x on x.id = g.deliverable_id
         where x.deal_id = d.id and g.done_at is null and g.due_on is not null order by g.due_on, g.kind limit 1) nd on true`,
    );
}

export async function getPipeline(channelId: string, filter: Pick<DealListQuery, 'episodeId'> = {}): Promise<PipelineMonth[]> {
  const rows = await dealListRows(channelId, filter);
  return pipelineByMonth(
    rows.map((r) => ({
      feeMinor: Number(r.fee_minor),
      currency: r.currency,
      invoiceState: r.invoice_state,
      invoiceSentOn: r.invoice_sent_on,
      paidOn: r.paid_on,
      goLive: r.go_live,
      createdOn: dayOf(r.created_at),
    })),
  );
}

/** Episodes that carry at least one deliverable, for the Sponsors page's episode filter. */
export async function listSponsoredEpisodes(channelId: string): Promise<{ id: string; title: string }[]> {
  return db('episodes as e')
    .where('e.channel_id', channelId)
    .whereExists(db('deliverables as x').whereRaw('x.episode_id = e.id'))
    .orderBy([{ column: 'e.publish_date', order: 'asc', nulls: 'last' }, { column: 'e.title' }])
    .select('e.id', 'e.title');
}
