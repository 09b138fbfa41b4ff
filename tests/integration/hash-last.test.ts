import { randomUUID } from 'node:crypto';
import { beforeEach, describe, expect, it, vi } from 'vitest';
import { POST as acceptRoute } from '@/app/api/invitations/[token]/accept/route';
import { POST as signUpRoute } from '@/app/api/sign-up/route';
import type * as passwordModule from '@/lib/auth/password';
import { THROTTLE_LIMIT } from '@/lib/auth/throttle-queries';
import { createInvitation } from '@/lib/crew/queries';
import { PEER_HEADER } from '@/lib/http/peer';
import { call, makeCrew, makeUser, PASSWORD, uniqueEmail } from './helpers';

// Issue 12, item 2: sign-up and accept hashed the password before checking anything, unthrottled,
// so 12 parallel bogus accepts pushed another user's request from 17 ms to 5.7 s.

const hashes = vi.hoisted(() => ({ count: 0 }));
vi.mock('@/lib/auth/password', async (importOriginal) => {
  const original = await importOriginal<typeof passwordModule>();
  return {
    ...original,
    hashPassword: (password: string) => {
      hashes.count++;
      return original.hashPassword(password);
    },
  };
});

beforeEach(() => {
  hashes.count = 0;
});

/** A client address of its own per test, so the throttle's counts do not mix. */
const from = () => ({ [PEER_HEADER]: `2001:db8::${randomUUID().slice(0, 4)}:${randomUUID().slice(0, 4)}` });
const signUpBody = (email = uniqueEmail('hashlast')) => ({ name: 'Ada Plank', email, password: PASSWORD, channelName: 'Plank & Peg' });

describe('check first, hash last', () => {
  it('hashes nothing for an unknown, used or already-registered invitation', async () => {
    const headers = from();
    const bogus = await call(acceptRoute, 'POST', { params: { token: 'x'.repeat(43) }, body: { name: 'Who', password: PASSWORD }, headers });
    expect(bogus.status).toBe(404);
    const crew = await makeCrew();
    const existing = await makeUser('invited');
    const { token } = await createInvitation(crew.channel.id, crew.host.id, { email: existing.email, role: 'editor' });
    hashes.count = 0; // the fixtures' own passwords
    const taken = await call(acceptRoute, 'POST', { params: { token }, body: { name: 'Twin', password: PASSWORD }, headers });
    expect(taken.status).toBe(409);
    expect(hashes.count).toBe(0);
  });

  // Item 12 wins over item 2 here: a sign-up for a known address hashes too, so its answer takes as
  // long as a new one's and cannot tell whether the address has an account; the per-address limit
  // below bounds what that costs.
  it('hashes once for a sign-up with an e-mail that has an account, the same as a new one', async () => {
    const user = await makeUser('registered');
    hashes.count = 0;
    const res = await call(signUpRoute, 'POST', { body: signUpBody(user.email), headers: from() });
    expect(res.status).toBe(202);
    expect(hashes.count).toBe(1);
  });

  it('still hashes once for a real sign-up', async () => {
    expect((await call(signUpRoute, 'POST', { body: signUpBody(), headers: from() })).status).toBe(202);
    expect(hashes.count).toBe(1);
  });
});

describe('throttled per client address', () => {
  it(`answers 429 to bogus accepts after ${THROTTLE_LIMIT}, in parallel too, and another address goes on`, async () => {
    const headers = from();
    const bogus = () => call(acceptRoute, 'POST', { params: { token: randomUUID().replace(/-/g, '').padEnd(43, 'a') }, body: { name: 'Who', password: PASSWORD }, headers });
    const statuses: number[] = [];
    for (let i = 0; i < THROTTLE_LIMIT + 2; i++) statuses.push((await bogus()).status);
    expect(statuses).toEqual([...Array<number>(THROTTLE_LIMIT).fill(404), 429, 429]);
    // Twelve in parallel from a fresh address: whatever the count lets through, none costs a hash.
    const burst = from();
    const answers = await Promise.all(Array.from({ length: 12 }, () => call(acceptRoute, 'POST', { params: { token: 'z'.repeat(43) }, body: { name: 'Who', password: PASSWORD }, headers: burst })));
    expect(answers.every((a) => a.status === 404 || a.status === 429)).toBe(true);
    const after = await call(acceptRoute, 'POST', { params: { token: 'y'.repeat(43) }, body: { name: 'Who', password: PASSWORD }, headers });
    expect(after.status).toBe(429);
    expect(after.json.error?.code).toBe('too_many_requests');
    const other = await call(acceptRoute, 'POST', { params: { token: 'y'.repeat(43) }, body: { name: 'Who', password: PASSWORD }, headers: from() });
    expect(other.status).toBe(404);
    expect(hashes.count).toBe(0);
  });

  it(`answers 429 to sign-ups after ${THROTTLE_LIMIT} from one address`, async () => {
    const headers = from();
    for (let i = 0; i < THROTTLE_LIMIT; i++) expect((await call(signUpRoute, 'POST', { body: signUpBody(), headers })).status).toBe(202);
    const refused = await call(signUpRoute, 'POST', { body: signUpBody(), headers });
    expect(refused.status).toBe(429);
    expect(hashes.count).toBe(THROTTLE_LIMIT);
  });
});
