import { describe, expect, it } from 'vitest';
import { safeRedirectPath, safeRedirectUrl } from './redirect';

const ORIGIN = 'https://kerfline.example';

describe('safeRedirectPath', () => {
  it.each([
    '/\\evil.example/x',
    '/%09/evil.example/x',
    '/\t/evil.example/x',
    '/\n/evil.example/x',
    '//evil.example/x',
    '///evil.example/x',
    '/%5Cevil.example',
    '/%2F/evil.example',
    'http://evil.example/x',
    'https://kerfline.example.evil.example/',
    'javascript:alert(1)',
    'evil.example',
    ' /x',
    '',
    '/\u0000x',
    '/\u0085x',
  ])('refuses %j', (raw) => {
    expect(safeRedirectPath(raw, ORIGIN)).toBe('/');
  });

  it('refuses anything that is not a string', () => {
    expect(safeRedirectPath(undefined, ORIGIN)).toBe('/');
    expect(safeRedirectPath(['/c/x'], ORIGIN)).toBe('/');
  });

  it.each([
    ['/c/tallowmere', '/c/tallowmere'],
    ['/c/tallowmere/episodes?stage=edit#top', '/c/tallowmere/episodes?stage=edit#top'],
    ['/c/a/../b', '/c/b'],
    ['/c/caf%C3%A9', '/c/caf%C3%A9'],
  ])('keeps the same-origin path %j', (raw, expected) => {
    expect(safeRedirectPath(raw, ORIGIN)).toBe(expected);
  });
});

describe('safeRedirectUrl (next-auth redirect callback)', () => {
  it('keeps our own absolute URLs and paths', () => {
    expect(safeRedirectUrl('https://kerfline.example/c/x', ORIGIN)).toBe('https://kerfline.example/c/x');
    expect(safeRedirectUrl('/sign-in', ORIGIN)).toBe('https://kerfline.example/sign-in');
  });

  it('sends everything else home', () => {
    expect(safeRedirectUrl('https://evil.example/x', ORIGIN)).toBe('https://kerfline.example/');
    expect(safeRedirectUrl('/\\evil.example/x', ORIGIN)).toBe('https://kerfline.example/');
    expect(safeRedirectUrl('/%09/evil.example/x', ORIGIN)).toBe('https://kerfline.example/');
    expect(safeRedirectUrl('https://kerfline.example/\\evil.example', ORIGIN)).toBe('https://kerfline.example/');
  });
});
