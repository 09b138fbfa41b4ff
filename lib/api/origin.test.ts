import { describe, expect, it } from 'vitest';
import { crossSiteRefusal, ownOrigins, refuseCrossSite } from './origin';

const own = ownOrigins('https://kerfline.example', 'https://kerfline.example/api/x');
const check = (method: string, headers: Record<string, string>) => crossSiteRefusal({ method, headers: new Headers(headers), ownOrigins: own });

describe('crossSiteRefusal', () => {
  it('lets reads through whatever their origin', () => {
    expect(check('GET', { origin: 'https://evil.example', cookie: 'a=b' })).toBeNull();
    expect(check('HEAD', {})).toBeNull();
  });

  it.each(['POST', 'PUT', 'PATCH', 'DELETE'])('%s from our own origin passes', (method) => {
    expect(check(method, { origin: 'https://kerfline.example', cookie: 'a=b' })).toBeNull();
  });

  it.each(['POST', 'PUT', 'PATCH', 'DELETE'])('%s from another origin is 403', (method) => {
    expect(check(method, { origin: 'https://evil.example' })?.status).toBe(403);
    expect(check(method, { origin: 'null', cookie: 'a=b' })?.status).toBe(403);
    expect(check(method, { origin: 'http://kerfline.example', cookie: 'a=b' })?.status).toBe(403);
  });

  it('refuses a state change without Origin when it carries a cookie', () => {
    expect(check('POST', { cookie: 'next-auth.session-token=x' })?.status).toBe(403);
  });

  it('refuses a state change without Origin that a browser marks cross-site', () => {
    expect(check('POST', { 'sec-fetch-site': 'cross-site' })?.status).toBe(403);
    expect(check('POST', { 'sec-fetch-site': 'same-site' })?.status).toBe(403);
  });

  it('lets a cookie-less state change without Origin through (a script acting as nobody)', () => {
    expect(check('POST', {})).toBeNull();
  });
});

describe('ownOrigins and refuseCrossSite', () => {
  it('take the configured URL and the Host the browser addressed', () => {
    expect(ownOrigins('https://kerfline.example', 'http://localhost:3000/api/x', '127.0.0.1:3230')).toEqual([
      'https://kerfline.example',
      'http://localhost:3000',
      'http://127.0.0.1:3230',
    ]);
  });

  it('accept a POST from the addressed host and refuse one from elsewhere', () => {
    const req = (origin: string) => new Request('http://localhost:3230/api/uploads', { method: 'POST', headers: { host: '127.0.0.1:3230', origin, cookie: 'a=b' } });
    expect(refuseCrossSite(req('http://127.0.0.1:3230'), 'https://kerfline.example')).toBeNull();
    expect(refuseCrossSite(req('http://evil.example'), 'https://kerfline.example')?.status).toBe(403);
  });
});
