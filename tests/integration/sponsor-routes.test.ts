import { describe, expect, it } from 'vitest';
import * as dealRoute from '@/app/api/channels/[channel]/deals/[dealId]/route';
import * as deliverablesRoute from '@/app/api/channels/[channel]/deals/[dealId]/deliverables/route';
import * as dealsRoute from '@/app/api/channels/[channel]/deals/route';
import * as dueDateRoute from '@/app/api/channels/[channel]/deliverables/[deliverableId]/due-dates/[kind]/route';
import * as deliverableRoute from '@/app/api/channels/[channel]/deliverables/[deliverableId]/route';
import * as episodeDeliverablesRoute from '@/app/api/channels/[channel]/episodes/[episodeId]/deliverables/route';
import * as sponsorRoute from '@/app/api/channels/[channel]/sponsors/[sponsorId]/route';
import * as sponsorsRoute from '@/app/api/channels/[channel]/sponsors/route';
import { db } from '@/db/client';
import { createSponsor } from '@/lib/sponsors/queries';
import type { DealDto, DealRowDto } from '@/lib/sponsors/schemas';
import { makeOutlinedEpisode } from './episode-fixtures';
import { call, makeCrew } from './helpers';
import { describeRouteMatrix, type Crew, type RouteCase } from './route-matrix';
import { makeDeal, writeScript } from './sponsor-fixtures';

const ch = (c: Crew) => ({ channel: c.channel.slug });
// What params() made for a crew, for body() to name (params runs first).
const made = new Map<string, string>();
const sponsorBody = { name: 'Quillfern Tools', contacts: [{ name: 'Tam Reyes', email: 'tam@quillfern.test' }] };

const cases: RouteCase[] = [
  { name: 'GET sponsors', fn: sponsorsRoute.GET, method: 'GET', allowed: ['host'], params: ch, okStatus: 200 },
  {
    name: 'POST sponsor',
    fn: sponsorsRoute.POST,
    method: 'POST',
    allowed: ['host'],
    params: ch,
    body: () => sponsorBody,
    badBody: { name: ' ', contacts: [{ name: 'X', email: 'not-mail' }] },
    okStatus: 201,
  },
  {
    name: 'PATCH sponsor',
    fn: sponsorRoute.PATCH,
    method: 'PATCH',
    allowed: ['host'],
    params: async (c) => ({ ...ch(c), sponsorId: (await createSponsor(c.channel.id, { ...sponsorBody, notes: '' })).id }),
    body: () => ({ notes: 'Prefers e-mail' }),
    badBody: { name: '', notes: 7 },
    okStatus: 200,
  },
  {
    name: 'DELETE sponsor without deals',
    fn: sponsorRoute.DELETE,
    method: 'DELETE',
    allowed: ['host'],
    params: async (c) => ({ ...ch(c), sponsorId: (await createSponsor(c.channel.id, { ...sponsorBody, name: `Gone ${Math.random()}`, notes: '' })).id }),
    okStatus: 204,
  },
  { name: 'GET deals', fn: dealsRoute.GET, method: 'GET', allowed: ['host'], params: ch, okStatus: 200 },
  {
    name: 'POST deal',
    fn: dealsRoute.POST,
    method: 'POST',
    allowed: ['host'],
    params: async (c) => {
      made.set(c.channel.id, (await createSponsor(c.channel.id, { ...sponsorBody, notes: '' })).id);
      return ch(c);
    },
    body: (c) => ({ sponsorId: made.get(c.channel.id), title: 'Router bit read', feeMinor: 120_000, currency: 'JPY' }),
    badBody: { sponsorId: 'nope', title: '', feeMinor: 1.5, currency: 'usd', invoiceState: 'paid' },
    okStatus: 201,
  },
  { name: 'GET deal', fn: dealRoute.GET, method: 'GET', allowed: ['host'], params: async (c) => ({ ...ch(c), dealId: (await makeDeal(c)).deal.id }), okStatus: 200 },
  {
    name: 'PATCH deal',
    fn: dealRoute.PATCH,
    method: 'PATCH',
    allowed: ['host'],
    params: async (c) => ({ ...ch(c), dealId: (await makeDeal(c)).deal.id }),
    body: () => ({ invoiceState: 'sent', invoiceSentOn: '2027-03-21' }),
    badBody: { feeMinor: -1, currency: 'XXQ', invoiceSentOn: '2027-02-30' },
    okStatus: 200,
  },
  { name: 'DELETE deal', fn: dealRoute.DELETE, method: 'DELETE', allowed: ['host'], params: async (c) => ({ ...ch(c), dealId: (await makeDeal(c)).deal.id }), okStatus: 204 },
  {
    name: 'POST deliverable',
    fn: deliverablesRoute.POST,
    method: 'POST',
    allowed: ['host'],
    params: async (c) => {
      const { deal, episode } = await makeDeal(c);
      made.set(c.channel.id, episode.id);
      return { ...ch(c), dealId: deal.id };
    },
    body: (c) => ({ episodeId: made.get(c.channel.id), kind: 'description_link', tracking: 'https://bramblewick.test/kerf' }),
    badBody: { episodeId: 'x', kind: 'billboard', readMinSeconds: '9:99', placement: { kind: 'within_percent', percent: 0 } },
    okStatus: 201,
  },
  {
    name: 'PATCH deliverable',
    fn: deliverableRoute.PATCH,
    method: 'PATCH',
    allowed: ['host'],
    params: async (c) => ({ ...ch(c), deliverableId: (await makeDeal(c)).deliverable.id }),
    body: () => ({ mustSay: ['code KERF10', 'free shipping'] }),
    badBody: { mustSay: [''], readMinSeconds: 90, readMaxSeconds: 60 },
    okStatus: 200,
  },
  {
    name: 'DELETE deliverable',
    fn: deliverableRoute.DELETE,
    method: 'DELETE',
    allowed: ['host'],
    params: async (c) => ({ ...ch(c), deliverableId: (await makeDeal(c)).deliverable.id }),
    okStatus: 204,
  },
  {
    name: 'PATCH due date',
    fn: dueDateRoute.PATCH,
    method: 'PATCH',
    allowed: ['host'],
    params: async (c) => ({ ...ch(c), deliverableId: (await makeDeal(c)).deliverable.id, kind: 'script_due' }),
    body: () => ({ done: true }),
    badBody: { dueOn: 'soon', done: 'yes' },
    okStatus: 200,
  },
  {
    name: 'GET episode deliverables (Editor view)',
    fn: episodeDeliverablesRoute.GET,
    method: 'GET',
    allowed: ['host', 'editor'],
    params: async (c) => ({ ...ch(c), episodeId: (await makeDeal(c)).episode.id }),
    okStatus: 200,
  },
];

