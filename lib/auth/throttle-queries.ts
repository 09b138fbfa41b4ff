import 'server-only';
import { pruneLimits, refundHit, resetLimit, secondsUntilAllowed, takeHit } from '@/lib/rate-limits/queries';
import { SIGN_IN_BACKOFF } from '@/lib/rate-limits/rules';

// Issue 12 item 9: tries are counted atomically in rate_limits, and after THROTTLE_LIMIT tries each
// further one waits 1, 2, 4 … up to 60 s (numbers and their reasoning: lib/rate-limits/rules.ts).
// THROTTLE_WINDOW_MINUTES without a try starts the count over.
export const THROTTLE_LIMIT = SIGN_IN_BACKOFF.freeTries;
export const THROTTLE_WINDOW_MINUTES = SIGN_IN_BACKOFF.quietSeconds / 60;
export const THROTTLE_MAX_WAIT_SECONDS = SIGN_IN_BACKOFF.maxDelaySeconds;

export const emailKey = (email: string) => `email:${email.toLowerCase()}`;
export const ipKey = (ip: string) => `ip:${ip}`;

/**
 * Takes one try for every key, atomically: true when it may go ahead (then check the password),
 * false when any key must still wait. Parallel callers cannot overshoot the limit.
 */
export async function claimTry(keys: string[]): Promise<boolean> {
  const { allowed } = await takeHit(keys, SIGN_IN_BACKOFF);
  return allowed;
}

/** Whether any key must wait now. Counts nothing; prefer claimTry, which checks and counts at once. */
export async function isThrottled(keys: string[]): Promise<boolean> {
  return (await secondsUntilAllowed(keys)) > 0;
}

/** Counts a failed try on every key (for callers that check first and count after). */
export async function recordFailure(keys: string[]): Promise<void> {
  await takeHit(keys, SIGN_IN_BACKOFF);
  // Old rows are useless to any window; trimming here keeps the table small without a cron.
  await pruneLimits();
}

export async function clearFailures(key: string): Promise<void> {
  await resetLimit(key);
}

/** A try that turned out right does not count against a shared key (an address many people use). */
export async function forgiveTry(key: string): Promise<void> {
  await refundHit(key, SIGN_IN_BACKOFF);
}
