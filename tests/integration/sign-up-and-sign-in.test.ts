import { describe, expect, it } from 'vitest';
import { POST as signUpRoute } from '@/app/api/sign-up/route';
import { db } from '@/db/client';
import { authorizeCredentials } from '@/lib/auth/sign-in';
import { THROTTLE_LIMIT } from '@/lib/auth/throttle-queries';
import { SIGN_UP_ANSWER } from '@/lib/users/sign-up';
import { waitForMail } from '../support/mail-catcher';
import { call, makeUser, PASSWORD, uniqueEmail } from './helpers';

describe('sign-up', () => {
  it('creates the user, a channel and a Host membership in one go, and mails a welcome', async () => {
    const email = uniqueEmail('signup');
    const res = await call(signUpRoute, 'POST', { body: { name: 'Ada Plank', email, password: PASSWORD, channelName: 'Plank & Peg' } });
    expect(res.status).toBe(202);
    expect(res.json).toEqual({ message: SIGN_UP_ANSWER });
    const user = await db('users').where({ email }).first('id');
    const membership = await db('memberships as m').join('channels as c', 'c.id', 'm.channel_id').where({ 'm.user_id': user.id }).first('m.role', 'c.slug');
    expect(membership?.role).toBe('host');
    expect(membership?.slug).toMatch(/^plank-peg-[0-9a-f]{6}$/);
    const [mail] = await waitForMail(email);
    expect(mail?.subject).toMatch(/is ready/);
    expect(mail?.text).toContain(`/c/${membership?.slug}`);
  });

  it('answers an address that has an account exactly as a new one, and mails the owner instead (issue 12 item 12)', async () => {
    const email = uniqueEmail('dupe');
    await call(signUpRoute, 'POST', { body: { name: 'One', email, password: PASSWORD, channelName: 'First' } });
    const channelName = `Second ${Date.now()}`;
    const res = await call(signUpRoute, 'POST', { body: { name: 'Two', email: email.toUpperCase(), password: 'another-password', channelName } });
    expect(res.status).toBe(202);
    expect(res.json).toEqual({ message: SIGN_UP_ANSWER });
    expect(JSON.stringify(res.json)).not.toMatch(/exist|already|registered/i);
    expect(await db('channels').where({ name: channelName }).first()).toBeUndefined();
    expect(await db('users').where({ email })).toHaveLength(1);
    const mails = await waitForMail(email, { atLeast: 2 });
    expect(mails.some((m) => /tried to create a Kerfline account/.test(m.subject))).toBe(true);
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
    expect(result).toEqual({ id: user.id, email: user.email, name: user.name, sessionVersion: 0 });
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
