import 'server-only';
import type { Knex } from 'knex';
import { db } from '@/db/client';
import { invalidInput, notFound } from '@/lib/errors';
import { derivePaymentDue } from './dates';
import { dueDateKinds, type DueDateDto, type DueDateEventDto, type DueDateKind, type UpdateDueDateInput } from './schemas';

type DueRow = {
  id: string;
  deliverable_id: string;
  kind: DueDateKind;
  due_on: string | null;
  overridden: boolean;
  done_at: Date | null;
  done_by_name: string | null;
};

/** Five due dates per deliverable, created with it; history starts with the dates first set. */
export async function insertDueDates(trx: Knex.Transaction, deliverableId: string, dates: Partial<Record<DueDateKind, string | null>>, userId: string) {
  const rows: { id: string; kind: DueDateKind; due_on: string | null }[] = await trx('due_dates')
    .insert(dueDateKinds.map((kind) => ({ deliverable_id: deliverableId, kind, due_on: dates[kind] ?? null, overridden: kind === 'payment_due' && !!dates[kind] })))
    .returning(['id', 'kind', 'due_on']);
  const events = rows.filter((r) => r.due_on).map((r) => ({ due_date_id: r.id, action: 'set', due_on: r.due_on, user_id: userId }));
  if (events.length) await trx('due_date_events').insert(events);
  await refreshPaymentDue(trx, deliverableId, userId);
}

/** Payment due follows go-live or the invoice plus terms, unless set by hand; history records each move. */
export async function refreshPaymentDue(trx: Knex.Transaction, deliverableId: string, userId: string | null): Promise<void> {
  const row: { id: string; due_on: string | null; overridden: boolean; go_live: string | null; invoice_sent_on: string | null; terms: number } | undefined = await trx(
    'due_dates as p',
  )
    .join('deliverables as x', 'x.id', 'p.deliverable_id')
    .join('sponsor_deals as d', 'd.id', 'x.deal_id')
    .leftJoin('due_dates as g', function () {
      this.on('g.deliverable_id', 'x.id').andOnVal('g.kind', 'go_live');
    })
    .where({ 'p.deliverable_id': deliverableId, 'p.kind': 'payment_due' })
    .forUpdate('p')
    .first('p.id', 'p.due_on', 'p.overridden', 'g.due_on as go_live', 'd.invoice_sent_on', 'd.payment_terms_days as terms');
  if (!row || row.overridden) return;
  const derived = derivePaymentDue({ goLive: row.go_live, invoiceSentOn: row.invoice_sent_on, termsDays: row.terms });
  if (derived === row.due_on) return;
  await trx('due_dates').where({ id: row.id }).update({ due_on: derived, revision: trx.raw('revision + 1') });
  await trx('due_date_events').insert({ due_date_id: row.id, action: 'set', due_on: derived, user_id: userId });
}

/** Moves a due date or marks it done/open, under the row's lock, with one history entry per change. */
export async function updateDueDate(channelId: string, deliverableId: string, kind: DueDateKind, input: UpdateDueDateInput, userId: string): Promise<string> {
  return db.transaction(async (trx) => {
    const row: { id: string; deal_id: string; due_on: string | null; done_at: Date | null } | undefined = await trx('due_dates as g')
      .join('deliverables as x', 'x.id', 'g.deliverable_id')
      .join('sponsor_deals as d', 'd.id', 'x.deal_id')
      .where({ 'g.deliverable_id': deliverableId, 'g.kind': kind, 'd.channel_id': channelId })
      .forUpdate('g')
      .first('g.id', 'x.deal_id', 'g.due_on', 'g.done_at');
    if (!row) throw notFound('That deliverable');
    if (input.done === true && !(input.dueOn !== undefined ? input.dueOn : row.due_on)) {
      throw invalidInput({ done: 'Give the date before marking it done.' });
    }
    const events: { due_date_id: string; action: string; due_on: string | null; user_id: string }[] = [];
    const patch: Record<string, unknown> = {};
    if (input.dueOn !== undefined && input.dueOn !== row.due_on) {
      patch.due_on = input.dueOn;
      if (kind === 'payment_due') patch.overridden = input.dueOn !== null;
      events.push({ due_date_id: row.id, action: 'set', due_on: input.dueOn, user_id: userId });
    } else if (input.dueOn === null && kind === 'payment_due') {
      patch.overridden = false;
    }
    if (input.done !== undefined && input.done !== (row.done_at !== null)) {
      patch.done_at = input.done ? trx.fn.now() : null;
      patch.done_by = input.done ? userId : null;
      events.push({ due_date_id: row.id, action: input.done ? 'done' : 'reopened', due_on: (patch.due_on as string | null | undefined) ?? row.due_on, user_id: userId });
    }
    if (Object.keys(patch).length > 0) await trx('due_dates').where({ id: row.id }).update({ ...patch, revision: trx.raw('revision + 1') });
    if (events.length) await trx('due_date_events').insert(events);
    if (kind === 'go_live' || kind === 'payment_due') await refreshPaymentDue(trx, deliverableId, userId);
    return row.deal_id;
  });
}

