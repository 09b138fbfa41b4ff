/**
 * The rules behind Kerfline's counters. Pure data and arithmetic, so the numbers are documented
 * and unit-tested in one place; lib/rate-limits/queries.ts applies them atomically in PostgreSQL.
 */

/** At most `limit` hits per fixed window; then refused until the window ends. */
export type QuotaRule = { kind: 'quota'; limit: number; windowSeconds: number };

/**
 * `freeTries` tries with no wait; from then on each try must wait `baseDelaySeconds · 2^(n − freeTries)`
 * after the previous one, capped at `maxDelaySeconds`; `quietSeconds` without a try starts over.
 */
export type BackoffRule = { kind: 'backoff'; freeTries: number; baseDelaySeconds: number; maxDelaySeconds: number; quietSeconds: number };

export type LimitRule = QuotaRule | BackoffRule;

// Common practice, no published source: a handful of free tries, then doubling waits. With these
// numbers the owner who forgot a password waits at most one minute between tries and never more;
// a guesser gets 5 tries, then 1 + 2 + 4 + 8 + 16 + 32 s, then one try a minute (about 60 an
// hour per e-mail and per address, instead of unlimited).
export const SIGN_IN_BACKOFF: BackoffRule = { kind: 'backoff', freeTries: 5, baseDelaySeconds: 1, maxDelaySeconds: 60, quietSeconds: 15 * 60 };

// Common practice, no published source: invitation mail is a few per person and a few dozen per
// channel in an hour; more than that from one channel is a runaway script or abuse of our sender.
export const INVITE_MAIL_PER_CHANNEL: QuotaRule = { kind: 'quota', limit: 30, windowSeconds: 60 * 60 };
export const INVITE_MAIL_PER_ADDRESS: QuotaRule = { kind: 'quota', limit: 3, windowSeconds: 60 * 60 };
// Sign-up mail (welcome, or "someone tried to sign up with your address") to one address.
export const SIGN_UP_MAIL_PER_ADDRESS: QuotaRule = { kind: 'quota', limit: 3, windowSeconds: 60 * 60 };

/** Seconds to wait after the n-th try (1-based) before the next one may start. */
export function backoffDelaySeconds(rule: BackoffRule, tries: number): number {
  if (tries < rule.freeTries) return 0;
  const exponent = Math.min(tries - rule.freeTries, 30);
  return Math.min(rule.baseDelaySeconds * 2 ** exponent, rule.maxDelaySeconds);
}
