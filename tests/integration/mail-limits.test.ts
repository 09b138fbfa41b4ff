import { NextRequest } from 'next/server';
import { describe, expect, it } from 'vitest';
import { POST as resendRoute } from '@/app/api/channels/[channel]/invitations/[invitationId]/resend/route';
import { POST as inviteRoute } from '@/app/api/channels/[channel]/invitations/route';
import { db } from '@/db/client';
import { INVITE_MAIL_PER_ADDRESS, INVITE_MAIL_PER_CHANNEL } from '@/lib/rate-limits/rules';
import { BASE, ORIGIN, call, makeCrew, sessionCookie, uniqueEmail } from './helpers';

describe('invitation mail is rate-limited (issue 12 item 12)', () => {
  it(`resends to one address stop after ${INVITE_MAIL_PER_ADDRESS.limit} mails an hour with 429 and Retry-After`, async () => {
    const crew = await makeCrew();
    const email = uniqueEmail('flooded');
    const made = await call(inviteRoute, 'POST', { as: crew.host, params: { channel: crew.channel.slug }, body: { email, role: 'editor' } });
    expect(made.status).toBe(201);
    const invitationId = (made.json.invitation as { id: string }).id;
    const params = { channel: crew.channel.slug, invitationId };
    for (let i = 1; i < INVITE_MAIL_PER_ADDRESS.limit; i++) expect((await call(resendRoute, 'POST', { as: crew.host, params })).status).toBe(200);
    const tokenBefore = (await db('invitations').where({ id: invitationId }).first('token_hash')).token_hash;

    const req = new NextRequest(new URL('/api/x', BASE), { method: 'POST', headers: { cookie: await sessionCookie(crew.host), origin: ORIGIN } });
    const refused = await resendRoute(req, { params: Promise.resolve(params) });
    expect(refused.status).toBe(429);
    expect(Number(refused.headers.get('retry-after'))).toBeGreaterThan(0);
    expect(((await refused.json()) as { error: { message: string } }).error.message).toMatch(/invitation e-mails in the last hour/);
    // Refused means untouched: the link already mailed still works.
    expect((await db('invitations').where({ id: invitationId }).first('token_hash')).token_hash).toBe(tokenBefore);
  });

  it('the per-address limit holds across channels, so many channels cannot flood one inbox', async () => {
    const email = uniqueEmail('target');
    const statuses: number[] = [];
    for (let i = 0; i <= INVITE_MAIL_PER_ADDRESS.limit; i++) {
      const crew = await makeCrew();
      statuses.push((await call(inviteRoute, 'POST', { as: crew.host, params: { channel: crew.channel.slug }, body: { email, role: 'editor' } })).status);
    }
    expect(statuses).toEqual([...Array<number>(INVITE_MAIL_PER_ADDRESS.limit).fill(201), 429]);
  });

  it(`one channel stops after ${INVITE_MAIL_PER_CHANNEL.limit} invitation mails an hour, and a refused invite writes nothing`, async () => {
    const crew = await makeCrew();
    // The channel has used its hour already (as after that many invites), counted in the same table.
    await db('rate_limits').insert({
      limit_key: `invite-mail-channel:${crew.channel.id}`,
      hits: INVITE_MAIL_PER_CHANNEL.limit,
      window_started_at: db.fn.now(),
      next_allowed_at: db.raw(`now() + interval '1 hour'`),
    });
    const email = uniqueEmail('one-too-many');
    const res = await call(inviteRoute, 'POST', { as: crew.host, params: { channel: crew.channel.slug }, body: { email, role: 'editor' } });
    expect(res.status).toBe(429);
    expect(await db('invitations').where({ channel_id: crew.channel.id, email }).first()).toBeUndefined();
  });

  it('parallel invites cannot overshoot the channel limit', async () => {
    const crew = await makeCrew();
    await db('rate_limits').insert({
      limit_key: `invite-mail-channel:${crew.channel.id}`,
      hits: INVITE_MAIL_PER_CHANNEL.limit - 3,
      window_started_at: db.fn.now(),
      next_allowed_at: db.fn.now(),
    });
    const results = await Promise.all(
      Array.from({ length: 10 }, () => call(inviteRoute, 'POST', { as: crew.host, params: { channel: crew.channel.slug }, body: { email: uniqueEmail('burst'), role: 'editor' } })),
    );
    expect(results.filter((r) => r.status === 201)).toHaveLength(3);
    expect(results.filter((r) => r.status === 429)).toHaveLength(7);
  });
});
