import { afterEach, describe, expect, it, vi } from 'vitest';

// next.config.mjs reads NEXTAUTH_URL when it loads, so each case loads a fresh copy.
async function headersFor(nextAuthUrl) {
  vi.resetModules();
  vi.stubEnv('NEXTAUTH_URL', nextAuthUrl);
  const { default: config } = await import('../../next.config.mjs');
  return config.headers();
}

const keysFor = (rules, source) => rules.filter((r) => r.source === source).flatMap((r) => r.headers.map((h) => h.key));

afterEach(() => vi.unstubAllEnvs());

describe('next.config.mjs headers', () => {
  it('send HSTS only when the public URL is https (issue 12 item 11)', async () => {
    expect(keysFor(await headersFor('https://plan.tallowmere.test'), '/:path*')).toContain('Strict-Transport-Security');
    expect(keysFor(await headersFor('http://127.0.0.1:3000'), '/:path*')).not.toContain('Strict-Transport-Security');
  });

  it('keep the page CSP off the clip file route, whose own sandbox CSP must survive (issue 12 item 13)', async () => {
    const rules = await headersFor('http://127.0.0.1:3000');
    const withCsp = rules.filter((r) => r.headers.some((h) => h.key === 'Content-Security-Policy'));
    expect(withCsp).toHaveLength(1);
    const source = withCsp[0].source;
    expect(source).toMatch(/\(\?!api\/channels\/\[\^\/\]\+\/clips\/\[\^\/\]\+\/file\$\)/);
  });
});
