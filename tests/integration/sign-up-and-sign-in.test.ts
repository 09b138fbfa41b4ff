import { describe, expect, it } from 'vitest';
import { POST as signUpRoute } from '@/app/api/sign-up/route';
import { db } from '@/db/client';
import { authorizeCredentials } from '@/lib/auth/sign-in';
import { THROTTLE_LIMIT } from '@/lib/auth/throttle-queries';
import { call, makeUser, PASSWORD, uniqueEmail } from './helpers';

describe('sign-up', () => {
  it('creates the user, a channel and a Host membership in one go', async () => {
    const email = uniqueEmail('signup');
    const res = await call(signUpRoute, 'POST', { body: { name: 'Ada Plank', email, password: PASSWORD, channelName: 'Plank & Peg' } });
    expect(res.status).toBe(201);
    const { user, channel } = res.json as { user: { id: string; email: string }; channel: { id: string; slug: string } };
    expect(user.email).toBe(email);
    expect(JSON.stringify(res.json)).not.toMatch(/password|hash/i);
    expect(channel.slug).toMatch(/^plank-peg-[0-9a-f]{6}$/);
    const membership = await db('memberships').where({ user_id: user.id, channel_id: channel.id }).first();
    expect(membership?.role).toBe('host');
  });

  it('refuses a second account for the same e-mail in any letter case, with a field error', async () => {
    const email = uniqueEmail('dupe');
    await call(signUpRoute, 'POST', { body: { name: 'One', email, password: PASSWORD, channelName: 'First' } });
    const res = await call(signUpRoute, 'POST', { body: { name: 'Two', email: email.toUpperCase(), password: PASSWORD, channelName: 'Second' } });
    expect(res.status).toBe(409);
    expect(res.json.error?.fields?.email).toBeTruthy();
    expect(await db('channels').where({ name: 'Second' }).first()).toBeUndefined();
  });

  it('answers 400 with field errors for bad input and writes nothing', async () => {
    const res = await call(signUpRoute, 'POST', { body: { name: '', email: 'not-an-email', password: 'short', channelName: 'x', extra: 1 } });
    expect(res.status).toBe(400);
    expect(Object.keys(res.json.error?.fields ?? {}).sort()).toEqual(['channelName', 'email', 'extra', 'name', 'password']);
  });
});

describe('sign-in throttling', () => {
  it('accepts the right password and never returns the hash', async () => {
    const user = await makeUser('signin');
    const result = await authorizeCredentials({ email: user.email.toUpperCase(), password: PASSWORD }, '203.0.113.1');
    expect(result).toEqual({ id: user.id, email: user.email, name: user.name });
  });

  it(`blocks an e-mail after ${THROTTLE_LIMIT} failures, even with the right password and from another IP`, async () => {
    const user = await makeUser('victim');
    for (let i = 0; i < THROTTLE_LIMIT; i++) {
      expect(await authorizeCredentials({ email: user.email, password: 'wrong-password' }, `198.51.100.${i}`)).toBeNull();
    }
    expect(await authorizeCredentials({ email: user.email, password: PASSWORD }, '198.51.100.200')).toBeNull();
  });

  it(`blocks an IP after ${THROTTLE_LIMIT} failures across e-mails`, async () => {
    const ip = `192.0.2.${Math.floor(Math.random() * 250)}`;
    for (let i = 0; i < THROTTLE_LIMIT; i++) {
      await authorizeCredentials({ email: uniqueEmail('nobody'), password: 'whatever-pass' }, ip);
    }
    const user = await makeUser('sameip');
    expect(await authorizeCredentials({ email: user.email, password: PASSWORD }, ip)).toBeNull();
    expect(await authorizeCredentials({ email: user.email, password: PASSWORD }, '192.0.2.251')).not.toBeNull();
  });

  it('forgets earlier failures of an e-mail after a successful sign-in', async () => {
    const user = await makeUser('recover');
    for (let i = 0; i < THROTTLE_LIMIT - 1; i++) await authorizeCredentials({ email: user.email, password: 'nope-nope' }, '203.0.113.9');
    expect(await authorizeCredentials({ email: user.email, password: PASSWORD }, '203.0.113.10')).not.toBeNull();
    await authorizeCredentials({ email: user.email, password: 'nope-nope' }, '203.0.113.11');
    expect(await authorizeCredentials({ email: user.email, password: PASSWORD }, '203.0.113.12')).not.toBeNull();
  });

  it('rejects malformed credentials without touching the database', async () => {
    expect(await authorizeCredentials({ email: 42, password: null }, '203.0.113.20')).toBeNull();
    expect(await authorizeCredentials(undefined, '203.0.113.20')).toBeNull();
  });
});
