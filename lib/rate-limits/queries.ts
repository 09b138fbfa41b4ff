import 'server-only';
import type { Knex } from 'knex';
import { db } from '@/db/client';
import { backoffDelaySeconds, type BackoffRule, type LimitRule } from './rules';

export type HitResult = { allowed: boolean; retryAfterSeconds: number };

const SECONDS = `* interval '1 second'`;

// Each statement counts and decides in one INSERT … ON CONFLICT DO UPDATE … WHERE: PostgreSQL locks
// the row and re-reads its latest version for the WHERE, so parallel hits are counted one by one
// and no more than the rule allows get through (Source: PostgreSQL 15 docs, INSERT, "ON CONFLICT
// DO UPDATE … guarantees an atomic INSERT or UPDATE outcome"). A refused hit changes nothing.
function quotaSql(): string {
  const expired = `r.window_started_at <= now() - (:win ${SECONDS})`;
  return `
    insert into rate_limits as r (limit_key, hits, window_started_at, next_allowed_at)
    select k, 1, now(), case when 1 >= :limit then now() + (:win ${SECONDS}) else now() end
    from unnest(cast(:keys as text[])) as k
    on conflict (limit_key) do update set
      hits = case when ${expired} then 1 else r.hits + 1 end,
      window_started_at = case when ${expired} then now() else r.window_started_at end,
      next_allowed_at = case
        when ${expired} then (case when 1 >= :limit then now() + (:win ${SECONDS}) else now() end)
        when r.hits + 1 >= :limit then r.window_started_at + (:win ${SECONDS})
        else now() end
    where ${expired} or r.hits < :limit
    returning limit_key`;
}

function backoffSql(): string {
  const quiet = `r.next_allowed_at <= now() - (:quiet ${SECONDS})`;
  const tries = `(case when ${quiet} then 1 else r.hits + 1 end)`;
  const wait = `(case when ${tries} < :free then 0 else least(:max, :base * power(2, least(${tries} - :free, 30))) end)`;
  return `
    insert into rate_limits as r (limit_key, hits, window_started_at, next_allowed_at)
    select k, 1, now(), now() + (:first ${SECONDS})
    from unnest(cast(:keys as text[])) as k
    on conflict (limit_key) do update set
      hits = ${tries},
      window_started_at = case when ${quiet} then now() else r.window_started_at end,
      next_allowed_at = now() + (${wait} ${SECONDS})
    where r.next_allowed_at <= now()
    returning limit_key`;
}

function bindings(rule: LimitRule, keys: string[]): Record<string, unknown> {
  if (rule.kind === 'quota') return { keys, limit: rule.limit, win: rule.windowSeconds };
  const b: BackoffRule = rule;
  return { keys, quiet: b.quietSeconds, free: b.freeTries, max: b.maxDelaySeconds, base: b.baseDelaySeconds, first: backoffDelaySeconds(b, 1) };
}

/**
 * Counts one hit on every key; allowed only when every key had room. Keys are de-duplicated.
 * A refused key is not counted; a key that had room is (a try that was partly refused still costs).
 */
export async function takeHit(keys: string[], rule: LimitRule, executor: Knex | Knex.Transaction = db): Promise<HitResult> {
  const unique = [...new Set(keys)];
  if (unique.length === 0) return { allowed: true, retryAfterSeconds: 0 };
  const sql = rule.kind === 'quota' ? quotaSql() : backoffSql();
  const result: { rows: { limit_key: string }[] } = await executor.raw(sql, bindings(rule, unique));
  if (result.rows.length === unique.length) return { allowed: true, retryAfterSeconds: 0 };
  return { allowed: false, retryAfterSeconds: await secondsUntilAllowed(unique, executor) };
}

/** Whether any key must wait now, without counting a hit. */
export async function secondsUntilAllowed(keys: string[], executor: Knex | Knex.Transaction = db): Promise<number> {
  const result: { rows: { wait: string | null }[] } = await executor.raw(
    `select ceil(extract(epoch from max(next_allowed_at) - now())) as wait from rate_limits where limit_key = any(cast(:keys as text[]))`,
    { keys },
  );
  return Math.max(0, Number(result.rows[0]?.wait ?? 0));
}

/**
 * Gives back one hit on a back-off key (a try that turned out right): shared addresses (an office,
 * a test runner) are slowed only by wrong tries. Below the free tries the wait is lifted too.
 */
export async function refundHit(key: string, rule: BackoffRule, executor: Knex | Knex.Transaction = db): Promise<void> {
  await executor.raw(
    `update rate_limits set hits = greatest(hits - 1, 0),
       next_allowed_at = case when hits - 1 < :free then least(next_allowed_at, now()) else next_allowed_at end
     where limit_key = :key`,
    { key, free: rule.freeTries },
  );
}

/** Forgets a key (a correct password ends the e-mail's back-off). */
export async function resetLimit(key: string, executor: Knex | Knex.Transaction = db): Promise<void> {
  await executor('rate_limits').where({ limit_key: key }).delete();
}

/** Rows whose window and wait both ended a day ago are dead weight; trimmed now and then. */
export async function pruneLimits(executor: Knex | Knex.Transaction = db): Promise<void> {
  await executor('rate_limits')
    .where('next_allowed_at', '<', executor.raw(`now() - interval '1 day'`))
    .where('window_started_at', '<', executor.raw(`now() - interval '1 day'`))
    .delete();
}

