import { describe, expect, it } from 'vitest';
import { emailSchema, newPasswordSchema, signUpSchema } from './schemas';

describe('emailSchema', () => {
  it('trims and lower-cases', () => {
    expect(emailSchema.parse('  Rowan@Example.COM ')).toBe('rowan@example.com');
  });
  it.each(['', 'rowan', 'rowan@', '@example.com', 'a b@example.com'])('refuses %j', (v) => {
    expect(emailSchema.safeParse(v).success).toBe(false);
  });
  // RFC 5321 section 4.5.3.1.3: a path is at most 256 octets, so an address of over 254 cannot be delivered.
  it('refuses addresses longer than 254 characters', () => {
    expect(emailSchema.safeParse(`${'a'.repeat(64)}@${'b'.repeat(186)}.com`).success).toBe(false);
  });
});

describe('newPasswordSchema', () => {
  it('needs 10 characters', () => {
    expect(newPasswordSchema.safeParse('123456789').success).toBe(false);
    expect(newPasswordSchema.safeParse('1234567890').success).toBe(true);
  });
  it('refuses more than 72 bytes, which bcrypt would silently cut', () => {
    expect(newPasswordSchema.safeParse('a'.repeat(72)).success).toBe(true);
    expect(newPasswordSchema.safeParse('a'.repeat(73)).success).toBe(false);
    expect(newPasswordSchema.safeParse('é'.repeat(37)).success).toBe(false);
  });
});

describe('signUpSchema', () => {
  it('refuses unknown fields', () => {
    const r = signUpSchema.safeParse({ name: 'A', email: 'a@b.co', password: 'long-enough-pw', channelName: 'Shop', role: 'host' });
    expect(r.success).toBe(false);
  });
});
