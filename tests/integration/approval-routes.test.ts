import { describe, expect, it } from 'vitest';
import * as linkRoute from '@/app/api/channels/[channel]/approval-links/[linkId]/route';
import * as dealRoute from '@/app/api/channels/[channel]/deals/[dealId]/route';
import * as runningOrderRoute from '@/app/api/channels/[channel]/episodes/[episodeId]/running-order/route';
import * as sendRoute from '@/app/api/channels/[channel]/deliverables/[deliverableId]/approval-links/route';
import * as approvalRoute from '@/app/api/approvals/[token]/route';
import { db } from '@/db/client';
import { sendApprovalLink } from '@/lib/approvals/queries';
import type { RunningOrderDto } from '@/lib/segments/schemas';
import type { DealDto } from '@/lib/sponsors/schemas';
import { call, makeCrew, uniqueEmail } from './helpers';
import { PEER_HEADER } from '@/lib/http/peer';
import { waitForMail } from '../support/mail-catcher';
import { describeRouteMatrix, type Crew, type RouteCase } from './route-matrix';
import { makeDeal, writeScript } from './sponsor-fixtures';

const ch = (c: Crew) => ({ channel: c.channel.slug });

async function linkFor(c: Crew) {
  const made = await makeDeal(c);
  const email = uniqueEmail('sponsor');
  const { link } = await sendApprovalLink(c.channel, made.deliverable.id, email, c.host);
  const [mail] = await waitForMail(email);
  const token = /\/approve\/([A-Za-z0-9_-]+)/.exec(mail!.text)?.[1];
  if (!token) throw new Error('no approval link in mail');
  return { ...made, link, token, email, mail: mail! };
}

const cases: RouteCase[] = [
  {
    name: 'POST approval link',
    fn: sendRoute.POST,
    method: 'POST',
    allowed: ['host'],
    params: async (c) => ({ ...ch(c), deliverableId: (await makeDeal(c)).deliverable.id }),
    body: () => ({ contactEmail: uniqueEmail('sponsor') }),
    badBody: { contactEmail: 'not an address' },
    okStatus: 201,
  },
  { name: 'DELETE approval link', fn: linkRoute.DELETE, method: 'DELETE', allowed: ['host'], params: async (c) => ({ ...ch(c), linkId: (await linkFor(c)).link.id }), okStatus: 204 },
];
describeRouteMatrix(cases);

const decide = (token: string, body: unknown, ip = '203.0.113.7') => call(approvalRoute.POST, 'POST', { params: { token }, body, headers: { [PEER_HEADER]: ip } });
const view = (token: string, ip = '203.0.113.7') => call(approvalRoute.GET, 'GET', { params: { token }, headers: { [PEER_HEADER]: ip } });

