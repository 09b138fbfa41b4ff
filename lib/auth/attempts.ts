import 'server-only';
import { AppError } from '@/lib/errors';
import { isThrottled, recordFailure } from './throttle-queries';

// Sign-up and invitation accept cost a password hash each and are open to anyone, so both are
// limited per client address with the sign-in throttle's window and limit (issue 12, item 2).

export const signUpKey = (ip: string) => `sign-up:${ip}`;
export const acceptKey = (ip: string) => `accept:${ip}`;

export const tooManyAttempts = () =>
  new AppError('too_many_requests', 'Too many tries from this address. Wait 15 minutes and try again.');

/** 429 once the keys have had the throttle's limit of tries in its window. */
export async function refuseIfThrottled(keys: string[]): Promise<void> {
  if (await isThrottled(keys)) throw tooManyAttempts();
}

/** Counts one try against the keys (the throttle calls them failures; here every try counts). */
export async function countAttempt(keys: string[]): Promise<void> {
  await recordFailure(keys);
}
