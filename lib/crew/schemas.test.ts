import { describe, expect, it } from 'vitest';
import { acceptSchema, changeRoleSchema, inviteSchema, tokenParamsSchema } from './schemas';

describe('crew schemas', () => {
  it('accepts the three roles only', () => {
    for (const role of ['host', 'shop_hand', 'editor']) expect(changeRoleSchema.safeParse({ role }).success).toBe(true);
    expect(changeRoleSchema.safeParse({ role: 'Host' }).success).toBe(false);
    expect(changeRoleSchema.safeParse({ role: 'admin' }).success).toBe(false);
  });
  it('normalises the invited address', () => {
    expect(inviteSchema.parse({ email: ' Dev@Shop.Test ', role: 'editor' }).email).toBe('dev@shop.test');
  });
  it('accept takes both name and password, or neither', () => {
    expect(acceptSchema.safeParse({}).success).toBe(true);
    expect(acceptSchema.safeParse({ name: 'Dev', password: 'long-enough-pw' }).success).toBe(true);
    const half = acceptSchema.safeParse({ name: 'Dev' });
    expect(half.success).toBe(false);
    expect(half.error?.issues[0]?.path).toEqual(['password']);
  });
  it('token params take only base64url tokens of a plausible length', () => {
    expect(tokenParamsSchema.safeParse({ token: 'A'.repeat(43) }).success).toBe(true);
    expect(tokenParamsSchema.safeParse({ token: '../../etc' }).success).toBe(false);
  });
});
