import { describe, expect, it } from 'vitest';
import { api, channelApi, channelPage } from './paths';

describe('paths', () => {
  it('builds channel API and page paths from their parts', () => {
    expect(channelApi('tallowmere-woodshop')).toBe('/api/channels/tallowmere-woodshop');
    expect(channelApi('shop', 'segments', 'a1b2', 'shots', 'bulk')).toBe('/api/channels/shop/segments/a1b2/shots/bulk');
    expect(channelPage('shop', 'episodes', 'e1', 'segments', 's1')).toBe('/c/shop/episodes/e1/segments/s1');
    expect(api('invitations', 'tok_en-1', 'accept')).toBe('/api/invitations/tok_en-1/accept');
  });

  it('encodes every part, so an id cannot add a segment, a query or a fragment', () => {
    // Source: RFC 3986 §3.3 and §2.1; encodeURIComponent leaves only unreserved characters bare.
    expect(channelApi('shop', 'shots', '../x?y=1#z')).toBe('/api/channels/shop/shots/..%2Fx%3Fy%3D1%23z');
    expect(channelPage('a b', 'é')).toBe('/c/a%20b/%C3%A9');
    expect(api('invitations', 'a/b')).toBe('/api/invitations/a%2Fb');
  });
});
