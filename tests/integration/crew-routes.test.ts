import { describe, expect, it } from 'vitest';
import * as channelRoute from '@/app/api/channels/[channel]/route';
import * as crewRoute from '@/app/api/channels/[channel]/crew/route';
import * as memberRoute from '@/app/api/channels/[channel]/crew/[userId]/route';
import * as invitationRoute from '@/app/api/channels/[channel]/invitations/[invitationId]/route';
import * as resendRoute from '@/app/api/channels/[channel]/invitations/[invitationId]/resend/route';
import * as invitationsRoute from '@/app/api/channels/[channel]/invitations/route';
import * as channelsRoute from '@/app/api/channels/route';
import { createInvitation } from '@/lib/crew/queries';
import { addMember, call, makeCrew, makeUser, uniqueEmail } from './helpers';
import { describeRouteMatrix, type Crew, type RouteCase } from './route-matrix';

const invitationOf = async (c: Crew) => (await createInvitation(c.channel.id, c.host.id, { email: uniqueEmail('inv'), role: 'editor' })).invitation.id;

const channelCases: RouteCase[] = [
  { name: 'GET channel', fn: channelRoute.GET, method: 'GET', allowed: ['host', 'shop_hand', 'editor'], params: (c) => ({ channel: c.channel.slug }), okStatus: 200 },
  {
    name: 'PATCH channel settings',
    fn: channelRoute.PATCH,
    method: 'PATCH',
    allowed: ['host'],
    params: (c) => ({ channel: c.channel.slug }),
    body: () => ({ speakingRateWpm: 160 }),
    badBody: { speakingRateWpm: 'fast' },
    okStatus: 200,
  },
  { name: 'GET crew', fn: crewRoute.GET, method: 'GET', allowed: ['host', 'shop_hand', 'editor'], params: (c) => ({ channel: c.channel.slug }), okStatus: 200 },
  {
    name: 'PATCH crew role',
    fn: memberRoute.PATCH,
    method: 'PATCH',
    allowed: ['host'],
    params: (c) => ({ channel: c.channel.slug, userId: c.shopHand.id }),
    body: () => ({ role: 'editor' }),
    badBody: { role: 'foreman' },
    okStatus: 200,
  },
  { name: 'DELETE crew member', fn: memberRoute.DELETE, method: 'DELETE', allowed: ['host'], params: (c) => ({ channel: c.channel.slug, userId: c.editor.id }), okStatus: 204 },
  { name: 'GET invitations', fn: invitationsRoute.GET, method: 'GET', allowed: ['host'], params: (c) => ({ channel: c.channel.slug }), okStatus: 200 },
  {
    name: 'POST invitation',
    fn: invitationsRoute.POST,
    method: 'POST',
    allowed: ['host'],
    params: (c) => ({ channel: c.channel.slug }),
    body: () => ({ email: uniqueEmail('invitee'), role: 'shop_hand' }),
    badBody: { email: 'not an address', role: 'shop_hand' },
    okStatus: 201,
  },
  {
    name: 'DELETE invitation',
    fn: invitationRoute.DELETE,
    method: 'DELETE',
    allowed: ['host'],
    params: async (c) => ({ channel: c.channel.slug, invitationId: await invitationOf(c) }),
    okStatus: 204,
  },
  {
    name: 'POST invitation resend',
    fn: resendRoute.POST,
    method: 'POST',
    allowed: ['host'],
    params: async (c) => ({ channel: c.channel.slug, invitationId: await invitationOf(c) }),
    okStatus: 200,
  },
];

describeRouteMatrix(channelCases);

