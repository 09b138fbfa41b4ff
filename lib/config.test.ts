import { describe, expect, it } from 'vitest';
import { ConfigError, parseConfig } from './config';

describe('parseConfig', () => {
  it('gives every variable its long-standing default when nothing is set', () => {
    const c = parseConfig({});
    expect(c).toMatchObject({
      NODE_ENV: 'development',
      DATABASE_URL: 'postgres://postgres@127.0.0.1:54329/kerfline',
      DB_POOL_MAX: 10,
      SMTP_URL: 'smtp://127.0.0.1:1025',
      MAIL_FROM: 'Kerfline <no-reply@kerfline.local>',
      SHOT_MAIL_DELAY_SECONDS: 180,
      SHOT_MAIL_POLL_MS: 10_000,
      KERFLINE_MAIL_WORKER: true,
      KERFLINE_CLIP_WORKER: true,
      CLIP_JOB_POLL_MS: 2000,
      UPLOAD_DIR: '.data/uploads',
      MAX_UPLOAD_BYTES: 50 * 1024 ** 3,
      STALE_UPLOAD_DAYS: 7,
      TRUST_PROXY_HOPS: 0,
      CLIP_RECONCILE_MS: 60_000,
      KERFLINE_BYTE_REMOVALS: true,
      KERFLINE_TEST_CRASH_BEFORE_CLIP_ROW: false,
    });
    expect(c.NEXTAUTH_SECRET).toBeUndefined();
    expect(c.APP_URL).toBeUndefined();
    expect(c.POSTER_DIR).toBeUndefined();
  });

  it('reads numbers, switches and URLs as given', () => {
    const c = parseConfig({
      SHOT_MAIL_DELAY_SECONDS: '0',
      CLIP_JOB_POLL_MS: '300',
      MAX_UPLOAD_BYTES: String(300 * 1024 * 1024),
      KERFLINE_MAIL_WORKER: 'off',
      KERFLINE_CLIP_WORKER: 'on',
      APP_URL: 'https://kerfline.example/',
      DATABASE_URL: 'postgresql://u:p@db:5432/k',
      SMTP_URL: 'smtps://user:pw@mail.example:465',
    });
    expect(c.SHOT_MAIL_DELAY_SECONDS).toBe(0);
    expect(c.CLIP_JOB_POLL_MS).toBe(300);
    expect(c.MAX_UPLOAD_BYTES).toBe(300 * 1024 * 1024);
    expect(c.KERFLINE_MAIL_WORKER).toBe(false);
    expect(c.KERFLINE_CLIP_WORKER).toBe(true);
    expect(c.APP_URL).toBe('https://kerfline.example/');
  });

  it('treats an empty value as unset', () => {
    expect(parseConfig({ DB_POOL_MAX: '', MAIL_FROM: '' })).toMatchObject({ DB_POOL_MAX: 10, MAIL_FROM: 'Kerfline <no-reply@kerfline.local>' });
  });

  it('refuses bad values with one line per variable that names it and what was given', () => {
    const bad = () =>
      parseConfig({ TRUST_PROXY_HOPS: '-1', MAX_UPLOAD_BYTES: 'lots', DB_POOL_MAX: '2.5', SHOT_MAIL_DELAY_SECONDS: '-1', SMTP_URL: 'http://mail', NODE_ENV: 'staging' });
    expect(bad).toThrow(ConfigError);
    let message = '';
    try {
      bad();
    } catch (err) {
      message = (err as Error).message;
    }
    expect(message).toContain('MAX_UPLOAD_BYTES: must be a whole number > 0, got "lots"');
    expect(message).toContain('DB_POOL_MAX: must be a whole number > 0, got "2.5"');
    expect(message).toContain('SHOT_MAIL_DELAY_SECONDS: must be a number >= 0, got "-1"');
    expect(message).toContain('SMTP_URL: must be a URL starting smtp:// or smtps://, got "http://mail"');
    expect(message).toContain('TRUST_PROXY_HOPS: must be a whole number >= 0, got "-1"');
    expect(message).toContain('NODE_ENV: must be development, production or test');
  });
});