/** Due dates with their history for a set of deliverables, keyed by deliverable. */
export async function loadDueDates(deliverableIds: readonly string[]): Promise<Map<string, DueDateDto[]>> {
  const out = new Map<string, DueDateDto[]>();
  if (deliverableIds.length === 0) return out;
  const [rows, events]: [DueRow[], { due_date_id: string; action: DueDateEventDto['action']; due_on: string | null; at: Date; by_name: string | null }[]] =
    await Promise.all([
      db('due_dates as g')
        .leftJoin('users as u', 'u.id', 'g.done_by')
        .whereIn('g.deliverable_id', deliverableIds)
        .select('g.id', 'g.deliverable_id', 'g.kind', 'g.due_on', 'g.overridden', 'g.done_at', 'u.name as done_by_name'),
      db('due_date_events as v')
        .join('due_dates as g', 'g.id', 'v.due_date_id')
        .leftJoin('users as u', 'u.id', 'v.user_id')
        .whereIn('g.deliverable_id', deliverableIds)
        .orderBy('v.id')
        .select('v.due_date_id', 'v.action', 'v.due_on', 'v.at', 'u.name as by_name'),
    ]);
  const order = (k: DueDateKind) => dueDateKinds.indexOf(k);
  for (const r of rows.sort((a, b) => order(a.kind) - order(b.kind))) {
    const list = out.get(r.deliverable_id) ?? [];
    list.push({
      kind: r.kind,
      dueOn: r.due_on,
      overridden: r.overridden,
      doneAt: r.done_at?.toISOString() ?? null,
      doneByName: r.done_by_name,
      history: events
        .filter((e) => e.due_date_id === r.id)
        .map((e) => ({ action: e.action, dueOn: e.due_on, at: e.at.toISOString(), byName: e.by_name })),
    });
    out.set(r.deliverable_id, list);
  }
  return out;
}

export type UpcomingDueDto = { dealId: string; deliverableId: string; sponsorName: string; episodeTitle: string; kind: DueDateKind; dueOn: string };

/** Open due dates of the channel up to `until` (inclusive), overdue ones first: the dashboard's list. */
export async function listOpenDueDates(channelId: string, until: string): Promise<UpcomingDueDto[]> {
  const rows: { deal_id: string; deliverable_id: string; sponsor_name: string; episode_title: string; kind: DueDateKind; due_on: string }[] = await db('due_dates as g')
    .join('deliverables as x', 'x.id', 'g.deliverable_id')
    .join('sponsor_deals as d', 'd.id', 'x.deal_id')
    .join('sponsors as sp', 'sp.id', 'd.sponsor_id')
    .join('episodes as e', 'e.id', 'x.episode_id')
    .where('d.channel_id', channelId)
    .whereNull('g.done_at')
    .whereNotNull('g.due_on')
    .where('g.due_on', '<=', until)
    .orderBy([{ column: 'g.due_on' }, { column: 'sp.name' }])
    .select('d.id as deal_id', 'x.id as deliverable_id', 'sp.name as sponsor_name', 'e.title as episode_title', 'g.kind', 'g.due_on');
  return rows.map((r) => ({ dealId: r.deal_id, deliverableId: r.deliverable_id, sponsorName: r.sponsor_name, episodeTitle: r.episode_title, kind: r.kind, dueOn: r.due_on }));
}
