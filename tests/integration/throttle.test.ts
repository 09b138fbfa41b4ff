import { describe, expect, it, vi } from 'vitest';
import type * as PasswordModule from '@/lib/auth/password';
import { authorizeCredentials } from '@/lib/auth/sign-in';
import { THROTTLE_LIMIT } from '@/lib/auth/throttle-queries';
import { SIGN_IN_BACKOFF } from '@/lib/rate-limits/rules';
import { db } from '@/db/client';
import { PASSWORD, makeUser, uniqueEmail } from './helpers';

// Counts every password check (bcrypt compare), the costly step the throttle must ration.
const checks = vi.hoisted(() => ({ n: 0 }));
vi.mock('@/lib/auth/password', async (importOriginal) => {
  const real = await importOriginal<typeof PasswordModule>();
  return {
    ...real,
    verifyPassword: (password: string, hash: string) => {
      checks.n++;
      return real.verifyPassword(password, hash);
    },
    burnPasswordCheck: (password: string) => {
      checks.n++;
      return real.burnPasswordCheck(password);
    },
  };
});

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

describe('sign-in throttling is atomic and backs off (issue 12 item 9)', () => {
  it(`25 parallel tries for one e-mail run at most ${THROTTLE_LIMIT} password checks`, async () => {
    const user = await makeUser('crowd');
    checks.n = 0;
    const results = await Promise.all(
      Array.from({ length: 25 }, (_, i) => authorizeCredentials({ email: user.email, password: `wrong-${i}` }, `198.51.100.${i}`)),
    );
    expect(results.every((r) => r === null)).toBe(true);
    expect(checks.n).toBeLessThanOrEqual(THROTTLE_LIMIT);
    expect(checks.n).toBeGreaterThan(0);
  });

  it('25 parallel tries from one address across e-mails also stop at the limit', async () => {
    const ip = `203.0.113.${Math.floor(Math.random() * 250)}`;
    checks.n = 0;
    await Promise.all(Array.from({ length: 25 }, () => authorizeCredentials({ email: uniqueEmail('spray'), password: 'whatever-pass' }, ip)));
    expect(checks.n).toBeLessThanOrEqual(THROTTLE_LIMIT);
  });

  it('slows a guesser with doubling waits but lets the owner in after a short wait, not 15 minutes', async () => {
    const user = await makeUser('owner');
    const ip = () => `192.0.2.${Math.floor(Math.random() * 250)}`;
    for (let i = 0; i < THROTTLE_LIMIT; i++) expect(await authorizeCredentials({ email: user.email, password: 'nope-nope' }, ip())).toBeNull();
    // Right away even the right password waits (the back-off is 1 s after the fifth try)…
    expect(await authorizeCredentials({ email: user.email, password: PASSWORD }, ip())).toBeNull();
    const row = await db('rate_limits').where({ limit_key: `email:${user.email}` }).first('hits');
    expect(row.hits).toBe(THROTTLE_LIMIT);
    // …and once the wait is over the owner gets in, and the count starts over.
    await sleep(SIGN_IN_BACKOFF.baseDelaySeconds * 1000 + 300);
    expect(await authorizeCredentials({ email: user.email, password: PASSWORD }, ip())).not.toBeNull();
    expect(await db('rate_limits').where({ limit_key: `email:${user.email}` }).first()).toBeUndefined();
  });
});
