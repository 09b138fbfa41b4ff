import { describe, expect, it } from 'vitest';
import { POST as acceptRoute } from '@/app/api/invitations/[token]/accept/route';
import { GET as lookupRoute } from '@/app/api/invitations/[token]/route';
import { POST as resendRoute } from '@/app/api/channels/[channel]/invitations/[invitationId]/resend/route';
import { DELETE as revokeRoute } from '@/app/api/channels/[channel]/invitations/[invitationId]/route';
import { POST as inviteRoute } from '@/app/api/channels/[channel]/invitations/route';
import { db } from '@/db/client';
import { authorizeCredentials } from '@/lib/auth/sign-in';
import { invitationTokenFrom, waitForMail } from '../support/mail-catcher';
import { call, makeCrew, makeUser, PASSWORD, uniqueEmail } from './helpers';

async function invite(email: string, role = 'shop_hand') {
  const crew = await makeCrew();
  const res = await call(inviteRoute, 'POST', { as: crew.host, params: { channel: crew.channel.slug }, body: { email, role } });
  expect(res.status).toBe(201);
  expect(res.json.delivered).toBe(true);
  const [mail] = await waitForMail(email);
  if (!mail) throw new Error('no mail');
  return { ...crew, mail, token: invitationTokenFrom(mail), invitationId: (res.json.invitation as { id: string }).id };
}

describe('invitations', () => {
  it('mails a link that a new person uses to set a name and password and join with the invited role', async () => {
    const email = uniqueEmail('newbie');
    const { mail, token, channel, host } = await invite(email, 'editor');
    expect(mail.subject).toContain(channel.name);
    expect(mail.text).toContain(host.name);
    expect(mail.text).toContain(`/invite/${token}`);

    const lookup = await call(lookupRoute, 'GET', { params: { token } });
    expect(lookup.json.invitation).toMatchObject({ status: 'open', email, role: 'editor', accountExists: false });

    const res = await call(acceptRoute, 'POST', { params: { token }, body: { name: 'New Person', password: PASSWORD } });
    expect(res.status).toBe(200);
    expect(res.json.accepted).toMatchObject({ channelSlug: channel.slug, role: 'editor' });
    const user = await authorizeCredentials({ email, password: PASSWORD }, '127.0.0.2');
    expect(user?.name).toBe('New Person');
    const membership = await db('memberships').where({ channel_id: channel.id, user_id: user?.id }).first();
    expect(membership?.role).toBe('editor');
  });

  it('lets an existing user who is signed in as the invited address join', async () => {
    const existing = await makeUser('existing');
    const { token, channel } = await invite(existing.email, 'shop_hand');
    const lookup = await call(lookupRoute, 'GET', { params: { token } });
    expect(lookup.json.invitation).toMatchObject({ accountExists: true });

    expect((await call(acceptRoute, 'POST', { params: { token }, body: {} })).status).toBe(401);
    const stranger = await makeUser('stranger');
    expect((await call(acceptRoute, 'POST', { params: { token }, body: {}, as: stranger })).status).toBe(403);
    const res = await call(acceptRoute, 'POST', { params: { token }, body: {}, as: existing });
    expect(res.status).toBe(200);
    const membership = await db('memberships').where({ channel_id: channel.id, user_id: existing.id }).first();
    expect(membership?.role).toBe('shop_hand');
  });

  it('refuses to create an account over an existing one', async () => {
    const existing = await makeUser('taken');
    const { token } = await invite(existing.email);
    const res = await call(acceptRoute, 'POST', { params: { token }, body: { name: 'Impostor', password: PASSWORD } });
    expect(res.status).toBe(409);
  });

  it('says clearly when a link was already used, revoked or has expired', async () => {
    const used = await invite(uniqueEmail('used'));
    await call(acceptRoute, 'POST', { params: { token: used.token }, body: { name: 'Once', password: PASSWORD } });
    const again = await call(acceptRoute, 'POST', { params: { token: used.token }, body: { name: 'Twice', password: PASSWORD } });
    expect(again.status).toBe(409);
    expect(again.json.error?.message).toMatch(/already been used/);
    expect((await call(lookupRoute, 'GET', { params: { token: used.token } })).json.invitation).toMatchObject({ status: 'accepted' });

    const revoked = await invite(uniqueEmail('revoked'));
    const rv = await call(revokeRoute, 'DELETE', { as: revoked.host, params: { channel: revoked.channel.slug, invitationId: revoked.invitationId } });
    expect(rv.status).toBe(204);
    const r = await call(acceptRoute, 'POST', { params: { token: revoked.token }, body: { name: 'Late', password: PASSWORD } });
    expect(r.status).toBe(409);
    expect(r.json.error?.message).toMatch(/withdrawn/);

    const expired = await invite(uniqueEmail('expired'));
    await db('invitations').where({ id: expired.invitationId }).update({ expires_at: new Date(Date.now() - 1000) });
    const e = await call(acceptRoute, 'POST', { params: { token: expired.token }, body: { name: 'Slow', password: PASSWORD } });
    expect(e.status).toBe(409);
    expect(e.json.error?.message).toMatch(/expired/);
    expect((await call(lookupRoute, 'GET', { params: { token: expired.token } })).json.invitation).toMatchObject({ status: 'expired' });

    const unknown = await call(acceptRoute, 'POST', { params: { token: 'x'.repeat(43) }, body: { name: 'Who', password: PASSWORD } });
    expect(unknown.status).toBe(404);
  });

  it('resend mails a new link and the old one stops working', async () => {
    const email = uniqueEmail('resend');
    const first = await invite(email);
    const res = await call(resendRoute, 'POST', { as: first.host, params: { channel: first.channel.slug, invitationId: first.invitationId } });
    expect(res.status).toBe(200);
    const mails = await waitForMail(email, { atLeast: 2 });
    const newToken = mails.map(invitationTokenFrom).find((t) => t !== first.token);
    expect(newToken).toBeTruthy();
    expect((await call(lookupRoute, 'GET', { params: { token: first.token } })).json.invitation).toMatchObject({ status: 'unknown' });
    expect((await call(lookupRoute, 'GET', { params: { token: newToken ?? '' } })).json.invitation).toMatchObject({ status: 'open' });
  });

  it('refuses to invite someone already on the crew, or twice', async () => {
    const crew = await makeCrew();
    const dupe = await call(inviteRoute, 'POST', { as: crew.host, params: { channel: crew.channel.slug }, body: { email: crew.editor.email, role: 'editor' } });
    expect(dupe.status).toBe(409);
    const email = uniqueEmail('twice');
    await call(inviteRoute, 'POST', { as: crew.host, params: { channel: crew.channel.slug }, body: { email, role: 'editor' } });
    const twice = await call(inviteRoute, 'POST', { as: crew.host, params: { channel: crew.channel.slug }, body: { email, role: 'host' } });
    expect(twice.status).toBe(409);
    expect(twice.json.error?.fields?.email).toBeTruthy();
  });
});