describe('channels list and create', () => {
  it('401 signed out, lists only my channels, creates one with me as Host, 400 on a bad name', async () => {
    expect((await call(channelsRoute.GET, 'GET')).status).toBe(401);
    const c = await makeCrew();
    await makeCrew();
    const list = await call(channelsRoute.GET, 'GET', { as: c.editor });
    expect(list.json.channels).toEqual([expect.objectContaining({ slug: c.channel.slug, role: 'editor' })]);
    const made = await call(channelsRoute.POST, 'POST', { as: c.editor, body: { name: 'Second Shop' } });
    expect(made.status).toBe(201);
    const after = await call(channelsRoute.GET, 'GET', { as: c.editor });
    expect(after.json.channels).toHaveLength(2);
    const bad = await call(channelsRoute.POST, 'POST', { as: c.editor, body: { name: ' ' } });
    expect(bad.status).toBe(400);
    expect(bad.json.error?.fields?.name).toBeTruthy();
  });
});

describe('the last Host', () => {
  it('cannot be demoted or removed', async () => {
    const c = await makeCrew();
    const params = { channel: c.channel.slug, userId: c.host.id };
    const demote = await call(memberRoute.PATCH, 'PATCH', { as: c.host, params, body: { role: 'editor' } });
    expect(demote.status).toBe(409);
    expect(demote.json.error?.message).toMatch(/at least one Host/);
    expect((await call(memberRoute.DELETE, 'DELETE', { as: c.host, params })).status).toBe(409);
  });

  it('two Hosts demoting each other at once leaves exactly one Host', async () => {
    const c = await makeCrew();
    const second = await makeUser('cohost');
    await addMember(c.channel, second, 'host');
    const [a, b] = await Promise.all([
      call(memberRoute.PATCH, 'PATCH', { as: c.host, params: { channel: c.channel.slug, userId: second.id }, body: { role: 'shop_hand' } }),
      call(memberRoute.PATCH, 'PATCH', { as: second, params: { channel: c.channel.slug, userId: c.host.id }, body: { role: 'shop_hand' } }),
    ]);
    const statuses = [a.status, b.status].sort();
    // One demotion wins; the other either finds itself no longer a Host (403) or hits the last-host rule (409).
    expect(statuses[0]).toBe(200);
    expect([403, 409]).toContain(statuses[1]);
    const crew = await call(crewRoute.GET, 'GET', { as: c.editor, params: { channel: c.channel.slug } });
    const hosts = (crew.json.crew as { role: string }[]).filter((m) => m.role === 'host');
    expect(hosts).toHaveLength(1);
  });

  it('can hand over: make another Host, then step down', async () => {
    const c = await makeCrew();
    const promote = await call(memberRoute.PATCH, 'PATCH', { as: c.host, params: { channel: c.channel.slug, userId: c.shopHand.id }, body: { role: 'host' } });
    expect(promote.status).toBe(200);
    const stepDown = await call(memberRoute.PATCH, 'PATCH', { as: c.host, params: { channel: c.channel.slug, userId: c.host.id }, body: { role: 'editor' } });
    expect(stepDown.status).toBe(200);
    expect(stepDown.json.member).toMatchObject({ role: 'editor' });
  });
});

describe('malformed requests', () => {
  it('415 for a non-JSON body, 400 for broken JSON, 413 for a huge body, 404 for a malformed id', async () => {
    const c = await makeCrew();
    const params = { channel: c.channel.slug };
    const form = await call(invitationsRoute.POST, 'POST', { as: c.host, params, rawBody: 'email=a', headers: { 'content-type': 'application/x-www-form-urlencoded' } });
    expect(form.status).toBe(415);
    const broken = await call(invitationsRoute.POST, 'POST', { as: c.host, params, rawBody: '{"email":', headers: { 'content-type': 'application/json' } });
    expect(broken.status).toBe(400);
    expect(broken.json.error?.code).toBe('malformed_json');
    const huge = await call(invitationsRoute.POST, 'POST', { as: c.host, params, body: { email: 'a@b.co', role: 'editor', pad: 'x'.repeat(200_000) } });
    expect(huge.status).toBe(413);
    const badId = await call(memberRoute.PATCH, 'PATCH', { as: c.host, params: { channel: c.channel.slug, userId: 'not-a-uuid' }, body: { role: 'editor' } });
    expect(badId.status).toBe(404);
  });
});