describeRouteMatrix(cases);

describe('sponsor deals', () => {
  it('creates a sponsor, a deal and a read with due dates, and derives payment due from go-live and terms', async () => {
    const c = await makeCrew();
    const { episode, segments } = await makeOutlinedEpisode(c);
    const read = segments.find((s) => s.kind === 'sponsor_read')!;
    const sponsor = await call(sponsorsRoute.POST, 'POST', { as: c.host, params: ch(c), body: sponsorBody });
    expect(sponsor.status).toBe(201);
    const sponsorId = (sponsor.json.sponsor as { id: string }).id;
    const dup = await call(sponsorsRoute.POST, 'POST', { as: c.host, params: ch(c), body: sponsorBody });
    expect(dup.status).toBe(400);
    expect(dup.json.error?.fields?.name).toBeDefined();

    const dealRes = await call(dealsRoute.POST, 'POST', {
      as: c.host,
      params: ch(c),
      body: { sponsorId, title: 'Router bit read', feeMinor: 180_000, currency: 'EUR', paymentTermsDays: 45 },
    });
    expect(dealRes.status).toBe(201);
    const dealId = (dealRes.json.deal as DealDto).id;

    const withRead = await call(deliverablesRoute.POST, 'POST', {
      as: c.host,
      params: { ...ch(c), dealId },
      body: {
        episodeId: episode.id,
        segmentId: read.id,
        kind: 'segment_read',
        mustSay: ['Quillfern'],
        disclosure: 'Quillfern sponsors this video',
        readMinSeconds: '1:00',
        readMaxSeconds: '1:30',
        placement: { kind: 'starts_before', seconds: '3:00' },
        dueDates: { go_live: '2027-04-01', approval_due: '2027-03-20' },
      },
    });
    expect(withRead.status, JSON.stringify(withRead.json)).toBe(201);
    const deal = withRead.json.deal as DealDto;
    const d = deal.deliverables[0]!;
    expect(d.readMinSeconds).toBe(60);
    expect(d.placement).toEqual({ kind: 'starts_before', seconds: 180 });
    const due = Object.fromEntries(d.dueDates.map((x) => [x.kind, x.dueOn]));
    expect(due).toEqual({ script_due: null, approval_due: '2027-03-20', go_live: '2027-04-01', report_due: null, payment_due: '2027-05-16' });

    // Sending the invoice moves payment due to invoice date + terms; a hand-set date sticks.
    const invoiced = await call(dealRoute.PATCH, 'PATCH', { as: c.host, params: { ...ch(c), dealId }, body: { invoiceState: 'sent', invoiceSentOn: '2027-04-03' } });
    expect((invoiced.json.deal as DealDto).deliverables[0]!.dueDates.find((x) => x.kind === 'payment_due')!.dueOn).toBe('2027-05-18');
    const set = await call(dueDateRoute.PATCH, 'PATCH', { as: c.host, params: { ...ch(c), deliverableId: d.id, kind: 'payment_due' }, body: { dueOn: '2027-06-01' } });
    const pay = (set.json.deal as DealDto).deliverables[0]!.dueDates.find((x) => x.kind === 'payment_due')!;
    expect(pay).toMatchObject({ dueOn: '2027-06-01', overridden: true });
    expect(pay.history.map((h) => h.dueOn)).toEqual(['2027-05-16', '2027-05-18', '2027-06-01']);
    await call(dealRoute.PATCH, 'PATCH', { as: c.host, params: { ...ch(c), dealId }, body: { paymentTermsDays: 10 } });
    const after = await call(dealRoute.GET, 'GET', { as: c.host, params: { ...ch(c), dealId } });
    expect((after.json.deal as DealDto).deliverables[0]!.dueDates.find((x) => x.kind === 'payment_due')!.dueOn).toBe('2027-06-01');
  });

  it('refuses an invoice state without its dates, and a segment of another episode', async () => {
    const c = await makeCrew();
    const { deal, deliverable } = await makeDeal(c);
    const paid = await call(dealRoute.PATCH, 'PATCH', { as: c.host, params: { ...ch(c), dealId: deal.id }, body: { invoiceState: 'paid' } });
    expect(paid.status).toBe(400);
    expect(paid.json.error?.fields?.invoiceSentOn).toBeDefined();
    const other = await makeOutlinedEpisode(c);
    const moved = await call(deliverableRoute.PATCH, 'PATCH', {
      as: c.host,
      params: { ...ch(c), deliverableId: deliverable.id },
      body: { segmentId: other.segments[0]!.id },
    });
    expect(moved.status).toBe(400);
    expect(moved.json.error?.fields?.segmentId).toBeDefined();
    const unknownSponsor = await call(dealsRoute.POST, 'POST', { as: c.host, params: ch(c), body: { sponsorId: '00000000-0000-4000-8000-000000000000', title: 'x', feeMinor: 1, currency: 'USD' } });
    expect(unknownSponsor.json.error?.fields?.sponsorId).toBeDefined();
  });

  it('marks a due date done by whom, reopens it, and keeps the history', async () => {
    const c = await makeCrew();
    const { deal, deliverable } = await makeDeal(c);
    const params = { ...ch(c), deliverableId: deliverable.id, kind: 'script_due' };
    await call(dueDateRoute.PATCH, 'PATCH', { as: c.host, params, body: { done: true } });
    const reopened = await call(dueDateRoute.PATCH, 'PATCH', { as: c.host, params, body: { done: false } });
    const due = (reopened.json.deal as DealDto).deliverables[0]!.dueDates.find((x) => x.kind === 'script_due')!;
    expect(due.doneAt).toBeNull();
    expect(due.history.map((h) => [h.action, h.byName])).toEqual([
      ['set', c.host.name],
      ['done', c.host.name],
      ['reopened', c.host.name],
    ]);
    const noDate = await call(dueDateRoute.PATCH, 'PATCH', { as: c.host, params: { ...params, kind: 'report_due' }, body: { done: true } });
    expect(noDate.status).toBe(400);
    expect(deal.id).toBeTruthy();
  });

  it('lists deals with their next due date, filters them, and totals the pipeline per month and currency', async () => {
    const c = await makeCrew();
    const { deal, sponsor } = await makeDeal(c);
    const res = await call(dealsRoute.GET, 'GET', { as: c.host, params: ch(c) });
    const rows = res.json.deals as DealRowDto[];
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({ id: deal.id, sponsorName: sponsor.name, feeMinor: 250_000, currency: 'USD', nextDue: { kind: 'script_due', dueOn: '2027-03-01' } });
    expect(res.json.pipeline).toEqual([{ month: '2027-03', currency: 'USD', bookedMinor: 250_000, invoicedMinor: 0, paidMinor: 0 }]);
    const filtered = await call(dealsRoute.GET, 'GET', { as: c.host, params: ch(c), path: '/api/test?invoiceState=paid' });
    expect(filtered.json.deals).toEqual([]);
    const bad = await call(dealsRoute.GET, 'GET', { as: c.host, params: ch(c), path: '/api/test?invoiceState=owed' });
    expect(bad.status).toBe(400);

    // The episode filter narrows both the deals and the pipeline.
    const { deal: other } = await makeDeal(c, 'Grubwood Finishes');
    const all = await call(dealsRoute.GET, 'GET', { as: c.host, params: ch(c) });
    expect((all.json.deals as DealRowDto[]).map((d) => d.id).sort()).toEqual([deal.id, other.id].sort());
    expect(all.json.pipeline).toEqual([{ month: '2027-03', currency: 'USD', bookedMinor: 500_000, invoicedMinor: 0, paidMinor: 0 }]);
    const episodeId = (rows[0]!.episodes[0] as { id: string }).id;
    const one = await call(dealsRoute.GET, 'GET', { as: c.host, params: ch(c), path: `/api/test?episodeId=${episodeId}` });
    expect((one.json.deals as DealRowDto[]).map((d) => d.id)).toEqual([deal.id]);
    expect(one.json.pipeline).toEqual([{ month: '2027-03', currency: 'USD', bookedMinor: 250_000, invoicedMinor: 0, paidMinor: 0 }]);
    const badEpisode = await call(dealsRoute.GET, 'GET', { as: c.host, params: ch(c), path: '/api/test?episodeId=nope' });
    expect(badEpisode.json.error?.fields).toEqual({ episodeId: 'Not an episode.' });
  });

  it('deletes a sponsor only when it holds no deals, and edits its name, contacts and notes', async () => {
    const c = await makeCrew();
    const { sponsor, deal } = await makeDeal(c);
    const params = { ...ch(c), sponsorId: sponsor.id };
    const edited = await call(sponsorRoute.PATCH, 'PATCH', {
      as: c.host,
      params,
      body: { name: 'Bramblewick Abrasives Ltd', contacts: [{ name: 'Ines Okafor', email: 'ines@bramblewick.test' }, { name: 'Dov Marsh', email: 'dov@bramblewick.test' }], notes: 'Net 45 preferred' },
    });
    expect(edited.status).toBe(200);
    expect(edited.json.sponsor).toMatchObject({ name: 'Bramblewick Abrasives Ltd', notes: 'Net 45 preferred', contacts: [{ name: 'Ines Okafor' }, { name: 'Dov Marsh' }] });
    const badContact = await call(sponsorRoute.PATCH, 'PATCH', { as: c.host, params, body: { contacts: [{ name: 'Dov', email: 'not mail' }] } });
    expect(Object.keys(badContact.json.error?.fields ?? {})).toEqual(['contacts.0.email']);

    const refused = await call(sponsorRoute.DELETE, 'DELETE', { as: c.host, params });
    expect(refused.status).toBe(409);
    expect(await db('sponsor_deals').where({ id: deal.id }).first('id')).toBeDefined();
    // The database refuses too, whatever the app checked: no cascade takes the deals with the sponsor.
    await expect(db('sponsors').where({ id: sponsor.id }).delete()).rejects.toMatchObject({ code: '23503' });

    expect((await call(dealRoute.DELETE, 'DELETE', { as: c.host, params: { ...ch(c), dealId: deal.id } })).status).toBe(204);
    expect((await call(sponsorRoute.DELETE, 'DELETE', { as: c.host, params })).status).toBe(204);
    expect((await call(sponsorRoute.DELETE, 'DELETE', { as: c.host, params })).status).toBe(404);
  });

  it('checks the read live against the script and the forecast', async () => {
    const c = await makeCrew();
    const { deal, read } = await makeDeal(c);
    const before = await call(dealRoute.GET, 'GET', { as: c.host, params: { ...ch(c), dealId: deal.id } });
    const checks = () => (before.json.deal as DealDto).deliverables[0]!.checks!;
    expect(checks().find((x) => x.name === 'disclosure')!.status).toBe('fail');
    await writeScript(c, read.id, 'This video is sponsored by Bramblewick. Use code KERF10 at checkout for ten percent off.', read.scriptVersion);
    const after = await call(dealRoute.GET, 'GET', { as: c.host, params: { ...ch(c), dealId: deal.id } });
    const byName = Object.fromEntries((after.json.deal as DealDto).deliverables[0]!.checks!.map((x) => [x.name, x.status]));
    // The read is the only segment with words, so it runs 6 s (15 words at 150 wpm) and starts at 00:00.
    expect(byName).toEqual({ placement: 'pass', length: 'pass', mustSay: 'pass', disclosure: 'pass' });
  });

  it('shows the Editor talking points and disclosure but never a fee', async () => {
    const c = await makeCrew();
    const { episode } = await makeDeal(c);
    const res = await call(episodeDeliverablesRoute.GET, 'GET', { as: c.editor, params: { ...ch(c), episodeId: episode.id } });
    expect(res.status).toBe(200);
    const [d] = res.json.deliverables as Record<string, unknown>[];
    expect(d).toMatchObject({ disclosure: 'This video is sponsored by Bramblewick', sponsorName: 'Bramblewick Abrasives' });
    expect(JSON.stringify(res.json)).not.toMatch(/fee|250000|currency|payment/i);
    const shop = await call(dealsRoute.GET, 'GET', { as: c.shopHand, params: ch(c) });
    expect(shop.status).toBe(403);
  });
});
