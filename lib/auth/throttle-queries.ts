import 'server-only';
import { db } from '@/db/client';

// Issue #2: at most 5 failed sign-ins in 15 minutes per e-mail and per IP (common practice, no published source).
export const THROTTLE_LIMIT = 5;
export const THROTTLE_WINDOW_MINUTES = 15;

export const emailKey = (email: string) => `email:${email.toLowerCase()}`;
export const ipKey = (ip: string) => `ip:${ip}`;

export async function isThrottled(keys: string[]): Promise<boolean> {
  const rows: { throttle_key: string; n: string }[] = await db('sign_in_failures')
    .whereIn('throttle_key', keys)
    .where('failed_at', '>', db.raw(`now() - interval '${THROTTLE_WINDOW_MINUTES} minutes'`))
    .groupBy('throttle_key')
    .select('throttle_key', db.raw('count(*) as n'));
  return rows.some((r) => Number(r.n) >= THROTTLE_LIMIT);
}

export async function recordFailure(keys: string[]): Promise<void> {
  await db('sign_in_failures').insert(keys.map((throttle_key) => ({ throttle_key })));
  // Old rows are useless to the window; trimming here keeps the table small without a cron.
  await db('sign_in_failures').where('failed_at', '<', db.raw(`now() - interval '1 day'`)).delete();
}

export async function clearFailures(key: string): Promise<void> {
  await db('sign_in_failures').where({ throttle_key: key }).delete();
}
