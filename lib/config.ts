import { z } from 'zod';

// Every environment variable Kerfline reads, validated once. The names and defaults are the ones the
// code used before this module existed; README.md lists what each one is for. NEXT_RUNTIME is the one
// exception: Next.js sets it, and instrumentation.ts reads it literally so the bundler can drop the
// Node-only branch from the edge bundle.

const text = (fallback: string) =>
  z
    .string()
    .optional()
    .transform((raw) => (raw === undefined || raw === '' ? fallback : raw));

const optionalText = z
  .string()
  .optional()
  .transform((raw) => (raw === undefined || raw === '' ? undefined : raw));

function checkUrl(value: string, protocols: readonly string[], ctx: z.RefinementCtx): boolean {
  if (URL.canParse(value) && protocols.includes(new URL(value).protocol)) return true;
  ctx.addIssue({ code: 'custom', message: `must be a URL starting ${protocols.map((p) => `${p}//`).join(' or ')}, got "${value}"` });
  return false;
}

/** A URL with one of the given schemes (`postgres:`, `smtp:` …), or the fallback when unset. */
const url = (fallback: string, protocols: readonly string[]) =>
  z
    .string()
    .optional()
    .transform((raw, ctx) => {
      const value = raw === undefined || raw === '' ? fallback : raw;
      return checkUrl(value, protocols, ctx) ? value : z.NEVER;
    });

const optionalUrl = (protocols: readonly string[]) =>
  z
    .string()
    .optional()
    .transform((raw, ctx) => {
      if (raw === undefined || raw === '') return undefined;
      return checkUrl(raw, protocols, ctx) ? raw : z.NEVER;
    });

const number = (fallback: number, { min, integer }: { min: 'zero' | 'positive'; integer?: boolean }) =>
  z
    .string()
    .optional()
    .transform((raw, ctx) => {
      if (raw === undefined || raw.trim() === '') return fallback;
      const n = Number(raw);
      const ok = Number.isFinite(n) && (min === 'zero' ? n >= 0 : n > 0) && (!integer || Number.isInteger(n));
      if (!ok) {
        const kind = integer ? 'a whole number' : 'a number';
        ctx.addIssue({ code: 'custom', message: `must be ${kind} ${min === 'zero' ? '>= 0' : '> 0'}, got "${raw}"` });
        return z.NEVER;
      }
      return n;
    });

/** On unless set to exactly "off", as the workers have always read it. */
const switchedOn = z
  .string()
  .optional()
  .transform((raw) => raw !== 'off');

const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test'], { error: 'must be development, production or test' }).default('development'),
  DATABASE_URL: url('postgres://postgres@127.0.0.1:54329/kerfline', ['postgres:', 'postgresql:']),
  DB_POOL_MAX: number(10, { min: 'positive', integer: true }),
  NEXTAUTH_SECRET: optionalText,
  NEXTAUTH_URL: optionalUrl(['http:', 'https:']),
  APP_URL: optionalUrl(['http:', 'https:']),
  SMTP_URL: url('smtp://127.0.0.1:1025', ['smtp:', 'smtps:']),
  MAIL_FROM: text('Kerfline <no-reply@kerfline.local>'),
  SHOT_MAIL_DELAY_SECONDS: number(180, { min: 'zero' }),
  SHOT_MAIL_POLL_MS: number(10_000, { min: 'positive' }),
  KERFLINE_MAIL_WORKER: switchedOn,
  KERFLINE_CLIP_WORKER: switchedOn,
  KERFLINE_REMINDER_WORKER: switchedOn,
  REMINDER_POLL_MS: number(60_000, { min: 'positive' }),
  // Test-only: the app's clock adds an offset kept in app_meta (lib/clock/queries.ts); never set in production.
  KERFLINE_TEST_CLOCK: z
    .string()
    .optional()
    .transform((raw) => raw === '1'),
  CLIP_JOB_POLL_MS: number(2000, { min: 'positive' }),
  UPLOAD_DIR: text('.data/uploads'),
  POSTER_DIR: optionalText,
  MAX_UPLOAD_BYTES: number(50 * 1024 ** 3, { min: 'positive', integer: true }),
  STALE_UPLOAD_DAYS: number(7, { min: 'positive' }),
  // How many reverse proxies in front of Kerfline append to X-Forwarded-For (lib/http/peer.ts).
  TRUST_PROXY_HOPS: number(0, { min: 'zero', integer: true }),
  CLIP_RECONCILE_MS: number(60_000, { min: 'positive' }),
  // Off only where another store shares the database (tests/system/uploads.test.ts).
  KERFLINE_BYTE_REMOVALS: switchedOn,
  // Test-only: the finish hook exits before writing the clip row, to prove the reconciler recovers it.
  KERFLINE_TEST_CRASH_BEFORE_CLIP_ROW: z
    .string()
    .optional()
    .transform((raw) => raw === '1'),
  // Connections for upload locks, one per tus request in flight (db/lock-pool.ts).
  UPLOAD_LOCK_POOL_MAX: number(20, { min: 'positive', integer: true }),
  // Where clip bytes and posters live (storage/config.ts turns these into the store's settings).
  STORAGE: z
    .string()
    .optional()
    .transform((raw, ctx) => {
      if (raw === undefined || raw === '' || raw === 'disk') return 'disk' as const;
      if (raw === 's3') return 's3' as const;
      ctx.addIssue({ code: 'custom', message: `must be disk or s3, got "${raw}"` });
      return z.NEVER;
    }),
  S3_ENDPOINT: optionalUrl(['http:', 'https:']),
  S3_BUCKET: optionalText,
  S3_REGION: text('us-east-1'),
  S3_ACCESS_KEY_ID: optionalText,
  S3_SECRET_ACCESS_KEY: optionalText,
  // Unset: path-style URLs exactly when S3_ENDPOINT names a non-AWS server.
  S3_FORCE_PATH_STYLE: z
    .string()
    .optional()
    .transform((raw) => (raw === undefined || raw === '' ? undefined : raw !== 'false')),
  S3_PART_SIZE_MIB: number(8, { min: 'positive' }),
  // Source: STACK-NOTES (Swift's s3api takes at most 1000 parts per upload; AWS takes 10,000).
  S3_MAX_PARTS: number(1000, { min: 'positive', integer: true }),
}).superRefine((env, ctx) => {
  if (env.STORAGE === 's3' && !env.S3_BUCKET) {
    ctx.addIssue({ code: 'custom', path: ['S3_BUCKET'], message: 'STORAGE=s3 needs a bucket name (and usually S3_ENDPOINT, S3_ACCESS_KEY_ID, S3_SECRET_ACCESS_KEY)' });
  }
});

export type Config = z.infer<typeof envSchema>;

/** Thrown at start-up when a variable is set to something Kerfline cannot use; the message names it. */
export class ConfigError extends Error {
  override name = 'ConfigError';
}

/** Validates an environment; pure, so tests hand it their own. */
export function parseConfig(env: Record<string, string | undefined>): Config {
  const result = envSchema.safeParse(env);
  if (result.success) return result.data;
  const lines = result.error.issues.map((issue) => `  ${issue.path.join('.')}: ${issue.message}`);
  throw new ConfigError(`Kerfline cannot start: fix these environment variables.\n${lines.join('\n')}`);
}

let cached: Config | undefined;

/** The validated environment, read from process.env on first use and kept for the module's life. */
export function config(): Config {
  cached ??= parseConfig(process.env);
  return cached;
}

/** The public address of the app, for links in e-mail. */
export function appUrl(): string {
  const { APP_URL, NEXTAUTH_URL } = config();
  return (APP_URL ?? NEXTAUTH_URL ?? 'http://127.0.0.1:3000').replace(/\/+$/, '');
}
