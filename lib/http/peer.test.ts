import { describe, expect, it } from 'vitest';
import { PEER_HEADER, clientAddress } from './peer';

describe('clientAddress', () => {
  it('takes the socket peer and ignores a client-sent X-Forwarded-For by default', () => {
    const h = new Headers({ [PEER_HEADER]: '203.0.113.7', 'x-forwarded-for': '198.51.100.1' });
    expect(clientAddress(h, 0)).toBe('203.0.113.7');
  });

  it('with one trusted proxy takes the address that proxy saw (the right-most entry)', () => {
    const h = new Headers({ [PEER_HEADER]: '10.0.0.2', 'x-forwarded-for': '198.51.100.1, 203.0.113.7' });
    expect(clientAddress(h, 1)).toBe('203.0.113.7');
    expect(clientAddress(h, 2)).toBe('198.51.100.1');
  });

  it('never walks past the left end of the chain', () => {
    const h = { [PEER_HEADER]: '10.0.0.2', 'x-forwarded-for': '203.0.113.7' };
    expect(clientAddress(h, 5)).toBe('203.0.113.7');
  });

  it('says unknown when no peer was tagged', () => {
    expect(clientAddress(new Headers({ 'x-forwarded-for': '1.2.3.4' }), 0)).toBe('unknown');
  });
});
