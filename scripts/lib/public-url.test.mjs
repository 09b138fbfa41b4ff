import { describe, expect, it } from 'vitest';
import { publicUrls } from './public-url.mjs';

describe('publicUrls (npm start)', () => {
  it('keeps the operator’s https NEXTAUTH_URL instead of forcing the local http one', () => {
    const urls = publicUrls({ NEXTAUTH_URL: 'https://plan.tallowmere.test/' }, 3000);
    expect(urls).toEqual({
      localUrl: 'http://127.0.0.1:3000',
      nextAuthUrl: 'https://plan.tallowmere.test',
      appUrl: 'https://plan.tallowmere.test',
      secure: true,
    });
  });

  it('takes APP_URL for links when only it is set, and keeps both when both are', () => {
    expect(publicUrls({ APP_URL: 'https://a.test' }, 3000).nextAuthUrl).toBe('https://a.test');
    const both = publicUrls({ NEXTAUTH_URL: 'https://a.test', APP_URL: 'https://links.a.test' }, 3000);
    expect([both.nextAuthUrl, both.appUrl]).toEqual(['https://a.test', 'https://links.a.test']);
  });

  it('falls back to local http (not secure) when nothing is set', () => {
    expect(publicUrls({ NEXTAUTH_URL: '  ' }, 4030)).toMatchObject({ nextAuthUrl: 'http://127.0.0.1:4030', secure: false });
  });
});
