import { describe, expect, it } from 'vitest';
import { generateInvitationToken, hashInvitationToken, invitationExpiry } from './tokens';

describe('invitation tokens', () => {
  // Source: FIPS 180-2, appendix B.1 — SHA-256("abc").
  it('hashes with SHA-256', () => {
    expect(hashInvitationToken('abc')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
  });
  it('makes 256-bit base64url tokens that do not repeat', () => {
    const tokens = new Set(Array.from({ length: 200 }, generateInvitationToken));
    expect(tokens.size).toBe(200);
    for (const t of tokens) expect(t).toMatch(/^[A-Za-z0-9_-]{43}$/);
  });
  it('expires after 7 days', () => {
    const from = new Date('2026-12-01T00:00:00Z');
    expect(invitationExpiry(from).toISOString()).toBe('2026-12-08T00:00:00.000Z');
  });
});
