import 'server-only';
import { AppError } from '@/lib/errors';
import { secondsUntilAllowed, takeHit } from '@/lib/rate-limits/queries';
import { SIGN_IN_BACKOFF } from '@/lib/rate-limits/rules';

// Sign-up and invitation accept cost a password hash each and are open to anyone, so each try is
// counted per client address under the sign-in back-off (issue 12, items 2 and 9): a few free
// tries, then doubling waits up to a minute. Counting and deciding are one statement, so parallel
// tries cannot get past the limit.

export const signUpKey = (ip: string) => `sign-up:${ip}`;
export const acceptKey = (ip: string) => `accept:${ip}`;

const tooManyAttempts = (waitSeconds: number) =>
  new AppError('too_many_requests', 'Too many tries from this address. Wait a minute and try again.', undefined, {
    retryAfterSeconds: Math.max(1, waitSeconds),
  });

/** Counts one try on every key; 429 with Retry-After when any key must still wait. */
export async function claimAttempt(keys: string[]): Promise<void> {
  const { allowed, retryAfterSeconds } = await takeHit(keys, SIGN_IN_BACKOFF);
  if (!allowed) throw tooManyAttempts(retryAfterSeconds);
}

/** 429 while any key must still wait; counts nothing (for callers that count only failures). */
export async function refuseIfThrottled(keys: string[]): Promise<void> {
  const wait = await secondsUntilAllowed(keys);
  if (wait > 0) throw tooManyAttempts(wait);
}