describe('sponsor approval link', () => {
  it('shows the read without sign-in, records the approved script version once, and flags a later change', async () => {
    const c = await makeCrew();
    const { token, read, deal, mail, episode } = await linkFor(c);
    const changedOnBoard = async (as: Crew['host']) =>
      ((await call(runningOrderRoute.GET, 'GET', { as, params: { ...ch(c), episodeId: episode.id } })).json as RunningOrderDto).changedSinceApproval;
    expect(mail.subject).toContain('Bramblewick Abrasives');
    const saved = await writeScript(c, read.id, 'This video is sponsored by Bramblewick. Use code KERF10.', read.scriptVersion);
    const shown = await view(token);
    expect(shown.status).toBe(200);
    const approval = shown.json.approval as Record<string, unknown>;
    expect(approval).toMatchObject({ status: 'open', sponsorName: 'Bramblewick Abrasives', scriptVersion: saved.version, disclosure: 'This video is sponsored by Bramblewick' });
    // Nothing else of the channel: no fee, no terms, no crew.
    expect(JSON.stringify(approval)).not.toMatch(/fee|currency|250000|@it\.kerfline/i);

    // Deciding on an older version than the current script is refused.
    expect((await decide(token, { decision: 'approved', scriptVersion: saved.version - 1 })).status).toBe(409);
    const ok = await decide(token, { decision: 'approved', scriptVersion: saved.version });
    expect(ok.status).toBe(200);
    // Reused: the link works once.
    const again = await decide(token, { decision: 'changes_requested', comment: 'Too late', scriptVersion: saved.version });
    expect(again.status).toBe(409);

    const after = (await call(dealRoute.GET, 'GET', { as: c.host, params: { ...ch(c), dealId: deal.id } })).json.deal as DealDto;
    const d = after.deliverables[0]!;
    expect(d.approval).toMatchObject({ approvedScriptVersion: saved.version, changedSinceApproval: false });
    expect(d.dueDates.find((x) => x.kind === 'approval_due')!.doneAt).not.toBeNull();
    expect(d.approvalLinks[0]).toMatchObject({ decision: 'approved', scriptVersion: saved.version });
    expect(await changedOnBoard(c.host)).toEqual([]);

    await writeScript(c, read.id, 'This video is sponsored by Bramblewick. Use code KERF10 today.', saved.version);
    const changed = (await call(dealRoute.GET, 'GET', { as: c.host, params: { ...ch(c), dealId: deal.id } })).json.deal as DealDto;
    expect(changed.deliverables[0]!.approval.changedSinceApproval).toBe(true);
    // The running order flags the read's card for who reads sponsor reads, and hides it from the shop.
    expect(await changedOnBoard(c.host)).toEqual([read.id]);
    expect(await changedOnBoard(c.editor)).toEqual([read.id]);
    expect(await changedOnBoard(c.shopHand)).toEqual([]);
  });

  it('asks for a comment with Request changes', async () => {
    const c = await makeCrew();
    const { token, read } = await linkFor(c);
    const res = await decide(token, { decision: 'changes_requested', scriptVersion: read.scriptVersion });
    expect(res.status).toBe(400);
    expect(res.json.error?.fields?.comment).toBeDefined();
    expect((await decide(token, { decision: 'changes_requested', comment: 'Say the code twice.', scriptVersion: read.scriptVersion })).status).toBe(200);
  });

  it('refuses expired and revoked links, and another channel cannot revoke', async () => {
    const c = await makeCrew();
    const expired = await linkFor(c);
    await db('approval_links').where({ id: expired.link.id }).update({ expires_at: db.raw(`now() - interval '1 minute'`) });
    expect((await view(expired.token)).status).toBe(404);
    expect((await decide(expired.token, { decision: 'approved', scriptVersion: 0 })).status).toBe(404);

    const c2 = await makeCrew();
    const revoked = await linkFor(c2);
    expect((await call(linkRoute.DELETE, 'DELETE', { as: c.host, params: { ...ch(c), linkId: revoked.link.id } })).status).toBe(404);
    expect((await call(linkRoute.DELETE, 'DELETE', { as: c2.host, params: { ...ch(c2), linkId: revoked.link.id } })).status).toBe(204);
    expect((await view(revoked.token)).status).toBe(404);
    expect((await decide(revoked.token, { decision: 'approved', scriptVersion: 0 })).status).toBe(404);
  });

  it('throttles an address that tries unknown tokens', async () => {
    const ip = `198.51.100.${Math.floor(Math.random() * 200)}`;
    for (let i = 0; i < 5; i++) expect((await view(`${'A'.repeat(42)}${i}`, ip)).status).toBe(404);
    const res = await view('B'.repeat(43), ip);
    expect(res.status).toBe(429);
    await db('rate_limits').where({ limit_key: `approval-ip:${ip}` }).delete();
  });

  it('needs a segment before a link can go', async () => {
    const c = await makeCrew();
    const { deliverable } = await makeDeal(c);
    await db('deliverables').where({ id: deliverable.id }).update({ segment_id: null });
    const res = await call(sendRoute.POST, 'POST', { as: c.host, params: { ...ch(c), deliverableId: deliverable.id }, body: { contactEmail: uniqueEmail('sponsor') } });
    expect(res.status).toBe(400);
    expect(res.json.error?.fields?.contactEmail).toBeDefined();
  });
});
