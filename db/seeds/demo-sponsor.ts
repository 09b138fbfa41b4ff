import type { Knex } from 'knex';
import { derivePaymentDue } from '../../lib/sponsors/dates';

// Invented demo sponsor (the one the demo episode's read names) and deal; the .test domain is reserved (RFC 2606).
const DUE: Record<string, string> = { script_due: '2027-01-08', approval_due: '2027-01-12', go_live: '2027-02-04', report_due: '2027-02-18' };

export async function seedDemoSponsor(trx: Knex.Transaction, channelId: string): Promise<void> {
  const read: { id: string; episode_id: string } | undefined = await trx('segments as s')
    .join('episodes as e', 'e.id', 's.episode_id')
    .where({ 'e.channel_id': channelId, 's.kind': 'sponsor_read' })
    .first('s.id', 's.episode_id');
  if (!read) return;
  const host: { user_id: string } | undefined = await trx('memberships').where({ channel_id: channelId, role: 'host' }).first('user_id');
  const [sponsor] = await trx('sponsors')
    .insert({ channel_id: channelId, name: 'Brightgrain Abrasives', contacts: JSON.stringify([{ name: 'Odile Marchetti', email: 'odile@brightgrain.test' }]), notes: 'Invented demo sponsor.' })
    .returning<{ id: string }[]>('id');
  if (!sponsor) throw new Error('demo sponsor insert returned no row');
  const [deal] = await trx('sponsor_deals')
    .insert({ channel_id: channelId, sponsor_id: sponsor.id, title: 'Mesh discs read, stool episode', fee_minor: 180_000, currency: 'USD', payment_terms_days: 30 })
    .returning<{ id: string }[]>('id');
  if (!deal) throw new Error('demo deal insert returned no row');
  const talkingPoints = {
    type: 'doc',
    content: [
      { type: 'paragraph', content: [{ type: 'text', text: 'Mesh discs let dust through to the extractor, so they do not clog.' }] },
      { type: 'paragraph', content: [{ type: 'text', text: 'Starter pack: every grit from 80 to 320.' }] },
    ],
  };
  const [deliverable] = await trx('deliverables')
    .insert({
      deal_id: deal.id,
      episode_id: read.episode_id,
      segment_id: read.id,
      kind: 'segment_read',
      talking_points: JSON.stringify(talkingPoints),
      must_say: JSON.stringify(['starter pack', 'every grit from eighty to three twenty']),
      disclosure: 'This video is sponsored by Brightgrain Abrasives',
      tracking: 'https://brightgrain.test/tallowmere',
      read_min_seconds: 30,
      read_max_seconds: 90,
      placement_kind: 'within_percent',
      placement_value: 60,
      owner_id: host?.user_id ?? null,
    })
    .returning<{ id: string }[]>('id');
  if (!deliverable) throw new Error('demo deliverable insert returned no row');
  const payment = derivePaymentDue({ goLive: DUE.go_live ?? null, invoiceSentOn: null, termsDays: 30 });
  const rows = ['script_due', 'approval_due', 'go_live', 'report_due', 'payment_due'].map((kind) => ({
    deliverable_id: deliverable.id,
    kind,
    due_on: kind === 'payment_due' ? payment : (DUE[kind] ?? null),
  }));
  const inserted: { id: string; due_on: string | null }[] = await trx('due_dates').insert(rows).returning(['id', 'due_on']);
  await trx('due_date_events').insert(inserted.map((r) => ({ due_date_id: r.id, action: 'set', due_on: r.due_on, user_id: host?.user_id ?? null })));
}
