import { describe, expect, it } from 'vitest';
import { crossSiteRefusal, ownOrigins } from './origin';

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
